/**
 * Rough speed of designMember (run with `npx tsx scripts/bench-engine.ts [sizes] [proposal]`): the
 * demo inputs against a 5 ms budget per keystroke, then a slab strip of 10, 100 and 1,000 equal spans
 * (with the proposal when the second argument is `proposal`), as ratios of CPU time to the first
 * size — a cost linear in the spans gives ratios near 10 and 100. Never used by tests: speed is
 * measured, not asserted.
 */
import { DEMO_BB1, DEMO_PS2, designMember } from '../shared/engine/index'
import type { MemberInputDraft } from '../shared/engine/index'

const BUDGET_MS = 5

/** CPU milliseconds per run of f, after warm-up runs. */
function cpuMs(f: () => unknown, runs: number, warm = 1): number {
  for (let i = 0; i < warm; i++) f()
  const t = process.cpuUsage()
  for (let i = 0; i < runs; i++) f()
  const d = process.cpuUsage(t)
  return (d.user + d.system) / 1000 / runs
}

for (const [name, demo] of [['PS-2', DEMO_PS2], ['BB-1', DEMO_BB1]] as const) {
  const full = cpuMs(() => designMember(demo), 10, 3)
  const core = cpuMs(() => designMember(demo, { proposal: false }), 10, 3)
  console.log(`${name}: ${full.toFixed(2)} ms with proposal (ratio ${(full / BUDGET_MS).toFixed(2)}), ${core.toFixed(2)} ms without (ratio ${(core / BUDGET_MS).toFixed(2)})`)
}

/** PS-2's strip over n equal 9.6 m spans; friction nearly nil so that a tendon of a thousand spans keeps its force (the work is the same). */
const strip = (n: number): MemberInputDraft => ({
  ...DEMO_PS2,
  losses: { mu: 0.001, wobble: 0 },
  geometry: { spans: Array.from({ length: n }, () => 9600) },
  profile: { ...DEMO_PS2.profile, lowPointAt: Array.from({ length: n }, () => 0.5) },
})

const sizes = (process.argv[2] ?? '10,100,1000').split(',').map(Number)
const proposal = process.argv[3] === 'proposal'
let base = 0
for (const n of sizes) {
  const ms = cpuMs(() => designMember(strip(n), { proposal }), n >= 1000 ? 1 : 3, n >= 1000 ? 0 : 1)
  if (base === 0) base = ms
  const heap = process.memoryUsage().heapUsed / 1e6
  console.log(`${n} spans: ${ms.toFixed(0)} ms ${proposal ? 'with' : 'without'} the proposal, ratio to ${sizes[0]} spans ${(ms / base).toFixed(1)} (linear: ${(n / (sizes[0] as number)).toFixed(0)}); heap after ${heap.toFixed(0)} MB`)
}
