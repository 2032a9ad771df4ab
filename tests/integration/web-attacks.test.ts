// Attacks from the web on the running product: headers that keep pages from being framed or running
// foreign script, state changes from other sites, a cookie replayed after sign-out, concurrent
// password guessing, script and links in a sheet's text, the PDF renderer sent to another loopback
// port or a local file, spreadsheet formulas in the register, cut-off uploads, and error answers
// that say what was wrong. Every attack is counted in the closing table; none may succeed.
import { createServer, type Server } from 'node:http'
import { connect } from 'node:net'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { recordFigures } from '../helpers/figures'
import { countRows, withDb } from '../helpers/db'
import { png } from '../helpers/png'
import { issue, makeSheet, newPerson, pdfText, session, type Session } from './records-fixtures'

let base = ''
let tried = 0
let succeeded = 0

/** Counts one attack; `held` is true when the product refused it. */
function attack(held: boolean) {
  tried += 1
  if (!held) succeeded += 1
  return held
}

beforeAll(() => {
  base = inject('baseUrl')
})

afterAll(() => {
  recordFigures({ suite: 'web attacks', attacksTried: tried, attacksSucceeded: succeeded })
})

describe('security headers', () => {
  it('frame no page, sniff no type, leak no address, and run no inline script but Nuxt\'s own with the page\'s nonce', async () => {
    for (const path of ['/signin', '/api/health', '/api/no-such-route', '/favicon.svg', '/projects']) {
      const res = await fetch(`${base}${path}`, { redirect: 'manual' })
      const csp = res.headers.get('content-security-policy') ?? ''
      const script = /script-src ([^;]*)/.exec(csp)?.[1] ?? ''
      // an error answer carries Nitro's own stricter policy: no script at all
      const none = script.trim() === '\'none\''
      expect(attack(none || (script.includes('\'self\'') && !script.includes('unsafe-inline') && !script.includes('unsafe-eval'))), `${path}: ${csp}`).toBe(true)
      expect(csp).toContain('frame-ancestors \'none\'')
      if (!none) expect(csp).toContain('object-src \'none\'')
      expect(res.headers.get('x-content-type-options')).toBe('nosniff')
      expect(res.headers.get('x-frame-options')).toBe('DENY')
      expect(res.headers.get('referrer-policy')).toMatch(/^(same-origin|no-referrer)$/)
      if (path === '/signin') {
        const nonce = /'nonce-([^']+)'/.exec(script)?.[1]
        const html = await res.text()
        const inline = [...html.matchAll(/<script(?![^>]*\bsrc=)([^>]*)>/g)]
        expect(inline.length).toBeGreaterThan(0)
        expect(inline.every(m => m[1]!.includes(`nonce="${nonce}"`))).toBe(true)
      }
    }
    // a new nonce for every page
    const a = (await fetch(`${base}/signin`)).headers.get('content-security-policy')
    const b = (await fetch(`${base}/signin`)).headers.get('content-security-policy')
    expect(a).not.toBe(b)
  })
})

describe('state changes from elsewhere', () => {
  it('refuses a missing, unreadable or foreign Origin with 403 naming why, and changes nothing', async () => {
    const engineer = await session('engineer')
    const projects = await countRows('projects')
    const origins: Array<string | null> = [null, 'null', 'not a web address', 'http://evil.example', 'javascript:alert(1)', `http://127.0.0.1:1`, `${base}.evil.example`, 'http://[::1']
    for (const origin of origins) {
      for (const [method, path, body] of [['POST', '/api/projects', { jobNumber: 'XS-1', name: 'Cross-site project' }], ['POST', '/api/auth/signout', {}], ['POST', '/api/auth/signout-everywhere', {}]] as const) {
        const res = await fetch(`${base}${path}`, { method, headers: { 'content-type': 'application/json', cookie: engineer.cookie, ...(origin === null ? {} : { origin }) }, body: JSON.stringify(body) })
        const answer = await res.json() as { message: string }
        expect(attack(res.status === 403), `${origin} ${path} → ${res.status}`).toBe(true)
        expect(answer.message).toMatch(/^Cross-site request refused: /)
      }
    }
    expect(await countRows('projects')).toBe(projects)
    // the session was not ended by any of them
    expect((await engineer.json('GET', '/api/auth/me')).status).toBe(200)
  })

  it('ends the session on the server: a cookie replayed after sign-out neither reads nor writes', async () => {
    const s = await session('engineer')
    const cookie = s.cookie
    expect((await s.json('POST', '/api/auth/signout')).status).toBe(200)
    const read = await fetch(`${base}/api/projects`, { headers: { cookie } })
    const write = await fetch(`${base}/api/projects`, { method: 'POST', headers: { cookie, origin: base, 'content-type': 'application/json' }, body: JSON.stringify({ jobNumber: 'RP-1', name: 'Replayed cookie' }) })
    expect(attack(read.status === 401)).toBe(true)
    expect(attack(write.status === 401)).toBe(true)
  })

  it('lets 30 concurrent wrong passwords reach the password check at most 5 times', async () => {
    const person = await newPerson('engineer', 'Guessed At')
    const answers = await Promise.all(Array.from({ length: 30 }, (_, i) => fetch(`${base}/api/auth/signin`, { method: 'POST', headers: { origin: base, 'content-type': 'application/json' }, body: JSON.stringify({ email: person.email, password: `guess-${i}` }) })))
    const checked = answers.filter(a => a.status === 401).length
    expect(answers.every(a => a.status === 401 || a.status === 429)).toBe(true)
    expect(attack(checked <= 5), `${checked} password checks`).toBe(true)
  })
})

