/**
 * Labels, symbols, display units, decimals and clauses of the part-2 results (ULS, deflection,
 * cracking, site), keyed like RESULT_SPECS by the dot path into Design with [] for any index.
 */
import type { QuantitySpec } from '../contract'
import type { DisplayUnit } from '../../utils/units'

const q = (label: string, unit: DisplayUnit, precision: number, symbol?: string, clause?: string): QuantitySpec => {
  const s: QuantitySpec = { label, unit, precision }
  if (symbol !== undefined) s.symbol = symbol
  if (clause !== undefined) s.clause = clause
  return s
}

const BEND = 'EN 1992-1-1 6.1, 3.1.7(3)'

function bendingFace(face: 'sagging' | 'hogging'): Record<string, QuantitySpec> {
  const p = `uls.sections[].${face}`
  return {
    [`${p}.MEd`]: q(`Design moment, ${face}`, 'kNm', 1, 'M_{Ed}', 'EN 1990 eq. (6.10); EN 1992-1-1 5.10.8(1)'),
    [`${p}.MRd`]: q(`Bending resistance, ${face}`, 'kNm', 1, 'M_{Rd}', BEND),
    [`${p}.x`]: q(`Neutral-axis depth, ${face}`, 'mm', 1, 'x', BEND),
    [`${p}.d`]: q(`Depth of the tension resultant, ${face}`, 'mm', 1, 'd'),
    [`${p}.xOverD`]: q(`Neutral-axis depth ratio, ${face}`, '', 3, 'x/d', 'EN 1992-1-1 5.6.3(2)'),
    [`${p}.xOverDLimit`]: q('Neutral-axis depth ratio, limit', '', 2, '(x/d)_{lim}', 'EN 1992-1-1 5.6.3(2)'),
    [`${p}.tendonStress`]: q(`Tendon stress at ULS, ${face}`, 'MPa', 0, '\\sigma_{pd}', 'EN 1992-1-1 3.3.6(7), 5.10.8(2)'),
    [`${p}.tendonStrain`]: q(`Tendon strain at ULS, ${face}`, '‰', 2, '\\varepsilon_{p}', 'EN 1992-1-1 6.1(2), strain compatibility'),
    [`${p}.utilisation`]: q(`Bending utilisation, ${face}`, '', 2, 'M_{Ed}/M_{Rd}'),
    [`${p}.AsRequired`]: q(`Passive steel to add, ${face}`, 'mm²', 0, 'A_{s,req}', BEND),
  }
}

