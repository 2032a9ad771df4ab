/** Seeded random tendon profiles of one to four spans for the invariant tests of the prestress modules. */
import type { TendonProfile } from '../../shared/engine/prestress/profile'
import { between } from './prng'

export function randomProfile(r: () => number): TendonProfile {
  const n = 1 + Math.floor(r() * 4)
  const spans = Array.from({ length: n }, () => Math.round(between(r, 4000, 12000)))
  return {
    spans,
    supportEcc: Array.from({ length: n + 1 }, (_, j) => (j === 0 || j === n ? between(r, -30, 30) : between(r, -120, -40))),
    spanEcc: spans.map(() => between(r, 40, 120)),
    lowPointAt: spans.map(() => between(r, 0.35, 0.65)),
    inflection: r() < 0.3 ? 0 : between(r, 0.05, 0.15),
  }
}
