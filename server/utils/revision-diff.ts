// What changed between two frozen revisions of a sheet, as a checker reads it: the inputs by label
// in display units (those that apply to the member as set up), then the results section by section
// of the report — checks whose state changed first, then the governing values that moved more than
// the threshold — and, apart, every result value that changed at all. Pure, so unit tests can drive
// it with any pair of runs and a model of their own.
import type { CheckResult, QuantitySpec } from '../../shared/engine/contract'
import type { ReportModel, ReportSection } from '../../shared/report'
import { valueText } from '../../shared/report/format'
import { getPath } from '../../shared/utils/paths'
import { formatQuantity } from '../../shared/utils/units'

/** One side of the comparison: a frozen run and where its report shows each check and value. */
export interface DiffSide {
  inputs: unknown
  results: unknown
  sections: readonly ReportSection[]
  /** check id → id of the section whose table shows it */
  checkSections: Readonly<Record<string, string>>
  /** concrete result path → id of the first section that shows it */
  keySections: Readonly<Record<string, string>>
}

export interface InputChange {
  path: string
  label: string
  group: string
  before: string
  after: string
}

export interface ValueChange {
  path: string
  label: string
  before: string
  after: string
  /** relative change (after − before) / |before|, when both are numbers and before ≠ 0 */
  relative: number | null
}

export type CheckChangeKind = 'now-fails' | 'now-passes' | 'added' | 'removed' | 'utilisation'

export interface CheckChange {
  id: string
  title: string
  location: string
  clause: string
  change: CheckChangeKind
  before: { pass: boolean, utilisation: number, actual: string } | null
  after: { pass: boolean, utilisation: number, actual: string } | null
}

/** The changes shown under one top-level section of the report (id null: values no section shows). */
export interface SectionChanges {
  id: string | null
  title: string
  checks: CheckChange[]
  values: ValueChange[]
}

export interface RevisionDiff {
  inputs: InputChange[]
  sections: SectionChanges[]
  counts: { nowFails: number, nowPasses: number, governingMoved: number }
  /** every catalogued result value that changed beyond a tiny tolerance, for the "show all" list */
  all: ValueChange[]
  /** changed values the catalogue does not describe (figure samples, intermediate lists), counted only */
  uncatalogued: number
  /** governing values and utilisations are listed when they move by more than this share */
  threshold: number
}

export interface DiffOptions {
  /** relative move of a governing value or a utilisation worth listing (default 1 %) */
  threshold?: number
}

/** Result subtrees that are not results a checker compares: the echoed input, figure samples, the check list (compared on its own). */
const SKIPPED_RESULTS = ['input', 'series', 'checks', 'engineVersion', 'warnings']
/** Below this a number has not changed (float noise between engine versions). */
const NOISE = { relative: 1e-6, absolute: 1e-9 }
const ORDER: Record<CheckChangeKind, number> = { 'now-fails': 0, 'now-passes': 1, 'added': 2, 'removed': 3, 'utilisation': 4 }

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

/** 'sections.3.e' → 'sections[].e': the catalogue's pattern of a concrete path. */
function patternOf(path: string): string {
  return path.replace(/\.(\d+)(?=\.|$)/g, '[]')
}

function specOf(model: ReportModel, path: string): QuantitySpec | undefined {
  const pattern = patternOf(path)
  return model.resultSpecs[pattern] ?? model.resultSpec?.(pattern)
}

/** "Mean force in service (span 2)": the label, with the element's position where the path has one. */
function labelOf(model: ReportModel, path: string): string {
  const spec = specOf(model, path)
  if (!spec) return path
  const positions = [...path.matchAll(/\.(\d+)(?=\.|$)/g)].map(m => Number(m[1]) + 1)
  return positions.length ? `${spec.label} (${positions.join(', ')})` : spec.label
}

