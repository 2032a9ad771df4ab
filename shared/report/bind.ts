/**
 * Keys against a model: which input field or result a key names, with its spec, and how the local
 * names of `each` blocks stand for array elements. Shared by compile (patterns, `[]` for any index)
 * and render (concrete paths, '.3' for the fourth element).
 */
import type { QuantitySpec } from '../engine/contract'
import type { ModelInputField, ReportModel, ShapeKind } from './model'
import { isPosition, patternOf } from './syntax'

export interface KeyInfo {
  source: 'input' | 'result'
  pattern: string
  kind: ShapeKind
  spec?: QuantitySpec
  field?: ModelInputField
}

interface ModelIndex {
  inputs: Map<string, KeyInfo>
  /** patterns of everything inside the inputs (groups like 'geometry' included) */
  inputPrefixes: Set<string>
  topNames: Set<string>
  allPatterns: string[]
}

const indexes = new WeakMap<ReportModel, ModelIndex>()

function prefixesOf(pattern: string): string[] {
  const out: string[] = []
  const re = /\.|\[\]/g
  for (const m of pattern.matchAll(re)) out.push(pattern.slice(0, m.index))
  return out
}

function indexOf(model: ReportModel): ModelIndex {
  const cached = indexes.get(model)
  if (cached) return cached
  const inputs = new Map<string, KeyInfo>()
  const inputPrefixes = new Set<string>()
  for (const field of model.inputFields) {
    const pattern = patternOf(field.path.split('.'))
    if (field.kind === 'array' || field.kind === 'table') {
      inputs.set(pattern, { source: 'input', pattern, kind: 'array', spec: field.spec, field })
      inputs.set(`${pattern}[]`, { source: 'input', pattern: `${pattern}[]`, kind: 'leaf', spec: field.spec, field })
    } else {
      inputs.set(pattern, { source: 'input', pattern, kind: 'leaf', spec: field.spec, field })
    }
    for (const p of prefixesOf(pattern)) inputPrefixes.add(p)
  }
  const resultPatterns = [...model.resultShape.keys(), ...Object.keys(model.resultSpecs)]
  const allPatterns = [...new Set([...inputs.keys(), ...inputPrefixes, ...resultPatterns])].sort()
  const topNames = new Set(allPatterns.map((p) => p.split(/\.|\[\]/)[0]!))
  const index = { inputs, inputPrefixes, topNames, allPatterns }
  indexes.set(model, index)
  return index
}

/** The prefix under which :val[…] reaches the inputs (the engine's results echo them there too). */
export const INPUT_PREFIX = 'input.'

function inputInfo(index: ModelIndex, pattern: string): KeyInfo | undefined {
  const input = index.inputs.get(pattern)
  if (input) return input
  if (index.inputPrefixes.has(pattern)) return { source: 'input', pattern, kind: 'object' }
  return undefined
}

function resultInfo(model: ReportModel, pattern: string): KeyInfo | undefined {
  const spec = model.resultSpecs[pattern] ?? model.resultSpec?.(pattern)
  const shape = model.resultShape.get(pattern)
  if (spec) return { source: 'result', pattern, kind: shape ?? 'leaf', spec }
  if (shape) return { source: 'result', pattern, kind: shape }
  return undefined
}

/**
 * What a key pattern names. `:in[…]` names input fields by their own path; every other use names
 * results, and `input.…` reaches the inputs (falling back to what the results echo under `input`).
 */
export function describeKey(model: ReportModel, pattern: string, use: 'input' | 'value'): KeyInfo | undefined {
  const index = indexOf(model)
  if (use === 'input') return inputInfo(index, inputPath(pattern))
  if (pattern.startsWith(INPUT_PREFIX)) {
    const input = inputInfo(index, pattern.slice(INPUT_PREFIX.length))
    if (input) return input
  }
  return resultInfo(model, pattern)
}

