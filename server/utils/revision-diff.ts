// What changed between two frozen revisions of a sheet: inputs, results beyond a tolerance, and
// checks whose state changed. Pure, so unit tests can drive it with any pair of runs.
import type { CheckResult, QuantitySpec } from '../../shared/engine/contract'
import { formatQuantity } from '../../shared/utils/units'

export interface ValueChange {
  path: string
  label: string
  before: string
  after: string
  /** relative change (after − before) / |before|, when both are numbers and before ≠ 0 */
  relative: number | null
}

export interface CheckChange {
  id: string
  title: string
  location: string
  change: 'now-fails' | 'now-passes' | 'added' | 'removed' | 'utilisation'
  before: { pass: boolean, utilisation: number } | null
  after: { pass: boolean, utilisation: number } | null
}

export interface RevisionDiff {
  inputs: ValueChange[]
  results: ValueChange[]
  /** result changes beyond the tolerance that were left out of `results` to keep the list readable */
  resultsOmitted: number
  checks: CheckChange[]
  tolerance: { relative: number, absolute: number }
}

export interface DiffOptions {
  /** spec of a concrete path ('sections.3.stress.transfer.top'), for labels and units */
  specFor?: (path: string) => QuantitySpec | undefined
  relative?: number
  absolute?: number
  maxResults?: number
}

/** Result subtrees that are not results a checker compares: the echoed input, figure samples, the check list (compared on its own). */
const SKIPPED_RESULTS = ['input', 'series', 'checks', 'engineVersion', 'warnings']

type Leaf = string | number | boolean | null

export function flattenLeaves(value: unknown, prefix = '', out = new Map<string, Leaf>()): Map<string, Leaf> {
  if (Array.isArray(value)) value.forEach((v, i) => flattenLeaves(v, prefix ? `${prefix}.${i}` : String(i), out))
  else if (value !== null && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) flattenLeaves(v, prefix ? `${prefix}.${k}` : k, out)
  }
  else if (value === null || typeof value === 'string' || typeof value === 'number' || typeof value === 'boolean') out.set(prefix, value)
  return out
}

/** Beyond tolerance: |a − b| > absolute + relative · max(|a|, |b|). */
export function differsBeyond(a: number, b: number, relative: number, absolute: number): boolean {
  return Math.abs(a - b) > absolute + relative * Math.max(Math.abs(a), Math.abs(b))
}

function show(value: Leaf | undefined, spec: QuantitySpec | undefined): string {
  if (value === undefined) return '—'
  if (typeof value === 'number' && spec) return formatQuantity(value, spec.unit, spec.precision)
  return String(value)
}

function valueChanges(before: Map<string, Leaf>, after: Map<string, Leaf>, opts: Required<Omit<DiffOptions, 'specFor'>> & DiffOptions, numericOnly: boolean) {
  const out: ValueChange[] = []
  const paths = [...new Set([...before.keys(), ...after.keys()])].sort()
  for (const path of paths) {
    const a = before.get(path)
    const b = after.get(path)
    if (numericOnly && typeof a !== 'number' && typeof b !== 'number') continue
    const bothNumbers = typeof a === 'number' && typeof b === 'number'
    const changed = bothNumbers ? differsBeyond(a, b, opts.relative, opts.absolute) : a !== b
    if (!changed) continue
    const spec = opts.specFor?.(path)
    out.push({
      path,
      label: spec?.label ?? path,
      before: show(a, spec),
      after: show(b, spec),
      relative: bothNumbers && a !== 0 ? (b - a) / Math.abs(a) : null,
    })
  }
  return out
}

function checkChanges(before: CheckResult[], after: CheckResult[], relative: number): CheckChange[] {
  const a = new Map(before.map(c => [c.id, c]))
  const b = new Map(after.map(c => [c.id, c]))
  const out: CheckChange[] = []
  for (const id of [...new Set([...a.keys(), ...b.keys()])].sort()) {
    const x = a.get(id)
    const y = b.get(id)
    const ref = (y ?? x)!
    const base = { id, title: ref.title, location: ref.location ?? '', before: x ? { pass: x.pass, utilisation: x.utilisation } : null, after: y ? { pass: y.pass, utilisation: y.utilisation } : null }
    if (!x) out.push({ ...base, change: 'added' })
    else if (!y) out.push({ ...base, change: 'removed' })
    else if (x.pass !== y.pass) out.push({ ...base, change: y.pass ? 'now-passes' : 'now-fails' })
    else if (differsBeyond(x.utilisation, y.utilisation, relative, 0.005)) out.push({ ...base, change: 'utilisation' })
  }
  return out
}

function checksOf(results: unknown): CheckResult[] {
  const checks = (results as { checks?: unknown })?.checks
  return Array.isArray(checks) ? (checks as CheckResult[]) : []
}

function resultLeaves(results: unknown) {
  const all = flattenLeaves(results)
  for (const path of [...all.keys()]) {
    const top = path.split('.')[0]!
    if (SKIPPED_RESULTS.includes(top)) all.delete(path)
  }
  return all
}

export function diffRevisions(
  before: { inputs: unknown, results: unknown },
  after: { inputs: unknown, results: unknown },
  options: DiffOptions = {},
): RevisionDiff {
  const opts = { relative: 1e-3, absolute: 1e-9, maxResults: 200, ...options }
  const results = valueChanges(resultLeaves(before.results), resultLeaves(after.results), opts, true)
  return {
    inputs: valueChanges(flattenLeaves(before.inputs), flattenLeaves(after.inputs), opts, false),
    results: results.slice(0, opts.maxResults),
    resultsOmitted: Math.max(0, results.length - opts.maxResults),
    checks: checkChanges(checksOf(before.results), checksOf(after.results), opts.relative),
    tolerance: { relative: opts.relative, absolute: opts.absolute },
  }
}
