/**
 * designMember: the design of a post-tensioned continuous member to EN 1992-1-1, stage by stage as
 * the job reads — section, loads, profile, balancing, losses, prestress moments, stresses, Magnel
 * regions and the proposal, ULS, SLS and the site schedules. Sign conventions: sagging +, gravity +,
 * e below the centroid +, compression +. The result is plain JSON data in engine units (N, mm, MPa,
 * N·mm); its keys are frozen in issued revisions and report templates bind to them.
 */
import type { CheckResult } from '../contract'
import { ENGINE_VERSION } from '../version'
import { isCantileverSpan } from '../prestress/profile'
import { parseMemberInput } from '../input/schema'
import type { MemberInput } from '../input/schema'
import type { SectionProperties } from '../section'
import type { ConcreteAtAge, ConcreteProperties } from '../materials/concrete'
import type { JackingLimits, Strand, StrandType } from '../materials/strand'
import type { PrestressMomentLine } from './analysis'
import type { BalancingNeed } from './balancing'
import type { LoadPattern } from './loads'
import type { ResponseQuantity } from '../analysis/pattern-loading'
import type { BalancingProvided, ForceSummary, LossSummary } from './losses'
import { magnelStage } from './magnel'
import { proposalStage } from './proposal'
import type { Proposal } from './proposal'
import { memberSeries } from './series'
import type { MemberSeries } from './series'
import { designForService } from './service-design'
import type { ServiceDesign } from './service-design'
import { siteStage } from './site'
import { fireStage } from './fire'
import type { MemberFire } from './fire'
import { anchorageStage } from './anchorage-zone'
import { columnMoments } from './column-moments'
import { quantitiesStage } from './quantities'
import { designForces, designLoads } from './design-loads'
import type { DesignLoad } from './design-loads'
import type { MemberQuantities } from './quantities'
import type { ColumnMoments } from './column-moments'
import type { AnchorageEnd } from './anchorage-zone'
import type { MemberSite } from './site'
import { slsStage } from './sls'
import type { MemberCracking, MemberDeflection } from './sls'
import type { CriticalSection, StressLimits } from './stress-limits'
import { ulsStage } from './uls'
import type { MemberUls } from './uls'
import type { MagnelResult } from '../checks/magnel'

export interface Design {
  engineVersion: string
  input: MemberInput
  section: SectionProperties & { tributaryWidth: number; spanDepth: number[] }
  concrete: { class: string; at28: ConcreteProperties; atTransfer: ConcreteAtAge & { age: number } }
  strand: Strand & { type: StrandType }
  jacking: JackingLimits & {
    sigmaJack: number
    PjackStrand: number
    strandsPerTendon: number
    tendonsPerWidth: number
    strands: number
    Ap: number
    Pjack: number
  }
  eccentricity: { top: number; bottom: number; dTop: number; dBottom: number; coverForBond: number }
  profile: {
    supportEcc: number[]
    spanEcc: number[]
    lowPointAt: number[]
    inflection: number
    drapes: number[]
    lowPointX: number[]
    length: number
  }
  loads: { selfWeight: number; superimposed: number; imposed: number; balanced: number }
  balancing: BalancingNeed & BalancingProvided
  force: ForceSummary
  losses: LossSummary
  prestressMoments: Record<'transfer' | 'service', PrestressMomentLine>
  loadCases: {
    patterns: LoadPattern[]
    supportMoments: { selfWeight: number[]; superimposed: number[]; imposed: number[][] }
  }
  limits: StressLimits
  sections: CriticalSection[]
  checks: CheckResult[]
  precompression: { transfer: number; service: number; min: number; max: number }
  proposal: Proposal
  series: MemberSeries
  warnings: string[]
  /** design moments and shears, resistances, detailing limits, punching (EN 1992-1-1 6, 9) */
  uls: MemberUls
  /** short- and long-term deflection under the unbalanced quasi-permanent load (7.4) */
  deflection: MemberDeflection
  /** crack control by exposure, crack widths and decompression (7.3) */
  cracking: MemberCracking
  /** tendon height schedule and stressing schedule */
  site: MemberSite
  /** fire resistance by tabulated data (EN 1992-1-2 5), null where none is asked for */
  fire: MemberFire | null
  /** anchorage zones at the two ends of the tendon (EN 1992-1-1 8.10.3, 6.7) */
  anchorages: AnchorageEnd[]
  /** each load with its combination factors and values (EN 1990 6.4.3, 6.5.3) */
  designLoads: DesignLoad[]
  /** each point load and line load across the member with its combination factors and values, N */
  designForces: DesignLoad[]
  /** post-tensioning quantities for the cost plan */
  quantities: MemberQuantities
  /** drops and thickened bands over supports: where they run and their sections */
  drops: DropRecord[]
  /** the columns at the supports: their stiffness and the moments the member passes into them, or null */
  columns: { Ecm: number; I: number; joints: ColumnMoments[] } | null
}

