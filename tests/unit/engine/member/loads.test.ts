import { describe, expect, it } from 'vitest'
import { loadPatterns, loadsStage } from '../../../../shared/engine/member/loads'
import { sectionStage } from '../../../../shared/engine/member/section'
import { stationGrid } from '../../../../shared/engine/member/stations'
import { ONE_SPAN_SLAB, TWO_SPAN_SLAB, parsed } from '../../../helpers/members'

describe('loads stage', () => {
  it('self-weight 25 kN/m³ × 0.25 m² = 6.25 kN/m and wL²/8 at mid-span of a simple span (EN 1991-1-1 Table A.1; statics)', () => {
    const input = parsed(ONE_SPAN_SLAB)
    const st = stationGrid(input)
    const l = loadsStage(input, sectionStage(input).result, st).result
    expect(l.selfWeight).toBeCloseTo(6.25, 12)
    const mid = st.findIndex((s) => s.x === 4000)
    expect(l.cases.selfWeight[mid]).toBeCloseTo((6.25 * 8000 ** 2) / 8, 3)
    expect(l.cases.imposedRange.max[mid]!).toBeCloseTo((4 * 8000 ** 2) / 8, 3) // 4 kN/m² over the 1 m strip
    expect(l.cases.imposedAllQuasiPermanent[mid]!).toBeCloseTo((0.3 * 4 * 8000 ** 2) / 8, 3) // ψ2 = 0.3 (EN 1990 Table A1.1, the schema's default)
  })
  it('two equal spans: −wL²/8 over the middle support under load on both spans (handbook coefficient 0.125)', () => {
    const input = parsed(TWO_SPAN_SLAB)
    const st = stationGrid(input)
    const l = loadsStage(input, sectionStage(input).result, st).result
    const support = st.findIndex((s) => s.span === 1 && s.x === 0)
    expect(l.cases.selfWeight[support]).toBeCloseTo((-6.25 * 8000 ** 2) / 8, 2)
  })
  it('patterns of EN 1992-1-1 5.1.3: all spans, alternate spans, and adjacent pairs from three spans', () => {
    expect(loadPatterns(parsed(TWO_SPAN_SLAB)).map((p) => p.id)).toEqual(['all', 'odd', 'even'])
    expect(loadPatterns(parsed(TWO_SPAN_SLAB, { geometry: { spans: [8000, 8000, 8000] } })).map((p) => p.id)).toEqual(['all', 'odd', 'even', 'adjacent-1', 'adjacent-2'])
  })
})
