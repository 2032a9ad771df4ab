import { describe, expect, it } from 'vitest'
import { UTILISATION_CAP, capUtilisation, ratioCheck } from '../../../../shared/engine/common/check'

const base = { id: 'x', group: 'g', title: 'T', clause: 'EN 1992-1-1', unit: 'MPa' as const }

describe('the one ratio check', () => {
  it('actual ≤ limit: utilisation actual/limit (hand: 12/15 = 0.8 passes, 18/15 = 1.2 fails)', () => {
    expect(ratioCheck({ ...base, actual: 12, limit: 15 })).toMatchObject({ utilisation: 0.8, pass: true })
    expect(ratioCheck({ ...base, actual: 18, limit: 15 })).toMatchObject({ utilisation: 1.2, pass: false })
  })
  it('actual ≥ limit (a resistance or least amount): utilisation limit/actual (hand: 300/400 = 0.75)', () => {
    expect(ratioCheck({ ...base, actual: 400, limit: 300, atLeast: true })).toMatchObject({ utilisation: 0.75, pass: true })
    expect(ratioCheck({ ...base, actual: 0, limit: 300, atLeast: true })).toMatchObject({ utilisation: UTILISATION_CAP, pass: false })
  })
  it('keeps location and note only when given', () => {
    expect(ratioCheck({ ...base, actual: 1, limit: 2 })).not.toHaveProperty('location')
    expect(ratioCheck({ ...base, actual: 1, limit: 2, location: 'Span 1', note: 'n' })).toMatchObject({ location: 'Span 1', note: 'n' })
  })
  it('the cap keeps the utilisation finite JSON', () => {
    expect(capUtilisation(Infinity)).toBe(UTILISATION_CAP)
    expect(capUtilisation(Number.NaN)).toBe(UTILISATION_CAP)
    expect(capUtilisation(5000)).toBe(UTILISATION_CAP)
  })
})

describe('a check whose limit or capacity is not positive fails and says why', () => {
  it('an at-least check against a negative requirement (1.15·Mcr with Mcr < 0, EN 1992-1-1 9.2.1.1(4)) fails', () => {
    const c = ratioCheck({ ...base, actual: 100e6, limit: 1.15 * -20e6, atLeast: true })
    expect(c.pass).toBe(false)
    expect(c.utilisation).toBe(UTILISATION_CAP)
    expect(c.note).toMatch(/not positive/)
  })
  it('a resistance that is not positive (MRd ≤ 0) fails, even against no action', () => {
    expect(ratioCheck({ ...base, actual: 0, limit: 0 }).pass).toBe(false)
    expect(ratioCheck({ ...base, actual: 5, limit: -1 }).note).toMatch(/limit -1 is not positive/)
  })
  it('an at-least check with nothing provided fails (MRd ≤ 0 against 1.15·Mcr)', () => {
    const c = ratioCheck({ ...base, actual: -3, limit: 10, atLeast: true, note: 'n' })
    expect(c.pass).toBe(false)
    expect(c.note).toBe('fails: the value provided -3 is not positive; n')
  })
})
