import { describe, expect, it } from 'vitest'
import { formatQuantity, fromEngine, toEngine } from '../../../shared/utils/units'

describe('display units', () => {
  // SI definitions (BIPM SI Brochure): 1 kN/m² = 1 kPa = 1e-3 N/mm²; 1 kNm = 1e6 N·mm; 1 m = 1000 mm
  it('converts to the engine base units (N, mm, MPa)', () => {
    expect(toEngine(5, 'kN/m²')).toBeCloseTo(0.005, 12)
    expect(toEngine(7.8, 'm')).toBeCloseTo(7800, 9)
    expect(toEngine(250, 'kNm')).toBeCloseTo(2.5e8, 3)
    expect(toEngine(2, '%')).toBeCloseTo(0.02, 12)
    expect(toEngine(180, '°')).toBeCloseTo(Math.PI, 12)
  })

  it('round-trips every unit', () => {
    for (const unit of ['mm', 'm', 'kN', 'kNm', 'MPa', 'kN/m', 'kN/m²', '%', 'rad/m'] as const) {
      expect(fromEngine(toEngine(3.21, unit), unit)).toBeCloseTo(3.21, 10)
    }
  })

  it('formats with the precision, a true minus sign and no negative zero', () => {
    expect(formatQuantity(-2.5e8, 'kNm', 1)).toBe('−250.0\u202fkNm')
    expect(formatQuantity(-0.0001, 'MPa', 2)).toBe('0.00\u202fMPa')
    expect(formatQuantity(Number.NaN, 'MPa', 2)).toBe('—')
    expect(formatQuantity(0.35, '', 2)).toBe('0.35')
  })
})

describe('large numbers', () => {
  // ISO 80000-1 7.3.1: digits grouped in threes with a thin space; powers of ten for large magnitudes
  it('groups five-digit whole parts and writes large magnitudes with a power of ten', () => {
    expect(formatQuantity(260000, 'mm²', 0)).toBe('260\u2009000\u202fmm²')
    expect(formatQuantity(2600, 'mm²', 0)).toBe('2600\u202fmm²')
    expect(formatQuantity(1464666667, 'mm⁴', 0)).toBe('1.465 × 10⁹\u202fmm⁴')
    expect(formatQuantity(-11266667, 'mm³', 0)).toBe('−1.127 × 10⁷\u202fmm³')
  })
})
