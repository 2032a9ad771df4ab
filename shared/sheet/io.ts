/**
 * Import and export of a sheet's inputs, in the units the engineer types (kN/m², m, mm, MPa, %),
 * each value with its unit named. JSON (`tendonbook-inputs/2`) keeps the shape of the inputs with
 * `{ value, unit }` at every field; CSV is one row per value, `field,value,unit,label`. Files of the
 * first format (`tendonbook-inputs/1`, engine units N/mm/MPa) still import: the format marker says
 * which units a file is in.
 */
import Papa from 'papaparse'
import { DISPLAY_UNITS, fromEngine, isDisplayUnit, toEngine, type DisplayUnit } from '../utils/units'
import { clonePlain, fieldFor, getPath, leafPaths, setPath } from '../utils/paths'
import { CSV_FORMULA_START, unescapeCsvCell } from '../utils/csv'
import { inputLabel } from './labels'

export const INPUTS_FORMAT = 'tendonbook-inputs/2'
/** The first format: the inputs exactly as the engine holds them (N, mm, MPa, fractions). */
export const ENGINE_UNITS_FORMAT = 'tendonbook-inputs/1'

export interface FieldUnit {
  path: string
  unit: DisplayUnit
  kind: 'number' | 'enum' | 'array' | 'boolean' | 'text' | 'table'
  /** a table's columns, paths relative to a row */
  columns?: FieldUnit[]
}

/** The field of a path: a field, an element of a list, or a cell of a table ('loads.points.0.at') as its column. */
function fieldOfPath(fields: FieldUnit[], path: string): FieldUnit | undefined {
  const direct = fieldFor(fields, path)
  if (direct) return direct
  for (const t of fields) {
    if (t.kind !== 'table' || !path.startsWith(`${t.path}.`)) continue
    const [row, ...rest] = path.slice(t.path.length + 1).split('.')
    if (!/^\d+$/.test(row ?? '')) return undefined
    const column = t.columns?.find(c => c.path === rest.join('.'))
    return column ? { ...column, path } : undefined
  }
  return undefined
}

/** A table's rows with each numeric cell in its column's display unit, or back (toEngine). */
function rowsIn(rows: unknown, table: FieldUnit, convert: (v: number, unit: DisplayUnit) => number): unknown {
  if (!Array.isArray(rows)) return rows
  return rows.map((row) => {
    if (!row || typeof row !== 'object') return row
    const out: Record<string, unknown> = { ...(row as Record<string, unknown>) }
    for (const c of table.columns ?? []) {
      const v = out[c.path]
      if (typeof v === 'number') out[c.path] = convert(v, c.unit)
    }
    return out
  })
}

export class InputsFileError extends Error {
  constructor(readonly problems: string[]) {
    super(problems.join('\n'))
    this.name = 'InputsFileError'
  }
}

const unitLabel = (unit: DisplayUnit) => DISPLAY_UNITS[unit].label

/** A number in the field's display unit, without float noise (7.8, not 7.800000000000001). */
function shown(value: number, unit: DisplayUnit): number {
  return Number(fromEngine(value, unit).toPrecision(12))
}

/** The unit a file names, by its label ("kN/m²") or key; '' when the file names none. */
function unitNamed(text: string): DisplayUnit | string {
  return Object.keys(DISPLAY_UNITS).find(u => DISPLAY_UNITS[u as DisplayUnit].label === text) ?? text
}

