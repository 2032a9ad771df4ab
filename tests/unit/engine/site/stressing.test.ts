import { describe, expect, it } from 'vitest'
import { stressingSchedule, type StressingInput } from '../../../../shared/engine/site/stressing'
import { tendonSlope, type TendonProfile } from '../../../../shared/engine/prestress/profile'
import { EngineInputError } from '../../../../shared/engine/contract'
import { fieldOf, rel } from '../../../helpers/engine'


const single: TendonProfile = { spans: [8000], supportEcc: [0, 0], spanEcc: [80] }

describe('stressing schedule', () => {
  const straight: TendonProfile = { spans: [10000, 10000], supportEcc: [0, 0, 0], spanEcc: [0, 0] }
  const base: StressingInput = { profile: straight, tendons: [{ id: 'T1', ends: 'left', Pjack: 600e3, Ap: 400 }], Ep: 195000, mu: 0.19, k: 0.01 / 1000, drawIn: 6 }

  it('straight tendon with wobble friction: ΔL = P0(1 − e^(−μkL))/(μk·Ep·Ap) (hand integral of eq. (5.45))', () => {
    const r = stressingSchedule(base)
    const t = r.tendons[0]!
    const mk = 0.19 * 0.01 / 1000
    const hand = (600e3 * (1 - Math.exp(-mk * 20000))) / (mk * 195000 * 400)
    expect(rel(t.extension.left as number, hand)).toBeLessThan(1e-6)
    expect(t.extension.right).toBeNull()
    expect(t.theta).toBe(0)
    expect(t.length).toBeCloseTo(20000, 9)
  })

  it('lock-off extension is the jack extension less the draw-in (the draw-in area is Δ·Ep·Ap, textbook method)', () => {
    const t = stressingSchedule(base).tendons[0]!
    expect(t.extensionAfterLockOff).toBeCloseTo((t.extension.left as number) - 6, 3)
    expect(t.forceAfterLockOff.max).toBeLessThan(600e3)
  })

  it('both ends of a symmetric tendon: each end stretches its half', () => {
    const t = stressingSchedule({ ...base, tendons: [{ id: 'T1', ends: 'both', Pjack: 600e3, Ap: 400 }] }).tendons[0]!
    const mk = 0.19 * 0.01 / 1000
    const half = (600e3 * (1 - Math.exp(-mk * 10000))) / (mk * 195000 * 400)
    expect(rel(t.extension.left as number, half)).toBeLessThan(1e-6)
    expect(rel(t.extension.right as number, half)).toBeLessThan(1e-6)
    expect(t.extension.total).toBeCloseTo(2 * half, 6)
  })

  it('a single parabola deviates the tendon by 2·atan(4a/L) (geometry of the parabola)', () => {
    const t = stressingSchedule({ ...base, profile: single }).tendons[0]!
    expect(t.theta).toBeCloseTo(2 * Math.atan((4 * 80) / 8000), 9)
    expect(t.length).toBeGreaterThan(8000)
  })

  it('flags measured extensions outside the ±7 % band (common practice)', () => {
    const calc = stressingSchedule(base).tendons[0]!.extension.total
    const r = stressingSchedule({
      ...base,
      tendons: [{ id: 'T1', ends: 'left', Pjack: 600e3, Ap: 400 }, { id: 'T2', ends: 'right', Pjack: 600e3, Ap: 400 }],
      measured: [{ id: 'T1', extension: calc * 1.05 }, { id: 'T2', end: 'right', extension: calc * 0.9 }],
    })
    expect(r.tendons[0]!.accepted).toBe(true)
    expect(r.tendons[1]!.accepted).toBe(false)
    expect(r.tendons[1]!.checks[0]!.deviation).toBeCloseTo(-0.1, 9)
    expect(r.tendons[0]!.band.upper).toBeCloseTo(calc * 1.07, 9)
  })

  it('bad input names the field', () => {
    expect(fieldOf(() => stressingSchedule({ ...base, measured: [{ id: 'T9', extension: 100 }] }))).toBe('measured.0.id')
    expect(fieldOf(() => stressingSchedule({ ...base, measured: [{ id: 'T1', end: 'right', extension: 100 }] }))).toBe('measured.0.end')
    expect(fieldOf(() => stressingSchedule({ ...base, tendons: [{ id: 'T1', ends: 'left', Pjack: 0, Ap: 400 }] }))).toBe('tendons.0.Pjack')
    expect(fieldOf(() => stressingSchedule({ ...base, tolerance: 0.9 }))).toBe('tolerance')
    expect(fieldOf(() => stressingSchedule({ ...base, mu: -0.1 }))).toBe('mu')
  })
})

