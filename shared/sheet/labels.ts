/**
 * Input paths in people's words: `geometry.spans.1` is "Span 2", `section.kind` = `tee-beam` is
 * "T band beam". Labels come from the engine's input field specs; list elements are numbered from 1
 * the way a drawing numbers spans and supports. Every message the editor and the sheet routes show
 * goes through here, so a field path never reaches the engineer.
 */
import { inputFieldSpecs, type InputFieldSpec } from '../engine/index'
import { fieldFor } from '../utils/paths'

const SPECS: InputFieldSpec[] = inputFieldSpecs()

/** A list field's element, by its number counted from 1. */
const ELEMENT_LABELS: Record<string, (n: number) => string> = {
  'geometry.spans': n => `Span ${n}`,
  'geometry.supports': n => `Support ${n}`,
  'profile.supportEcc': n => `Eccentricity at support ${n}`,
  'profile.spanEcc': n => `Eccentricity at the low point of span ${n}`,
  'profile.lowPointAt': n => `Low point in span ${n}`,
  'site.measured': n => `Measured extension, tendon ${n}`,
  'loads.points': n => `Point load ${n}`,
  'loads.lines': n => `Line load ${n}`,
  'loads.partials': n => `Partial load ${n}`,
  'section.drops': n => `Drop ${n}`,
  'tendon.joints': n => `Joint ${n}`,
}

/** The words of a table's add button: "Add a point load". */
const ADD_ROW_LABELS: Record<string, string> = {
  'loads.points': 'Add a point load',
  'loads.lines': 'Add a line load',
  'loads.partials': 'Add a partial load',
}

/** The words of the button that adds a row to a table field. */
export function addRowLabel(path: string): string {
  return ADD_ROW_LABELS[path] ?? `Add a row to “${inputSpecFor(path)?.spec.label ?? path}”`
}

/** Where the engine's own label does not tell two fields apart. */
const FIELD_LABELS: Record<string, string> = {
  'profile.anchorLeft': 'Eccentricity at the left anchorage',
  'profile.anchorRight': 'Eccentricity at the right anchorage',
}

/** Words for the engine's option ids, per field (list fields by the field's path). */
const OPTION_WORDS: Record<string, Record<string, string>> = {
  'geometry.supports': { pinned: 'Pinned', fixed: 'Fixed', free: 'Free (cantilever tip)' },
  'columns.where': { none: 'None (the member rests on its supports)', interior: 'At the interior supports', all: 'At every support' },
  'section.kind': { 'slab-strip': 'Slab strip', 'tee-beam': 'T band beam', 'ell-beam': 'L band beam', 'rectangle': 'Rectangle', 'flanged': 'Flanged section' },
  'materials.cement': { R: 'Class R (rapid hardening)', N: 'Class N (normal)', S: 'Class S (slow)' },
  'tendon.strand': { '12.5': '12.5 mm strand', '12.9': '12.9 mm strand', '15.2': '15.2 mm strand', '15.7': '15.7 mm strand' },
  'tendon.ductShape': { flat: 'Flat duct', round: 'Round duct' },
  'tendon.bond': { bonded: 'Bonded (grouted)', unbonded: 'Unbonded' },
  'tendon.stressing': { left: 'Left end', right: 'Right end', both: 'Both ends' },
  'profile.mode': { deepest: 'Deepest the covers allow', custom: 'Custom eccentricities' },
  'loads.pattern': { 'alternate-and-adjacent': 'Alternate and adjacent spans', 'all-spans': 'All spans loaded' },
  'losses.model': { detailed: 'Creep, shrinkage and relaxation', percentage: 'Accepted percentage' },
  'losses.relaxationClass': { 1: 'Class 1 (wire or strand, ordinary)', 2: 'Class 2 (wire or strand, low relaxation)', 3: 'Class 3 (bars)' },
  'uls.combination': { '6.10': 'Equation (6.10)', '6.10a/b': 'Equations (6.10a) and (6.10b)' },
  'uls.branch': { inclined: 'Inclined top branch', horizontal: 'Horizontal top branch' },
  'shear.ductMaterial': { metal: 'Metal', plastic: 'Plastic' },
  'punching.column': { none: 'No column head', interior: 'Interior column', edge: 'Edge column', corner: 'Corner column' },
  'cracking.duration': { long: 'Long-term', short: 'Short-term' },
  'site.alternateEnds': { no: 'No', yes: 'Yes' },
  'loads.points.type': { permanent: 'Permanent', imposed: 'Imposed' },
  'loads.lines.type': { permanent: 'Permanent', imposed: 'Imposed' },
  'loads.partials.type': { permanent: 'Permanent', imposed: 'Imposed' },
  'tendon.joints.kind': { 'intermediate-anchorage': 'Intermediate anchorage (stressing pocket)', coupler: 'Coupler' },
  'tendon.joints.stressed': { left: 'The segment on the left', right: 'The segment on the right', both: 'Both segments', neither: 'Neither (dead anchorages)' },
}

