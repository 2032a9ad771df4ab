import { describe, expect, it } from 'vitest'
import { creepCoefficient, khFactor, shrinkageStrain } from '../../../../shared/engine/index'

describe('creep and shrinkage, EN 1992-1-1 Annex B and 3.1.4', () => {
  it('φ(70 y, 28 d) for C30/37, RH 50 %, h0 = 150 mm, cement N: hand calculation by eqs. (B.1)–(B.8)', () => {
    // hand: fcm 38 → α1 = 0.944, α2 = 0.984; φRH = (1 + 0.5/(0.1·150^(1/3))·α1)·α2 = 1.858;
    // β(fcm) = 16.8/√38 = 2.725; β(t0) = 1/(0.1 + 28^0.2) = 0.4885; βH = 1.5(1 + 0.6^18)150 + 250·α3 = 468.4;
    // βc = (25522/(468.4 + 25522))^0.3 = 0.9946 → φ = 2.460. EN 1992-1-1 Figure 3.1 reads about 2.4 (from memory).
    const phi = creepCoefficient({ fck: 30, RH: 50, h0: 150, t0: 28, t: 28 + 70 * 365, cement: 'N' })
    expect(phi).toBeCloseTo(2.46, 1)
    expect(Math.abs(phi - 2.4) / 2.4).toBeLessThan(0.1)
  })
  it('cement class adjusts t0 (eq. (B.9)): S creeps more than N, N more than R', () => {
    const base = { fck: 32, RH: 60, h0: 200, t0: 5, t: 18250 }
    const s = creepCoefficient({ ...base, cement: 'S' })
    const n = creepCoefficient({ ...base, cement: 'N' })
    const r = creepCoefficient({ ...base, cement: 'R' })
    expect(s).toBeGreaterThan(n)
    expect(n).toBeGreaterThan(r)
  })
  // EN 1992-1-1 Table 3.2 (nominal unrestrained drying shrinkage εcd,0 in ‰, cement class N), from memory
  const table32: Array<[number, number, number]> = [
    [20, 40, 0.58], [20, 60, 0.49], [20, 80, 0.30], [40, 40, 0.46], [40, 60, 0.38], [40, 80, 0.24], [60, 60, 0.30], [80, 60, 0.24],
  ]
  it.each(table32)('εcd,0 for fck %i at RH %i %% is %s ‰ (Table 3.2, eq. (B.11))', (fck, RH, value) => {
    const s = shrinkageStrain({ fck, RH, h0: 100, ts: 0, t: 1e12, cement: 'N' })
    expect(Math.abs(s.drying * 1000 - value)).toBeLessThanOrEqual(0.011)
  })
  it('βds(t, ts) uses h0^(3/2) (eq. (3.10)): 100 days of drying at h0 = 200 mm give 100/(100 + 0.04·200^1.5)', () => {
    const inf = shrinkageStrain({ fck: 30, RH: 50, h0: 200, ts: 0, t: 1e12, cement: 'N' }).drying
    const at = shrinkageStrain({ fck: 30, RH: 50, h0: 200, ts: 7, t: 107, cement: 'N' }).drying
    expect(at / inf).toBeCloseTo(100 / (100 + 0.04 * 200 ** 1.5), 8)
  })
  it('kh of Table 3.3: 1.0 / 0.85 / 0.75 / 0.70 at 100 / 200 / 300 / ≥ 500 mm', () => {
    expect(khFactor(100)).toBe(1)
    expect(khFactor(200)).toBeCloseTo(0.85, 12)
    expect(khFactor(300)).toBeCloseTo(0.75, 12)
    expect(khFactor(800)).toBeCloseTo(0.7, 12)
    expect(khFactor(250)).toBeCloseTo(0.8, 12)
  })
  it('autogenous shrinkage εca(∞) = 2.5(fck − 10)·10⁻⁶ and βas = 1 − exp(−0.2√t) (eqs. (3.12), (3.13))', () => {
    expect(shrinkageStrain({ fck: 30, RH: 50, h0: 200, ts: 3, t: 1e12, cement: 'N' }).autogenous).toBeCloseTo(50e-6, 12)
    const s = shrinkageStrain({ fck: 30, RH: 50, h0: 200, ts: 3, t: 28, cement: 'N' })
    expect(s.autogenous).toBeCloseTo((1 - Math.exp(-0.2 * Math.sqrt(28))) * 50e-6, 12)
  })
  it('bad humidity gives a typed error naming RH', () => {
    expect(() => creepCoefficient({ fck: 30, RH: 120, h0: 150, t0: 28, t: 100, cement: 'N' })).toThrow(/RH/)
  })
})
