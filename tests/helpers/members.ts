/** Small member inputs for the stage fixture tests (invented; engine units: mm, N/mm², fractions). */
import { parseMemberInput } from '../../shared/engine/input/schema'
import type { MemberInput, MemberInputDraft } from '../../shared/engine/input/schema'
import { designForService as serviceDesign } from '../../shared/engine/member/service-design'
import { magnelStage } from '../../shared/engine/member/magnel'
import { stressSearch } from '../../shared/engine/member/proposal-search'
import type { InputPatch } from '../../shared/engine/input/patch'

/** One simply supported 8 m slab strip, 250 mm, C32/40, 3 × 12.9 mm strands at 600 mm. */
export const ONE_SPAN_SLAB: MemberInputDraft = {
  geometry: { spans: [8000] },
  section: { kind: 'slab-strip', h: 250 },
  materials: { concreteClass: 'C32/40' },
  tendon: { strand: '12.9', strandsPerTendon: 3, spacing: 600, coverTop: 25, coverBottom: 25, stressing: 'left' },
  profile: { mode: 'deepest', anchorLeft: 0, anchorRight: 0 },
  loads: { superimposed: 1.5e-3, imposed: 4.0e-3 },
}

/** Two equal 8 m spans of the same slab. */
export const TWO_SPAN_SLAB: MemberInputDraft = { ...ONE_SPAN_SLAB, geometry: { spans: [8000, 8000] }, tendon: { ...ONE_SPAN_SLAB.tendon, stressing: 'both' } }

export function parsed(draft: MemberInputDraft, patch: Partial<MemberInputDraft> = {}): MemberInput {
  return parseMemberInput({ ...draft, ...patch })
}

/** The service stages of a member run one by one, for the fixture tests of each stage. */
export const designForService = serviceDesign


/** The least force and profile for the stresses alone (the first step of the proposal), shaped like a proposal. */
export function stressProposal(draft: MemberInputDraft): { feasible: boolean; reason: string | null; strands: number | null; forceTransfer: number | null; inputPatch: InputPatch | null; verified: boolean } {
  const d = serviceDesign(parseMemberInput(draft))
  const s = stressSearch(d, magnelStage(d).result)
  if (s.least === null) return { feasible: false, reason: s.reason, strands: null, forceTransfer: null, inputPatch: null, verified: false }
  const f = s.least
  return { feasible: true, reason: null, strands: f.candidate.strands, forceTransfer: f.run.losses.transfer.Pmean, inputPatch: s.patchOf(f.candidate, f.supportEcc, f.spanEcc), verified: true }
}
