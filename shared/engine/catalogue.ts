/**
 * Labels, symbols, display units, decimals and clauses of every number a report shows, keyed by
 * its dot path into Design with [] for any array index ('sections[].stress.transfer.top').
 * Input paths ('input.tendon.spacing', or a proposal's 'proposal.inputPatch.tendon.spacing') take
 * their spec from the input schema's metadata.
 */
import type { QuantitySpec } from './contract'
import type { DisplayUnit } from '../utils/units'
import { inputFieldSpecs } from './schema'
import type { InputFieldSpec } from './schema'
import { PART2_RESULT_SPECS } from './uls/part2-specs'

const q = (label: string, unit: DisplayUnit, precision: number, symbol?: string, clause?: string): QuantitySpec => {
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
    out[`sections[].stress.${stage}.top`] = q(`Top fibre stress, ${name}`, 'MPa', 2, '\\sigma_{top}', clause)
    out[`sections[].stress.${stage}.bottom`] = q(`Bottom fibre stress, ${name}`, 'MPa', 2, '\\sigma_{bot}', clause)
    out[`sections[].envelope.${stage}.topMin`] = q(`Top fibre, least stress, ${name}`, 'MPa', 2, '\\sigma_{top,min}', clause)
    out[`sections[].envelope.${stage}.topMax`] = q(`Top fibre, greatest stress, ${name}`, 'MPa', 2, '\\sigma_{top,max}', clause)
    out[`sections[].envelope.${stage}.bottomMin`] = q(`Bottom fibre, least stress, ${name}`, 'MPa', 2, '\\sigma_{bot,min}', clause)
    out[`sections[].envelope.${stage}.bottomMax`] = q(`Bottom fibre, greatest stress, ${name}`, 'MPa', 2, '\\sigma_{bot,max}', clause)
    const lc = stage === 'transfer' ? 'EN 1992-1-1 5.10.2.2(5)' : stage === 'characteristic' ? 'EN 1992-1-1 7.2(2)' : 'EN 1992-1-1 7.2(3)'
    out[`limits.${stage}.compression`] = q(`Compression limit, ${name}`, 'MPa', 2, '\\sigma_{c,lim}', lc)
    out[`limits.${stage}.tension`] = q(`Tension limit, ${name}`, 'MPa', 2, 'f_{t,lim}', stage === 'transfer' ? 'EN 1992-1-1 7.1(2), eq. (3.4)' : 'EN 1992-1-1 7.1(2), Table 7.1N')
  }
  for (const [stage, name] of Object.entries(STAGE_NAMES)) {
    if (stage === 'transfer') continue
    out[`sections[].moments.${stage}.min`] = q(`Least moment, ${name} combination`, 'kNm', 1, 'M_{min}', 'EN 1990 6.5.3, EN 1992-1-1 5.1.3')
    out[`sections[].moments.${stage}.max`] = q(`Greatest moment, ${name} combination`, 'kNm', 1, 'M_{max}', 'EN 1990 6.5.3, EN 1992-1-1 5.1.3')
  }
  for (const [k, name] of Object.entries({ friction: 'friction', drawIn: 'anchorage draw-in', elasticShortening: 'elastic shortening', creep: 'creep', shrinkage: 'shrinkage', relaxation: 'relaxation', longTerm: 'long-term (creep, shrinkage, relaxation)', total: 'total' })) {
    const clause = { friction: 'EN 1992-1-1 eq. (5.45)', drawIn: 'EN 1992-1-1 5.10.5.3', elasticShortening: 'EN 1992-1-1 eq. (5.44)', creep: 'EN 1992-1-1 eq. (5.46)', shrinkage: 'EN 1992-1-1 eq. (5.46)', relaxation: 'EN 1992-1-1 eq. (5.46), eqs. (3.28)–(3.30)', longTerm: 'EN 1992-1-1 eq. (5.46)', total: 'EN 1992-1-1 5.10.4–5.10.6' }[k]
    out[`losses.${k}.force`] = q(`Loss by ${name} (mean along the tendon)`, 'kN', 1, '\\Delta P', clause)
    out[`losses.${k}.percent`] = q(`Loss by ${name}, share of the jacking force`, '%', 1, '\\Delta P / P_{max}', clause)
  }
  for (const stage of ['transfer', 'service'] as const) {
    const name = stage === 'transfer' ? 'at transfer' : 'in service'
    out[`prestressMoments.${stage}.primary[]`] = q(`Primary moment of prestress at the support, ${name}`, 'kNm', 1, 'M_1 = -P e', 'EN 1992-1-1 5.10.7')
    out[`prestressMoments.${stage}.secondary[]`] = q(`Secondary moment of prestress at the support, ${name}`, 'kNm', 1, 'M_2', 'EN 1992-1-1 5.10.7')
    out[`prestressMoments.${stage}.total[]`] = q(`Total moment of prestress at the support, ${name}`, 'kNm', 1, 'M_p', 'EN 1992-1-1 5.10.7')
  }
  return out
}

