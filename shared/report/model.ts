/**
 * What a template binds to: an engine model described by its input fields, its result catalogue,
 * the shape of its results, its checks and its figures. The renderer knows nothing else about the
 * engine, so a test can bind templates to a small model of its own.
 */
import type { CheckResult, QuantitySpec } from '../engine/contract'

/** One input field, as the engine's inputFieldSpecs() lists it (path with dots, arrays whole). */
export interface ModelInputField {
  path: string
  spec: QuantitySpec & { group: string; help?: string }
  kind: 'number' | 'enum' | 'array' | 'table'
  options?: string[]
}

/** One line of a report's front page: a governing quantity and the key whose section it links to. */
export interface OverviewRow {
  label: string
  /** the value as text, with its unit */
  value: string
  /** the concrete result path shown in the section the row links to (e.g. 'deflection.spans.1.longTerm.down') */
  key?: string
}

/** The front page of results: the member in one line and its governing quantities. */
export interface ModelOverview {
  member: string
  rows: OverviewRow[]
}

/** An SVG figure drawn from the results; `at` is the concrete path of an element (e.g. 'sections.2'). */
/** A quantity of the engineer's own calculation drawn on a figure: a line across it at its value. */
export interface FigureMark {
  /** the quantity's name, shown beside the line */
  label: string
  /** along the member (a vertical line) or on the figure's value axis (a horizontal line) */
  axis: 'x' | 'y'
  /** in the unit the figure declares for that axis */
  value: number
}

export interface ModelFigure {
  label: string
  /** the pattern of the array whose element `at` may name (e.g. 'sections[]'); absent: no `at` */
  at?: string
  /**
   * the units (as mathjs writes them) of the axes a quantity may be marked on, in the engine's
   * units of the data drawn; absent: the figure takes no marks
   */
  marks?: { x?: string; y?: string }
  render(results: unknown, at?: string, marks?: readonly FigureMark[]): string
}

export interface ReportModel {
  /** the name templates give in their front matter, e.g. 'pt-member' */
  id: string
  label: string
  inputFields: readonly ModelInputField[]
  /** the input groups a template may list in its front matter */
  inputGroups: readonly string[]
  /** result catalogue: pattern ('sections[].stress.transfer.top') → spec */
  resultSpecs: Readonly<Record<string, QuantitySpec>>
  /** specs the table does not list by pattern (e.g. the input echoed in the results) */
  resultSpec?(pattern: string): QuantitySpec | undefined
  /** every result pattern with what it holds, numbers or not ('sections[].label', 'sections') */
  resultShape: ReadonlyMap<string, ShapeKind>
  /** the check groups a `checks` block may name */
  checkGroups: readonly string[]
  /** words for the check groups, for front pages, tallies and e-mails */
  groupLabels?: Readonly<Record<string, string>>
  /** the front page of results (`::: overview`); absent: the model has none */
  overview?(results: unknown): ModelOverview
  /** result paths (patterns, `[]` for every element) a checker compares first between two revisions */
  governingKeys?: readonly string[]
  /** whether an input field applies to the member as the inputs set it up (a mode not chosen does not) */
  inputApplies?(path: string, inputs: unknown): boolean
  figures: Readonly<Record<string, ModelFigure>>
  /** all checks of a result, in report order */
  checksOf(results: unknown): readonly CheckResult[]
  /** the completed input inside a result (defaults filled in), for input keys the draft leaves out */
  inputOf?(results: unknown): unknown
  /** runs the engine (throws EngineInputError on bad input) */
  run(inputs: unknown): unknown
}

export type ShapeKind = 'leaf' | 'object' | 'array'

/** The shape of plain JSON data as patterns: { a: [{ b: 1 }] } → a: array, a[]: object, a[].b: leaf. */
export function shapeOf(data: unknown, into: Map<string, ShapeKind> = new Map(), prefix = ''): Map<string, ShapeKind> {
  if (Array.isArray(data)) {
    if (prefix) into.set(prefix, 'array')
    for (const item of data) shapeOf(item, into, `${prefix}[]`)
  } else if (data !== null && typeof data === 'object') {
    if (prefix) into.set(prefix, 'object')
    for (const [k, v] of Object.entries(data)) shapeOf(v, into, prefix ? `${prefix}.${k}` : k)
  } else if (prefix && !into.has(prefix)) {
    into.set(prefix, 'leaf')
  }
  return into
}