/** A cell of a table field ('loads.points.0.at'): the table, the row from 0 and the column, or null. */
export function tableCell(path: string): { table: InputFieldSpec, row: number, column: InputFieldSpec | undefined } | null {
  const bare = path.replace(/^inputs\./, '')
  const table = SPECS.find(f => f.kind === 'table' && bare.startsWith(`${f.path}.`))
  if (!table) return null
  const [row, ...rest] = bare.slice(table.path.length + 1).split('.')
  if (!/^\d+$/.test(row ?? '')) return null
  return { table, row: Number(row), column: rest.length ? table.columns?.find(c => c.path === rest.join('.')) : undefined }
}

/** The input field a path belongs to (the field itself, or an element of a list field). */
export function inputSpecFor(path: string): InputFieldSpec | undefined {
  return fieldFor(SPECS, path.replace(/^inputs\./, ''))
}

/**
 * Labels already worked out, by path: the editor asks for the label of each of its fields on every
 * keystroke (a span change renders the input panel's 226 fields again), and each answer means
 * searching the field specs twice. A label depends on the path alone, so it is kept; the map is let
 * go if it ever grows past any sheet's count of paths.
 */
const knownLabels = new Map<string, string>()
const KNOWN_LABELS_MAX = 20_000

/** The label of an input path: "Span 2", "Overall depth"; an unknown path is returned as it is. */
export function inputLabel(path: string): string {
  let label = knownLabels.get(path)
  if (label === undefined) {
    if (knownLabels.size >= KNOWN_LABELS_MAX) knownLabels.clear()
    label = labelOf(path)
    knownLabels.set(path, label)
  }
  return label
}

function labelOf(path: string): string {
  const bare = path.replace(/^inputs\./, '')
  const cell = tableCell(bare)
  if (cell) {
    const row = ELEMENT_LABELS[cell.table.path]?.(cell.row + 1) ?? `${cell.table.spec.label}, row ${cell.row + 1}`
    return cell.column ? `${row}, ${cell.column.spec.label.charAt(0).toLowerCase()}${cell.column.spec.label.slice(1)}` : row
  }
  const field = inputSpecFor(bare)
  if (!field) return bare
  if (field.path === bare) return FIELD_LABELS[bare] ?? field.spec.label
  const n = Number(bare.slice(field.path.length + 1)) + 1
  return ELEMENT_LABELS[field.path]?.(n) ?? `${field.spec.label}, no. ${n}`
}

/** The words for an option of an enum field: `optionLabel('section.kind', 'tee-beam')` → "T band beam". */
export function optionLabel(path: string, option: string): string {
  const cell = tableCell(path)
  const field = inputSpecFor(path)
  const words = cell?.column ? OPTION_WORDS[`${cell.table.path}.${cell.column.path}`]?.[option] : field ? OPTION_WORDS[field.path]?.[option] : undefined
  if (words) return words
  return option.charAt(0).toUpperCase() + option.slice(1).replace(/-/g, ' ')
}

/** One message about one input, led by its label unless the message already names it. */
export function describeInputError(path: string, message: string): string {
  const label = inputLabel(path)
  if (message.startsWith(label)) return message
  // the engine's own "Span length: enter a number" names the field in its words: say it once, in ours
  const own = /^[^:]{1,80}: (?=[a-z])/.exec(message)
  return `${label}: ${own ? message.slice(own[0].length) : message}`
}

/** One line over every input at fault: "Span 2: A span must be at least 1 m; Overall depth …". */
export function describeInputErrors(errors: Record<string, string>): string {
  return Object.entries(errors).map(([path, message]) => describeInputError(path, message)).join('; ')
}
