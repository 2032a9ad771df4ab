/**
 * Labels, symbols, display units, decimals and clauses of every number a report shows, keyed by
 * its dot path into Design with [] for any array index ('sections[].stress.transfer.top'), stage by
 * stage: section and materials, loads, profile, balancing, losses, stresses, Magnel, proposal, ULS,
 * deflection, cracking and the site schedules.
 * Input paths ('input.tendon.spacing', or a proposal's 'proposal.inputPatch.tendon.spacing') take
 * their spec from the input schema's metadata.
 */
import type { QuantitySpec } from '../contract'
import type { DisplayUnit } from '../../utils/units'
import { inputFieldSpecs } from '../input/field-specs'
import type { InputFieldSpec } from '../input/field-specs'

const spec = (label: string, unit: DisplayUnit, precision: number, symbol?: string, clause?: string): QuantitySpec => {
  const s: QuantitySpec = { label, unit, precision }
  if (symbol !== undefined) s.symbol = symbol
  if (clause !== undefined) s.clause = clause
  return s
}

const T31 = 'EN 1992-1-1 Table 3.1'
const STAGE_NAMES = { transfer: 'at transfer', characteristic: 'characteristic', frequent: 'frequent', quasiPermanent: 'quasi-permanent' } as const

function stressSpecs(): Record<string, QuantitySpec> {
  const out: Record<string, QuantitySpec> = {}
  for (const [stage, name] of Object.entries(STAGE_NAMES)) {
    const clause = stage === 'transfer' ? 'EN 1992-1-1 5.10.2.2' : 'EN 1992-1-1 7.2, 7.1(2)'
    out[`sections[].stress.${stage}.top`] = spec(`Top fibre stress, ${name}`, 'MPa', 2, '\\sigma_{top}', clause)
    out[`sections[].stress.${stage}.bottom`] = spec(`Bottom fibre stress, ${name}`, 'MPa', 2, '\\sigma_{bot}', clause)
    out[`sections[].envelope.${stage}.topMin`] = spec(`Top fibre, least stress, ${name}`, 'MPa', 2, '\\sigma_{top,min}', clause)
    out[`sections[].envelope.${stage}.topMax`] = spec(`Top fibre, greatest stress, ${name}`, 'MPa', 2, '\\sigma_{top,max}', clause)
    out[`sections[].envelope.${stage}.bottomMin`] = spec(`Bottom fibre, least stress, ${name}`, 'MPa', 2, '\\sigma_{bot,min}', clause)
    out[`sections[].envelope.${stage}.bottomMax`] = spec(`Bottom fibre, greatest stress, ${name}`, 'MPa', 2, '\\sigma_{bot,max}', clause)
    const lc = stage === 'transfer' ? 'EN 1992-1-1 5.10.2.2(5)' : stage === 'characteristic' ? 'EN 1992-1-1 7.2(2)' : 'EN 1992-1-1 7.2(3)'
    out[`limits.${stage}.compression`] = spec(`Compression limit, ${name}`, 'MPa', 2, '\\sigma_{c,lim}', lc)
    out[`limits.${stage}.tension`] = spec(`Tension limit, ${name}`, 'MPa', 2, 'f_{t,lim}', stage === 'transfer' ? 'EN 1992-1-1 7.1(2), eq. (3.4)' : 'EN 1992-1-1 7.1(2), Table 7.1N')
  }
  for (const [stage, name] of Object.entries(STAGE_NAMES)) {
    if (stage === 'transfer') continue
    out[`sections[].moments.${stage}.min`] = spec(`Least moment, ${name} combination`, 'kNm', 1, 'M_{min}', 'EN 1990 6.5.3, EN 1992-1-1 5.1.3')
    out[`sections[].moments.${stage}.max`] = spec(`Greatest moment, ${name} combination`, 'kNm', 1, 'M_{max}', 'EN 1990 6.5.3, EN 1992-1-1 5.1.3')
  }
  for (const [k, name] of Object.entries({ friction: 'friction', drawIn: 'anchorage draw-in', elasticShortening: 'elastic shortening', creep: 'creep', shrinkage: 'shrinkage', relaxation: 'relaxation', longTerm: 'long-term (creep, shrinkage, relaxation)', total: 'total' })) {
    const clause = { friction: 'EN 1992-1-1 eq. (5.45)', drawIn: 'EN 1992-1-1 5.10.5.3', elasticShortening: 'EN 1992-1-1 eq. (5.44)', creep: 'EN 1992-1-1 eq. (5.46)', shrinkage: 'EN 1992-1-1 eq. (5.46)', relaxation: 'EN 1992-1-1 eq. (5.46), eqs. (3.28)–(3.30)', longTerm: 'EN 1992-1-1 eq. (5.46)', total: 'EN 1992-1-1 5.10.4–5.10.6' }[k]
    out[`losses.${k}.force`] = spec(`Loss by ${name} (mean along the tendon)`, 'kN', 1, '\\Delta P', clause)
    out[`losses.${k}.percent`] = spec(`Loss by ${name}, share of the jacking force`, '%', 1, '\\Delta P / P_{max}', clause)
  }
  for (const stage of ['transfer', 'service'] as const) {
    const name = stage === 'transfer' ? 'at transfer' : 'in service'
    out[`prestressMoments.${stage}.primary[]`] = spec(`Primary moment of prestress at the support, ${name}`, 'kNm', 1, 'M_1 = -P e', 'EN 1992-1-1 5.10.7')
    out[`prestressMoments.${stage}.secondary[]`] = spec(`Secondary moment of prestress at the support, ${name}`, 'kNm', 1, 'M_2', 'EN 1992-1-1 5.10.7')
    out[`prestressMoments.${stage}.total[]`] = spec(`Total moment of prestress at the support, ${name}`, 'kNm', 1, 'M_p', 'EN 1992-1-1 5.10.7')
  }
  return out
}

const BEND = 'EN 1992-1-1 6.1, 3.1.7(3)'

function bendingFace(face: 'sagging' | 'hogging'): Record<string, QuantitySpec> {
  const p = `uls.sections[].${face}`
  return {
    [`${p}.MEd`]: spec(`Design moment, ${face}`, 'kNm', 1, 'M_{Ed}', 'EN 1990 eq. (6.10); EN 1992-1-1 5.10.8(1)'),
    [`${p}.MRd`]: spec(`Bending resistance, ${face}`, 'kNm', 1, 'M_{Rd}', BEND),
    [`${p}.x`]: spec(`Neutral-axis depth, ${face}`, 'mm', 1, 'x', BEND),
    [`${p}.d`]: spec(`Depth of the tension resultant, ${face}`, 'mm', 1, 'd'),
    [`${p}.xOverD`]: spec(`Neutral-axis depth ratio, ${face}`, '', 3, 'x/d', 'EN 1992-1-1 5.6.3(2)'),
    [`${p}.xOverDLimit`]: spec('Neutral-axis depth ratio, limit', '', 2, '(x/d)_{lim}', 'EN 1992-1-1 5.6.3(2)'),
    [`${p}.tendonStress`]: spec(`Tendon stress at ULS, ${face}`, 'MPa', 0, '\\sigma_{pd}', 'EN 1992-1-1 3.3.6(7), 5.10.8(2)'),
    [`${p}.tendonStrain`]: spec(`Tendon strain at ULS, ${face}`, '‰', 2, '\\varepsilon_{p}', 'EN 1992-1-1 6.1(2), strain compatibility'),
    [`${p}.utilisation`]: spec(`Bending utilisation, ${face}`, '', 2, 'M_{Ed}/M_{Rd}'),
    [`${p}.AsRequired`]: spec(`Passive steel to add, ${face}`, 'mm²', 0, 'A_{s,req}', BEND),
  }
}

