/**
 * Turning engine values into report text: HTML-escaped prose, TeX for formulas, and the plain
 * number an input field shows. Units and decimals come from the key's spec; conversion from
 * engine units happens here, at the edge, through shared/utils/units.ts.
 */
import type { QuantitySpec } from '../engine/contract'
import { DISPLAY_UNITS, formatQuantity, fromEngine, numberParts } from '../utils/units'
import type { DisplayUnit } from '../utils/units'

export function escapeHtml(text: string): string {
  return text
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;')
}

/** Text safe inside TeX's \text{…}: every character TeX treats specially is escaped. */
export function escapeTexText(text: string): string {
  return text.replace(/[\\{}$&#^_%~]/g, (c) => {
    if (c === '\\') return '\\textbackslash{}'
    if (c === '^') return '\\textasciicircum{}'
    if (c === '~') return '\\textasciitilde{}'
    return `\\${c}`
  })
}

/** A display unit typeset upright in math: 'kN/m²' → '\mathrm{kN/m^{2}}'. */
export function unitTex(unit: DisplayUnit): string {
  switch (unit) {
    case '':
      return ''
    case '%':
      return '\\%'
    case '‰':
      return '\\text{‰}'
    case '°':
      return '^{\\circ}'
    case 'days':
      return '\\text{days}'
    default: {
      const label = DISPLAY_UNITS[unit].label
      const tex = label.replace(/²/g, '^{2}').replace(/³/g, '^{3}').replace(/⁴/g, '^{4}')
      return `\\mathrm{${tex}}`
    }
  }
}

/** A value of any kind as prose text (not yet escaped). Numbers need a spec for unit and decimals. */
export function valueText(value: unknown, spec: QuantitySpec | undefined): string {
  if (value === null || value === undefined) return '—'
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) return '—'
    return spec ? formatQuantity(value, spec.unit, spec.precision) : formatPlain(value)
  }
  if (typeof value === 'boolean') return value ? 'yes' : 'no'
  if (typeof value === 'string') return value
  if (Array.isArray(value)) return value.map((v) => valueText(v, spec)).join(', ')
  return '—'
}

/** A value as TeX: numbers as \text{…} with \,\mathrm{unit}; text escaped inside \text{…}. */
export function valueTex(value: unknown, spec: QuantitySpec | undefined): string {
  if (typeof value === 'number' && Number.isFinite(value) && spec) {
    const { digits, exponent, negative } = numberParts(fromEngine(value, spec.unit), spec.precision)
    const unit = unitTex(spec.unit)
    const sep = unit === '' || unit === '\\%' || unit.startsWith('^') ? '' : '\\,'
    const number = `\\text{${digits.replace(/\u2009/g, '\\,')}}`.replace(/\\,/g, '}\\,\\text{')
    const power = exponent === null ? '' : ` \\times 10^{${exponent}}`
    return `${negative ? '-' : ''}${number}${power}${unit ? sep + unit : ''}`
  }
  if (typeof value === 'number' && Number.isFinite(value)) return `\\text{${formatPlain(value).replace('−', '-')}}`
  return `\\text{${escapeTexText(valueText(value, spec))}}`
}

/** An engine value as the number an input field shows in its display unit (no float noise). */
export function inputText(value: unknown, spec: QuantitySpec): string {
  if (typeof value === 'number' && Number.isFinite(value)) return String(Number(fromEngine(value, spec.unit).toPrecision(12)))
  if (Array.isArray(value)) return value.map((v) => inputText(v, spec)).join(', ')
  if (typeof value === 'string') return value
  return ''
}

function formatPlain(value: number): string {
  return String(Number(value.toPrecision(6))).replace('-', '−')
}

/** Decimals for a check's actual and limit, which carry a unit but no precision of their own. */
export function checkPrecision(unit: DisplayUnit): number {
  switch (unit) {
    case 'MPa':
      return 2
    case 'kNm':
    case 'kNm/m':
    case 'kN/m':
    case 'kN/m²':
    case 'mm':
      return 1
    case '%':
    case '‰':
      return 1
    case 'kN':
    case 'N':
    case 'mm²':
    case 'mm²/m':
      return 0
    default:
      return 2
  }
}
