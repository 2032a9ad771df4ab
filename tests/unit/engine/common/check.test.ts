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
