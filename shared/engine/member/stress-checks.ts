/**
 * The checks of the stresses stage: every stage's fibre stresses against their limits at the most
 * utilised critical section, the tendon stresses at jacking, after lock-off and in service, the
 * cover to the ducts for bond, and the average precompression.
 */
import type { CheckResult } from '../contract'
import { ratioCheck } from '../common/check'
import type { MemberInput } from '../input/schema'
import type { MemberLosses } from './losses'
import type { MemberSection } from './section'
import { STAGES, STAGE_LABEL, stageClause } from './stress-limits'
import type { ServiceSection, ServiceStresses, Stage, StageStress, UtilisationKey } from './stress-limits'

interface StressChecksInput {
  input: MemberInput
  section: MemberSection
  losses: MemberLosses
  stresses: ServiceStresses
}

const FIBRE_ITEMS: Array<{ fibre: 'top' | 'bottom'; bound: 'compression' | 'tension'; key: UtilisationKey }> = [
  { fibre: 'top', bound: 'tension', key: 'topT' },
  { fibre: 'top', bound: 'compression', key: 'topC' },
  { fibre: 'bottom', bound: 'tension', key: 'botT' },
  { fibre: 'bottom', bound: 'compression', key: 'botC' },
]

function fibreChecks(stresses: ServiceStresses): CheckResult[] {
  const checks: CheckResult[] = []
  const { limits, sections, stressBySection } = stresses
  for (const stage of STAGES) {
    const L = limits[stage]
    for (const it of FIBRE_ITEMS) {
      const limit = it.bound === 'compression' ? L.compression : L.tension
      if (limit === null) continue
      let worst = 0
      let u = -1
      stressBySection.forEach((s, i) => {
        const v = s[stage].utilisation[it.key]
        if (v > u) { u = v; worst = i }
      })
      const sec = sections[worst] as ServiceSection
      const env = (stressBySection[worst] as Record<Stage, StageStress>)[stage].envelope
      const sigma = it.fibre === 'top' ? (it.bound === 'compression' ? env.topMax : env.topMin) : it.bound === 'compression' ? env.bottomMax : env.bottomMin
      const actual = it.bound === 'compression' ? Math.max(0, sigma) : Math.max(0, -sigma)
      checks.push({
        id: `${stage}.${it.fibre}.${it.bound}`,
        group: stage === 'transfer' ? 'transfer' : 'service',
        title: `${STAGE_LABEL[stage]}: ${it.fibre} fibre ${it.bound === 'compression' ? 'compression' : limit === 0 ? 'decompression' : 'tension'}`,
        location: `${sec.label}, x = ${(sec.X / 1000).toFixed(2)} m`,
        clause: stageClause(stage, it.bound, limits),
        actual,
        limit,
        unit: 'MPa',
        utilisation: u,
        pass: u <= 1 + 1e-9,
        ...(limit === 0 ? { note: 'no tension allowed; utilisation above 1 grows with the tension over fctm' } : {}),
      })
    }
  }
  return checks
}

export function stressChecks({ input, section, losses, stresses }: StressChecksInput): CheckResult[] {
  const { Ap, sigmaJack, jacking } = section
  const A = section.properties.A
  const maxLockOff = Math.max(...losses.afterDrawIn) / Ap
  const maxService = Math.max(...losses.service.P) / Ap
  const pa0 = losses.transfer.Pmean / A
  const pa = losses.service.Pmean / A
  const t = input.tendon
  return [
    ...fibreChecks(stresses),
    ratioCheck({ id: 'tendon.jacking', group: 'tendon', title: 'Stress at jacking', clause: 'EN 1992-1-1 5.10.2.1(1) eq. (5.41)', actual: sigmaJack, limit: jacking.sigmaPmax, unit: 'MPa' }),
    ratioCheck({ id: 'tendon.lockOff', group: 'tendon', title: 'Largest stress after lock-off (friction and draw-in)', clause: 'EN 1992-1-1 5.10.3(2) eq. (5.43)', actual: maxLockOff, limit: jacking.sigmaPm0, unit: 'MPa' }),
    ratioCheck({
      id: 'tendon.service', group: 'tendon', title: 'Tendon stress in service (uncracked, characteristic)', clause: 'EN 1992-1-1 7.2(5)',
      actual: maxService, limit: stresses.limits.tendonService, unit: 'MPa', note: 'the stress increase of an uncracked section under live load is neglected',
    }),
    ratioCheck({
      id: 'tendon.coverBond', group: 'tendon', title: 'Cover to duct for bond', clause: 'EN 1992-1-1 4.4.1.2, Table 4.2',
      actual: Math.min(t.coverTop, t.coverBottom), limit: section.eccentricity.coverForBond, unit: 'mm',
      note: 'the durability cover of Table 4.5N and Δcdev are the designer\'s to add', atLeast: true,
    }),
    // a least precompression of 0 asks for none: no check
    ...(input.limits.precompressionMin > 0
      ? [ratioCheck({ id: 'precompression.min', group: 'precompression', title: 'Average precompression in service, at least', clause: 'common practice (P/A)', actual: pa, limit: input.limits.precompressionMin, unit: 'MPa', atLeast: true })]
      : []),
    ratioCheck({ id: 'precompression.max', group: 'precompression', title: 'Average precompression at transfer, at most', clause: 'common practice (P/A)', actual: pa0, limit: input.limits.precompressionMax, unit: 'MPa' }),
  ]
}