function valueChange(model: ReportModel, path: string, a: Leaf | undefined, b: Leaf | undefined): ValueChange {
  const spec = specOf(model, path)
  return {
    path,
    label: labelOf(model, path),
    before: valueText(a ?? null, spec),
    after: valueText(b ?? null, spec),
    relative: typeof a === 'number' && typeof b === 'number' && a !== 0 ? (b - a) / Math.abs(a) : null,
  }
}

function sameJson(a: unknown, b: unknown) {
  return JSON.stringify(a) === JSON.stringify(b)
}

/** Inputs by field, in display units; a field that applies to neither run (a mode not chosen) is left out. */
function inputChanges(model: ReportModel, before: unknown, after: unknown): InputChange[] {
  const out: InputChange[] = []
  const covered: string[] = []
  for (const field of model.inputFields) {
    covered.push(field.path)
    const a = getPath(before, field.path)
    const b = getPath(after, field.path)
    if (sameJson(a, b)) continue
    const applies = model.inputApplies ?? (() => true)
    if (!applies(field.path, before) && !applies(field.path, after)) continue
    out.push({ path: field.path, label: field.spec.label, group: field.spec.group, before: valueText(a ?? null, field.spec), after: valueText(b ?? null, field.spec) })
  }
  // anything the field list does not describe still shows, by its path
  const isCovered = (path: string) => covered.some(c => path === c || path.startsWith(`${c}.`))
  const leavesBefore = flattenLeaves(before)
  const leavesAfter = flattenLeaves(after)
  for (const path of [...new Set([...leavesBefore.keys(), ...leavesAfter.keys()])].sort()) {
    if (isCovered(path) || sameJson(leavesBefore.get(path), leavesAfter.get(path))) continue
    out.push({ path, label: path, group: '', before: valueText(leavesBefore.get(path) ?? null, undefined), after: valueText(leavesAfter.get(path) ?? null, undefined) })
  }
  return out
}

function resultLeaves(results: unknown) {
  const all = flattenLeaves(results)
  for (const path of [...all.keys()]) {
    if (SKIPPED_RESULTS.includes(path.split('.')[0]!)) all.delete(path)
  }
  return all
}

function changedLeaves(before: Map<string, Leaf>, after: Map<string, Leaf>, relative: number, absolute: number): string[] {
  return [...new Set([...before.keys(), ...after.keys()])].sort().filter((path) => {
    const a = before.get(path)
    const b = after.get(path)
    if (typeof a !== 'number' && typeof b !== 'number') return false
    return typeof a === 'number' && typeof b === 'number' ? differsBeyond(a, b, relative, absolute) : a !== b
  })
}

/**
 * The model's governing quantities in both runs: a single value as it is; a list (a pattern with
 * `[]`, one value per span or section) by its element of greatest magnitude, which is what governs.
 * `path` is where the later run has it (the section that shows it), `of` how many elements compete.
 */
function governingValues(model: ReportModel, before: Map<string, Leaf>, after: Map<string, Leaf>) {
  const out: Array<{ path: string, before: number, after: number, of: number }> = []
  for (const pattern of model.governingKeys ?? []) {
    const extreme = (leaves: Map<string, Leaf>) => {
      let best: { path: string, value: number } | null = null
      let count = 0
      for (const [path, value] of leaves) {
        if (typeof value !== 'number' || patternOf(path) !== pattern) continue
        count += 1
        if (!best || Math.abs(value) > Math.abs(best.value)) best = { path, value }
      }
      return { best, count }
    }
    const a = extreme(before)
    const b = extreme(after)
    if (a.best && b.best) out.push({ path: b.best.path, before: a.best.value, after: b.best.value, of: Math.max(a.count, b.count) })
  }
  return out
}

function checksOf(model: ReportModel, results: unknown): readonly CheckResult[] {
  try {
    return model.checksOf(results) ?? []
  }
  catch {
    return []
  }
}

function shownCheck(c: CheckResult) {
  return { pass: c.pass, utilisation: c.utilisation, actual: `${formatQuantity(c.actual, c.unit, 2)} of ${formatQuantity(c.limit, c.unit, 2)}` }
}

