/**
 * Which input fields apply to the member as set up: a slab strip has no flange, a beam no tendon
 * spacing, a profile of the deepest kind no hand-set eccentricities. Fields that do not apply are
 * hidden in the form (their values are kept, the engine ignores them).
 */
import { getPath } from '../utils/paths'

type Rule = (inputs: unknown) => boolean

const kind = (inputs: unknown) => String(getPath(inputs, 'section.kind') ?? '')
const flanged = (inputs: unknown) => ['tee-beam', 'ell-beam', 'flanged'].includes(kind(inputs))

const RULES: Record<string, Rule> = {
  'section.b': i => kind(i) === 'rectangle',
  'section.bw': flanged,
  'section.bf': flanged,
  'section.hf': flanged,
  'section.tributaryWidth': i => kind(i) !== 'slab-strip',
  'tendon.count': i => kind(i) !== 'slab-strip',
  'tendon.spacing': i => kind(i) === 'slab-strip',
  'profile.supportEcc': i => getPath(i, 'profile.mode') === 'custom',
  'profile.spanEcc': i => getPath(i, 'profile.mode') === 'custom',
  'losses.longTermShare': i => getPath(i, 'losses.model') === 'percentage',
  'uls.xi': i => getPath(i, 'uls.combination') === '6.10a/b',
  'uls.deltaSigmaUnbonded': i => getPath(i, 'tendon.bond') === 'unbonded',
}

const PUNCHING_DETAIL = /^punching\.(?!column$)/

export function isRelevant(path: string, inputs: unknown): boolean {
  if (PUNCHING_DETAIL.test(path)) return getPath(inputs, 'punching.column') !== 'none' && getPath(inputs, 'punching.column') !== undefined
  const rule = RULES[path]
  return rule ? rule(inputs) : true
}