/** The height rows appear both as one list and per span. */
function heightRowSpecs(): Record<string, QuantitySpec> {
  const out: Record<string, QuantitySpec> = {}
  for (const base of ['site.heights.rows[]', 'site.heights.spans[].rows[]']) {
    Object.assign(out, {
      [`${base}.span`]: spec('Span (index from 0)', '', 0),
      [`${base}.x`]: spec('Distance from the left support of the span', 'm', 2, 'x'),
      [`${base}.xGlobal`]: spec('Distance from the first support', 'm', 2, 'X'),
      [`${base}.e`]: spec('Tendon eccentricity (below centroid +)', 'mm', 1, 'e'),
      [`${base}.centroid`]: spec('Tendon centroid above the soffit', 'mm', 0, 'y_p'),
      [`${base}.underside`]: spec('Duct underside above the soffit', 'mm', 0, 'y_{chair}'),
      [`${base}.chair`]: spec('Chair height (rounded)', 'mm', 0, 'h_{chair}'),
    })
  }
  return out
}

export const RESULT_SPECS: Record<string, QuantitySpec> = {
  'section.h': spec('Overall depth', 'mm', 0, 'h'),
  'section.A': spec('Area of the gross section', 'mm²', 0, 'A_c'),
  'section.yt': spec('Centroid below the top fibre', 'mm', 1, 'y_t'),
  'section.yb': spec('Centroid above the bottom fibre', 'mm', 1, 'y_b'),
  'section.I': spec('Second moment of area', 'mm⁴', 0, 'I_c'),
  'section.Zt': spec('Section modulus, top fibre', 'mm³', 0, 'Z_t', 'Z_t = I/y_t'),
  'section.Zb': spec('Section modulus, bottom fibre', 'mm³', 0, 'Z_b', 'Z_b = I/y_b'),
  'section.u': spec('Perimeter exposed to drying', 'mm', 0, 'u', 'EN 1992-1-1 3.1.4(6)'),
  'section.h0': spec('Notional size', 'mm', 0, 'h_0', 'EN 1992-1-1 3.1.4(6): h0 = 2Ac/u'),
  'section.bTop': spec('Width at the top fibre', 'mm', 0, 'b_{top}'),
  'section.bBottom': spec('Width at the bottom fibre', 'mm', 0, 'b_{bot}'),
  'section.kernTop': spec('Upper kern distance above the centroid', 'mm', 1, 'k_t', 'k_t = Z_b/A'),
  'section.kernBottom': spec('Lower kern distance below the centroid', 'mm', 1, 'k_b', 'k_b = Z_t/A'),
  'section.tributaryWidth': spec('Width loaded', 'mm', 0, 'b_{trib}'),
  'section.spanDepth[]': spec('Span / depth', '', 1, 'L/h', 'common practice: slabs 35–45, band beams 20–30'),
  'concrete.at28.fck': spec('Characteristic cylinder strength', 'MPa', 1, 'f_{ck}', T31),
  'concrete.at28.fcm': spec('Mean cylinder strength', 'MPa', 1, 'f_{cm}', `${T31}: fcm = fck + 8`),
  'concrete.at28.fctm': spec('Mean tensile strength', 'MPa', 2, 'f_{ctm}', T31),
  'concrete.at28.fctk005': spec('Characteristic tensile strength, 5 %', 'MPa', 2, 'f_{ctk,0.05}', T31),
  'concrete.at28.fctk095': spec('Characteristic tensile strength, 95 %', 'MPa', 2, 'f_{ctk,0.95}', T31),
  'concrete.at28.Ecm': spec('Secant modulus of elasticity', 'GPa', 1, 'E_{cm}', T31),
  'concrete.atTransfer.betaCC': spec('Strength development coefficient', '', 3, '\\beta_{cc}(t)', 'EN 1992-1-1 eq. (3.2)'),
  'concrete.atTransfer.fcm': spec('Mean strength at stressing', 'MPa', 1, 'f_{cm}(t)', 'EN 1992-1-1 eq. (3.1)'),
  'concrete.atTransfer.fck': spec('Characteristic strength at stressing', 'MPa', 1, 'f_{ck}(t)', 'EN 1992-1-1 3.1.2(5)'),
  'concrete.atTransfer.fctm': spec('Mean tensile strength at stressing', 'MPa', 2, 'f_{ctm}(t)', 'EN 1992-1-1 eq. (3.4)'),
  'concrete.atTransfer.Ecm': spec('Modulus at stressing', 'GPa', 1, 'E_{cm}(t)', 'EN 1992-1-1 eq. (3.5)'),
  'concrete.atTransfer.age': spec('Age at stressing', 'days', 0, 't_0'),
  'strand.diameter': spec('Nominal strand diameter', 'mm', 1, '\\phi', 'prEN 10138-3'),
  'strand.Ap': spec('Area of one strand', 'mm²', 0, 'A_{p1}', 'prEN 10138-3'),
  'strand.fpk': spec('Tensile strength of strand', 'MPa', 0, 'f_{pk}', 'prEN 10138-3'),
  'strand.fp01k': spec('0.1 % proof stress of strand', 'MPa', 0, 'f_{p0.1k}', 'prEN 10138-3'),
  'strand.Ep': spec('Modulus of strand', 'GPa', 0, 'E_p', 'EN 1992-1-1 3.3.6(3)'),
  'jacking.sigmaPmax': spec('Greatest stress at jacking', 'MPa', 0, '\\sigma_{p,max}', 'EN 1992-1-1 eq. (5.41)'),
  'jacking.Pmax': spec('Greatest jacking force per strand', 'kN', 1, 'P_{max}', 'EN 1992-1-1 5.10.2.1'),
  'jacking.sigmaPm0': spec('Greatest stress after transfer', 'MPa', 0, '\\sigma_{pm0}', 'EN 1992-1-1 eq. (5.43)'),
  'jacking.Pm0': spec('Greatest force after transfer per strand', 'kN', 1, 'P_{m0}', 'EN 1992-1-1 5.10.3(2)'),
  'jacking.sigmaJack': spec('Stress at jacking', 'MPa', 0, '\\sigma_{p,jack}', 'EN 1992-1-1 5.10.2.1'),
  'jacking.PjackStrand': spec('Jacking force per strand', 'kN', 1, 'P_{jack,1}'),
  'jacking.strandsPerTendon': spec('Strands per tendon', '', 0, 'n_s'),
  'jacking.tendonsPerWidth': spec('Tendons in the width modelled', '', 2, 'n_t'),
  'jacking.strands': spec('Strands in the width modelled', '', 2, 'n'),
  'jacking.Ap': spec('Area of prestressing steel', 'mm²', 0, 'A_p'),
  'jacking.Pjack': spec('Jacking force', 'kN', 0, 'P_{max}', 'EN 1992-1-1 5.10.2.1'),
  'eccentricity.top': spec('Greatest eccentricity above the centroid', 'mm', 1, 'e_{top}', 'e = y_t − c − h_d/2 (common practice)'),
  'eccentricity.bottom': spec('Greatest eccentricity below the centroid', 'mm', 1, 'e_{bot}', 'e = y_b − c − h_d/2 (common practice)'),
  'eccentricity.dTop': spec('Top face to tendon centroid at the high point', 'mm', 1, 'd_{top}'),
  'eccentricity.dBottom': spec('Bottom face to tendon centroid at the low point', 'mm', 1, 'd_{bot}'),
  'eccentricity.coverForBond': spec('Least cover to duct for bond', 'mm', 0, 'c_{min,b}', 'EN 1992-1-1 Table 4.2'),
  'profile.supportEcc[]': spec('Tendon eccentricity at the support', 'mm', 1, 'e_{sup}'),
  'profile.spanEcc[]': spec('Tendon eccentricity at the low point', 'mm', 1, 'e_{span}'),
  'profile.lowPointAt[]': spec('Low point, share of the span', '%', 0),
  'profile.inflection': spec('Reverse curve, share of the span', '%', 0, '\\lambda'),
  'profile.drapes[]': spec('Drape (sag below the chord)', 'mm', 1, 'a', 'Lin, load balancing'),
  'profile.lowPointX[]': spec('Low point along the member', 'm', 2, 'x_{low}'),
  'profile.length': spec('Tendon length', 'm', 2, 'L_{tot}'),
  'loads.selfWeight': spec('Self-weight', 'kN/m', 2, 'g_{sw}', 'EN 1991-1-1 5.2'),
  'loads.superimposed': spec('Superimposed dead load', 'kN/m', 2, 'g_{sdl}'),
  'loads.imposed': spec('Imposed load', 'kN/m', 2, 'q_k'),
  'loads.balanced': spec('Load to balance', 'kN/m', 2, 'w_{bal}'),
  'balancing.load': spec('Load to balance', 'kN/m', 2, 'w_{bal}'),
  'balancing.perSpan[]': spec('Force to balance the load in the span', 'kN', 0, 'P = wL^2/8a', 'Lin, load balancing'),
  'balancing.governing': spec('Governing force to balance', 'kN', 0, 'P_{bal}', 'Lin, load balancing'),
  'balancing.strandsNeeded': spec('Strands needed at the mean service force', '', 2, 'n_{req}'),
  'balancing.strandsProvided': spec('Strands provided', '', 2, 'n_{prov}'),
  'balancing.tendonsNeeded': spec('Tendons needed', '', 2, 'n_{t,req}'),
  'balancing.spacingNeeded': spec('Tendon spacing to balance the load', 'mm', 0, 's_{req}'),
  'balancing.balancedProvided[]': spec('Load balanced by the force provided', 'kN/m', 2, 'w = 8Pa/L^2', 'Lin, load balancing'),
  'balancing.ratio[]': spec('Balanced / chosen load', '%', 0, 'w/w_{bal}'),
  'force.jacking': spec('Jacking force', 'kN', 0, 'P_{max}', 'EN 1992-1-1 5.10.2.1'),
  'force.meanAfterFriction': spec('Mean force after friction', 'kN', 0, 'P_{\\mu}', 'EN 1992-1-1 eq. (5.45)'),
  'force.meanAfterDrawIn': spec('Mean force after draw-in', 'kN', 0, 'P_{set}', 'EN 1992-1-1 5.10.5.3'),
  'force.meanTransfer': spec('Mean force at transfer', 'kN', 0, 'P_{m0}', 'EN 1992-1-1 5.10.3'),
  'force.meanService': spec('Mean force in service (after all losses)', 'kN', 0, 'P_{m,\\infty}', 'EN 1992-1-1 5.10.6'),
  'force.maxAfterLockOff': spec('Greatest force after lock-off', 'kN', 0, 'P_{0,max}', 'EN 1992-1-1 5.10.3(2)'),
  'force.drawInLength': spec('Length affected by draw-in', 'm', 2, 'l_{set}', 'l_set = √(Δ Ep Ap / p)'),
  'force.eta': spec('Service / transfer force', '', 3, '\\eta'),
  'force.segments[].number': spec('Segment', '', 0),
  'force.segments[].from': spec('Segment from support', '', 0),
  'force.segments[].to': spec('Segment to support', '', 0),
  'force.segments[].length': spec('Segment length along the tendon', 'm', 2, 'L_{seg}'),
  'force.segments[].theta': spec('Sum of angular deviations over the segment', 'rad', 3, '\\theta', 'EN 1992-1-1 5.10.5.2(1)'),
  'force.segments[].meanAfterFriction': spec('Mean force over the segment after friction', 'kN', 0, 'P_{\\mu}', 'EN 1992-1-1 eq. (5.45)'),
  'force.segments[].meanAfterDrawIn': spec('Mean force over the segment after draw-in', 'kN', 0, 'P_{set}', 'EN 1992-1-1 5.10.5.3'),
  'force.segments[].drawInLength.left': spec('Length affected by draw-in from the segment\'s left end', 'm', 2, 'l_{set}', 'EN 1992-1-1 5.10.5.3, area method'),
  'force.segments[].drawInLength.right': spec('Length affected by draw-in from the segment\'s right end', 'm', 2, 'l_{set}', 'EN 1992-1-1 5.10.5.3, area method'),
  'losses.phi': spec('Creep coefficient', '', 2, '\\varphi(\\infty,t_0)', 'EN 1992-1-1 Annex B eq. (B.1)'),
  'losses.epsCs': spec('Shrinkage strain after stressing', '‰', 3, '\\varepsilon_{cs}', 'EN 1992-1-1 eq. (3.8), Annex B.2'),
  'loadCases.patterns[].loadedSpans[]': spec('Loaded span (index from 0)', '', 0),
  'loadCases.supportMoments.selfWeight[]': spec('Support moment, self-weight', 'kNm', 1, 'M_{sw}'),
  'loadCases.supportMoments.superimposed[]': spec('Support moment, superimposed dead load', 'kNm', 1, 'M_{sdl}'),
  'loadCases.supportMoments.imposed[][]': spec('Support moment, imposed load arrangement', 'kNm', 1, 'M_q', 'EN 1992-1-1 5.1.3'),
  'limits.tendonService': spec('Tendon stress limit in service', 'MPa', 0, 'k_5 f_{pk}', 'EN 1992-1-1 7.2(5)'),
  'sections[].span': spec('Span (index from 0)', '', 0),
  'sections[].x': spec('Distance from the left support of the span', 'm', 2, 'x'),
  'sections[].X': spec('Distance along the member', 'm', 2, 'X'),
  'sections[].e': spec('Tendon eccentricity (below centroid +)', 'mm', 1, 'e'),
  'sections[].force.transfer': spec('Force at transfer', 'kN', 0, 'P_0', 'EN 1992-1-1 5.10.3'),
  'sections[].force.service': spec('Force in service', 'kN', 0, 'P_{\\infty}', 'EN 1992-1-1 5.10.6'),
  'sections[].moments.selfWeight': spec('Moment, self-weight', 'kNm', 1, 'M_{sw}'),
  'sections[].moments.superimposed': spec('Moment, superimposed dead load', 'kNm', 1, 'M_{sdl}'),
  'sections[].moments.imposed.min': spec('Least moment, imposed load (all arrangements)', 'kNm', 1, 'M_{q,min}', 'EN 1992-1-1 5.1.3'),
  'sections[].moments.imposed.max': spec('Greatest moment, imposed load (all arrangements)', 'kNm', 1, 'M_{q,max}', 'EN 1992-1-1 5.1.3'),
  'sections[].moments.transfer': spec('Moment at transfer (self-weight)', 'kNm', 1, 'M_0', 'EN 1992-1-1 5.10.2.2'),
  'sections[].moments.primaryTransfer': spec('Primary moment of prestress at transfer', 'kNm', 1, 'M_1 = -P_0 e', 'EN 1992-1-1 5.10.7'),
  'sections[].moments.secondaryTransfer': spec('Secondary moment of prestress at transfer', 'kNm', 1, 'M_2', 'EN 1992-1-1 5.10.7'),
  'sections[].moments.totalTransfer': spec('Total moment of prestress at transfer', 'kNm', 1, 'M_p', 'EN 1992-1-1 5.10.7'),
  'sections[].moments.primaryService': spec('Primary moment of prestress in service', 'kNm', 1, 'M_1 = -P_\\infty e', 'EN 1992-1-1 5.10.7'),
  'sections[].moments.secondaryService': spec('Secondary moment of prestress in service', 'kNm', 1, 'M_2', 'EN 1992-1-1 5.10.7'),
  'sections[].moments.totalService': spec('Total moment of prestress in service', 'kNm', 1, 'M_p', 'EN 1992-1-1 5.10.7'),
  'sections[].utilisation': spec('Greatest stress utilisation at the section', '', 2, 'U'),
  'sections[].magnel.lines[].forceFactor': spec('Factor on the transfer force', '', 3, 'r \\eta', 'EN 1992-1-1 5.10.9'),
  'sections[].magnel.lines[].M': spec('Moment of the condition (with the secondary moment)', 'kNm', 1, 'M'),
  'sections[].magnel.lines[].limit': spec('Stress limit of the condition', 'MPa', 2, 'f'),
  'sections[].magnel.lines[].ae': spec('Coefficient of e in the condition', '', 6, 'a_e'),
  'sections[].magnel.lines[].au': spec('Coefficient of 1/P in the condition', '', 3, 'a_u'),
  'sections[].magnel.lines[].b': spec('Right-hand side of the condition', '', 6, 'b'),
  'sections[].magnel.eLimits.min': spec('Eccentricity limit above the centroid', 'mm', 1, 'e_{min}'),
  'sections[].magnel.eLimits.max': spec('Eccentricity limit below the centroid', 'mm', 1, 'e_{max}'),
  'sections[].magnel.minP': spec('Least force at transfer for this section', 'kN', 0, 'P_{min}', 'Magnel diagram'),
  'sections[].magnel.eAtMinP': spec('Eccentricity at the least force', 'mm', 1, 'e_{P,min}', 'Magnel diagram'),
  'sections[].magnel.region[].e': spec('Region vertex, eccentricity', 'mm', 1, 'e'),
  'sections[].magnel.region[].invP': spec('Region vertex, 1/P', '1/MN', 3, '1/P'),
  'checks[].actual': spec('Value checked (unit given with the check)', '', 2),
  'checks[].limit': spec('Limit (unit given with the check)', '', 2),
  'checks[].utilisation': spec('Utilisation', '', 2, 'U'),
  'precompression.transfer': spec('Average precompression at transfer', 'MPa', 2, 'P_0/A', 'common practice'),
  'precompression.service': spec('Average precompression in service', 'MPa', 2, 'P_\\infty/A', 'common practice'),
  'precompression.min': spec('Least average precompression (practice)', 'MPa', 2, undefined, 'common practice'),
  'precompression.max': spec('Greatest average precompression (practice)', 'MPa', 2, undefined, 'common practice'),
  'proposal.strands': spec('Strands proposed in the width modelled', '', 2, 'n'),
  'proposal.forceTransfer': spec('Mean force at transfer, proposed', 'kN', 0, 'P_0', 'Magnel diagram'),
  'proposal.spacing': spec('Tendon spacing proposed', 'mm', 0, 's'),
  'proposal.count': spec('Tendons proposed', '', 0, 'n_t'),
  'proposal.supportEcc[]': spec('Eccentricity at the support, proposed', 'mm', 1, 'e_{sup}'),
  'proposal.spanEcc[]': spec('Eccentricity at the low point, proposed', 'mm', 1, 'e_{span}'),
  'proposal.barsBottom': spec('Bottom bars added by the proposal', 'mm²', 0, '\\Delta A_{s,bot}', 'EN 1992-1-1 6.1, eq. (9.1N)'),
  'proposal.barsTop': spec('Top bars added by the proposal', 'mm²', 0, '\\Delta A_{s,top}', 'EN 1992-1-1 6.1, eq. (9.1N)'),
  'series.X[]': spec('Distance along the member', 'm', 2, 'X'),
  'series.span[]': spec('Span (index from 0)', '', 0),
  'series.x[]': spec('Distance from the left support of the span', 'm', 2, 'x'),
  'series.e[]': spec('Tendon eccentricity', 'mm', 1, 'e'),
  'series.eLimitTop[]': spec('Eccentricity limit, top', 'mm', 1, '-e_{top}'),
  'series.eLimitBottom[]': spec('Eccentricity limit, bottom', 'mm', 1, 'e_{bot}'),
  'series.depth[]': spec('Section depth', 'mm', 0, 'h'),
  'series.centroid[]': spec('Centroid below the top fibre', 'mm', 1, 'y_t'),
  'series.forceFriction[]': spec('Force after friction', 'kN', 0, 'P_\\mu(x)', 'EN 1992-1-1 eq. (5.45)'),
  'series.forceDrawIn[]': spec('Force after draw-in', 'kN', 0, 'P_{set}(x)', 'EN 1992-1-1 5.10.5.3'),
  'series.forceTransfer[]': spec('Force at transfer', 'kN', 0, 'P_0(x)', 'EN 1992-1-1 5.10.3'),
  'series.forceService[]': spec('Force in service', 'kN', 0, 'P_\\infty(x)', 'EN 1992-1-1 5.10.6'),
  'series.primaryTransfer[]': spec('Primary moment at transfer', 'kNm', 1, 'M_1', 'EN 1992-1-1 5.10.7'),
  'series.secondaryTransfer[]': spec('Secondary moment at transfer', 'kNm', 1, 'M_2', 'EN 1992-1-1 5.10.7'),
  'series.totalTransfer[]': spec('Total prestress moment at transfer', 'kNm', 1, 'M_p', 'EN 1992-1-1 5.10.7'),
  'series.primaryService[]': spec('Primary moment in service', 'kNm', 1, 'M_1', 'EN 1992-1-1 5.10.7'),
  'series.secondaryService[]': spec('Secondary moment in service', 'kNm', 1, 'M_2', 'EN 1992-1-1 5.10.7'),
  'series.totalService[]': spec('Total prestress moment in service', 'kNm', 1, 'M_p', 'EN 1992-1-1 5.10.7'),
  'series.momentTransfer[]': spec('Moment at transfer', 'kNm', 1, 'M_0'),
  'series.momentServiceMax[]': spec('Greatest moment, characteristic', 'kNm', 1, 'M_{k,max}', 'EN 1990 eq. (6.14b)'),
  'series.momentServiceMin[]': spec('Least moment, characteristic', 'kNm', 1, 'M_{k,min}', 'EN 1990 eq. (6.14b)'),
  'series.stressTransferTopMin[]': spec('Top fibre, least stress at transfer', 'MPa', 2, '\\sigma_{top}'),
  'series.stressTransferTopMax[]': spec('Top fibre, greatest stress at transfer', 'MPa', 2, '\\sigma_{top}'),
  'series.stressTransferBottomMin[]': spec('Bottom fibre, least stress at transfer', 'MPa', 2, '\\sigma_{bot}'),
  'series.stressTransferBottomMax[]': spec('Bottom fibre, greatest stress at transfer', 'MPa', 2, '\\sigma_{bot}'),
  'series.stressServiceTopMin[]': spec('Top fibre, least stress in service', 'MPa', 2, '\\sigma_{top}'),
  'series.stressServiceTopMax[]': spec('Top fibre, greatest stress in service', 'MPa', 2, '\\sigma_{top}'),
  'series.stressServiceBottomMin[]': spec('Bottom fibre, least stress in service', 'MPa', 2, '\\sigma_{bot}'),
  'series.stressServiceBottomMax[]': spec('Bottom fibre, greatest stress in service', 'MPa', 2, '\\sigma_{bot}'),
  'series.limitTransferCompression[]': spec('Compression limit at transfer', 'MPa', 2, undefined, 'EN 1992-1-1 5.10.2.2(5)'),
  'series.limitTransferTension[]': spec('Tension limit at transfer (negative)', 'MPa', 2, undefined, 'EN 1992-1-1 7.1(2)'),
  'series.limitServiceCompression[]': spec('Compression limit, characteristic', 'MPa', 2, undefined, 'EN 1992-1-1 7.2(2)'),
  'series.limitServiceTension[]': spec('Tension limit in service (negative)', 'MPa', 2, undefined, 'EN 1992-1-1 7.1(2), Table 7.1N'),
  'series.momentUlsMax[]': spec('Greatest design moment, ULS', 'kNm', 1, 'M_{Ed,max}', 'EN 1990 eq. (6.10), EN 1992-1-1 5.10.8(1)'),
  'series.momentUlsMin[]': spec('Least design moment, ULS', 'kNm', 1, 'M_{Ed,min}', 'EN 1990 eq. (6.10), EN 1992-1-1 5.10.8(1)'),
  'series.shearUlsMax[]': spec('Greatest design shear, ULS', 'kN', 1, 'V_{Ed,max}', 'EN 1990 eq. (6.10), EN 1992-1-1 5.10.8(1)'),
  'series.shearUlsMin[]': spec('Least design shear, ULS', 'kN', 1, 'V_{Ed,min}', 'EN 1990 eq. (6.10), EN 1992-1-1 5.10.8(1)'),
  ...stressSpecs(),
  // ultimate limit state, deflection, cracking and the site schedules
  'uls.factors.gammaG': spec('Partial factor on permanent actions', '', 2, '\\gamma_G', 'EN 1990 Table A1.2(B)'),
  'uls.factors.gammaQ': spec('Partial factor on the imposed load', '', 2, '\\gamma_Q', 'EN 1990 Table A1.2(B)'),
  'uls.factors.psi0': spec('Combination value factor', '', 2, '\\psi_0', 'EN 1990 Table A1.1'),
  'uls.factors.xi': spec('Reduction factor of eq. (6.10b)', '', 2, '\\xi', 'EN 1990 Table A1.2(B)'),
  'uls.factors.gammaP': spec('Partial factor on the secondary effects of prestress', '', 2, '\\gamma_P', 'EN 1992-1-1 2.4.2.2(1)'),
  'uls.sections[].span': spec('Span (index from 0)', '', 0),
  'uls.sections[].x': spec('Distance from the left support of the span', 'm', 2, 'x'),
  'uls.sections[].X': spec('Distance along the member', 'm', 2, 'X'),
  'uls.sections[].MEdMax': spec('Greatest design moment', 'kNm', 1, 'M_{Ed,max}', 'EN 1990 eq. (6.10); EN 1992-1-1 5.1.3, 5.10.8(1)'),
  'uls.sections[].MEdMin': spec('Least design moment', 'kNm', 1, 'M_{Ed,min}', 'EN 1990 eq. (6.10); EN 1992-1-1 5.1.3, 5.10.8(1)'),
  'uls.sections[].secondary.min': spec('Secondary moment at ULS, least', 'kNm', 1, '\\gamma_P M_2', 'EN 1992-1-1 5.10.7, 2.4.2.2(1)'),
  'uls.sections[].secondary.max': spec('Secondary moment at ULS, greatest', 'kNm', 1, '\\gamma_P M_2', 'EN 1992-1-1 5.10.7, 2.4.2.2(1)'),
  'uls.sections[].utilisation': spec('Greatest bending utilisation at the section', '', 2, 'U'),
  ...bendingFace('sagging'),
  ...bendingFace('hogging'),
  'uls.shear[].support': spec('Support (index from 0)', '', 0),
  'uls.shear[].span': spec('Span (index from 0)', '', 0),
  'uls.shear[].x': spec('Distance from the left support of the span', 'm', 2, 'x'),
  'uls.shear[].VEd': spec('Design shear force', 'kN', 1, 'V_{Ed}', 'EN 1990 eq. (6.10); EN 1992-1-1 5.1.3'),
  'uls.shear[].Vsecondary': spec('Secondary shear of prestress at ULS', 'kN', 1, 'V_2', 'EN 1992-1-1 5.10.7'),
  'uls.shear[].d': spec('Effective depth for shear', 'mm', 0, 'd', 'EN 1992-1-1 6.2.2(1)'),
  'uls.shear[].sigmaCp': spec('Mean precompression (≤ 0.2 fcd)', 'MPa', 2, '\\sigma_{cp}', 'EN 1992-1-1 6.2.2(1)'),
  'uls.shear[].VRdc': spec('Shear resistance without shear reinforcement', 'kN', 1, 'V_{Rd,c}', 'EN 1992-1-1 eq. (6.2.a/b)'),
  'uls.shear[].VRdcUncracked': spec('Shear resistance, uncracked in flexure', 'kN', 1, 'V_{Rd,c}', 'EN 1992-1-1 6.2.2(2) eq. (6.4)'),
  'uls.shear[].VRd': spec('Shear resistance used for the check', 'kN', 1, 'V_{Rd}', 'EN 1992-1-1 6.2'),
  'uls.shear[].AswPerS': spec('Links needed', 'mm²/m', 0, 'A_{sw}/s', 'EN 1992-1-1 eq. (6.8), (9.5N)'),
  'uls.shear[].cotTheta': spec('Strut inclination', '', 2, '\\cot\\theta', 'EN 1992-1-1 6.2.3(2)'),
  'uls.shear[].VRdMax': spec('Strut crushing resistance', 'kN', 1, 'V_{Rd,max}', 'EN 1992-1-1 eq. (6.9), (6.11aN)'),
  'uls.shear[].utilisation': spec('Shear utilisation', '', 2, 'V_{Ed}/V_{Rd}'),
  'uls.reinforcement.AsMinBottom': spec('Least tension steel, bottom', 'mm²', 0, 'A_{s,min}', 'EN 1992-1-1 eq. (9.1N)'),
  'uls.reinforcement.AsMinTop': spec('Least tension steel, top', 'mm²', 0, 'A_{s,min}', 'EN 1992-1-1 eq. (9.1N)'),
  'uls.reinforcement.AsMax': spec('Greatest longitudinal steel', 'mm²', 0, 'A_{s,max}', 'EN 1992-1-1 9.2.1.1(3)'),
  'uls.reinforcement.providedBottom': spec('Bottom bars provided', 'mm²', 0, 'A_{s,bot}'),
  'uls.reinforcement.providedTop': spec('Top bars provided', 'mm²', 0, 'A_{s,top}'),
  'uls.reinforcement.bondedTendon': spec('Bonded tendon area counted with the bars', 'mm²', 0, 'A_p', 'common practice'),
  'uls.reinforcement.supportSteel.As': spec('Bonded top steel over the supports', 'mm²', 0, 'A_{s,sup}', 'common practice: 0.075 % of h × panel width'),
  'uls.reinforcement.supportSteel.bandWidth': spec('Width the support steel is placed in', 'mm', 0, 'c + 3h', 'common practice'),
  'uls.reinforcement.supportSteel.perWidth': spec('Support steel within its band', 'mm²/m', 0, 'A_{s,sup}/b', 'common practice'),
  'uls.proposal.AsBottom': spec('Bottom bars to add (worst section)', 'mm²', 0, 'A_{s,bot,req}', BEND),
  'uls.proposal.AsTop': spec('Top bars to add (worst section)', 'mm²', 0, 'A_{s,top,req}', BEND),
  'uls.punching.support': spec('Support of the column (index from 0)', '', 0),
  'uls.punching.VEd': spec('Column reaction at ULS', 'kN', 1, 'V_{Ed}', 'EN 1990 eq. (6.10)'),
  'uls.punching.Vpd': spec('Vertical component of the tendons at the control perimeter', 'kN', 1, 'V_{pd}', 'EN 1992-1-1 6.4.3'),
  'uls.punching.d': spec('Mean effective depth', 'mm', 0, 'd_{eff}', 'EN 1992-1-1 eq. (6.32)'),
  'uls.punching.u0': spec('Column perimeter', 'mm', 0, 'u_0', 'EN 1992-1-1 6.4.5(3)'),
  'uls.punching.u1': spec('Basic control perimeter at 2d', 'mm', 0, 'u_1', 'EN 1992-1-1 6.4.2'),
  'uls.punching.beta': spec('Eccentricity factor', '', 2, '\\beta', 'EN 1992-1-1 6.4.3(6), Fig. 6.21N'),
  'uls.punching.rhoL': spec('Bonded tension steel ratio', '%', 2, '\\rho_l', 'EN 1992-1-1 6.4.4(1)'),
  'uls.punching.sigmaCp': spec('Mean precompression', 'MPa', 2, '\\sigma_{cp}', 'EN 1992-1-1 6.4.4(1)'),
  'uls.punching.vEd': spec('Punching shear stress at u1', 'MPa', 3, 'v_{Ed}', 'EN 1992-1-1 eq. (6.38)'),
  'uls.punching.vRdc': spec('Punching resistance without shear reinforcement', 'MPa', 3, 'v_{Rd,c}', 'EN 1992-1-1 eq. (6.47)'),
  'uls.punching.vEdFace': spec('Shear stress at the column face', 'MPa', 3, 'v_{Ed,0}', 'EN 1992-1-1 6.4.5(3)'),
  'uls.punching.vRdMax': spec('Greatest punching resistance at the column face', 'MPa', 3, 'v_{Rd,max}', 'EN 1992-1-1 6.4.5(3)'),
  'uls.punching.utilisation': spec('Punching utilisation at u1', '', 2, 'v_{Ed}/v_{Rd,c}'),
  'uls.punching.utilisationFace': spec('Punching utilisation at the column face', '', 2, 'v_{Ed,0}/v_{Rd,max}'),

  'deflection.phi': spec('Creep coefficient', '', 2, '\\varphi(\\infty, t_0)', 'EN 1992-1-1 Annex B'),
  'deflection.EcEff': spec('Effective modulus', 'GPa', 1, 'E_{c,eff}', 'EN 1992-1-1 eq. (7.20)'),
  'deflection.unbalanced[]': spec('Unbalanced quasi-permanent load', 'kN/m', 2, 'w_{qp} - w_{bal}', 'EN 1990 eq. (6.16b); Lin, load balancing'),
  'deflection.spans[].span': spec('Span (index from 0)', '', 0),
  'deflection.spans[].L': spec('Span length', 'm', 2, 'L'),
  'deflection.spans[].shortTerm.down': spec('Short-term deflection, downward', 'mm', 1, '\\delta_{0}', 'EN 1992-1-1 7.4.3'),
  'deflection.spans[].shortTerm.up': spec('Short-term deflection, upward', 'mm', 1, '\\delta_{0}', 'EN 1992-1-1 7.4.3'),
  'deflection.spans[].shortTerm.at': spec('Where the short-term deflection is greatest', 'm', 2, 'x'),
  'deflection.spans[].longTerm.down': spec('Long-term deflection, downward', 'mm', 1, '\\delta_{\\infty}', 'EN 1992-1-1 7.4.3, eq. (7.20)'),
  'deflection.spans[].longTerm.up': spec('Long-term deflection, upward', 'mm', 1, '\\delta_{\\infty}', 'EN 1992-1-1 7.4.3, eq. (7.20)'),
  'deflection.spans[].longTerm.at': spec('Where the long-term deflection is greatest', 'm', 2, 'x'),
  'deflection.spans[].shortTerm.value': spec('Short-term deflection, downward + / upward (camber) −', 'mm', 1, '\\delta_{0}', 'EN 1992-1-1 7.4.3'),
  'deflection.spans[].longTerm.value': spec('Long-term deflection, downward + / upward (camber) −', 'mm', 1, '\\delta_{\\infty}', 'EN 1992-1-1 7.4.3, eq. (7.20)'),
  'deflection.spans[].limitCamber': spec('Upward deflection (camber) limit', 'mm', 1, 'L/250', 'common practice (appearance)'),
  'deflection.spans[].afterConstruction': spec('Deflection after construction (long less short term)', 'mm', 1, '\\Delta\\delta', 'EN 1992-1-1 7.4.1(5)'),
  'deflection.spans[].limitTotal': spec('Deflection limit, total', 'mm', 1, 'L/250', 'EN 1992-1-1 7.4.1(4)'),
  'deflection.spans[].limitAfter': spec('Deflection limit, after construction', 'mm', 1, 'L/500', 'EN 1992-1-1 7.4.1(5)'),
  'deflection.spans[].limitEngineer': spec('Deflection limit set by the engineer', 'mm', 1, '\\delta_{lim}'),
  'deflection.spans[].utilisation': spec('Deflection utilisation', '', 2, '\\delta/\\delta_{lim}'),
  'deflection.spans[].McrSagging': spec('Net cracking moment, sagging', 'kNm', 1, 'M_{cr}', 'EN 1992-1-1 7.1(2), 7.4.3(3)'),
  'deflection.spans[].McrHogging': spec('Net cracking moment, hogging', 'kNm', 1, 'M_{cr}', 'EN 1992-1-1 7.1(2), 7.4.3(3)'),
  'deflection.spans[].IcrSagging': spec('Cracked second moment, sagging', 'mm⁴', 0, 'I_{II}', 'EN 1992-1-1 7.4.3(3)'),
  'deflection.spans[].IcrHogging': spec('Cracked second moment, hogging', 'mm⁴', 0, 'I_{II}', 'EN 1992-1-1 7.4.3(3)'),
  'deflection.series.x[]': spec('Distance along the member', 'm', 2, 'X'),
  'deflection.series.span[]': spec('Span (index from 0)', '', 0),
  'deflection.series.shortTerm[]': spec('Short-term deflection', 'mm', 1, '\\delta_0'),
  'deflection.series.longTerm[]': spec('Long-term deflection', 'mm', 1, '\\delta_{\\infty}'),

  'cracking.wmax': spec('Crack width limit', 'mm', 2, 'w_{max}', 'EN 1992-1-1 Table 7.1N'),
  'cracking.fctEff': spec('Effective tensile strength', 'MPa', 2, 'f_{ct,eff}', 'EN 1992-1-1 7.3.2(2)'),
  'cracking.sections[].X': spec('Distance along the member', 'm', 2, 'X'),
  'cracking.sections[].tension': spec('Greatest tension of the uncracked section', 'MPa', 2, '\\sigma_{ct}', 'EN 1992-1-1 7.1(2)'),
  'cracking.sections[].sigmaS': spec('Stress in the tension steel, cracked section', 'MPa', 0, '\\sigma_s', 'EN 1992-1-1 7.3.4(1)'),
  'cracking.sections[].x': spec('Neutral-axis depth, cracked section', 'mm', 1, 'x', 'EN 1992-1-1 7.3.4(1)'),
  'cracking.sections[].srMax': spec('Largest crack spacing', 'mm', 0, 's_{r,max}', 'EN 1992-1-1 eq. (7.11), (7.14)'),
  'cracking.sections[].wk': spec('Crack width', 'mm', 3, 'w_k', 'EN 1992-1-1 eq. (7.8)'),
  'cracking.decompressionSections[].X': spec('Distance along the member', 'm', 2, 'X'),
  'cracking.decompressionSections[].level': spec('Depth checked for decompression', 'mm', 0, 'y_{dec}', 'EN 1992-1-1 7.3.1(5)'),
  'cracking.decompressionSections[].stress': spec('Concrete stress at that depth', 'MPa', 2, '\\sigma_c', 'EN 1992-1-1 7.3.1(5)'),
  'cracking.minSteel[].tension': spec('Greatest tension, characteristic combination', 'MPa', 2, '\\sigma_{ct}', 'EN 1992-1-1 7.3.2(4)'),
  'cracking.minSteel[].sigmaC': spec('Mean precompression, characteristic prestress', 'MPa', 2, '\\sigma_c', 'EN 1992-1-1 eq. (7.4)'),
  'cracking.minSteel[].hct': spec('Depth in tension just before cracking', 'mm', 0, 'h_{ct}', 'EN 1992-1-1 7.3.2(2)'),
  'cracking.minSteel[].Act': spec('Concrete in tension just before cracking', 'mm²', 0, 'A_{ct}', 'EN 1992-1-1 7.3.2(2)'),
  'cracking.minSteel[].kc': spec('Stress distribution factor', '', 2, 'k_c', 'EN 1992-1-1 eqs. (7.2), (7.3)'),
  'cracking.minSteel[].k': spec('Self-equilibrating stress factor', '', 2, 'k', 'EN 1992-1-1 7.3.2(2)'),
  'cracking.minSteel[].sigmaS': spec('Steel stress taken just after cracking', 'MPa', 0, '\\sigma_s', 'EN 1992-1-1 7.3.2(2), Table 7.2N'),
  'cracking.minSteel[].AsMin': spec('Least steel for crack control', 'mm²', 0, 'A_{s,min}', 'EN 1992-1-1 eq. (7.1)'),
  'cracking.minSteel[].provided': spec('Bars provided at the face', 'mm²', 0, 'A_{s,prov}'),
  'cracking.minSteel[].barDiameter': spec('Bar diameter', 'mm', 0, '\\phi'),
  'cracking.minSteel[].maxSpacing': spec('Largest bar spacing at that steel stress', 'mm', 0, 's_{max}', 'EN 1992-1-1 Table 7.3N'),
  'cracking.minSteel[].spacing': spec('Bar spacing provided (slab strip)', 'mm', 0, 's'),

  'fire.minDimension': spec('Least slab thickness or beam width for the rating', 'mm', 0, 'h_{s,min}, b_{min}', 'EN 1992-1-2 Tables 5.5, 5.6, 5.8, 5.9'),
  'fire.dimension': spec('Slab thickness or beam width provided', 'mm', 0, 'h_s, b'),
  'fire.axisBars': spec('Least axis distance of the bars', 'mm', 0, 'a', 'EN 1992-1-2 Tables 5.5, 5.6, 5.8, 5.9'),
  'fire.axisTendons': spec('Least axis distance of the tendons', 'mm', 0, 'a + \\Delta a', 'EN 1992-1-2 5.2(5)'),
  'fire.tendonAxisProvided': spec('Axis distance of the tendons provided', 'mm', 1, 'a_p'),
  'fire.barAxisProvided': spec('Axis distance of the bottom bars provided', 'mm', 1, 'a_s'),
  'anchorages[].FEd': spec('Design force of one anchorage, 1.2·Pjack', 'kN', 1, 'F_{Ed}', 'EN 1992-1-1 2.4.2.2(3)'),
  'anchorages[].plateWidth': spec('Anchor plate width', 'mm', 0, 'a_1'),
  'anchorages[].plateHeight': spec('Anchor plate height', 'mm', 0, 'a_2'),
  'anchorages[].depth': spec('Depth of the plate centre below the top', 'mm', 0, 'y_a'),
  'anchorages[].bAcross': spec('Width the force spreads to, across', 'mm', 0, 'b_1', 'EN 1992-1-1 8.10.3'),
  'anchorages[].bDepth': spec('Depth the force spreads to', 'mm', 0, 'b_2', 'EN 1992-1-1 8.10.3'),
  'anchorages[].tieAcross': spec('Tie force across', 'kN', 1, 'T_1', 'EN 1992-1-1 eq. (6.58)'),
  'anchorages[].tieDepth': spec('Tie force up and down', 'kN', 1, 'T_2', 'EN 1992-1-1 eq. (6.58)'),
  'anchorages[].AsAcross': spec('Bars for the tie across', 'mm²', 0, 'A_{s1} = T_1/f_{yd}', 'EN 1992-1-1 8.10.3(3)'),
  'anchorages[].AsDepth': spec('Bars for the tie up and down', 'mm²', 0, 'A_{s2} = T_2/f_{yd}', 'EN 1992-1-1 8.10.3(3)'),
  'anchorages[].Ac0': spec('Loaded area under the plate', 'mm²', 0, 'A_{c0}', 'EN 1992-1-1 6.7'),
  'anchorages[].Ac1': spec('Distribution area', 'mm²', 0, 'A_{c1}', 'EN 1992-1-1 6.7(2)'),
  'anchorages[].fcdTransfer': spec('Design strength at stressing', 'MPa', 1, 'f_{cd}(t)', 'EN 1992-1-1 3.1.6(1)'),
  'anchorages[].FRdu': spec('Resistance of the concrete under the plate', 'kN', 1, 'F_{Rdu}', 'EN 1992-1-1 eq. (6.63)'),
  'anchorages[].utilisation': spec('Utilisation under the plate', '', 2, 'F_{Ed}/F_{Rdu}'),

  'drops[].support': spec('Support', '', 0),
  'drops[].from': spec('Drop starts at', 'm', 2, 'X_1'),
  'drops[].to': spec('Drop ends at', 'm', 2, 'X_2'),
  'drops[].depth': spec('Depth below the soffit', 'mm', 0, 'h_d'),
  'drops[].width': spec('Width of the thickening', 'mm', 0, 'b_d'),
  'drops[].h': spec('Overall depth over the drop', 'mm', 0, 'h + h_d'),
  'drops[].A': spec('Area over the drop', 'mm²', 0, 'A_{c,d}'),
  'drops[].yt': spec('Centroid below the top over the drop', 'mm', 1, 'y_{t,d}'),
  'drops[].I': spec('Second moment of area over the drop', 'mm⁴', 0, 'I_{c,d}'),
  'drops[].Zt': spec('Section modulus over the drop, top fibre', 'mm³', 0, 'Z_{t,d}'),
  'drops[].Zb': spec('Section modulus over the drop, bottom fibre', 'mm³', 0, 'Z_{b,d}'),
  'drops[].shift': spec('Centroid below the plain section\'s', 'mm', 1, '\delta', 'the tendon\'s e over the drop is smaller by δ'),
  'drops[].eTop': spec('Eccentricity limit above the centroid over the drop', 'mm', 1, 'e_{top,d}'),
  'drops[].eBottom': spec('Eccentricity limit below the centroid over the drop', 'mm', 1, 'e_{bot,d}'),
  'drops[].weight': spec('Weight of the drop beyond the plain section', 'kN/m', 2, 'g_d', 'EN 1991-1-1 5.2'),

  'columns.Ecm': spec('Modulus of the columns (the member\'s concrete)', 'GPa', 1, 'E_{cm}', 'EN 1992-1-1 Table 3.1'),
  'columns.I': spec('Second moment of area of a column, gross', 'mm⁴', 0, 'I_c = c_2 c_1^3/12', 'EN 1992-1-1 Annex I.1.2(1)'),
  'columns.joints[].support': spec('Support (index from 0)', '', 0),
  'columns.joints[].number': spec('Support', '', 0),
  'columns.joints[].kBelow': spec('Stiffness of the columns below, in the width designed', 'kNm/rad', 0, 'k_b = 4EI/H \\text{ or } 3EI/H', 'EN 1992-1-1 5.3, slope–deflection'),
  'columns.joints[].kAbove': spec('Stiffness of the columns above, in the width designed', 'kNm/rad', 0, 'k_a', 'EN 1992-1-1 5.3, slope–deflection'),
  'columns.joints[].shareBelow': spec('Share of the joint moment taken below', '', 2, 'k_b/(k_b + k_a)'),
  'columns.joints[].permanent': spec('Column moment from the permanent load', 'kNm', 1, 'M_{c,G}', 'EN 1992-1-1 5.3'),
  'columns.joints[].imposedMin': spec('Column moment from the imposed load, least', 'kNm', 1, 'M_{c,Q,min}', 'EN 1992-1-1 5.1.3'),
  'columns.joints[].imposedMax': spec('Column moment from the imposed load, greatest', 'kNm', 1, 'M_{c,Q,max}', 'EN 1992-1-1 5.1.3'),
  'columns.joints[].prestressTransfer': spec('Column moment from prestress at transfer', 'kNm', 1, 'M_{c,P0}', 'EN 1992-1-1 5.10.7'),
  'columns.joints[].prestressService': spec('Column moment from prestress in service', 'kNm', 1, 'M_{c,P}', 'EN 1992-1-1 5.10.7'),

  'quantities.tendonLength': spec('Length of one tendon', 'm', 2, 'L_t'),
  'quantities.strandPerTendon': spec('Strand in one tendon', 'kg', 1, 'm_t', 'EN 1991-1-1 Table A.4: 78.5 kN/m³'),
  'quantities.strandRate': spec('Strand per m² of floor', 'kg/m²', 2, 'm_p'),
  'quantities.anchorages': spec('Anchorages (live and dead) in the width designed', '', 2, 'n_a'),
  'quantities.couplers': spec('Couplers in the width designed', '', 2, 'n_c'),
  'quantities.barRate': spec('Passive bars, each layer over the whole length (upper estimate)', 'kg/m²', 1, 'm_s'),
  'quantities.ductFill': spec('Strands across the flat duct (mm), or duct to strand area (round)', '', 1),

  'designLoads[].value': spec('Characteristic line load', 'kN/m', 2, 'g_k, q_k', 'EN 1991-1-1'),
  'designLoads[].gammaUls': spec('Partial factor at ULS', '', 2, '\\gamma', 'EN 1990 Table A1.2(B)'),
  'designLoads[].uls': spec('Design line load at ULS', 'kN/m', 2, '\\gamma F_k', 'EN 1990 eq. (6.10), (6.10a/b)'),
  'designLoads[].psiFrequent': spec('ψ1 (frequent)', '', 2, '\\psi_1', 'EN 1990 Table A1.1'),
  'designLoads[].psiQuasiPermanent': spec('ψ2 (quasi-permanent)', '', 2, '\\psi_2', 'EN 1990 Table A1.1'),
  'designLoads[].characteristic': spec('Line load, characteristic combination', 'kN/m', 2, 'F_{k}', 'EN 1990 eq. (6.14b)'),
  'designLoads[].frequent': spec('Line load, frequent combination', 'kN/m', 2, '\\psi_1 F_k', 'EN 1990 eq. (6.15b)'),
  'designLoads[].quasiPermanent': spec('Line load, quasi-permanent combination', 'kN/m', 2, '\\psi_2 F_k', 'EN 1990 eq. (6.16b)'),
  'designForces[].value': spec('Characteristic force', 'kN', 2, 'g_k, q_k', 'EN 1991-1-1'),
  'designForces[].gammaUls': spec('Partial factor at ULS', '', 2, '\\gamma', 'EN 1990 Table A1.2(B)'),
  'designForces[].uls': spec('Design force at ULS', 'kN', 2, '\\gamma F_k', 'EN 1990 eq. (6.10), (6.10a/b)'),
  'designForces[].psiFrequent': spec('ψ1 (frequent)', '', 2, '\\psi_1', 'EN 1990 Table A1.1'),
  'designForces[].psiQuasiPermanent': spec('ψ2 (quasi-permanent)', '', 2, '\\psi_2', 'EN 1990 Table A1.1'),
  'designForces[].characteristic': spec('Force, characteristic combination', 'kN', 2, 'F_{k}', 'EN 1990 eq. (6.14b)'),
  'designForces[].frequent': spec('Force, frequent combination', 'kN', 2, '\\psi_1 F_k', 'EN 1990 eq. (6.15b)'),
  'designForces[].quasiPermanent': spec('Force, quasi-permanent combination', 'kN', 2, '\\psi_2 F_k', 'EN 1990 eq. (6.16b)'),

  'site.heights.spacing': spec('Station spacing', 'mm', 0, 's'),
  'site.heights.roundTo': spec('Chair heights rounded to', 'mm', 0),
  'site.heights.outside': spec('Stations where the duct leaves the section', '', 0),
  'site.heights.spans[].span': spec('Span (index from 0)', '', 0),
  'site.heights.spans[].L': spec('Span length', 'm', 2, 'L'),
  'site.stressing.tolerance': spec('Acceptance band on measured extensions', '%', 0, '\\pm', 'common practice'),
  'site.stressing.tendons[].Pjack': spec('Jacking force', 'kN', 1, 'P_{max}', 'EN 1992-1-1 5.10.2.1'),
  'site.stressing.tendons[].Ap': spec('Steel area of the tendon', 'mm²', 0, 'A_p'),
  'site.stressing.tendons[].length': spec('Tendon length along its profile', 'm', 2, 'L_t'),
  'site.stressing.tendons[].theta': spec('Sum of angular deviations', 'rad', 3, '\\theta', 'EN 1992-1-1 5.10.5.2(1)'),
  'site.stressing.tendons[].extension.left': spec('Calculated extension at the left end', 'mm', 0, '\\Delta L_{left}', '∫P(x)dx/(Ep Ap), EN 1992-1-1 eq. (5.45)'),
  'site.stressing.tendons[].extension.right': spec('Calculated extension at the right end', 'mm', 0, '\\Delta L_{right}', '∫P(x)dx/(Ep Ap), EN 1992-1-1 eq. (5.45)'),
  'site.stressing.tendons[].extension.total': spec('Calculated extension, total', 'mm', 0, '\\Delta L', '∫P(x)dx/(Ep Ap)'),
  'site.stressing.tendons[].extensionAfterLockOff': spec('Extension after lock-off (draw-in)', 'mm', 0, '\\Delta L_{set}', 'EN 1992-1-1 5.10.5.3'),
  'site.stressing.tendons[].band.lower': spec('Acceptance band, lower', 'mm', 0, '\\Delta L_{min}', 'common practice'),
  'site.stressing.tendons[].band.upper': spec('Acceptance band, upper', 'mm', 0, '\\Delta L_{max}', 'common practice'),
  'site.stressing.tendons[].forceAfterLockOff.min': spec('Least force after lock-off', 'kN', 1, 'P_{min}', 'EN 1992-1-1 5.10.5.3'),
  'site.stressing.tendons[].forceAfterLockOff.max': spec('Greatest force after lock-off', 'kN', 1, 'P_{max}', 'EN 1992-1-1 5.10.5.3'),
  'site.stressing.tendons[].checks[].measured': spec('Measured extension', 'mm', 0, '\\Delta L_{meas}'),
  'site.stressing.tendons[].checks[].calculated': spec('Calculated extension compared', 'mm', 0, '\\Delta L_{calc}'),
  'site.stressing.tendons[].checks[].deviation': spec('Deviation of measured from calculated', '%', 1, '\\Delta L_{meas}/\\Delta L_{calc} - 1', 'common practice'),
  'site.stressing.tendons[].checks[].segment': spec('Segment measured on', '', 0),
  'site.stressing.tendons[].segments[].number': spec('Segment', '', 0),
  'site.stressing.tendons[].segments[].from': spec('Segment from support', '', 0),
  'site.stressing.tendons[].segments[].to': spec('Segment to support', '', 0),
  'site.stressing.tendons[].segments[].length': spec('Segment length along the tendon', 'm', 2, 'L_{seg}'),
  'site.stressing.tendons[].segments[].theta': spec('Sum of angular deviations over the segment', 'rad', 3, '\\theta', 'EN 1992-1-1 5.10.5.2(1)'),
  'site.stressing.tendons[].segments[].extension.left': spec('Calculated extension at the segment\'s left end', 'mm', 0, '\\Delta L_{left}', '∫P(x)dx/(Ep Ap), EN 1992-1-1 eq. (5.45)'),
  'site.stressing.tendons[].segments[].extension.right': spec('Calculated extension at the segment\'s right end', 'mm', 0, '\\Delta L_{right}', '∫P(x)dx/(Ep Ap), EN 1992-1-1 eq. (5.45)'),
  'site.stressing.tendons[].segments[].extension.total': spec('Calculated extension of the segment', 'mm', 0, '\\Delta L', '∫P(x)dx/(Ep Ap)'),
  'site.stressing.tendons[].segments[].extensionAfterLockOff': spec('Extension of the segment after lock-off (draw-in)', 'mm', 0, '\\Delta L_{set}', 'EN 1992-1-1 5.10.5.3'),
  'site.stressing.tendons[].segments[].band.lower': spec('Acceptance band of the segment, lower', 'mm', 0, '\\Delta L_{min}', 'common practice'),
  'site.stressing.tendons[].segments[].band.upper': spec('Acceptance band of the segment, upper', 'mm', 0, '\\Delta L_{max}', 'common practice'),
  'site.stressing.tendons[].segments[].forceAfterLockOff.min': spec('Least force in the segment after lock-off', 'kN', 1, 'P_{min}', 'EN 1992-1-1 5.10.5.3'),
  'site.stressing.tendons[].segments[].forceAfterLockOff.max': spec('Greatest force in the segment after lock-off', 'kN', 1, 'P_{max}', 'EN 1992-1-1 5.10.5.3'),
  'site.stressing.series.s[]': spec('Distance along the tendon', 'm', 2, 's'),
  'site.stressing.series.force[][]': spec('Force after lock-off', 'kN', 1, 'P(s)', 'EN 1992-1-1 eq. (5.45), 5.10.5.3'),
  ...heightRowSpecs(),
}

let inputSpecs: InputFieldSpec[] | null = null
/** The input fields' specs (from the schema metadata), computed once. */
export function inputSpecsList(): InputFieldSpec[] {
  inputSpecs ??= inputFieldSpecs()
  return inputSpecs
}

/** Input specs keyed by the input dot path ('tendon.spacing'). */
export const INPUT_SPECS: Record<string, InputFieldSpec['spec']> = Object.fromEntries(inputSpecsList().flatMap((f) => [
  [f.path, f.spec] as const,
  // a table's columns under the table's path ('loads.lines.w')
  ...(f.columns ?? []).map((c) => [`${f.path}.${c.path}`, c.spec] as const),
]))

/** The spec of a concrete result path ('sections.3.stress.transfer.top'), or of an input path. */
export function specFor(path: string): QuantitySpec | undefined {
  const generic = path.replace(/\.(\d+)(?=\.|$)/g, '[]')
  const direct = RESULT_SPECS[generic]
  if (direct) return direct
  for (const prefix of ['input.', 'proposal.inputPatch.']) {
    if (generic.startsWith(prefix)) {
      const key = generic.slice(prefix.length).replace(/\[\]/g, '')
      return INPUT_SPECS[key]
    }
  }
  return undefined
}
