/**
 * Fire resistance by tabulated data, EN 1992-1-2 section 5: least slab thickness or beam width and
 * least axis distance (surface to the axis of the bottom steel) for a standard fire rating.
 * Prestressing steel is more sensitive to heat: 5.2(5) raises the axis distance by 10 mm for bars
 * and 15 mm for wires and strands.
 *
 * THE TABLE VALUES BELOW ARE FROM MEMORY, TO BE CHECKED AGAINST EN 1992-1-2 before this lookup is
 * used for design (Tables 5.5, 5.6, 5.8, 5.9); a national annex does not change them, but the
 * tables carry conditions (moment redistribution, slab continuity, top steel over supports in flat
 * slabs, corner-bar axis distance a_sd = a + 10 mm in beams with one layer) that the caller checks.
 */
import { EngineInputError } from '../contract'

export type FireRating = 'R60' | 'R90' | 'R120' | 'R180' | 'R240'
export type FireMember = 'slab-one-way' | 'slab-two-way' | 'flat-slab' | 'beam'
export type TendonKind = 'strand' | 'wire' | 'bar' | 'none'

export interface FireTabulatedInput {
  member: FireMember
  rating: FireRating
  /** prestressing steel at the bottom: 'strand' or 'wire' (+15 mm), 'bar' (+10 mm), 'none' (reinforcement only); default 'strand' */
  tendon?: TendonKind
  /** two-way slabs supported on four edges: ratio of the spans ly/lx ≥ 1 */
  spanRatio?: number
  /** beams: web width b, mm (selects the table's column); beams also take `continuity` */
  width?: number
  /** beams: 'continuous' (Table 5.6, default) or 'simply-supported' (Table 5.5) */
  continuity?: 'continuous' | 'simply-supported'
  /** the slab's thickness, mm, if known: the answer then says which requirement governs */
  thickness?: number
  /** the axis distance provided, mm, if known */
  axisDistance?: number
}

export interface FireTabulatedResult {
  table: string
  clause: string
  /** every value of these tables is from memory, to be checked against EN 1992-1-2 */
  fromMemory: true
  /** least slab thickness hs, mm (slabs); null for beams */
  minThickness: number | null
  /** least beam width bmin of the table column used, mm (beams); null for slabs */
  minWidth: number | null
  /** axis distance from the table, mm */
  axisDistanceTable: number
  /** 5.2(5) increase for prestressing steel, mm */
  tendonIncrease: number
  /** required axis distance = table value + increase, mm */
  axisDistance: number
  /** the requirement with the highest utilisation (needs the provided values); null if none was given */
  governs: 'thickness' | 'width' | 'axis distance' | null
  /** required / provided of the governing requirement; > 1 fails; null if nothing was provided */
  utilisation: number | null
  note?: string
}

const RATINGS: FireRating[] = ['R60', 'R90', 'R120', 'R180', 'R240']

// EN 1992-1-2 Table 5.8 (solid slabs, simply supported, one- and two-way): hs; a for one-way |
// two-way ly/lx ≤ 1.5 | two-way 1.5 < ly/lx ≤ 2 — from memory, to be checked against EN 1992-1-2
const TABLE_5_8: Record<FireRating, { hs: number; oneWay: number; twoWay15: number; twoWay20: number }> = {
  R60: { hs: 80, oneWay: 20, twoWay15: 10, twoWay20: 15 },
  R90: { hs: 100, oneWay: 30, twoWay15: 15, twoWay20: 20 },
  R120: { hs: 120, oneWay: 40, twoWay15: 20, twoWay20: 25 },
  R180: { hs: 150, oneWay: 55, twoWay15: 30, twoWay20: 40 },
  R240: { hs: 175, oneWay: 65, twoWay15: 40, twoWay20: 50 },
}

// EN 1992-1-2 Table 5.9 (flat slabs): hs, a — from memory, to be checked against EN 1992-1-2
const TABLE_5_9: Record<FireRating, { hs: number; a: number }> = {
  R60: { hs: 180, a: 15 },
  R90: { hs: 200, a: 25 },
  R120: { hs: 200, a: 35 },
  R180: { hs: 200, a: 45 },
  R240: { hs: 200, a: 50 },
}

// EN 1992-1-2 Table 5.5 (simply supported beams) and Table 5.6 (continuous beams): combinations
// of bmin / a — from memory, to be checked against EN 1992-1-2
const TABLE_5_5: Record<FireRating, Array<[number, number]>> = {
  R60: [[120, 40], [160, 35], [200, 30], [300, 25]],
  R90: [[150, 55], [200, 45], [300, 40], [400, 35]],
  R120: [[200, 65], [240, 60], [300, 55], [500, 50]],
  R180: [[240, 80], [300, 70], [400, 65], [600, 60]],
  R240: [[280, 90], [350, 80], [500, 75], [700, 70]],
}
const TABLE_5_6: Record<FireRating, Array<[number, number]>> = {
  R60: [[120, 25], [200, 12]],
  R90: [[150, 35], [250, 25]],
  R120: [[200, 45], [300, 35], [450, 35], [500, 30]],
  R180: [[240, 60], [400, 50], [550, 50], [600, 40]],
  R240: [[280, 75], [500, 60], [650, 60], [700, 50]],
}

