/**
 * Adding and removing spans with the lists that go with them (supports, support and low-point
 * eccentricities, low-point positions) kept in step. A member that is symmetric about its middle
 * stays symmetric: its left half is kept and mirrored, so spans come and go in the middle. Any other
 * member gains or loses its last span; the end support (and its eccentricity) stays the end.
 */
import { clonePlain, getPath, setPath } from '../utils/paths'

type Inputs = Record<string, unknown>

/** Lists with one entry per span, and per support (one more than the spans). */
const PER_SPAN = ['geometry.spans', 'profile.spanEcc', 'profile.lowPointAt'] as const
const PER_SUPPORT = ['geometry.supports', 'profile.supportEcc'] as const
/** A low point at 40 % of a span, seen from the other end, is at 60 %. */
const MIRRORED = new Set<string>(['profile.lowPointAt'])
const TOLERANCE = 1e-9

export function spanCount(inputs: unknown): number {
  const spans = getPath(inputs, 'geometry.spans')
  return Array.isArray(spans) ? spans.length : 0
}

function listAt(inputs: unknown, path: string): unknown[] | undefined {
  const list = getPath(inputs, path)
  return Array.isArray(list) ? list : undefined
}

function same(a: unknown, b: unknown): boolean {
  return typeof a === 'number' && typeof b === 'number' ? Math.abs(a - b) <= TOLERANCE * Math.max(1, Math.abs(a)) : a === b
}

function mirrorOf(path: string, value: unknown): unknown {
  return MIRRORED.has(path) && typeof value === 'number' ? 1 - value : value
}

/** Symmetric about the middle: spans, supports and the profile read the same from either end. */
export function isSymmetric(inputs: unknown): boolean {
  return [...PER_SPAN, ...PER_SUPPORT].every((path) => {
    const list = listAt(inputs, path)
    return !list || list.every((v, i) => same(v, mirrorOf(path, list[list.length - 1 - i])))
  })
}

/** A list of `n` built from the first half of `list`, mirrored. */
function mirrored(path: string, list: unknown[], n: number): unknown[] {
  const half = Math.ceil(n / 2)
  const left = list.slice(0, Math.min(half, list.length))
  while (left.length < half) left.push(list[Math.floor((list.length - 1) / 2)])
  const out = [...left, ...left.slice(0, n - half).reverse().map(v => mirrorOf(path, v))]
  // a span in the very middle has its low point in the middle
  if (MIRRORED.has(path) && n % 2 === 1) out[half - 1] = 0.5
  return out
}

/** A list of `n` that keeps its first entries and its last (the end support stays the end). */
function endKept(list: unknown[], n: number, perSupport: boolean): unknown[] {
  if (n >= list.length) {
    const out = [...list]
    // a new span goes before the end: it copies the last interior entry (or the last one)
    const at = perSupport ? out.length - 1 : out.length
    const source = out[Math.max(0, at - 1)]
    while (out.length < n) out.splice(perSupport ? out.length - 1 : out.length, 0, source)
    return out
  }
  return perSupport ? [...list.slice(0, n - 1), list[list.length - 1]] : list.slice(0, n)
}

/** The inputs with `count` spans, every per-span and per-support list resized with them. */
export function resizeSpanLists<T extends Inputs>(inputs: T, count: number): T {
  const symmetric = isSymmetric(inputs)
  let next = clonePlain(inputs)
  for (const path of [...PER_SPAN, ...PER_SUPPORT]) {
    const list = listAt(next, path)
    if (!list || !list.length) continue
    const perSupport = (PER_SUPPORT as readonly string[]).includes(path)
    const n = perSupport ? count + 1 : count
    next = setPath(next, path, symmetric ? mirrored(path, list, n) : endKept(list, n, perSupport))
  }
  return next
}