function checkChanges(before: readonly CheckResult[], after: readonly CheckResult[], threshold: number): CheckChange[] {
  const a = new Map(before.map(c => [c.id, c]))
  const b = new Map(after.map(c => [c.id, c]))
  const out: CheckChange[] = []
  for (const id of [...new Set([...a.keys(), ...b.keys()])]) {
    const x = a.get(id)
    const y = b.get(id)
    const ref = (y ?? x)!
    const base = { id, title: ref.title, location: ref.location ?? '', clause: ref.clause, before: x ? shownCheck(x) : null, after: y ? shownCheck(y) : null }
    if (!x) out.push({ ...base, change: 'added' })
    else if (!y) out.push({ ...base, change: 'removed' })
    else if (x.pass !== y.pass) out.push({ ...base, change: y.pass ? 'now-passes' : 'now-fails' })
    else if (differsBeyond(x.utilisation, y.utilisation, threshold, 0.005)) out.push({ ...base, change: 'utilisation' })
  }
  return out.sort((p, q) => ORDER[p.change] - ORDER[q.change])
}

/** The top-level section a section belongs to (its nearest level-1 ancestor in report order). */
function topLevelOf(sections: readonly ReportSection[], id: string | undefined): ReportSection | null {
  const at = id ? sections.findIndex(s => s.id === id) : -1
  if (at < 0) return null
  const top = Math.min(...sections.map(s => s.level))
  for (let i = at; i >= 0; i--) if (sections[i]!.level === top) return sections[i]!
  return sections[at]!
}

export function diffRevisions(model: ReportModel, before: DiffSide, after: DiffSide, options: DiffOptions = {}): RevisionDiff {
  const threshold = options.threshold ?? 0.01
  const leavesBefore = resultLeaves(before.results)
  const leavesAfter = resultLeaves(after.results)
  const changed = changedLeaves(leavesBefore, leavesAfter, NOISE.relative, NOISE.absolute)
  const all = changed.filter(path => specOf(model, path) !== undefined)
  const governing = governingValues(model, leavesBefore, leavesAfter)
    .filter(g => differsBeyond(g.before, g.after, threshold, NOISE.absolute))

  // sections in the order of the later report; what only the earlier one shows goes after them
  const groups = new Map<string, SectionChanges>()
  const other: SectionChanges = { id: null, title: 'Results the report does not show', checks: [], values: [] }
  const groupFor = (section: ReportSection | null) => {
    if (!section) return other
    if (!groups.has(section.id)) groups.set(section.id, { id: section.id, title: section.title, checks: [], values: [] })
    return groups.get(section.id)!
  }
  for (const s of after.sections) if (s.level === Math.min(...after.sections.map(x => x.level))) groupFor(s)
  const sectionOf = (lookup: (side: DiffSide) => string | undefined) =>
    topLevelOf(after.sections, lookup(after)) ?? topLevelOf(before.sections, lookup(before))

  const checks = checkChanges(checksOf(model, before.results), checksOf(model, after.results), threshold)
  for (const c of checks) groupFor(sectionOf(side => side.checkSections[c.id])).checks.push(c)
  for (const g of governing) {
    const change = valueChange(model, g.path, g.before, g.after)
    groupFor(sectionOf(side => side.keySections[g.path])).values.push(g.of > 1 ? { ...change, label: `${specOf(model, g.path)?.label ?? g.path}, greatest of ${g.of}` } : change)
  }

  const sections = [...groups.values(), other].filter(g => g.checks.length + g.values.length > 0)
  return {
    inputs: inputChanges(model, before.inputs, after.inputs),
    sections,
    counts: {
      nowFails: checks.filter(c => c.change === 'now-fails').length,
      nowPasses: checks.filter(c => c.change === 'now-passes').length,
      governingMoved: governing.length,
    },
    all: all.map(path => valueChange(model, path, leavesBefore.get(path), leavesAfter.get(path))),
    uncatalogued: changed.length - all.length,
    threshold,
  }
}
