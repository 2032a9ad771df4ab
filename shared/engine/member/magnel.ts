/**
 * Magnel stage: at every critical section, the stress conditions of every stage, fibre and
 * characteristic force factor as straight lines in (e, 1/P) — Magnel's construction — and the
 * feasible region they leave within the eccentricity limits, with the least force it allows.
 */
import { at } from '../common/numeric'
import type { StageOutcome } from '../common/stage'
import { magnelRegion } from '../checks/magnel'
import type { MagnelCondition, MagnelResult } from '../checks/magnel'
import type { PrestressAnalysis } from './analysis'
import type { MemberLosses } from './losses'
import type { MemberSection } from './section'
import { STAGES, STAGE_LABEL, forceFactors } from './stress-limits'
import type { MomentRange, ServiceSection, ServiceStresses, Stage } from './stress-limits'

interface MagnelInput {
  section: MemberSection
  losses: MemberLosses
  analysis: PrestressAnalysis
  stresses: ServiceStresses
}

/** Magnel conditions at a station: every fibre, bound and characteristic force factor of every stage. */
export function magnelConditions(i: MagnelInput, k: number, M: Record<Stage, MomentRange>, force: { transfer: number; service: number }): MagnelCondition[] {
  const out: MagnelCondition[] = []
  const { rsup, rinf, limits } = i.stresses
  const rs = forceFactors(rsup, rinf)
  const eta = force.service / force.transfer
  for (const stage of STAGES) {
    const L = limits[stage]
    const line = stage === 'transfer' ? i.analysis.transfer : i.analysis.service
    const etaS = stage === 'transfer' ? 1 : eta
    const M2 = at(line.secondary, k)
    for (const r of rs) {
      const add = (fibre: 'top' | 'bottom', bound: 'compression' | 'tension', m: number, limit: number | null): void => {
        if (limit === null) return
        out.push({
          id: `${stage}.${fibre}.${bound}${rs.length > 1 ? (r === rsup ? '.sup' : '.inf') : ''}`,
          label: `${STAGE_LABEL[stage]}, ${fibre} fibre ${bound}${rs.length > 1 ? ` (r = ${r})` : ''}`,
          stage: stage === 'transfer' ? 'transfer' : 'service',
          fibre, bound, forceFactor: r * etaS, M: m + r * M2, limit,
        })
      }
      add('top', 'compression', M[stage].max, L.compression)
      add('top', 'tension', M[stage].min, L.tension)
      add('bottom', 'compression', M[stage].min, L.compression)
      add('bottom', 'tension', M[stage].max, L.tension)
    }
  }
  return out
}

/** The Magnel region of each critical section, in the order of the sections. */
export function magnelStage(i: MagnelInput): StageOutcome<MagnelResult[]> {
  const result = i.stresses.sectionStations.map((k, r) => {
    const s = i.stresses.sections[r] as ServiceSection
    const local = i.section.at(s.span, s.x) // over a drop: its section, e from its centroid
    const sec = local.properties
    const { top, bottom } = local.eccentricity
    return magnelRegion({ A: sec.A, Zt: sec.Zt, Zb: sec.Zb }, magnelConditions(i, k, i.stresses.momentsBySection[r] as Record<Stage, MomentRange>, s.force), -top, bottom)
  })
  return { result, checks: [], warnings: [] }
}
