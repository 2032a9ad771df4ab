/**
 * Import and export of a sheet's inputs. JSON keeps engine units (lossless); CSV is for people and
 * spreadsheets: one row per value, `field,value,unit`, in the units the form shows.
 */
import Papa from 'papaparse'
import { DISPLAY_UNITS, fromEngine, isDisplayUnit, toEngine, type DisplayUnit } from '../utils/units'
import { clonePlain, getPath, leafPaths, setPath } from '../utils/paths'

export const INPUTS_FORMAT = 'tendonbook-inputs/1'

export interface FieldUnit {
  path: string
  unit: DisplayUnit
  kind: 'number' | 'enum' | 'array' | 'boolean' | 'text'
}

export class InputsFileError extends Error {
  constructor(readonly problems: string[]) {
    super(problems.join('\n'))
    this.name = 'InputsFileError'
  }
}

/** The field a concrete path belongs to: the field itself, or an element of a list field. */
export function fieldFor<F extends Pick<FieldUnit, 'path' | 'kind'>>(fields: F[], path: string): F | undefined {
  return fields.find(f => f.path === path) ?? fields.find(f => f.kind === 'array' && path.startsWith(`${f.path}.`) && /^\d+$/.test(path.slice(f.path.length + 1)))
}

export function exportJson(model: string, inputs: unknown, meta: Record<string, string> = {}) {
  return `${JSON.stringify({ format: INPUTS_FORMAT, model, units: 'N, mm, MPa (engine units)', ...meta, inputs }, null, 2)}\n`
}

export function exportCsv(inputs: unknown, fields: FieldUnit[]) {
  const rows = leafPaths(inputs).map((path) => {
    const value = getPath(inputs, path)
    const field = fieldFor(fields, path)
    if (typeof value === 'number' && field) return [path, String(Number(fromEngine(value, field.unit).toPrecision(12))), DISPLAY_UNITS[field.unit].label]
    return [path, value === null || value === undefined ? '' : String(value), '']
  })
  return `${Papa.unparse({ fields: ['field', 'value', 'unit'], data: rows }, { newline: '\n' })}\n`
}

/** Parses an uploaded inputs file (JSON or CSV) into engine-unit inputs merged over `base`. */
export function importInputs(text: string, filename: string, base: unknown, fields: FieldUnit[], model: string) {
  const looksJson = /\.json$/i.test(filename) || text.trimStart().startsWith('{')
  return looksJson ? importJson(text, model) : importCsv(text, base, fields)
}

function importJson(text: string, model: string) {
  let data: unknown
  try {
    data = JSON.parse(text)
  }
  catch (error) {
    throw new InputsFileError([`The file is not valid JSON: ${(error as Error).message}`])
  }
  const doc = data as { format?: unknown, model?: unknown, inputs?: unknown }
  if (doc?.format !== INPUTS_FORMAT) throw new InputsFileError([`format: expected "${INPUTS_FORMAT}" (a file exported by Tendonbook)`])
  if (doc.model !== model) throw new InputsFileError([`model: the file is for "${String(doc.model)}", this sheet uses "${model}"`])
  if (!doc.inputs || typeof doc.inputs !== 'object') throw new InputsFileError(['inputs: missing'])
  return doc.inputs as Record<string, unknown>
}

function importCsv(text: string, base: unknown, fields: FieldUnit[]) {
  const parsed = Papa.parse<string[]>(text.trim(), { skipEmptyLines: true })
  const rows = parsed.data
  const problems: string[] = parsed.errors.map(e => `line ${(e.row ?? 0) + 1}: ${e.message}`)
  const header = rows[0]?.map(h => h.trim().toLowerCase())
  if (!header || header[0] !== 'field' || header[1] !== 'value') throw new InputsFileError(['line 1: the header must be "field,value,unit"'])
  let inputs = clonePlain(base) as Record<string, unknown>
  rows.slice(1).forEach((row, i) => {
    const line = i + 2
    const [path = '', raw = '', unitText = ''] = row.map(c => c.trim())
    const field = fieldFor(fields, path)
    if (!field) {
      problems.push(`line ${line}: ${path || '(empty)'} is not an input of this sheet`)
      return
    }
    if (field.kind === 'number' || field.kind === 'array') {
      const value = Number(raw)
      if (raw === '' || !Number.isFinite(value)) {
        problems.push(`line ${line}: ${path} must be a number, not "${raw}"`)
        return
      }
      const unit = unitText === '' ? field.unit : (Object.keys(DISPLAY_UNITS).find(u => DISPLAY_UNITS[u as DisplayUnit].label === unitText) ?? unitText)
      if (!isDisplayUnit(unit) || unit !== field.unit) {
        problems.push(`line ${line}: ${path} is given in ${DISPLAY_UNITS[field.unit].label || 'no unit'}, not "${unitText}"`)
        return
      }
      inputs = setPath(inputs, path, toEngine(value, field.unit))
    }
    else if (field.kind === 'boolean') {
      if (raw !== 'true' && raw !== 'false') problems.push(`line ${line}: ${path} must be true or false`)
      else inputs = setPath(inputs, path, raw === 'true')
    }
    else {
      inputs = setPath(inputs, path, raw)
    }
  })
  if (problems.length) throw new InputsFileError(problems)
  return inputs
}
