import { describe, expect, it } from 'vitest'
import { stressingSchedule, type StressingInput } from '../../../../shared/engine/site/stressing'
import type { TendonProfile } from '../../../../shared/engine/prestress/profile'
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
