/**
 * Reading a number as a person types it: "8." and "-" are on their way to a number (partial), not
 * mistakes; "abc" is not a number. A decimal comma and the typographic minus are accepted.
 */
import { fromEngine, type DisplayUnit } from './units'

export type NumberText = { kind: 'number', value: number } | { kind: 'partial' } | { kind: 'invalid' }

// what a number can look like part-way through typing it: "", "-", "+", ".", "-.", "1e", "1e-"
const PARTIAL = /^[+-]?(?:\d*\.?\d*|(?:\d+\.?\d*|\.\d+)[eE][+-]?)$/

export function readNumber(text: string): NumberText {
  const normalised = text.trim().replace(',', '.').replace('−', '-')
  if (normalised !== '' && /^[+-]?(\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/.test(normalised)) {
    const value = Number(normalised)
    if (Number.isFinite(value)) return { kind: 'number', value }
  }
  return PARTIAL.test(normalised) ? { kind: 'partial' } : { kind: 'invalid' }
}

/** An engine value as the editable text of its field: display units, a little beyond the shown decimals. */
export function editableText(value: unknown, unit: DisplayUnit, precision: number): string {
  if (typeof value !== 'number' || !Number.isFinite(value)) return ''
  return String(Number(fromEngine(value, unit).toFixed(Math.max(precision, 0) + 2)))
}
