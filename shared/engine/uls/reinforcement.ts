/**
 * Detailing limits for passive reinforcement: minimum and maximum longitudinal steel of beams
 * (EN 1992-1-1 9.2.1.1) and slabs (9.3.1.1), the bar-spacing limits of slabs, and two rules that
 * practice applies to post-tensioned slabs (stated here, marked as common practice): bonded top
 * steel over the columns and bonded steel for the tension zone where service tension is high.
 * N, mm, MPa; areas mm² for the width given.
 */
import { requirePositive, requireRange } from '../common/guards'

export interface ReinforcementLimitsInput {
  member: 'beam' | 'slab'
  fctm: number
  fyk: number
  /** mean width of the tension zone, mm (9.2.1.1(1)) */
  bt: number
  d: number
  h: number
  /** gross concrete area, mm² */
  Ac: number
}

export interface ReinforcementLimits {
  /** EN 1992-1-1 eq. (9.1N), mm² */
  AsMin: number
  /** 0.04 Ac (9.2.1.1(3)), mm² */
  AsMax: number
  /** slabs: secondary (transverse) steel ≥ 20 % of the principal (9.3.1.1(2)); null for beams */
  secondaryFraction: number | null
  /** slabs: largest bar spacing, principal / secondary, generally and in areas of maximum moment (9.3.1.1(3)), mm */
  maxSpacing: { principal: number; secondary: number; principalAtMaxMoment: number; secondaryAtMaxMoment: number } | null
}

export function reinforcementLimits(i: ReinforcementLimitsInput): ReinforcementLimits {
  requirePositive('fctm', i.fctm)
  requireRange('fyk', i.fyk, 200, 700, 'fyk must lie between 200 and 700 MPa (3.2.2(3))')
  requirePositive('bt', i.bt)
  requirePositive('h', i.h)
  requireRange('d', i.d, 0, i.h, 'the effective depth must lie within the section depth')
  requirePositive('Ac', i.Ac)
  const AsMin = Math.max(0.26 * (i.fctm / i.fyk) * i.bt * i.d, 0.0013 * i.bt * i.d) // EN 1992-1-1 eq. (9.1N)
  const AsMax = 0.04 * i.Ac // EN 1992-1-1 9.2.1.1(3)
  if (i.member === 'beam') return { AsMin, AsMax, secondaryFraction: null, maxSpacing: null }
  return {
    AsMin,
    AsMax,
    secondaryFraction: 0.2, // EN 1992-1-1 9.3.1.1(2)
    maxSpacing: {
      principal: Math.min(3 * i.h, 400), // 9.3.1.1(3): 3h ≤ 400 mm
      secondary: Math.min(3.5 * i.h, 450), // 9.3.1.1(3): 3.5h ≤ 450 mm
      principalAtMaxMoment: Math.min(2 * i.h, 250), // 9.3.1.1(3): 2h ≤ 250 mm
      secondaryAtMaxMoment: Math.min(3 * i.h, 400), // 9.3.1.1(3): 3h ≤ 400 mm
    },
  }
}

export interface SupportSteelInput {
  /** slab depth, mm */
  h: number
  /** width of the slab panel carried by the column line (the strip width of the analysis), mm */
  panelWidth: number
  /** column width across the strip, mm */
  columnWidth: number
}

export interface SupportSteel {
  /** total bonded top steel over the column, mm² */
  As: number
  /** width over which it is placed: column width + 1.5 h each side, mm */
  bandWidth: number
  /** mm² per mm of band width (×1000 for mm²/m) */
  perWidth: number
  rule: string
}

/** The rule stated in the report beside the result. */
export const SUPPORT_STEEL_RULE = 'As ≥ 0.00075·h·l2 over the column, within the column width plus 1.5h each side (common practice for post-tensioned flat slabs; EN 1992-1-1 sets no amount)'

/** Bonded top reinforcement over a column of a post-tensioned slab (common practice, see SUPPORT_STEEL_RULE). */
export function supportBondedSteel(i: SupportSteelInput): SupportSteel {
  requirePositive('h', i.h)
  requirePositive('panelWidth', i.panelWidth)
  requirePositive('columnWidth', i.columnWidth)
  const As = 0.00075 * i.h * i.panelWidth // common practice: 0.075 % of the gross section of the panel strip
  const bandWidth = Math.min(i.panelWidth, i.columnWidth + 3 * i.h) // column width + 1.5h each side
  return { As, bandWidth, perWidth: As / bandWidth, rule: SUPPORT_STEEL_RULE }
}

/**
 * Bonded steel for a tension zone of a post-tensioned member in service: As = Nc/(0.5 fyk), Nc the
 * resultant of the tensile stress block of the uncracked section (common practice for slabs whose
 * tension exceeds about 0.17√fck, from memory; EN 1992-1-1 sets no such amount).
 */
export function tensionZoneSteel(i: { sigmaTension: number; sigmaCompression: number; h: number; b: number; fyk: number }): { Nc: number; As: number; depthInTension: number } {
  requirePositive('h', i.h)
  requirePositive('b', i.b)
  requireRange('fyk', i.fyk, 200, 700, 'fyk must lie between 200 and 700 MPa (3.2.2(3))')
  if (!(i.sigmaTension >= 0) || !Number.isFinite(i.sigmaTension)) return { Nc: 0, As: 0, depthInTension: 0 }
  const ft = i.sigmaTension
  const fc = Math.max(0, i.sigmaCompression)
  const depthInTension = (ft / (ft + fc)) * i.h // linear stress over the depth
  const Nc = 0.5 * ft * depthInTension * i.b // triangle of tensile stress
  return { Nc, As: Nc / (0.5 * i.fyk), depthInTension } // common practice: steel at 0.5 fy
}
