/**
 * Which input fields apply to the member as set up: a slab strip has no flange, a beam no tendon
 * spacing, a profile of the deepest kind no hand-set eccentricities. Fields that do not apply are
 * hidden in the form and the engine ignores them; the engineer's own values for a mode not chosen
 * are dropped (`withoutHiddenValues`), not kept out of sight.
 */
import { clonePlain, getPath } from '../utils/paths'

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
  'site.stripWidth': i => kind(i) === 'slab-strip',
  'profile.supportEcc': i => getPath(i, 'profile.mode') === 'custom',
  'profile.spanEcc': i => getPath(i, 'profile.mode') === 'custom',
  'losses.longTermShare': i => getPath(i, 'losses.model') === 'percentage',
  'uls.xi': i => getPath(i, 'uls.combination') === '6.10a/b',
  'uls.deltaSigmaUnbonded': i => getPath(i, 'tendon.bond') === 'unbonded',
  'columns.farEndBelow': i => Number(getPath(i, 'columns.heightBelow') ?? 3500) > 0,
  'columns.farEndAbove': i => Number(getPath(i, 'columns.heightAbove') ?? 0) > 0,
  'columns.panelWidth': i => kind(i) === 'slab-strip',
  'fire.slab': i => kind(i) === 'slab-strip',
  'fire.spanRatio': i => kind(i) === 'slab-strip' && getPath(i, 'fire.slab') === 'two-way',
}

const PUNCHING_DETAIL = /^punching\.(?!column$)/
const COLUMN_DETAIL = /^columns\.(?!where$)/
const FIRE_DETAIL = /^fire\.(?!rating$)/

export function isRelevant(path: string, inputs: unknown): boolean {
  if (PUNCHING_DETAIL.test(path)) return getPath(inputs, 'punching.column') !== 'none' && getPath(inputs, 'punching.column') !== undefined
  if (COLUMN_DETAIL.test(path) && (getPath(inputs, 'columns.where') ?? 'none') === 'none') return false
  if (FIRE_DETAIL.test(path) && (getPath(inputs, 'fire.rating') ?? 'none') === 'none') return false
  const rule = RULES[path]
  return rule ? rule(inputs) : true
}

/**
 * Fields whose value is the engineer's own for one mode, with no default standing in for it (the
 * hand-set eccentricities of a custom profile, a rectangle's width, a flange): once the mode changes
 * they do not apply, and they are dropped rather than kept as hidden values. Fields with a default
 * keep it while hidden, as the form would show it again.
 */
const OWN_VALUES_OF_A_MODE = ['section.b', 'section.bw', 'section.bf', 'section.hf', 'section.tributaryWidth', 'profile.supportEcc', 'profile.spanEcc', 'site.stripWidth']

/** The inputs without the values of fields that do not apply to the member as set up (see above). */
export function withoutHiddenValues<T>(inputs: T): T {
  const drop = OWN_VALUES_OF_A_MODE.filter(path => getPath(inputs, path) !== undefined && !isRelevant(path, inputs))
  if (!drop.length) return inputs
  const out = clonePlain(inputs)
  for (const path of drop) {
    const parts = path.split('.')
    const parent = getPath(out, parts.slice(0, -1).join('.')) as Record<string, unknown>
    delete parent[parts.at(-1)!]
  }
  return out
}