export interface DropRecord {
  /** the support, numbered from 1 */
  support: number
  /** where the drop starts and ends along the member, mm */
  from: number
  to: number
  depth: number
  width: number
  /** overall depth over the drop, and its section */
  h: number
  A: number
  yt: number
  I: number
  Zt: number
  Zb: number
  /** the local centroid's distance below the plain one's, mm */
  shift: number
  /** eccentricity limits from the local centroid, mm */
  eTop: number
  eBottom: number
  /** the drop's own weight beyond the plain section's, N/mm */
  weight: number
}

export interface DesignOptions {
  /** compute the proposal (default true); the proposal's own verification runs without it */
  proposal?: boolean
}

export function designMember(raw: unknown, options: DesignOptions = {}): Design {
  const input = parseMemberInput(raw)
  // section → loads → profile → balancing → losses → prestress moments → stresses
  const service = designForService(input)
  const { section, loads, profile, losses, analysis, stresses } = service
  const magnel = magnelStage({ section, losses, analysis, stresses })
  const proposal = proposalStage(service, magnel.result, { compute: options.proposal !== false, verify: memberChecks })
  const uls = ulsStage({ input, section, loads, profile, losses, analysis, stresses })
  const sls = slsStage({ input, section, loads, profile, losses, stresses })
  const site = siteStage(input, section, profile, service.stations)
  const fire = fireStage(input, section)
  const anchorages = anchorageStage(input, section, profile)
  const quantities = quantitiesStage(input, section, profile)
  const later = [magnel, proposal, uls, sls, fire, anchorages, quantities, site]
  return designRecord(service, {
    magnel: magnel.result,
    proposal: proposal.result,
    uls: uls.result,
    deflection: sls.result.deflection,
    cracking: sls.result.cracking,
    site: site.result,
    fire: fire.result,
    anchorages: anchorages.result,
    quantities: quantities.result,
    checks: [...service.checks, ...later.flatMap((s) => s.checks)],
    warnings: [...service.warnings, ...later.flatMap((s) => s.warnings)],
  })
}

/** The checks of the whole sheet but the site records, for the proposal to verify an arrangement by. */
function memberChecks(input: MemberInput): { checks: CheckResult[]; uls: MemberUls } {
  const service = designForService(input)
  const { section, loads, profile, losses, analysis, stresses } = service
  const uls = ulsStage({ input, section, loads, profile, losses, analysis, stresses })
  const sls = slsStage({ input, section, loads, profile, losses, stresses })
  return { checks: [...service.checks, ...uls.checks, ...sls.checks], uls: uls.result }
}

interface LaterResults {
  magnel: MagnelResult[]
  proposal: Proposal
  uls: MemberUls
  deflection: MemberDeflection
  cracking: MemberCracking
  site: MemberSite
  fire: MemberFire | null
  anchorages: AnchorageEnd[]
  quantities: MemberQuantities
  checks: CheckResult[]
  warnings: string[]
}

