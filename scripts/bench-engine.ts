/**
 * Rough speed of designMember on the demo inputs (run with `npx tsx scripts/bench-engine.ts`).
 * Prints milliseconds per run and the ratio to a 5 ms budget per keystroke; never used by tests.
 */
import { DEMO_BB1, DEMO_PS2, designMember } from '../shared/engine/index'

const BUDGET_MS = 5
for (const [name, demo] of [['PS-2', DEMO_PS2], ['BB-1', DEMO_BB1]] as const) {
  for (let i = 0; i < 5; i++) designMember(demo)
  const runs = 30
  // CPU time of this process, less disturbed by other work on the machine than wall time
  const t0 = process.cpuUsage()
  for (let i = 0; i < runs; i++) designMember(demo)
  const d0 = process.cpuUsage(t0)
  const full = (d0.user + d0.system) / 1000 / runs
  const t1 = process.cpuUsage()
  for (let i = 0; i < runs; i++) designMember(demo, { proposal: false })
  const d1 = process.cpuUsage(t1)
  const core = (d1.user + d1.system) / 1000 / runs
  console.log(`${name}: ${full.toFixed(2)} ms with proposal (ratio ${(full / BUDGET_MS).toFixed(2)}), ${core.toFixed(2)} ms without (ratio ${(core / BUDGET_MS).toFixed(2)})`)
}
