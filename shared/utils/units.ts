/**
 * Display units and their conversion to the engine's base units (N, mm, MPa, N/mm, N·mm).
 * The engine never sees a display unit: values are converted here, at the edge (form input,
 * report output). `factor` is how many engine base units one display unit is.
 */
export const DISPLAY_UNITS = {
  '': { factor: 1, label: '' },
  mm: { factor: 1, label: 'mm' },
  m: { factor: 1000, label: 'm' },
  N: { factor: 1, label: 'N' },
  kN: { factor: 1e3, label: 'kN' },
  MN: { factor: 1e6, label: 'MN' },
  kNm: { factor: 1e6, label: 'kNm' },
  'kNm/m': { factor: 1e3, label: 'kNm/m' },
  MPa: { factor: 1, label: 'MPa' },
  GPa: { factor: 1e3, label: 'GPa' },
  'kN/m': { factor: 1, label: 'kN/m' },
  'kN/m²': { factor: 1e-3, label: 'kN/m²' },
  'kN/m³': { factor: 1e-6, label: 'kN/m³' },
  'mm²': { factor: 1, label: 'mm²' },
  'mm²/m': { factor: 1e-3, label: 'mm²/m' },
  'mm³': { factor: 1, label: 'mm³' },
  'mm⁴': { factor: 1, label: 'mm⁴' },
  'm²': { factor: 1e6, label: 'm²' },
  '%': { factor: 0.01, label: '%' },
  '‰': { factor: 0.001, label: '‰' },
  'rad': { factor: 1, label: 'rad' },
  'kNm/rad': { factor: 1e6, label: 'kNm/rad' },
  '°': { factor: Math.PI / 180, label: '°' },
  'rad/m': { factor: 1e-3, label: 'rad/m' },
  '1/MN': { factor: 1e-6, label: '1/MN' },
  days: { factor: 1, label: 'days' },
  kg: { factor: 1, label: 'kg' },
  'kg/m': { factor: 1, label: 'kg/m' },
  'kg/m²': { factor: 1, label: 'kg/m²' },
  h: { factor: 1, label: 'h' },
} as const

export type DisplayUnit = keyof typeof DISPLAY_UNITS

export function isDisplayUnit(unit: string): unit is DisplayUnit {
  return Object.prototype.hasOwnProperty.call(DISPLAY_UNITS, unit)
}

/** A value typed by the user in `unit` → engine base units. */
export function toEngine(value: number, unit: DisplayUnit): number {
  return value * DISPLAY_UNITS[unit].factor
}

/** An engine value → the number shown in `unit`. */
export function fromEngine(value: number, unit: DisplayUnit): number {
  return value / DISPLAY_UNITS[unit].factor
}

/**
 * How a shown number is written: large magnitudes as a mantissa and a power of ten (1.465 × 10⁹),
 * five-digit and longer integers parts grouped by thousands with a thin space (260 000).
 */
export function numberParts(shown: number, precision: number): { digits: string, exponent: number | null, negative: boolean } {
  const abs = Math.abs(shown)
  if (abs >= 1e7) {
    const exponent = Math.floor(Math.log10(abs))
    const mantissa = (abs / 10 ** exponent).toFixed(3)
    return { digits: mantissa, exponent, negative: shown < 0 }
  }
  const fixed = abs.toFixed(Math.max(0, precision))
  const [whole, fraction] = fixed.split('.') as [string, string | undefined]
  const grouped = whole.length > 4 ? whole.replace(/\B(?=(\d{3})+(?!\d))/g, '\u2009') : whole
  const negative = shown < 0 && !/^0(\.0+)?$/.test(fixed)
  return { digits: fraction === undefined ? grouped : `${grouped}.${fraction}`, exponent: null, negative }
}

const SUPERSCRIPT: Record<string, string> = { '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹', '-': '⁻' }

/** Engine value → text in the display unit, to `precision` decimals, with the unit (thin space). */
export function formatQuantity(value: number, unit: DisplayUnit, precision: number): string {
  if (!Number.isFinite(value)) return '—'
  const { digits, exponent, negative } = numberParts(fromEngine(value, unit), precision)
  const power = exponent === null ? '' : ` × 10${String(exponent).replace(/./g, c => SUPERSCRIPT[c] ?? c)}`
  const text = `${negative ? '−' : ''}${digits}${power}`
  return unit ? `${text}\u202f${DISPLAY_UNITS[unit].label}` : text
}
