/**
 * Rough speed of designMember on the demo inputs (run with `npx tsx scripts/bench-engine.ts`).
 * Prints milliseconds per run and the ratio to a 5 ms budget per keystroke; never used by tests.
 */
import { DEMO_BB1, DEMO_PS2, designMember } from '../shared/engine/index'

const BUDGET_MS = 5
for (const [name, demo] of [['PS-2', DEMO_PS2], ['BB-1', DEMO_BB1]] as const) {
  for (let i = 0; i < 5; i++) designMember(demo)
  const runs = 30
  const t0 = performance.now()
  for (let i = 0; i < runs; i++) designMember(demo)
  const full = (performance.now() - t0) / runs
  const t1 = performance.now()
  for (let i = 0; i < runs; i++) designMember(demo, { proposal: false })
  const core = (performance.now() - t1) / runs
  console.log(`${name}: ${full.toFixed(2)} ms with proposal (ratio ${(full / BUDGET_MS).toFixed(2)}), ${core.toFixed(2)} ms without (ratio ${(core / BUDGET_MS).toFixed(2)})`)
}