export function exportJson(model: string, inputs: unknown, fields: FieldUnit[], meta: Record<string, string> = {}) {
  let out: Record<string, unknown> = {}
  for (const field of fields) {
    const value = getPath(inputs, field.path)
    if (value === undefined) continue
    if (field.kind === 'table') {
      const units = Object.fromEntries((field.columns ?? []).filter(c => c.unit !== '').map(c => [c.path, unitLabel(c.unit)]))
      out = setPath(out, field.path, { label: inputLabel(field.path), value: rowsIn(value, field, shown), units })
      continue
    }
    const numbers = field.kind === 'number' || (field.kind === 'array' && Array.isArray(value) && value.every(v => typeof v === 'number'))
    const entry = !numbers
      ? { value: clonePlain(value) }
      : { value: Array.isArray(value) ? value.map(v => shown(v as number, field.unit)) : shown(value as number, field.unit), unit: unitLabel(field.unit) }
    out = setPath(out, field.path, { label: inputLabel(field.path), ...entry })
  }
  return `${JSON.stringify({ format: INPUTS_FORMAT, model, units: 'as typed in the editor; each value names its unit', ...meta, inputs: out }, null, 2)}\n`
}

export function exportCsv(inputs: unknown, fields: FieldUnit[]) {
  const rows = leafPaths(inputs).map((path) => {
    const value = getPath(inputs, path)
    const field = fieldOfPath(fields, path)
    const label = field ? inputLabel(path) : ''
    if (typeof value === 'number' && field) return [path, shown(value, field.unit), unitLabel(field.unit), label]
    return [path, value === null || value === undefined ? '' : String(value), '', label]
  })
  return `${Papa.unparse({ fields: ['field', 'value', 'unit', 'label'], data: rows }, { newline: '\n', escapeFormulae: CSV_FORMULA_START })}\n`
}

/** Parses an uploaded inputs file (JSON or CSV) into engine-unit inputs merged over `base`. */
export function importInputs(text: string, filename: string, base: unknown, fields: FieldUnit[], model: string) {
  const looksJson = /\.json$/i.test(filename) || text.trimStart().startsWith('{')
  return looksJson ? importJson(text, fields, model) : importCsv(text, base, fields)
}

/** A typed number in `unitText` for `field`, in engine units; or the problem with it. */
function readValue(raw: unknown, unitText: string, field: FieldUnit, label: string): { value: number } | { problem: string } {
  const value = typeof raw === 'number' ? raw : typeof raw === 'string' && raw.trim() !== '' ? Number(raw) : Number.NaN
  if (!Number.isFinite(value)) return { problem: `${label} must be a number, not "${String(raw)}"` }
  const unit = unitText === '' ? field.unit : unitNamed(unitText)
  if (!isDisplayUnit(unit) || unit !== field.unit) return { problem: `${label} is given in ${unitLabel(field.unit) || 'no unit'}, not "${unitText}"` }
  return { value: toEngine(value, field.unit) }
}

function importJson(text: string, fields: FieldUnit[], model: string) {
  let data: unknown
  try {
    data = JSON.parse(text)
  }
  catch (error) {
    throw new InputsFileError([`The file is not valid JSON: ${(error as Error).message}`])
  }
  const doc = data as { format?: unknown, model?: unknown, inputs?: unknown }
  if (doc?.format !== INPUTS_FORMAT && doc?.format !== ENGINE_UNITS_FORMAT) {
    throw new InputsFileError([`The file is not a Tendonbook inputs file (its "format" should be "${INPUTS_FORMAT}")`])
  }
  if (doc.model !== model) throw new InputsFileError([`The file is for the model "${String(doc.model)}"; this sheet uses "${model}"`])
  if (!doc.inputs || typeof doc.inputs !== 'object') throw new InputsFileError(['The file holds no inputs'])
  if (doc.format === ENGINE_UNITS_FORMAT) return doc.inputs as Record<string, unknown>
  return fromTypedUnits(doc.inputs, fields)
}