describe('script, links and files in a sheet, through to its sealed PDF', () => {
  let trap: Server
  let trapHits = 0
  let trapPort = 0

  beforeAll(async () => {
    trap = createServer((req, res) => {
      trapHits += 1
      res.end('tracked')
    })
    await new Promise<void>(resolve => trap.listen(0, '127.0.0.1', resolve))
    trapPort = (trap.address() as { port: number }).port
  })
  afterAll(() => new Promise<void>(resolve => trap.close(() => resolve())))

  it('shows script, javascript: links and KaTeX \\href as text, fetches nothing elsewhere, and writes formulas in the register as text', async () => {
    const hostile = [
      '',
      '# Hostile section',
      '',
      '<script>document.title = "owned"</script>',
      '<img src="x" onerror="document.title = \'owned\'">',
      '[a link](javascript:document.title=1) and [another](JAVASCRIPT:alert(1)) and <a href="javascript:alert(1)">raw</a>',
      '$\\href{javascript:alert(1)}{click}$ and $\\url{javascript:alert(2)}$ and $\\htmlId{x}{y}$',
      `![tracker](http://127.0.0.1:${trapPort}/tracker.png) ![local](file:///etc/passwd) ![data](data:image/png;base64,iVBORw0KGgo=)`,
      `<link rel="stylesheet" href="http://127.0.0.1:${trapPort}/style.css"><iframe src="file:///etc/passwd"></iframe>`,
      '',
    ].join('\n')
    const { sheetId, projectId } = await makeSheet()
    await withDb(conn => conn.query('UPDATE sheets SET body = CONCAT((SELECT body FROM templates WHERE id = sheets.template_id), ?), title = ?, draft_version = draft_version + 1 WHERE id = ?', [hostile, '=HYPERLINK("http://evil.example","Podium")', sheetId]))
    const engineer = await session('engineer')
    const checker = await session('checker')
    const records = await session('records')
    const issued = await issue(engineer, sheetId, { failingChecksReason: 'Hostile text test: checks do not matter here' })
    expect(issued.status).toBe(201)
    const revision = await engineer.json<{ reportHtml: string }>('GET', `/api/revisions/${issued.body.id}`)
    const html = revision.body.reportHtml
    expect(html).toContain('Hostile section')
    expect(attack(!/<script/i.test(html))).toBe(true)
    expect(attack(!/<[a-z][^>]*\son[a-z]+\s*=/i.test(html))).toBe(true)
    expect(attack(!/href\s*=\s*["']?\s*javascript:/i.test(html))).toBe(true)
    expect(attack(!/<(img|link|iframe)[^>]+(src|href)=["']?(https?:|file:|data:)/i.test(html))).toBe(true)

    const approved = await checker.json('POST', `/api/revisions/${issued.body.id}/reviews`, { decision: 'approve' })
    expect(approved.status).toBe(201)
    const sealed = await records.json('POST', `/api/revisions/${issued.body.id}/seal`)
    expect(sealed.status).toBe(201)
    const pdf = new Uint8Array(await (await records.fetch(`/api/revisions/${issued.body.id}/pdf`)).arrayBuffer())
    const text = (await pdfText(pdf)).pages.join(' ')
    expect(text).toContain('Hostile section')
    expect(attack(!text.includes('root:x:0:0'))).toBe(true)
    expect(attack(trapHits === 0), `the renderer reached port ${trapPort} ${trapHits} times`).toBe(true)

    const csv = await (await records.fetch(`/api/archive/export.csv?project=${projectId}`)).text()
    expect(attack(csv.includes('"\'=HYPERLINK(') && !/(^|,)"?=HYPERLINK/m.test(csv))).toBe(true)
  })
})

describe('uploads cut short', () => {
  const boundary = '----tendonbook-cut'
  const head = (name: string) => `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="${name}"\r\nContent-Type: image/png\r\n\r\n`

  it('answers 400 or 415 with a message, stores nothing, for a form without its end, a wrong boundary, or a body that stops', async () => {
    const { sheetId } = await makeSheet()
    const engineer = await session('engineer')
    const before = await countRows('attachments', 'sheet_id = ?', [sheetId])
    const pngBytes = Buffer.from(png(16, 16))
    const bodies: Array<[string, Buffer, string]> = [
      ['no closing boundary', Buffer.concat([Buffer.from(head('cut.png')), pngBytes.subarray(0, 30)]), `multipart/form-data; boundary=${boundary}`],
      ['other boundary', Buffer.concat([Buffer.from(head('cut.png')), pngBytes, Buffer.from(`\r\n--${boundary}--\r\n`)]), 'multipart/form-data; boundary=something-else'],
      ['no boundary at all', Buffer.concat([Buffer.from(head('cut.png')), pngBytes]), 'multipart/form-data'],
      ['only the PNG signature', Buffer.concat([Buffer.from(head('cut.png')), pngBytes.subarray(0, 8), Buffer.from(`\r\n--${boundary}--\r\n`)]), `multipart/form-data; boundary=${boundary}`],
      ['not multipart', pngBytes, 'image/png'],
    ]
    for (const [what, body, type] of bodies) {
      const res = await engineer.fetch(`/api/sheets/${sheetId}/attachments`, { method: 'POST', body, headers: { 'content-type': type } })
      const answer = await res.json() as { message?: string }
      expect(attack([400, 415].includes(res.status)), `${what} → ${res.status} ${answer.message}`).toBe(true)
      expect(answer.message, what).toMatch(/file|form|upload|PNG|type/i)
    }
    // a body that stops before its declared length, the connection then closed from our side
    const status = await new Promise<number | null>((resolve) => {
      const url = new URL(base)
      const socket = connect(Number(url.port), url.hostname, () => {
        const part = Buffer.concat([Buffer.from(head('cut.png')), pngBytes.subarray(0, 20)])
        socket.write(`POST /api/sheets/${sheetId}/attachments HTTP/1.1\r\nHost: ${url.host}\r\nOrigin: ${base}\r\nCookie: ${engineer.cookie}\r\nContent-Type: multipart/form-data; boundary=${boundary}\r\nContent-Length: ${part.length + 5000}\r\n\r\n`)
        socket.write(part)
        socket.end()
      })
      let answer = ''
      socket.on('data', (c) => { answer += c.toString() })
      socket.on('close', () => resolve(answer ? Number(/^HTTP\/1\.1 (\d+)/.exec(answer)?.[1]) : null))
      socket.on('error', () => resolve(null))
    })
    expect(attack(status === null || (status >= 400 && status < 500)), `a body cut short → ${status}`).toBe(true)
    expect(await countRows('attachments', 'sheet_id = ?', [sheetId])).toBe(before)
    // the server is still there
    expect((await fetch(`${base}/api/health`)).status).toBe(200)
  })
})

describe('error answers', () => {
  it('say what was wrong, never a bare "Server Error"', async () => {
    const engineer = await session('engineer')
    const cases: Array<[string, string, string | undefined, RegExp]> = [
      ['GET', '/api/no-such-route', undefined, /no-such-route|not found/i],
      ['POST', '/api/projects', '{"jobNumber": ', /not valid JSON/i],
      ['GET', '/api/revisions/999999999', undefined, /No revision with id 999999999/],
      ['GET', '/api/sheets/abc', undefined, /^Record number in the address: must be a positive whole number/],
    ]
    for (const [method, path, body, expected] of cases) {
      const res = await engineer.fetch(path, { method, body, headers: body ? { 'content-type': 'application/json' } : {} })
      const answer = await res.json() as { message?: string }
      expect(res.status, path).toBeGreaterThanOrEqual(400)
      expect(res.status, path).toBeLessThan(500)
      expect(answer.message, path).toMatch(expected)
      expect(answer.message).not.toMatch(/^(Server Error|Internal Server Error)$/)
    }
  })
})
