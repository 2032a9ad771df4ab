/** Small member inputs for the stage fixture tests (invented; engine units: mm, N/mm², fractions). */
import { parseMemberInput } from '../../shared/engine/input/schema'
import type { MemberInput, MemberInputDraft } from '../../shared/engine/input/schema'

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
export { designForService } from '../../shared/engine/member/service-design'