export const RESULT_SPECS: Record<string, QuantitySpec> = {
  'section.h': q('Overall depth', 'mm', 0, 'h'),
  'section.A': q('Area of the gross section', 'mm²', 0, 'A_c'),
  'section.yt': q('Centroid below the top fibre', 'mm', 1, 'y_t'),
  'section.yb': q('Centroid above the bottom fibre', 'mm', 1, 'y_b'),
  'section.I': q('Second moment of area', 'mm⁴', 0, 'I_c'),
  'section.Zt': q('Section modulus, top fibre', 'mm³', 0, 'Z_t', 'Z_t = I/y_t'),
  'section.Zb': q('Section modulus, bottom fibre', 'mm³', 0, 'Z_b', 'Z_b = I/y_b'),
  'section.u': q('Perimeter exposed to drying', 'mm', 0, 'u', 'EN 1992-1-1 3.1.4(6)'),
  'section.h0': q('Notional size', 'mm', 0, 'h_0', 'EN 1992-1-1 3.1.4(6): h0 = 2Ac/u'),
  'section.bTop': q('Width at the top fibre', 'mm', 0, 'b_{top}'),
  'section.bBottom': q('Width at the bottom fibre', 'mm', 0, 'b_{bot}'),
  'section.kernTop': q('Upper kern distance above the centroid', 'mm', 1, 'k_t', 'k_t = Z_b/A'),
  'section.kernBottom': q('Lower kern distance below the centroid', 'mm', 1, 'k_b', 'k_b = Z_t/A'),
  'section.tributaryWidth': q('Width loaded', 'mm', 0, 'b_{trib}'),
  'section.spanDepth[]': q('Span / depth', '', 1, 'L/h', 'common practice: slabs 35–45, band beams 20–30'),
  'concrete.at28.fck': q('Characteristic cylinder strength', 'MPa', 1, 'f_{ck}', T31),
  'concrete.at28.fcm': q('Mean cylinder strength', 'MPa', 1, 'f_{cm}', `${T31}: fcm = fck + 8`),
  'concrete.at28.fctm': q('Mean tensile strength', 'MPa', 2, 'f_{ctm}', T31),
  'concrete.at28.fctk005': q('Characteristic tensile strength, 5 %', 'MPa', 2, 'f_{ctk,0.05}', T31),
  'concrete.at28.fctk095': q('Characteristic tensile strength, 95 %', 'MPa', 2, 'f_{ctk,0.95}', T31),
  'concrete.at28.Ecm': q('Secant modulus of elasticity', 'GPa', 1, 'E_{cm}', T31),
  'concrete.atTransfer.betaCC': q('Strength development coefficient', '', 3, '\\beta_{cc}(t)', 'EN 1992-1-1 eq. (3.2)'),
  'concrete.atTransfer.fcm': q('Mean strength at stressing', 'MPa', 1, 'f_{cm}(t)', 'EN 1992-1-1 eq. (3.1)'),
  'concrete.atTransfer.fck': q('Characteristic strength at stressing', 'MPa', 1, 'f_{ck}(t)', 'EN 1992-1-1 3.1.2(5)'),
  'concrete.atTransfer.fctm': q('Mean tensile strength at stressing', 'MPa', 2, 'f_{ctm}(t)', 'EN 1992-1-1 eq. (3.4)'),
  'concrete.atTransfer.Ecm': q('Modulus at stressing', 'GPa', 1, 'E_{cm}(t)', 'EN 1992-1-1 eq. (3.5)'),
  'concrete.atTransfer.age': q('Age at stressing', 'days', 0, 't_0'),
  'strand.diameter': q('Nominal strand diameter', 'mm', 1, '\\phi', 'prEN 10138-3'),
  'strand.Ap': q('Area of one strand', 'mm²', 0, 'A_{p1}', 'prEN 10138-3'),
  'strand.fpk': q('Tensile strength of strand', 'MPa', 0, 'f_{pk}', 'prEN 10138-3'),
  'strand.fp01k': q('0.1 % proof stress of strand', 'MPa', 0, 'f_{p0.1k}', 'prEN 10138-3'),
  'strand.Ep': q('Modulus of strand', 'GPa', 0, 'E_p', 'EN 1992-1-1 3.3.6(3)'),
  'jacking.sigmaPmax': q('Greatest stress at jacking', 'MPa', 0, '\\sigma_{p,max}', 'EN 1992-1-1 eq. (5.41)'),
  'jacking.Pmax': q('Greatest jacking force per strand', 'kN', 1, 'P_{max}', 'EN 1992-1-1 5.10.2.1'),
  'jacking.sigmaPm0': q('Greatest stress after transfer', 'MPa', 0, '\\sigma_{pm0}', 'EN 1992-1-1 eq. (5.43)'),
  'jacking.Pm0': q('Greatest force after transfer per strand', 'kN', 1, 'P_{m0}', 'EN 1992-1-1 5.10.3(2)'),
  'jacking.sigmaJack': q('Stress at jacking', 'MPa', 0, '\\sigma_{p,jack}', 'EN 1992-1-1 5.10.2.1'),
  'jacking.PjackStrand': q('Jacking force per strand', 'kN', 1, 'P_{jack,1}'),
  'jacking.strandsPerTendon': q('Strands per tendon', '', 0, 'n_s'),
  'jacking.tendonsPerWidth': q('Tendons in the width modelled', '', 2, 'n_t'),
  'jacking.strands': q('Strands in the width modelled', '', 2, 'n'),
  'jacking.Ap': q('Area of prestressing steel', 'mm²', 0, 'A_p'),
  'jacking.Pjack': q('Jacking force', 'kN', 0, 'P_{max}', 'EN 1992-1-1 5.10.2.1'),
  'eccentricity.top': q('Greatest eccentricity above the centroid', 'mm', 1, 'e_{top}', 'e = y_t − c − h_d/2 (common practice)'),
  'eccentricity.bottom': q('Greatest eccentricity below the centroid', 'mm', 1, 'e_{bot}', 'e = y_b − c − h_d/2 (common practice)'),
  'eccentricity.dTop': q('Top face to tendon centroid at the high point', 'mm', 1, 'd_{top}'),
  'eccentricity.dBottom': q('Bottom face to tendon centroid at the low point', 'mm', 1, 'd_{bot}'),
  'eccentricity.coverForBond': q('Least cover to duct for bond', 'mm', 0, 'c_{min,b}', 'EN 1992-1-1 Table 4.2'),
  'profile.supportEcc[]': q('Tendon eccentricity at the support', 'mm', 1, 'e_{sup}'),
  'profile.spanEcc[]': q('Tendon eccentricity at the low point', 'mm', 1, 'e_{span}'),
  'profile.lowPointAt[]': q('Low point, share of the span', '%', 0),
  'profile.inflection': q('Reverse curve, share of the span', '%', 0, '\\lambda'),
  'profile.drapes[]': q('Drape (sag below the chord)', 'mm', 1, 'a', 'Lin, load balancing'),
  'profile.lowPointX[]': q('Low point along the member', 'm', 2, 'x_{low}'),
  'profile.length': q('Tendon length', 'm', 2, 'L_{tot}'),
  'loads.selfWeight': q('Self-weight', 'kN/m', 2, 'g_{sw}', 'EN 1991-1-1 5.2'),
  'loads.superimposed': q('Superimposed dead load', 'kN/m', 2, 'g_{sdl}'),
  'loads.imposed': q('Imposed load', 'kN/m', 2, 'q_k'),
  'loads.balanced': q('Load to balance', 'kN/m', 2, 'w_{bal}'),
  'balancing.load': q('Load to balance', 'kN/m', 2, 'w_{bal}'),
  'balancing.perSpan[]': q('Force to balance the load in the span', 'kN', 0, 'P = wL^2/8a', 'Lin, load balancing'),
  'balancing.governing': q('Governing force to balance', 'kN', 0, 'P_{bal}', 'Lin, load balancing'),
  'balancing.strandsNeeded': q('Strands needed at the mean service force', '', 2, 'n_{req}'),
  'balancing.strandsProvided': q('Strands provided', '', 2, 'n_{prov}'),
  'balancing.tendonsNeeded': q('Tendons needed', '', 2, 'n_{t,req}'),
  'balancing.spacingNeeded': q('Tendon spacing to balance the load', 'mm', 0, 's_{req}'),
  'balancing.balancedProvided[]': q('Load balanced by the force provided', 'kN/m', 2, 'w = 8Pa/L^2', 'Lin, load balancing'),
  'balancing.ratio[]': q('Balanced / chosen load', '%', 0, 'w/w_{bal}'),
  'force.jacking': q('Jacking force', 'kN', 0, 'P_{max}', 'EN 1992-1-1 5.10.2.1'),
  'force.meanAfterFriction': q('Mean force after friction', 'kN', 0, 'P_{\\mu}', 'EN 1992-1-1 eq. (5.45)'),
  'force.meanAfterDrawIn': q('Mean force after draw-in', 'kN', 0, 'P_{set}', 'EN 1992-1-1 5.10.5.3'),
  'force.meanTransfer': q('Mean force at transfer', 'kN', 0, 'P_{m0}', 'EN 1992-1-1 5.10.3'),
  'force.meanService': q('Mean force in service (after all losses)', 'kN', 0, 'P_{m,\\infty}', 'EN 1992-1-1 5.10.6'),
  'force.maxAfterLockOff': q('Greatest force after lock-off', 'kN', 0, 'P_{0,max}', 'EN 1992-1-1 5.10.3(2)'),
  'force.drawInLength': q('Length affected by draw-in', 'm', 2, 'l_{set}', 'l_set = √(Δ Ep Ap / p)'),
  'force.eta': q('Service / transfer force', '', 3, '\\eta'),
  'losses.phi': q('Creep coefficient', '', 2, '\\varphi(\\infty,t_0)', 'EN 1992-1-1 Annex B eq. (B.1)'),
  'losses.epsCs': q('Shrinkage strain after stressing', '‰', 3, '\\varepsilon_{cs}', 'EN 1992-1-1 eq. (3.8), Annex B.2'),
  'loadCases.patterns[].loadedSpans[]': q('Loaded span (index from 0)', '', 0),
  'loadCases.supportMoments.selfWeight[]': q('Support moment, self-weight', 'kNm', 1, 'M_{sw}'),
  'loadCases.supportMoments.superimposed[]': q('Support moment, superimposed dead load', 'kNm', 1, 'M_{sdl}'),
  'loadCases.supportMoments.imposed[][]': q('Support moment, imposed load arrangement', 'kNm', 1, 'M_q', 'EN 1992-1-1 5.1.3'),
  'limits.tendonService': q('Tendon stress limit in service', 'MPa', 0, 'k_5 f_{pk}', 'EN 1992-1-1 7.2(5)'),
  'sections[].span': q('Span (index from 0)', '', 0),
  'sections[].x': q('Distance from the left support of the span', 'm', 2, 'x'),
  'sections[].X': q('Distance along the member', 'm', 2, 'X'),
  'sections[].e': q('Tendon eccentricity (below centroid +)', 'mm', 1, 'e'),
  'sections[].force.transfer': q('Force at transfer', 'kN', 0, 'P_0', 'EN 1992-1-1 5.10.3'),
  'sections[].force.service': q('Force in service', 'kN', 0, 'P_{\\infty}', 'EN 1992-1-1 5.10.6'),
  'sections[].moments.selfWeight': q('Moment, self-weight', 'kNm', 1, 'M_{sw}'),
  'sections[].moments.superimposed': q('Moment, superimposed dead load', 'kNm', 1, 'M_{sdl}'),
  'sections[].moments.imposed.min': q('Least moment, imposed load (all arrangements)', 'kNm', 1, 'M_{q,min}', 'EN 1992-1-1 5.1.3'),
  'sections[].moments.imposed.max': q('Greatest moment, imposed load (all arrangements)', 'kNm', 1, 'M_{q,max}', 'EN 1992-1-1 5.1.3'),
  'sections[].moments.transfer': q('Moment at transfer (self-weight)', 'kNm', 1, 'M_0', 'EN 1992-1-1 5.10.2.2'),
  'sections[].moments.primaryTransfer': q('Primary moment of prestress at transfer', 'kNm', 1, 'M_1 = -P_0 e', 'EN 1992-1-1 5.10.7'),
  'sections[].moments.secondaryTransfer': q('Secondary moment of prestress at transfer', 'kNm', 1, 'M_2', 'EN 1992-1-1 5.10.7'),
  'sections[].moments.totalTransfer': q('Total moment of prestress at transfer', 'kNm', 1, 'M_p', 'EN 1992-1-1 5.10.7'),
  'sections[].moments.primaryService': q('Primary moment of prestress in service', 'kNm', 1, 'M_1 = -P_\\infty e', 'EN 1992-1-1 5.10.7'),
  'sections[].moments.secondaryService': q('Secondary moment of prestress in service', 'kNm', 1, 'M_2', 'EN 1992-1-1 5.10.7'),
  'sections[].moments.totalService': q('Total moment of prestress in service', 'kNm', 1, 'M_p', 'EN 1992-1-1 5.10.7'),
  'sections[].utilisation': q('Greatest stress utilisation at the section', '', 2, 'U'),
  'sections[].magnel.lines[].forceFactor': q('Factor on the transfer force', '', 3, 'r \\eta', 'EN 1992-1-1 5.10.9'),
  'sections[].magnel.lines[].M': q('Moment of the condition (with the secondary moment)', 'kNm', 1, 'M'),
  'sections[].magnel.lines[].limit': q('Stress limit of the condition', 'MPa', 2, 'f'),
  'sections[].magnel.lines[].ae': q('Coefficient of e in the condition', '', 6, 'a_e'),
  'sections[].magnel.lines[].au': q('Coefficient of 1/P in the condition', '', 3, 'a_u'),
  'sections[].magnel.lines[].b': q('Right-hand side of the condition', '', 6, 'b'),
  'sections[].magnel.eLimits.min': q('Eccentricity limit above the centroid', 'mm', 1, 'e_{min}'),
  'sections[].magnel.eLimits.max': q('Eccentricity limit below the centroid', 'mm', 1, 'e_{max}'),
  'sections[].magnel.minP': q('Least force at transfer for this section', 'kN', 0, 'P_{min}', 'Magnel diagram'),
  'sections[].magnel.eAtMinP': q('Eccentricity at the least force', 'mm', 1, 'e_{P,min}', 'Magnel diagram'),
  'sections[].magnel.region[].e': q('Region vertex, eccentricity', 'mm', 1, 'e'),
  'sections[].magnel.region[].invP': q('Region vertex, 1/P', '1/MN', 3, '1/P'),
  'checks[].actual': q('Value checked (unit given with the check)', '', 2),
  'checks[].limit': q('Limit (unit given with the check)', '', 2),
  'checks[].utilisation': q('Utilisation', '', 2, 'U'),
  'precompression.transfer': q('Average precompression at transfer', 'MPa', 2, 'P_0/A', 'common practice'),
  'precompression.service': q('Average precompression in service', 'MPa', 2, 'P_\\infty/A', 'common practice'),
  'precompression.min': q('Least average precompression (practice)', 'MPa', 2, undefined, 'common practice'),
  'precompression.max': q('Greatest average precompression (practice)', 'MPa', 2, undefined, 'common practice'),
  'proposal.strands': q('Strands proposed in the width modelled', '', 2, 'n'),
  'proposal.forceTransfer': q('Mean force at transfer, proposed', 'kN', 0, 'P_0', 'Magnel diagram'),
  'proposal.spacing': q('Tendon spacing proposed', 'mm', 0, 's'),
  'proposal.count': q('Tendons proposed', '', 0, 'n_t'),
  'proposal.supportEcc[]': q('Eccentricity at the support, proposed', 'mm', 1, 'e_{sup}'),
  'proposal.spanEcc[]': q('Eccentricity at the low point, proposed', 'mm', 1, 'e_{span}'),
  'series.X[]': q('Distance along the member', 'm', 2, 'X'),
  'series.span[]': q('Span (index from 0)', '', 0),
  'series.x[]': q('Distance from the left support of the span', 'm', 2, 'x'),
  'series.e[]': q('Tendon eccentricity', 'mm', 1, 'e'),
  'series.eLimitTop[]': q('Eccentricity limit, top', 'mm', 1, '-e_{top}'),
  'series.eLimitBottom[]': q('Eccentricity limit, bottom', 'mm', 1, 'e_{bot}'),
  'series.depth[]': q('Section depth', 'mm', 0, 'h'),
  'series.centroid[]': q('Centroid below the top fibre', 'mm', 1, 'y_t'),
  'series.forceFriction[]': q('Force after friction', 'kN', 0, 'P_\\mu(x)', 'EN 1992-1-1 eq. (5.45)'),
  'series.forceDrawIn[]': q('Force after draw-in', 'kN', 0, 'P_{set}(x)', 'EN 1992-1-1 5.10.5.3'),
  'series.forceTransfer[]': q('Force at transfer', 'kN', 0, 'P_0(x)', 'EN 1992-1-1 5.10.3'),
  'series.forceService[]': q('Force in service', 'kN', 0, 'P_\\infty(x)', 'EN 1992-1-1 5.10.6'),
  'series.primaryTransfer[]': q('Primary moment at transfer', 'kNm', 1, 'M_1', 'EN 1992-1-1 5.10.7'),
  'series.secondaryTransfer[]': q('Secondary moment at transfer', 'kNm', 1, 'M_2', 'EN 1992-1-1 5.10.7'),
  'series.totalTransfer[]': q('Total prestress moment at transfer', 'kNm', 1, 'M_p', 'EN 1992-1-1 5.10.7'),
  'series.primaryService[]': q('Primary moment in service', 'kNm', 1, 'M_1', 'EN 1992-1-1 5.10.7'),
  'series.secondaryService[]': q('Secondary moment in service', 'kNm', 1, 'M_2', 'EN 1992-1-1 5.10.7'),
  'series.totalService[]': q('Total prestress moment in service', 'kNm', 1, 'M_p', 'EN 1992-1-1 5.10.7'),
  'series.momentTransfer[]': q('Moment at transfer', 'kNm', 1, 'M_0'),
  'series.momentServiceMax[]': q('Greatest moment, characteristic', 'kNm', 1, 'M_{k,max}', 'EN 1990 eq. (6.14b)'),
  'series.momentServiceMin[]': q('Least moment, characteristic', 'kNm', 1, 'M_{k,min}', 'EN 1990 eq. (6.14b)'),
  'series.stressTransferTopMin[]': q('Top fibre, least stress at transfer', 'MPa', 2, '\\sigma_{top}'),
  'series.stressTransferTopMax[]': q('Top fibre, greatest stress at transfer', 'MPa', 2, '\\sigma_{top}'),
  'series.stressTransferBottomMin[]': q('Bottom fibre, least stress at transfer', 'MPa', 2, '\\sigma_{bot}'),
  'series.stressTransferBottomMax[]': q('Bottom fibre, greatest stress at transfer', 'MPa', 2, '\\sigma_{bot}'),
  'series.stressServiceTopMin[]': q('Top fibre, least stress in service', 'MPa', 2, '\\sigma_{top}'),
  'series.stressServiceTopMax[]': q('Top fibre, greatest stress in service', 'MPa', 2, '\\sigma_{top}'),
  'series.stressServiceBottomMin[]': q('Bottom fibre, least stress in service', 'MPa', 2, '\\sigma_{bot}'),
  'series.stressServiceBottomMax[]': q('Bottom fibre, greatest stress in service', 'MPa', 2, '\\sigma_{bot}'),
  'series.limitTransferCompression[]': q('Compression limit at transfer', 'MPa', 2, undefined, 'EN 1992-1-1 5.10.2.2(5)'),
  'series.limitTransferTension[]': q('Tension limit at transfer (negative)', 'MPa', 2, undefined, 'EN 1992-1-1 7.1(2)'),
  'series.limitServiceCompression[]': q('Compression limit, characteristic', 'MPa', 2, undefined, 'EN 1992-1-1 7.2(2)'),
  'series.limitServiceTension[]': q('Tension limit in service (negative)', 'MPa', 2, undefined, 'EN 1992-1-1 7.1(2), Table 7.1N'),
  ...stressSpecs(),
  ...PART2_RESULT_SPECS,
}

let inputSpecs: InputFieldSpec[] | null = null
/** The input fields' specs (from the schema metadata), computed once. */
export function inputSpecsList(): InputFieldSpec[] {
  inputSpecs ??= inputFieldSpecs()
  return inputSpecs
}

/** Input specs keyed by the input dot path ('tendon.spacing'). */
export const INPUT_SPECS: Record<string, InputFieldSpec['spec']> = Object.fromEntries(inputSpecsList().map((f) => [f.path, f.spec]))

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