/** The path of a value inside the inputs, for a key that names an input. */
export function inputPath(path: string): string {
  return path.startsWith(INPUT_PREFIX) ? path.slice(INPUT_PREFIX.length) : path
}

/** Whether a local name would hide a key of the model. */
export function isModelName(model: ReportModel, name: string): boolean {
  return indexOf(model).topNames.has(name)
}

/** The closest few patterns to a misspelt one, for the error message. */
export function suggestKeys(model: ReportModel, pattern: string): string[] {
  const limit = Math.max(2, Math.floor(pattern.length / 5))
  return indexOf(model).allPatterns
    .map((p) => ({ p, d: editDistance(p, pattern, limit) }))
    .filter((x) => x.d <= limit)
    .sort((a, b) => a.d - b.d || a.p.localeCompare(b.p))
    .slice(0, 3)
    .map((x) => x.p)
}

/** Levenshtein distance, giving up (limit + 1) once it exceeds the limit. */
function editDistance(a: string, b: string, limit: number): number {
  if (Math.abs(a.length - b.length) > limit) return limit + 1
  let prev = Array.from({ length: b.length + 1 }, (_, j) => j)
  for (let i = 1; i <= a.length; i += 1) {
    const row = [i]
    let best = i
    for (let j = 1; j <= b.length; j += 1) {
      const v = Math.min(prev[j]! + 1, row[j - 1]! + 1, prev[j - 1]! + (a[i - 1] === b[j - 1] ? 0 : 1))
      row.push(v)
      best = Math.min(best, v)
    }
    if (best > limit) return limit + 1
    prev = row
  }
  return prev[b.length]!
}

/** A local name of an `each` block while compiling: the pattern of the element it stands for. */
export interface PatternScope {
  name: string
  /** null when the block's own key was wrong: keys under it are not checked again */
  pattern: string | null
}

export type ResolvedPattern = { kind: 'pattern'; pattern: string } | { kind: 'index' } | { kind: 'unchecked' } | { kind: 'bad'; problem: string }

function findLocal<T extends { name: string }>(scopes: readonly T[], name: string): T | undefined {
  for (let i = scopes.length - 1; i >= 0; i -= 1) if (scopes[i]!.name === name) return scopes[i]
  return undefined
}

export function resolvePattern(segments: readonly string[], scopes: readonly PatternScope[]): ResolvedPattern {
  for (const s of segments) {
    if (isPosition(s) && !findLocal(scopes, s.slice(1))) {
      return { kind: 'bad', problem: `"${segments.join('.')}": ${s} is the position of a local name, but no enclosing each is called ${s.slice(1)}` }
    }
  }
  if (segments.length === 1 && isPosition(segments[0]!)) return { kind: 'index' }
  const local = findLocal(scopes, segments[0]!)
  if (!local) return { kind: 'pattern', pattern: patternOf(segments) }
  if (local.pattern === null) return { kind: 'unchecked' }
  const rest = patternOf(['x', ...segments.slice(1)]).slice(1)
  return { kind: 'pattern', pattern: local.pattern + rest }
}

/** A local name while rendering: the concrete path of the element and its index. */
export interface PathScope {
  name: string
  path: string
  index: number
}

export type ResolvedPath = { kind: 'path'; path: string; pattern: string } | { kind: 'index'; index: number }

export function resolvePath(segments: readonly string[], scopes: readonly PathScope[]): ResolvedPath {
  if (segments.length === 1 && isPosition(segments[0]!)) return { kind: 'index', index: findLocal(scopes, segments[0]!.slice(1))?.index ?? -1 }
  const concrete = segments.map((s) => (isPosition(s) ? String(findLocal(scopes, s.slice(1))?.index ?? -1) : s))
  const local = findLocal(scopes, concrete[0]!)
  const path = local ? [local.path, ...concrete.slice(1)].join('.') : concrete.join('.')
  return { kind: 'path', path, pattern: patternOf(path.split('.')) }
}
