/**
 * What the text editor offers while one types a sheet's or a template's text: the model's keys
 * (with their label and unit) inside :val[…], :in[…], \val{…} and val("…"), the blocks after ":::",
 * and in a calculation block the quantities defined above and the units engineers write. Pure: the
 * editor component asks, this answers.
 */
import { INPUT_SPECS, RESULT_SPECS } from '../engine/results/specs'
import { BLOCK_DIRECTIVES } from '../report/syntax'
import { calcNames } from '../calc/quantities'

export interface TextCompletion {
  label: string
  detail?: string
  info?: string
  type: 'key' | 'input' | 'block' | 'quantity' | 'unit'
}

export interface CompletionContext {
  /** where the completed word starts in the text */
  from: number
  options: TextCompletion[]
}

const UNITS = ['m', 'mm', 'kN', 'kN/m', 'kN/m^2', 'kN/m^3', 'kNm', 'MPa', 'GPa', 'N', 'MN', 'mm^2', 'mm^4', 'm^2', 'kg', 'deg', 'rad']

let resultKeys: TextCompletion[] | null = null
let inputKeys: TextCompletion[] | null = null

function keysOfResults(): TextCompletion[] {
  resultKeys ??= [
    ...Object.entries(RESULT_SPECS).map(([k, s]) => ({ label: k.replace(/\[\]/g, '.0'), detail: s.unit || undefined, info: s.label, type: 'key' as const })),
    ...Object.entries(INPUT_SPECS).map(([k, s]) => ({ label: `input.${k}`, detail: s.unit || undefined, info: s.label, type: 'input' as const })),
  ]
  return resultKeys
}

function keysOfInputs(): TextCompletion[] {
  inputKeys ??= Object.entries(INPUT_SPECS).map(([k, s]) => ({ label: k, detail: s.unit || undefined, info: s.label, type: 'input' as const }))
  return inputKeys
}

/** Whether `pos` lies inside a ::: calc block of the text, and the block's text above it. */
function calcBlockAbove(text: string, pos: number): string | null {
  const before = text.slice(0, pos).split('\n')
  for (let i = before.length - 2; i >= 0; i--) {
    const line = before[i]!.trim()
    if (/^:::\s*calc\b/.test(line)) return before.slice(i + 1).join('\n')
    if (line.startsWith(':::')) return null
  }
  return null
}

/** The completions at a position of the text, or null where none applies. */
export function completionsAt(text: string, pos: number): CompletionContext | null {
  const line = text.slice(text.lastIndexOf('\n', pos - 1) + 1, pos)
  let m = /(?::val\[|\\val\{|val\(")([A-Za-z0-9_.#]*)$/.exec(line)
  if (m) return { from: pos - m[1]!.length, options: [...keysOfResults(), ...calcQuantityKeys(text)] }
  m = /:in\[([A-Za-z0-9_.]*)$/.exec(line)
  if (m) return { from: pos - m[1]!.length, options: keysOfInputs() }
  m = /^:::\s*([a-z]*)$/.exec(line)
  if (m) return { from: pos - m[1]!.length, options: BLOCK_DIRECTIVES.map((b) => ({ label: b, type: 'block' as const })) }
  const above = calcBlockAbove(text, pos)
  if (above !== null) {
    m = /([A-Za-z][A-Za-z0-9_^/]*)$/.exec(line)
    if (!m || line.trimStart().startsWith('#')) return null
    const word = m[1]!
    const afterNumber = /[0-9.]\s*$/.test(line.slice(0, line.length - word.length))
    const quantities = calcNames(above).map((q) => ({ label: q.name, type: 'quantity' as const, info: 'defined above' }))
    const units = UNITS.map((u) => ({ label: u, type: 'unit' as const }))
    return { from: pos - word.length, options: afterNumber ? units : [...quantities, ...units] }
  }
  return null
}

/** calc.name for every quantity the text's calculation blocks define. */
function calcQuantityKeys(text: string): TextCompletion[] {
  const out: TextCompletion[] = []
  const re = /^:::\s*calc\b[^\n]*\n([\s\S]*?)^:::\s*$/gm
  for (const b of text.matchAll(re)) for (const q of calcNames(b[1] ?? '')) out.push({ label: `calc.${q.name}`, type: 'quantity', info: 'a quantity of a calculation block' })
  return out
}

/** The line (1-based) and message of each problem the template checker reports as "line N: …". */
export function problemLines(errors: readonly string[]): Array<{ line: number; message: string }> {
  return errors.map((e) => {
    const m = /^line (\d+): ([\s\S]*)$/.exec(e)
    return m ? { line: Number(m[1]), message: m[2]! } : { line: 1, message: e }
  })
}