/** `{ value, unit }` at every field, in display units → engine-unit inputs. */
function fromTypedUnits(inputs: object, fields: FieldUnit[]) {
  const problems: string[] = []
  let out: Record<string, unknown> = {}
  for (const field of fields) {
    const entry = getPath(inputs, field.path) as { value?: unknown, unit?: unknown } | undefined
    if (entry === undefined) continue
    const label = inputLabel(field.path)
    if (entry === null || typeof entry !== 'object' || !('value' in entry)) {
      problems.push(`${label}: expected { "value": …, "unit": … }`)
      continue
    }
    if (field.kind === 'table') {
      const units = (entry as { units?: unknown }).units
      const named = units && typeof units === 'object' ? units as Record<string, unknown> : {}
      if (!Array.isArray(entry.value)) {
        problems.push(`${label} must be a list of rows`)
        continue
      }
      for (const c of field.columns ?? []) {
        const given = named[c.path]
        if (c.unit !== '' && given !== undefined && unitNamed(String(given)) !== c.unit) problems.push(`${label}, ${c.path}: given in "${String(given)}", not ${unitLabel(c.unit)}`)
      }
      out = setPath(out, field.path, rowsIn(entry.value, field, (v, unit) => toEngine(v, unit)))
      continue
    }
    const unitText = typeof entry.unit === 'string' ? entry.unit : ''
    const numeric = field.kind === 'number' || (field.kind === 'array' && unitText !== '') || (field.kind === 'array' && Array.isArray(entry.value) && entry.value.some(v => typeof v === 'number'))
    if (!numeric) {
      out = setPath(out, field.path, clonePlain(entry.value))
      continue
    }
    if (field.kind === 'array') {
      if (!Array.isArray(entry.value)) {
        problems.push(`${label} must be a list of numbers`)
        continue
      }
      const read = entry.value.map((v, i) => readValue(v, unitText, field, inputLabel(`${field.path}.${i}`)))
      const bad = read.flatMap(r => ('problem' in r ? [r.problem] : []))
      if (bad.length) problems.push(...bad)
      else out = setPath(out, field.path, read.map(r => (r as { value: number }).value))
      continue
    }
    const read = readValue(entry.value, unitText, field, label)
    if ('problem' in read) problems.push(read.problem)
    else out = setPath(out, field.path, read.value)
  }
  for (const path of leafPaths(inputs)) {
    const known = fields.some(f => path === f.path || path.startsWith(`${f.path}.`))
    if (!known) problems.push(`"${path}" is not an input of this sheet`)
  }
  if (problems.length) throw new InputsFileError([...new Set(problems)])
  return out
}

function importCsv(text: string, base: unknown, fields: FieldUnit[]) {
  const parsed = Papa.parse<string[]>(text.trim(), { skipEmptyLines: true })
  const rows = parsed.data
  const problems: string[] = parsed.errors.map(e => `line ${(e.row ?? 0) + 1}: ${e.message}`)
  const header = rows[0]?.map(h => h.trim().toLowerCase())
  if (!header || header[0] !== 'field' || header[1] !== 'value') throw new InputsFileError(['line 1: the header must be "field,value,unit" (a "label" column may follow)'])
  let inputs = clonePlain(base) as Record<string, unknown>
  rows.slice(1).forEach((row, i) => {
    const line = i + 2
    const [path = '', raw = '', unitText = ''] = row.map(c => unescapeCsvCell(c.trim()))
    const field = fieldOfPath(fields, path)
    if (!field) {
      problems.push(`line ${line}: "${path || '(empty)'}" is not an input of this sheet`)
      return
    }
    const label = inputLabel(path)
    if (field.kind === 'number' || (field.kind === 'array' && (unitText !== '' || field.unit !== ''))) {
      const read = readValue(raw, unitText, field, label)
      if ('problem' in read) problems.push(`line ${line}: ${read.problem}`)
      else inputs = setPath(inputs, path, read.value)
    }
    else if (field.kind === 'boolean') {
      if (raw !== 'true' && raw !== 'false') problems.push(`line ${line}: ${label} must be true or false`)
      else inputs = setPath(inputs, path, raw === 'true')
    }
    else {
      inputs = setPath(inputs, path, raw)
    }
  })
  if (problems.length) throw new InputsFileError(problems)
  return inputs
}
