#!/usr/bin/env node
// `npm test`: its own MariaDB (.data-test/, port 3407, emptied first), the demo seed, a production
// build, then every vitest project (unit, integration against the real database and server,
// end-to-end in the real Chromium); stops the database and ends with the runner's summary line.
import { spawnSync } from 'node:child_process'
import { existsSync, readdirSync, readFileSync, rmSync } from 'node:fs'
import { dirname, join, resolve } from 'node:path'
import { fileURLToPath } from 'node:url'
import { instance, serverEnv, start, stop } from './db.mjs'
import { seed } from './seed.mjs'
import { buildIfNeeded } from './build.mjs'

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..')
const extra = process.argv.slice(2)

async function main() {
  const fresh = instance(true)
  // Tests start from an empty database every run; the data directory itself is kept for speed.
  await stop({ test: true }).catch(() => {})
  rmSync(join(fresh.base, 'mariadb'), { recursive: true, force: true })
  rmSync(join(fresh.base, 'files'), { recursive: true, force: true })
  // every mailbox of the run (the demo's, and one per test project: mailbox-integration, mailbox-e2e):
  // a message left from an earlier run would name revision ids that this run gives out again
  if (existsSync(fresh.base)) {
    for (const entry of readdirSync(fresh.base)) if (/^mailbox(-|$)/.test(entry)) rmSync(join(fresh.base, entry), { recursive: true, force: true })
  }
  rmSync(join(fresh.base, FIGURES), { force: true })
  const inst = await start({ test: true })
  let code = 1
  try {
    seed(inst)
    buildIfNeeded()
    const result = spawnSync(process.execPath, [join(root, 'node_modules', 'vitest', 'vitest.mjs'), 'run', ...extra], {
      cwd: root,
      stdio: 'inherit',
      env: { ...process.env, ...serverEnv(inst), TENDONBOOK_TEST_BASE: inst.base, NODE_ENV: 'test' },
    })
    code = result.status ?? 1
    printFigures(join(inst.base, FIGURES))
  }
  finally {
    await stop({ test: true }).catch(() => {})
  }
  process.exit(code)
}

// the hardening suites' figures (tests/helpers/figures.ts), one JSON line per suite
const FIGURES = 'hardening-figures.jsonl'

/** The closing table: what the hardening suites tried and what got through (the must-be-0 rows). */
function printFigures(file) {
  if (!existsSync(file)) return
  const lines = readFileSync(file, 'utf8').split('\n').filter(Boolean).map(l => JSON.parse(l))
  const sum = key => lines.reduce((n, l) => n + (l[key] ?? 0), 0)
  const rows = [
    ['routes fuzzed', sum('routes'), ''],
    ['bodies and ids tried', sum('bodiesTried'), ''],
    ['answers 5xx', sum('serverErrors'), 'must be 0'],
    ['tamperings tried / detected', `${sum('tamperingsTried')} / ${sum('tamperingsDetected')}`, 'all detected'],
    ['faults injected / survived', `${sum('faultsInjected')} / ${sum('faultsSurvived')}`, 'all survived'],
    ['rows lost', sum('rowsLost'), 'must be 0'],
    ['attacks tried / succeeded', `${sum('attacksTried')} / ${sum('attacksSucceeded')}`, 'must be 0 succeeded'],
  ]
  const width = Math.max(...rows.map(r => r[0].length))
  const out = ['', `Hardening figures (${lines.map(l => l.suite).join(', ')}${process.env.TENDONBOOK_STRESS ? '; stress run' : ''})`]
  for (const [what, value, rule] of rows) out.push(`  ${what.padEnd(width)}  ${String(value).padStart(12)}  ${rule}`)
  process.stdout.write(`${out.join('\n')}\n\n`)
}

main().catch(async (error) => {
  process.stderr.write(`[test] ${error.message}\n`)
  await stop({ test: true }).catch(() => {})
  process.exit(1)
})
