import { describe, expect, it } from 'vitest'
import { stationGrid } from '../../../../shared/engine/member/stations'
import { parsed, TWO_SPAN_SLAB } from '../../../helpers/members'

describe('station grid', () => {
  const input = parsed(TWO_SPAN_SLAB, { profile: { lowPointAt: [0.42, 0.5], inflection: 0.1 } })
  const st = stationGrid(input)
  it('holds the twentieths of each span, the low point and the ends of the reverse curves (hand: λL = 0.1 × 8000 = 800 mm)', () => {
    const xs = (span: number): number[] => st.filter((s) => s.span === span).map((s) => s.x)
    expect(xs(0)).toContain(400) // 8000/20
    expect(xs(0)).toContain(3360) // low point 0.42 × 8000
    expect(xs(0)).toContain(7200) // L − λL: start of the hogging parabola over the interior support
    expect(xs(1)).toContain(800) // λL from the interior support
    expect(xs(0)).toHaveLength(22) // 21 grid points and the low point; 7200 = 18/20 L is on the grid already, and no duplicates
  })
  it('runs along the member without a gap: X = offset of the span + x', () => {
    for (const s of st) expect(s.X).toBe(s.span * 8000 + s.x)
    for (let k = 1; k < st.length; k++) expect(st[k]!.X).toBeGreaterThanOrEqual(st[k - 1]!.X)
  })
})