export const PART2_RESULT_SPECS: Record<string, QuantitySpec> = {
  'uls.factors.gammaG': q('Partial factor on permanent actions', '', 2, '\\gamma_G', 'EN 1990 Table A1.2(B)'),
  'uls.factors.gammaQ': q('Partial factor on the imposed load', '', 2, '\\gamma_Q', 'EN 1990 Table A1.2(B)'),
  'uls.factors.psi0': q('Combination value factor', '', 2, '\\psi_0', 'EN 1990 Table A1.1'),
  'uls.factors.xi': q('Reduction factor of eq. (6.10b)', '', 2, '\\xi', 'EN 1990 Table A1.2(B)'),
  'uls.factors.gammaP': q('Partial factor on the secondary effects of prestress', '', 2, '\\gamma_P', 'EN 1992-1-1 2.4.2.2(1)'),
  'uls.sections[].span': q('Span (index from 0)', '', 0),
  'uls.sections[].x': q('Distance from the left support of the span', 'm', 2, 'x'),
  'uls.sections[].X': q('Distance along the member', 'm', 2, 'X'),
  'uls.sections[].MEdMax': q('Greatest design moment', 'kNm', 1, 'M_{Ed,max}', 'EN 1990 eq. (6.10); EN 1992-1-1 5.1.3, 5.10.8(1)'),
  'uls.sections[].MEdMin': q('Least design moment', 'kNm', 1, 'M_{Ed,min}', 'EN 1990 eq. (6.10); EN 1992-1-1 5.1.3, 5.10.8(1)'),
  'uls.sections[].secondary.min': q('Secondary moment at ULS, least', 'kNm', 1, '\\gamma_P M_2', 'EN 1992-1-1 5.10.7, 2.4.2.2(1)'),
  'uls.sections[].secondary.max': q('Secondary moment at ULS, greatest', 'kNm', 1, '\\gamma_P M_2', 'EN 1992-1-1 5.10.7, 2.4.2.2(1)'),
  'uls.sections[].utilisation': q('Greatest bending utilisation at the section', '', 2, 'U'),
  ...bendingFace('sagging'),
  ...bendingFace('hogging'),
  'uls.shear[].support': q('Support (index from 0)', '', 0),
  'uls.shear[].span': q('Span (index from 0)', '', 0),
  'uls.shear[].x': q('Distance from the left support of the span', 'm', 2, 'x'),
  'uls.shear[].VEd': q('Design shear force', 'kN', 1, 'V_{Ed}', 'EN 1990 eq. (6.10); EN 1992-1-1 5.1.3'),
  'uls.shear[].Vsecondary': q('Secondary shear of prestress at ULS', 'kN', 1, 'V_2', 'EN 1992-1-1 5.10.7'),
  'uls.shear[].d': q('Effective depth for shear', 'mm', 0, 'd', 'EN 1992-1-1 6.2.2(1)'),
  'uls.shear[].sigmaCp': q('Mean precompression (≤ 0.2 fcd)', 'MPa', 2, '\\sigma_{cp}', 'EN 1992-1-1 6.2.2(1)'),
  'uls.shear[].VRdc': q('Shear resistance without shear reinforcement', 'kN', 1, 'V_{Rd,c}', 'EN 1992-1-1 eq. (6.2.a/b)'),
  'uls.shear[].VRdcUncracked': q('Shear resistance, uncracked in flexure', 'kN', 1, 'V_{Rd,c}', 'EN 1992-1-1 6.2.2(2) eq. (6.4)'),
  'uls.shear[].VRd': q('Shear resistance used for the check', 'kN', 1, 'V_{Rd}', 'EN 1992-1-1 6.2'),
  'uls.shear[].AswPerS': q('Links needed', 'mm²/m', 0, 'A_{sw}/s', 'EN 1992-1-1 eq. (6.8), (9.5N)'),
  'uls.shear[].cotTheta': q('Strut inclination', '', 2, '\\cot\\theta', 'EN 1992-1-1 6.2.3(2)'),
  'uls.shear[].VRdMax': q('Strut crushing resistance', 'kN', 1, 'V_{Rd,max}', 'EN 1992-1-1 eq. (6.9), (6.11aN)'),
  'uls.shear[].utilisation': q('Shear utilisation', '', 2, 'V_{Ed}/V_{Rd}'),
  'uls.reinforcement.AsMinBottom': q('Least tension steel, bottom', 'mm²', 0, 'A_{s,min}', 'EN 1992-1-1 eq. (9.1N)'),
  'uls.reinforcement.AsMinTop': q('Least tension steel, top', 'mm²', 0, 'A_{s,min}', 'EN 1992-1-1 eq. (9.1N)'),
  'uls.reinforcement.AsMax': q('Greatest longitudinal steel', 'mm²', 0, 'A_{s,max}', 'EN 1992-1-1 9.2.1.1(3)'),
  'uls.reinforcement.providedBottom': q('Bottom bars provided', 'mm²', 0, 'A_{s,bot}'),
  'uls.reinforcement.providedTop': q('Top bars provided', 'mm²', 0, 'A_{s,top}'),
  'uls.reinforcement.bondedTendon': q('Bonded tendon area counted with the bars', 'mm²', 0, 'A_p', 'common practice'),
  'uls.reinforcement.supportSteel.As': q('Bonded top steel over the supports', 'mm²', 0, 'A_{s,sup}', 'common practice: 0.075 % of h × panel width'),
  'uls.reinforcement.supportSteel.bandWidth': q('Width the support steel is placed in', 'mm', 0, 'c + 3h', 'common practice'),
  'uls.reinforcement.supportSteel.perWidth': q('Support steel within its band', 'mm²/m', 0, 'A_{s,sup}/b', 'common practice'),
  'uls.proposal.AsBottom': q('Bottom bars to add (worst section)', 'mm²', 0, 'A_{s,bot,req}', BEND),
  'uls.proposal.AsTop': q('Top bars to add (worst section)', 'mm²', 0, 'A_{s,top,req}', BEND),
  'uls.punching.support': q('Support of the column (index from 0)', '', 0),
  'uls.punching.VEd': q('Column reaction at ULS', 'kN', 1, 'V_{Ed}', 'EN 1990 eq. (6.10)'),
  'uls.punching.Vpd': q('Vertical component of the tendons at the control perimeter', 'kN', 1, 'V_{pd}', 'EN 1992-1-1 6.4.3'),
  'uls.punching.d': q('Mean effective depth', 'mm', 0, 'd_{eff}', 'EN 1992-1-1 eq. (6.32)'),
  'uls.punching.u0': q('Column perimeter', 'mm', 0, 'u_0', 'EN 1992-1-1 6.4.5(3)'),
  'uls.punching.u1': q('Basic control perimeter at 2d', 'mm', 0, 'u_1', 'EN 1992-1-1 6.4.2'),
  'uls.punching.beta': q('Eccentricity factor', '', 2, '\\beta', 'EN 1992-1-1 6.4.3(6), Fig. 6.21N'),
  'uls.punching.rhoL': q('Bonded tension steel ratio', '%', 2, '\\rho_l', 'EN 1992-1-1 6.4.4(1)'),
  'uls.punching.sigmaCp': q('Mean precompression', 'MPa', 2, '\\sigma_{cp}', 'EN 1992-1-1 6.4.4(1)'),
  'uls.punching.vEd': q('Punching shear stress at u1', 'MPa', 3, 'v_{Ed}', 'EN 1992-1-1 eq. (6.38)'),
  'uls.punching.vRdc': q('Punching resistance without shear reinforcement', 'MPa', 3, 'v_{Rd,c}', 'EN 1992-1-1 eq. (6.47)'),
  'uls.punching.vEdFace': q('Shear stress at the column face', 'MPa', 3, 'v_{Ed,0}', 'EN 1992-1-1 6.4.5(3)'),
  'uls.punching.vRdMax': q('Greatest punching resistance at the column face', 'MPa', 3, 'v_{Rd,max}', 'EN 1992-1-1 6.4.5(3)'),
  'uls.punching.utilisation': q('Punching utilisation at u1', '', 2, 'v_{Ed}/v_{Rd,c}'),
  'uls.punching.utilisationFace': q('Punching utilisation at the column face', '', 2, 'v_{Ed,0}/v_{Rd,max}'),

  'deflection.phi': q('Creep coefficient', '', 2, '\\varphi(\\infty, t_0)', 'EN 1992-1-1 Annex B'),
  'deflection.EcEff': q('Effective modulus', 'GPa', 1, 'E_{c,eff}', 'EN 1992-1-1 eq. (7.20)'),
  'deflection.unbalanced[]': q('Unbalanced quasi-permanent load', 'kN/m', 2, 'w_{qp} - w_{bal}', 'EN 1990 eq. (6.16b); Lin, load balancing'),
  'deflection.spans[].span': q('Span (index from 0)', '', 0),
  'deflection.spans[].L': q('Span length', 'm', 2, 'L'),
  'deflection.spans[].shortTerm.down': q('Short-term deflection, downward', 'mm', 1, '\\delta_{0}', 'EN 1992-1-1 7.4.3'),
  'deflection.spans[].shortTerm.up': q('Short-term deflection, upward', 'mm', 1, '\\delta_{0}', 'EN 1992-1-1 7.4.3'),
  'deflection.spans[].shortTerm.at': q('Where the short-term deflection is greatest', 'm', 2, 'x'),
  'deflection.spans[].longTerm.down': q('Long-term deflection, downward', 'mm', 1, '\\delta_{\\infty}', 'EN 1992-1-1 7.4.3, eq. (7.20)'),
  'deflection.spans[].longTerm.up': q('Long-term deflection, upward', 'mm', 1, '\\delta_{\\infty}', 'EN 1992-1-1 7.4.3, eq. (7.20)'),
  'deflection.spans[].longTerm.at': q('Where the long-term deflection is greatest', 'm', 2, 'x'),
  'deflection.spans[].afterConstruction': q('Deflection after construction (long less short term)', 'mm', 1, '\\Delta\\delta', 'EN 1992-1-1 7.4.1(5)'),
  'deflection.spans[].limitTotal': q('Deflection limit, total', 'mm', 1, 'L/250', 'EN 1992-1-1 7.4.1(4)'),
  'deflection.spans[].limitAfter': q('Deflection limit, after construction', 'mm', 1, 'L/500', 'EN 1992-1-1 7.4.1(5)'),
  'deflection.spans[].limitEngineer': q('Deflection limit set by the engineer', 'mm', 1, '\\delta_{lim}'),
  'deflection.spans[].utilisation': q('Deflection utilisation', '', 2, '\\delta/\\delta_{lim}'),
  'deflection.spans[].McrSagging': q('Net cracking moment, sagging', 'kNm', 1, 'M_{cr}', 'EN 1992-1-1 7.1(2), 7.4.3(3)'),
  'deflection.spans[].McrHogging': q('Net cracking moment, hogging', 'kNm', 1, 'M_{cr}', 'EN 1992-1-1 7.1(2), 7.4.3(3)'),
  'deflection.spans[].IcrSagging': q('Cracked second moment, sagging', 'mm⁴', 0, 'I_{II}', 'EN 1992-1-1 7.4.3(3)'),
  'deflection.spans[].IcrHogging': q('Cracked second moment, hogging', 'mm⁴', 0, 'I_{II}', 'EN 1992-1-1 7.4.3(3)'),
  'deflection.series.x[]': q('Distance along the member', 'm', 2, 'X'),
  'deflection.series.span[]': q('Span (index from 0)', '', 0),
  'deflection.series.shortTerm[]': q('Short-term deflection', 'mm', 1, '\\delta_0'),
  'deflection.series.longTerm[]': q('Long-term deflection', 'mm', 1, '\\delta_{\\infty}'),

  'cracking.wmax': q('Crack width limit', 'mm', 2, 'w_{max}', 'EN 1992-1-1 Table 7.1N'),
  'cracking.fctEff': q('Effective tensile strength', 'MPa', 2, 'f_{ct,eff}', 'EN 1992-1-1 7.3.2(2)'),
  'cracking.sections[].X': q('Distance along the member', 'm', 2, 'X'),
  'cracking.sections[].tension': q('Greatest tension of the uncracked section', 'MPa', 2, '\\sigma_{ct}', 'EN 1992-1-1 7.1(2)'),
  'cracking.sections[].sigmaS': q('Stress in the tension steel, cracked section', 'MPa', 0, '\\sigma_s', 'EN 1992-1-1 7.3.4(1)'),
  'cracking.sections[].x': q('Neutral-axis depth, cracked section', 'mm', 1, 'x', 'EN 1992-1-1 7.3.4(1)'),
  'cracking.sections[].srMax': q('Largest crack spacing', 'mm', 0, 's_{r,max}', 'EN 1992-1-1 eq. (7.11), (7.14)'),
  'cracking.sections[].wk': q('Crack width', 'mm', 3, 'w_k', 'EN 1992-1-1 eq. (7.8)'),
  'cracking.decompressionSections[].X': q('Distance along the member', 'm', 2, 'X'),
  'cracking.decompressionSections[].level': q('Depth checked for decompression', 'mm', 0, 'y_{dec}', 'EN 1992-1-1 7.3.1(5)'),
  'cracking.decompressionSections[].stress': q('Concrete stress at that depth', 'MPa', 2, '\\sigma_c', 'EN 1992-1-1 7.3.1(5)'),

  'site.heights.spacing': q('Station spacing', 'mm', 0, 's'),
  'site.heights.roundTo': q('Chair heights rounded to', 'mm', 0),
  'site.heights.outside': q('Stations where the duct leaves the section', '', 0),
  'site.heights.spans[].span': q('Span (index from 0)', '', 0),
  'site.heights.spans[].L': q('Span length', 'm', 2, 'L'),
  'site.stressing.tolerance': q('Acceptance band on measured extensions', '%', 0, '\\pm', 'common practice'),
  'site.stressing.tendons[].Pjack': q('Jacking force', 'kN', 1, 'P_{max}', 'EN 1992-1-1 5.10.2.1'),
  'site.stressing.tendons[].Ap': q('Steel area of the tendon', 'mm²', 0, 'A_p'),
  'site.stressing.tendons[].length': q('Tendon length along its profile', 'm', 2, 'L_t'),
  'site.stressing.tendons[].theta': q('Sum of angular deviations', 'rad', 3, '\\theta', 'EN 1992-1-1 5.10.5.2(1)'),
  'site.stressing.tendons[].extension.left': q('Calculated extension at the left end', 'mm', 0, '\\Delta L_{left}', '∫P(x)dx/(Ep Ap), EN 1992-1-1 eq. (5.45)'),
  'site.stressing.tendons[].extension.right': q('Calculated extension at the right end', 'mm', 0, '\\Delta L_{right}', '∫P(x)dx/(Ep Ap), EN 1992-1-1 eq. (5.45)'),
  'site.stressing.tendons[].extension.total': q('Calculated extension, total', 'mm', 0, '\\Delta L', '∫P(x)dx/(Ep Ap)'),
  'site.stressing.tendons[].extensionAfterLockOff': q('Extension after lock-off (draw-in)', 'mm', 0, '\\Delta L_{set}', 'EN 1992-1-1 5.10.5.3'),
  'site.stressing.tendons[].band.lower': q('Acceptance band, lower', 'mm', 0, '\\Delta L_{min}', 'common practice'),
  'site.stressing.tendons[].band.upper': q('Acceptance band, upper', 'mm', 0, '\\Delta L_{max}', 'common practice'),
  'site.stressing.tendons[].forceAfterLockOff.min': q('Least force after lock-off', 'kN', 1, 'P_{min}', 'EN 1992-1-1 5.10.5.3'),
  'site.stressing.tendons[].forceAfterLockOff.max': q('Greatest force after lock-off', 'kN', 1, 'P_{max}', 'EN 1992-1-1 5.10.5.3'),
  'site.stressing.tendons[].checks[].measured': q('Measured extension', 'mm', 0, '\\Delta L_{meas}'),
  'site.stressing.tendons[].checks[].calculated': q('Calculated extension compared', 'mm', 0, '\\Delta L_{calc}'),
  'site.stressing.tendons[].checks[].deviation': q('Deviation of measured from calculated', '%', 1, '\\Delta L_{meas}/\\Delta L_{calc} - 1', 'common practice'),
  'site.stressing.series.s[]': q('Distance along the tendon', 'm', 2, 's'),
  'site.stressing.series.force[][]': q('Force after lock-off', 'kN', 1, 'P(s)', 'EN 1992-1-1 eq. (5.45), 5.10.5.3'),
}

// the height rows appear both as one list and per span
for (const base of ['site.heights.rows[]', 'site.heights.spans[].rows[]']) {
  Object.assign(PART2_RESULT_SPECS, {
    [`${base}.span`]: q('Span (index from 0)', '', 0),
    [`${base}.x`]: q('Distance from the left support of the span', 'm', 2, 'x'),
    [`${base}.xGlobal`]: q('Distance from the first support', 'm', 2, 'X'),
    [`${base}.e`]: q('Tendon eccentricity (below centroid +)', 'mm', 1, 'e'),
    [`${base}.centroid`]: q('Tendon centroid above the soffit', 'mm', 0, 'y_p'),
    [`${base}.underside`]: q('Duct underside above the soffit', 'mm', 0, 'y_{chair}'),
    [`${base}.chair`]: q('Chair height (rounded)', 'mm', 0, 'h_{chair}'),
  })
}
