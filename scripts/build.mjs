// Builds the Nuxt app when any source is newer than the last build (or there is none).
import { spawnSync } from 'node:child_process'
import { existsSync, readdirSync, statSync, writeFileSync } from 'node:fs'
import { dirname, join, resolve } from 'node:path'
import { fileURLToPath } from 'node:url'

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..')
const SOURCES = ['pages', 'components', 'composables', 'stores', 'workers', 'layouts', 'middleware', 'assets', 'public', 'server', 'shared', 'content-templates', 'plugins', 'app.vue', 'error.vue', 'nuxt.config.ts', 'tailwind.config.ts', 'package-lock.json']
const stamp = join(root, '.output', '.tendonbook-build')

function newest(path) {
  if (!existsSync(path)) return 0
  const info = statSync(path)
  if (!info.isDirectory()) return info.mtimeMs
  let latest = info.mtimeMs
  for (const entry of readdirSync(path)) latest = Math.max(latest, newest(join(path, entry)))
  return latest
}

export function buildIfNeeded({ force = false } = {}) {
  const sourceTime = Math.max(...SOURCES.map(s => newest(join(root, s))))
  if (!force && existsSync(stamp) && statSync(stamp).mtimeMs >= sourceTime && existsSync(join(root, '.output', 'server', 'index.mjs'))) {
    process.stdout.write('[build] up to date\n')
    return
  }
  process.stdout.write('[build] building the app (nuxt build)…\n')
  const result = spawnSync(process.execPath, [join(root, 'node_modules', '@nuxt', 'cli', 'bin', 'nuxi.mjs'), 'build'], { cwd: root, stdio: 'inherit', env: { ...process.env, NODE_ENV: 'production' } })
  if (result.status !== 0) throw new Error('nuxt build failed')
  writeFileSync(stamp, new Date().toISOString())
}
