import { writeFileSync } from 'node:fs'
import { chromium } from 'playwright-core'
const [,, src, out, y, h] = process.argv
writeFileSync('/tmp/crop.html', `<html><body style="margin:0"><img src="file://${src}"></body></html>`)
const b = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--no-sandbox', '--disable-gpu', '--allow-file-access-from-files'] })
const p = await b.newPage({ viewport: { width: 1440, height: 900 } })
await p.goto('file:///tmp/crop.html')
await p.waitForLoadState('load')
await p.screenshot({ path: out, clip: { x: 0, y: Number(y || 0), width: 1440, height: Number(h || 900) }, fullPage: true })
await b.close()