/** EN 1992-1-2 5.2(5): axis distance increase for prestressing steel, mm. */
export function tendonAxisIncrease(tendon: TendonKind): number {
  switch (tendon) {
    case 'strand':
    case 'wire':
      return 15 // EN 1992-1-2 5.2(5): wires and strands
    case 'bar':
      return 10 // EN 1992-1-2 5.2(5): prestressing bars
    case 'none':
      return 0
    default:
      throw new EngineInputError('tendon', "the prestressing steel must be 'strand', 'wire', 'bar' or 'none'")
  }
}

function optionalPositive(v: number | undefined, field: string, what: string): void {
  if (v !== undefined && (!(v > 0) || !Number.isFinite(v))) throw new EngineInputError(field, `the ${what} must be a positive number`)
}

/** Least dimensions and axis distance for a fire rating, EN 1992-1-2 Tables 5.5, 5.6, 5.8, 5.9. */
export function fireTabulated(input: FireTabulatedInput): FireTabulatedResult {
  const { member, rating } = input
  if (!RATINGS.includes(rating)) throw new EngineInputError('rating', `the fire rating must be one of ${RATINGS.join(', ')}`)
  const tendonIncrease = tendonAxisIncrease(input.tendon ?? 'strand')
  optionalPositive(input.thickness, 'thickness', 'slab thickness')
  optionalPositive(input.axisDistance, 'axisDistance', 'axis distance')
  optionalPositive(input.width, 'width', 'beam width')
  let table: string
  let minThickness: number | null = null
  let minWidth: number | null = null
  let aTable: number
  let note: string | undefined
  switch (member) {
    case 'slab-one-way':
    case 'slab-two-way': {
      const row = TABLE_5_8[rating]
      table = 'EN 1992-1-2 Table 5.8'
      minThickness = row.hs
      if (member === 'slab-one-way') {
        aTable = row.oneWay
      } else {
        const ratio = input.spanRatio
        if (ratio === undefined || !(ratio >= 1) || !Number.isFinite(ratio)) throw new EngineInputError('spanRatio', 'a two-way slab needs the ratio of its spans ly/lx (longer over shorter, ≥ 1)')
        if (ratio <= 1.5) aTable = row.twoWay15
        else if (ratio <= 2) aTable = row.twoWay20
        else {
          aTable = row.oneWay // beyond ly/lx = 2 the table has no two-way column: the slab spans one way
          note = 'ly/lx > 2: taken as a one-way slab'
        }
      }
      break
    }
    case 'flat-slab': {
      const row = TABLE_5_9[rating]
      table = 'EN 1992-1-2 Table 5.9'
      minThickness = row.hs
      aTable = row.a
      break
    }
    case 'beam': {
      const simple = input.continuity === 'simply-supported'
      if (input.continuity !== undefined && input.continuity !== 'continuous' && !simple) throw new EngineInputError('continuity', "a beam is 'continuous' or 'simply-supported'")
      table = simple ? 'EN 1992-1-2 Table 5.5' : 'EN 1992-1-2 Table 5.6'
      const columns = (simple ? TABLE_5_5 : TABLE_5_6)[rating]
      const first = columns[0] as [number, number]
      const b = input.width
      // the widest column not wider than the beam (no interpolation between columns: on the safe side)
      const fit = b === undefined ? first : columns.filter(([bmin]) => bmin <= b).pop() ?? first
      minWidth = fit[0]
      aTable = fit[1]
      if (b === undefined) note = 'no width given: the narrowest column of the table'
      break
    }
    default:
      throw new EngineInputError('member', "the member must be 'slab-one-way', 'slab-two-way', 'flat-slab' or 'beam'")
  }
  const axisDistance = aTable + tendonIncrease // EN 1992-1-2 5.2(5)
  const demands: Array<{ what: 'thickness' | 'width' | 'axis distance'; u: number }> = []
  if (minThickness !== null && input.thickness !== undefined) demands.push({ what: 'thickness', u: minThickness / input.thickness })
  if (minWidth !== null && input.width !== undefined) demands.push({ what: 'width', u: minWidth / input.width })
  if (input.axisDistance !== undefined) demands.push({ what: 'axis distance', u: axisDistance / input.axisDistance })
  const worst = demands.reduce<{ what: 'thickness' | 'width' | 'axis distance'; u: number } | null>((w, d) => (w === null || d.u > w.u ? d : w), null)
  return {
    table,
    clause: 'EN 1992-1-2 5.2(5), ' + table,
    fromMemory: true,
    minThickness,
    minWidth,
    axisDistanceTable: aTable,
    tendonIncrease,
    axisDistance,
    governs: worst?.what ?? null,
    utilisation: worst?.u ?? null,
    ...(note ? { note } : {}),
  }
}
