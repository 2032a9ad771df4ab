/**
 * Fire resistance stage, EN 1992-1-2 section 5 (tabulated data): the least slab thickness or beam
 * width and the least axis distance of the bottom steel for the rating asked for — the tendons'
 * raised by 15 mm for strands (5.2(5)), the bars' as tabulated — against what the member has. The
 * table values are from memory, to be checked against EN 1992-1-2 (see fire/tabulated.ts).
 */
import type { CheckResult } from '../contract'
import { ratioCheck } from '../common/check'
import type { StageOutcome } from '../common/stage'
import { fireTabulated } from '../fire/tabulated'
import type { FireMember, FireRating, FireTabulatedResult } from '../fire/tabulated'
import type { MemberInput } from '../input/schema'
import type { MemberSection } from './section'

export interface MemberFire {
  rating: FireRating
  member: FireMember
  table: string
  /** least slab thickness (slabs) or beam width (beams), mm */
  minDimension: number
  /** the slab thickness or the beam's web width provided, mm */
  dimension: number
  /** axis distance of the tabulated bars, and of the tendons with the 5.2(5) increase, mm */
  axisBars: number
  axisTendons: number
  /** from the soffit to the strands' centroid at the low points, and to the axis of the bottom bars, mm */
  tendonAxisProvided: number
  barAxisProvided: number | null
  note: string
}

const FROM_MEMORY = 'tabulated values from memory, to be checked against EN 1992-1-2'

export function fireStage(input: MemberInput, section: MemberSection): StageOutcome<MemberFire | null> {
  const f = input.fire
  if (f.rating === 'none') return { result: null, checks: [], warnings: [] }
  const s = input.section
  const slab = section.isSlab
  const member: FireMember = slab ? (f.slab === 'flat-slab' ? 'flat-slab' : f.slab === 'one-way' ? 'slab-one-way' : 'slab-two-way') : 'beam'
  const width = slab ? undefined : s.kind === 'rectangle' ? (s.b as number) : (s.bw as number)
  const table: FireTabulatedResult = fireTabulated({
    member, rating: f.rating, tendon: 'strand', ...(member === 'slab-two-way' ? { spanRatio: f.spanRatio } : {}),
    ...(width !== undefined ? { width, continuity: input.geometry.spans.length > 1 ? 'continuous' as const : 'simply-supported' as const } : {}),
  })
  const bb = input.uls.barsBottom
  const tendonAxisProvided = section.eccentricity.dBottom // the strands' centroid at the low points, bearing on the duct's far side
  const barAxisProvided = bb.area > 0 ? bb.cover + bb.diameter / 2 : null
  const minDimension = (slab ? table.minThickness : table.minWidth) as number
  const dimension = slab ? s.h : (width as number)
  const checks: CheckResult[] = [
    ratioCheck({
      id: slab ? 'fire.thickness' : 'fire.width', group: 'fire', title: slab ? `Slab thickness for ${f.rating}` : `Beam width for ${f.rating}`,
      clause: table.table, actual: dimension, limit: minDimension, unit: 'mm', atLeast: true, note: FROM_MEMORY,
    }),
    ratioCheck({
      id: 'fire.axisTendons', group: 'fire', title: `Axis distance of the tendons for ${f.rating}`,
      clause: `${table.table}, EN 1992-1-2 5.2(5)`, actual: tendonAxisProvided, limit: table.axisDistance, unit: 'mm', atLeast: true,
      note: `tabulated ${table.axisDistanceTable} mm + ${table.tendonIncrease} mm for strands (5.2(5)); ${FROM_MEMORY}`,
    }),
  ]
  if (barAxisProvided !== null) {
    checks.push(ratioCheck({
      id: 'fire.axisBars', group: 'fire', title: `Axis distance of the bottom bars for ${f.rating}`,
      clause: table.table, actual: barAxisProvided, limit: table.axisDistanceTable, unit: 'mm', atLeast: true, note: FROM_MEMORY,
    }))
  }
  const note = [table.note, member === 'beam' && !slab ? 'beams with one layer of steel: the corner bars need a + 10 mm (5.6.3(3)), not checked' : null, FROM_MEMORY].filter(Boolean).join('; ')
  return {
    result: { rating: f.rating, member, table: table.table, minDimension, dimension, axisBars: table.axisDistanceTable, axisTendons: table.axisDistance, tendonAxisProvided, barAxisProvided, note },
    checks, warnings: [],
  }
}
