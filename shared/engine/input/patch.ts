/** Merging a partial input (a proposal's patch) into a member input: objects merge, arrays and values replace. */
import type { MemberInput } from './schema'

export type InputPatch = {
  [K in keyof MemberInput]?: Partial<MemberInput[K]>
}

function isPlainObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v)
}

function mergeDeep(base: unknown, patch: unknown): unknown {
  if (!isPlainObject(base) || !isPlainObject(patch)) return patch === undefined ? base : patch
  const out: Record<string, unknown> = { ...base }
  for (const [k, v] of Object.entries(patch)) out[k] = mergeDeep(base[k], v)
  return out
}

export function mergeInputPatch<T extends object>(input: T, patch: InputPatch): T {
  return mergeDeep(input, patch) as T
}