/** The stage results under the frozen keys of Design. */
function designRecord(d: ServiceDesign, later: LaterResults): Design {
  const { input, section, loads, profile, balancing, losses, analysis, stresses } = d
  const supportMoments = (m: number[]): number[] => analysis.supportStations.map((k) => m[k] as number)
  const spans = input.geometry.spans
  const supportLine: ResponseQuantity[] = spans.map((_, j) => ({ kind: 'moment' as const, span: j, x: 0 })).concat({ kind: 'moment', span: spans.length - 1, x: spans[spans.length - 1] as number })
  return {
    engineVersion: ENGINE_VERSION,
    input,
    section: { ...section.properties, tributaryWidth: section.tributaryWidth, spanDepth: section.spanDepth },
    concrete: { class: input.materials.concreteClass, at28: section.at28, atTransfer: { ...section.atTransfer, age: input.materials.ageAtStressing } },
    strand: { ...section.strand, type: input.tendon.strand },
    jacking: {
      ...section.jacking, sigmaJack: section.sigmaJack, PjackStrand: section.sigmaJack * section.strand.Ap, strandsPerTendon: input.tendon.strandsPerTendon,
      tendonsPerWidth: section.tendonsPerWidth, strands: section.strands, Ap: section.Ap, Pjack: section.Pjack,
    },
    eccentricity: section.eccentricity,
    profile: {
      supportEcc: profile.profile.supportEcc,
      // a cantilever's lowest point is the anchorage at its tip
      spanEcc: profile.profile.spanEcc.map((e, i) => (profile.pieces[i] && isCantileverSpan(profile.profile, i) ? (profile.profile.supportEcc[i === 0 ? 0 : i + 1] as number) : e)),
      lowPointAt: profile.lowAt.map((a, i) => (isCantileverSpan(profile.profile, i) ? (i === 0 ? 0 : 1) : a)), inflection: input.profile.inflection,
      drapes: profile.drapes, lowPointX: profile.lowPointX, length: profile.length,
    },
    loads: { selfWeight: loads.selfWeight, superimposed: loads.superimposed, imposed: loads.imposed, balanced: balancing.load },
    balancing: { ...balancing, ...losses.balancing },
    force: losses.force,
    losses: losses.summary,
    prestressMoments: analysis.atSupports,
    loadCases: {
      patterns: loads.patterns,
      supportMoments: {
        selfWeight: supportMoments(loads.cases.selfWeight),
        superimposed: supportMoments(loads.cases.superimposed),
        imposed: loads.patterns.map((_, p) => supportLine.map((q) => loads.arrangements('characteristic').value(q, p))),
      },
    },
    limits: stresses.limits,
    sections: stresses.sections.map((s, r) => ({ ...s, magnel: later.magnel[r] as MagnelResult })),
    checks: later.checks,
    precompression: {
      transfer: losses.transfer.Pmean / section.properties.A, service: losses.service.Pmean / section.properties.A,
      min: input.limits.precompressionMin, max: input.limits.precompressionMax,
    },
    proposal: later.proposal,
    series: memberSeries(d),
    warnings: later.warnings,
    uls: later.uls,
    deflection: later.deflection,
    cracking: later.cracking,
    site: later.site,
    fire: later.fire,
    anchorages: later.anchorages,
    quantities: later.quantities,
    designLoads: designLoads(input, loads),
    designForces: designForces(input, loads),
    drops: section.drops.map((z) => {
      const starts = spans.slice(0, z.support).reduce((a, b) => a + b, 0) // X of the support
      const left = z.parts.find((p) => p.span === z.support - 1)
      const right = z.parts.find((p) => p.span === z.support)
      const p = z.local.properties
      return {
        support: z.support + 1, from: starts - (left ? left.to - left.from : 0), to: starts + (right ? right.to - right.from : 0),
        depth: z.depth, width: z.width, h: p.h, A: p.A, yt: p.yt, I: p.I, Zt: p.Zt, Zb: p.Zb, shift: z.local.shift,
        eTop: z.local.eccentricity.top, eBottom: z.local.eccentricity.bottom, weight: input.materials.density * (p.A - section.properties.A),
      }
    }),
    columns: loads.columns ? { Ecm: loads.columns.Ecm, I: loads.columns.I, joints: columnMoments(loads, profile, losses) } : null,
  }
}