describe('stressing schedule: draw-in', () => {
  it('straight tendon, one end, constant friction per metre: l_set = √(Δ·Ep·Ap/p), anchor loss 2·p·l_set (textbook method)', () => {
    // hand: Pjack = 1400 MPa × 1000 mm² = 1.4 MN, μ = 0.19, k = 0.01 rad/m → p = μ·k·Pjack = 2.66 N/mm (straight: θ = 0)
    // l_set = √(6 × 195 000 × 1000 / 2.66) = 20 973 mm; anchor loss 2 × 2.66 × 20 973 = 111.6 kN (textbook, from memory)
    // p falls with the force along eq. (5.45) (≈ 4 % over l_set), hence 2.5 %; exact for e^(−αx), α = μk (derived in the
    // draw-in tests): anchor loss P0(1 − (1 − s)²), s = √(Δ·Ep·Ap·α/P0) → 109.35 kN
    const straight: TendonProfile = { spans: [60000], supportEcc: [0, 0], spanEcc: [0] }
    const r = stressingSchedule({ profile: straight, tendons: [{ id: 'T1', ends: 'left', Pjack: 1.4e6, Ap: 1000 }], Ep: 195000, mu: 0.19, k: 1e-5, drawIn: 6, stations: 600 })
    const f = r.series.force[0] as number[]
    const p = 0.19 * 1e-5 * 1.4e6
    const lset = Math.sqrt((6 * 195000 * 1000) / p)
    const loss = 1.4e6 - (f[0] as number)
    expect(Math.abs(loss / (2 * p * lset) - 1)).toBeLessThan(0.025)
    const s = Math.sqrt((6 * 195000 * 1000 * 0.19 * 1e-5) / 1.4e6)
    expect(Math.abs(loss / (1.4e6 * (1 - (1 - s) ** 2)) - 1)).toBeLessThan(1e-3)
    // beyond the affected length the force is the friction curve
    const at30m = f[300] as number
    expect(at30m).toBeCloseTo(1.4e6 * Math.exp(-0.19 * 1e-5 * 30000), 3)
  })

  // symmetric 3-span slab tendon, 6–7–6 m, parabolic with reverse curves over the supports; greased monostrand μ = 0.06
  // (common practice, from memory), so that the draw-in lengths from the two ends meet
  const threeSpans: TendonProfile = { spans: [6000, 7000, 6000], supportEcc: [0, -80, -80, 0], spanEcc: [80, 80, 80], inflection: 0.1 }
  const base: StressingInput = { profile: threeSpans, tendons: [{ id: 'T1', ends: 'both', Pjack: 4 * 150 * 1488, Ap: 600 }], Ep: 195000, mu: 0.06, k: 0.01 / 1000, drawIn: 6 }

  it('3 spans, both ends together (the default): the force after lock-off is mirror-symmetric', () => {
    const r = stressingSchedule(base)
    const f = r.series.force[0] as number[]
    const n = f.length
    const worst = Math.max(...f.map((v, i) => Math.abs(v - (f[n - 1 - i] as number)) / v))
    expect(worst).toBeLessThan(1e-9)
    // the set lengths of the two ends meet on this short tendon: the force at mid-length lies below the jacked force
    const s = r.series.s
    const mid = Math.floor(n / 2)
    expect(s[mid] as number).toBeCloseTo((s[n - 1] as number) / 2, 6)
    expect(f[mid] as number).toBeLessThan(4 * 150 * 1488 * Math.exp(-0.06 * (0.5 * r.tendons[0]!.theta + 1e-5 * (s[mid] as number))) - 1000)
  })

  it('3 spans together: the anchor force after lock-off from the half-tendon balance (independent sampling)', () => {
    // hand method: by symmetry the tendon stands still at mid-length and each half slides towards its anchor, where the
    // reverse friction gives F = A·e^(μ(θ + ks)) (eq. (5.45) backwards). The half gives back one slip:
    // ∫₀^(L/2) (F_L − A·e^(μ(θ + ks))) ds = Δ·Ep·Ap → A = (∫F_L ds − Δ·Ep·Ap)/∫e^(μ(θ + ks)) ds, sampled here on its own grid
    const mu = 0.06
    const k = 1e-5
    const Pj = 4 * 150 * 1488
    const n = 3000
    let sAcc = 0
    let theta = 0
    let prev: { s: number; slope: number } | null = null
    const pts: Array<{ s: number; F: number; grow: number }> = []
    threeSpans.spans.forEach((L, span) => {
      for (let j = 0; j <= n; j++) {
        const x = (L * j) / n
        const slope = tendonSlope(threeSpans, span, x)
        if (prev) {
          sAcc += j === 0 ? 0 : (L / n) * (Math.sqrt(1 + prev.slope ** 2) + Math.sqrt(1 + slope ** 2)) / 2 // ds = √(1 + e′²) dx
          theta += Math.abs(Math.atan(slope) - Math.atan(prev.slope)) // θ: true change of direction
        }
        prev = { s: sAcc, slope }
        pts.push({ s: sAcc, F: Pj * Math.exp(-mu * (theta + k * sAcc)), grow: Math.exp(mu * (theta + k * sAcc)) })
      }
    })
    const half = pts.filter((p) => p.s <= sAcc / 2)
    let intF = 0
    let intG = 0
    for (let j = 1; j < half.length; j++) {
      const h = (half[j] as { s: number }).s - (half[j - 1] as { s: number }).s
      intF += (((half[j - 1] as { F: number }).F + (half[j] as { F: number }).F) / 2) * h // trapezoidal rule
      intG += (((half[j - 1] as { grow: number }).grow + (half[j] as { grow: number }).grow) / 2) * h
    }
    const A = (intF - 6 * 195000 * 600) / intG
    const f = stressingSchedule({ ...base, stations: 400 }).series.force[0] as number[]
    expect(Math.abs((f[0] as number) / A - 1)).toBeLessThan(2e-3)
  })

  it('3 spans, one end then the other: left-first and right-first give mirror images', () => {
    const a = stressingSchedule({ ...base, sequence: 'left-first' }).series.force[0] as number[]
    const b = stressingSchedule({ ...base, sequence: 'right-first' }).series.force[0] as number[]
    const n = a.length
    expect(Math.max(...a.map((v, i) => Math.abs(v - (b[n - 1 - i] as number)) / v))).toBeLessThan(1e-9)
  })

  it('energy: each lock-off gives back its slip, so the extension after lock-off is the jacks\' extensions less 2Δ', () => {
    for (const sequence of ['simultaneous', 'left-first', 'right-first'] as const) {
      const t = stressingSchedule({ ...base, sequence }).tendons[0]!
      expect(t.extensionAfterLockOff).toBeCloseTo(t.extension.total - 2 * 6, 6)
    }
    const one = stressingSchedule({ ...base, tendons: [{ id: 'T1', ends: 'right', Pjack: 4 * 150 * 1488, Ap: 600 }] }).tendons[0]!
    expect(one.extensionAfterLockOff).toBeCloseTo(one.extension.total - 6, 6)
  })

  it('in sequence the second jack draws back the first slip where its curve lies higher', () => {
    const r = stressingSchedule({ ...base, sequence: 'left-first' })
    const t = r.tendons[0]!
    const s = r.series.s
    // the first jack draws what a tendon stressed from that end alone draws, ∫F_L dx/(Ep·Ap) over the whole tendon
    const alone = stressingSchedule({ ...base, tendons: [{ id: 'T1', ends: 'left', Pjack: 4 * 150 * 1488, Ap: 600 }] }).tendons[0]!
    expect(t.extension.left as number).toBeCloseTo(alone.extension.left as number, 9)
    // the second jack draws at least the first slip back where the set lengths meet, and more than half of the total together
    const together = stressingSchedule(base).tendons[0]!
    expect(t.extension.left as number).toBeGreaterThan(together.extension.left as number)
    expect(t.extension.right as number).toBeGreaterThan(0)
  })

  it('names a bad sequence', () => {
    let field = ''
    try {
      stressingSchedule({ ...base, sequence: 'middle-first' as 'left-first' })
    } catch (e) {
      if (e instanceof EngineInputError) field = e.field
    }
    expect(field).toBe('sequence')
    // a draw-in beyond the whole extension (≈ 1488 × 19 000/195 000 = 145 mm at most here) is named as the draw-in
    try {
      stressingSchedule({ ...base, drawIn: 200 })
      field = 'no error'
    } catch (e) {
      if (e instanceof EngineInputError) field = e.field
    }
    expect(field).toBe('drawIn')
  })
})
