/**
 * The engineer's own calculations in a sheet: named quantities with units and the engineer's own
 * checks, evaluated by mathjs in a closed scope. A block is a list of lines:
 *
 *   name = expression [to unit]   # description        a quantity
 *   check expression ≤ expression  # description        a check (<=, <, >=, > — "≤" and "≥" read too)
 *
 * An expression may use numbers with units (3.6 m, 0.75 kN/m^2), the quantities defined above it,
 * the sheet's inputs and results by key (val("section.h"), val("loads.imposed")) and a few functions
 * (sqrt, abs, min, max, the trigonometric ones, exp, log, log10, floor, ceil). Nothing else parses:
 * no function or unit definitions, no property access, no matrices, no strings but the key of val.
 * Each quantity is typeset in three lines — symbols, numbers substituted, result with its unit.
 */
import { all, create } from 'mathjs'
import type { MathNode, Unit } from 'mathjs'
import type { CheckResult } from '../engine/contract'
import { DISPLAY_UNITS, isDisplayUnit, numberParts } from '../utils/units'
import { valueTex } from '../report/format'
import type { DisplayUnit } from '../utils/units'

const full = create(all as NonNullable<typeof all>, { number: 'number', precision: 14 })
// the moment unit engineers write as one word (12 kNm); mathjs knows it only as kN m
full.createUnit('kNm', { definition: '1 kN m' })
// kept before the closed scope is made: the block's own parser and unit maker
const parse = full.parse.bind(full)
const unitOf = full.unit.bind(full)
const UnitClass = full.Unit
// the closed scope: nothing that defines, imports or re-parses is reachable from an expression (the
// whitelist below already refuses them; this is the second lock)
const closed = ['import', 'createUnit', 'evaluate', 'parse', 'compile', 'simplify', 'derivative', 'resolve', 'reviver', 'replacer', 'parser', 'chain', 'help']
full.import(Object.fromEntries(closed.map((name) => [name, () => { throw new Error(`${name} is not available in a calculation`) }])), { override: true })
const math = { parse, unit: unitOf, Unit: UnitClass }

/** A value of the sheet: its number in its display unit, and how to write it. */
export interface SheetValue {
  /** the number shown in the sheet, in `unit` */
  value: number
  unit: DisplayUnit
  precision: number
  /** the symbol (TeX) or label the sheet gives it */
  symbol?: string
  label: string
}

export interface CalcContext {
  /** a sheet key ('section.h', 'loads.imposed', 'uls.sections.2.MEdMin') → its value, or undefined when it has none */
  lookup(key: string): SheetValue | undefined
  /** quantities of earlier blocks, by name */
  earlier?: ReadonlyMap<string, CalcQuantity>
  /** id of the block, for the checks' ids */
  blockId: string
}

export interface CalcQuantity {
  name: string
  description: string
  line: number
  /** the result in `unit` */
  value: number
  /** the unit it is shown in: a display unit of the product where one fits, else mathjs's own text */
  unit: string
  precision: number
  /** TeX of the name and the three lines: the symbols, the numbers substituted, the result; given: a value typed in, one line */
  tex: { name: string; symbols: string; numbers: string; result: string; given: boolean }
  unitValue: Unit | number
}

export interface CalcProblem {
  /** 1-based line within the block */
  line: number
  name: string | null
  message: string
}

export interface CalcBlockResult {
  quantities: CalcQuantity[]
  checks: Array<CheckResult & { line: number; tex: string }>
  problems: CalcProblem[]
}

const NAME = /^[A-Za-z][A-Za-z0-9]*(?:_[A-Za-z0-9]+)?$/
const RESERVED = new Set(['constructor', 'prototype', 'toString', 'valueOf', 'hasOwnProperty', '__proto__', 'val', 'check', 'to', 'in', 'pi', 'true', 'false', 'null', 'undefined', 'Infinity', 'NaN'])
/**
 * The units an engineer writes after a number: never a quantity's name. Any other unit's name (L,
 * b, h, A, e…) may name a quantity, which then stands for it in the block.
 */
const WRITTEN_UNITS = new Set(['m', 'mm', 'cm', 'km', 'N', 'kN', 'MN', 'Pa', 'kPa', 'MPa', 'GPa', 'kg', 'g', 't', 's', 'min', 'deg', 'rad', 'hour', 'day', 'kNm'])
const FUNCTIONS = new Set(['sqrt', 'abs', 'min', 'max', 'sin', 'cos', 'tan', 'asin', 'acos', 'atan', 'exp', 'log', 'log10', 'floor', 'ceil'])
const OPERATORS = new Set(['add', 'subtract', 'multiply', 'divide', 'unaryMinus', 'unaryPlus', 'pow', 'to'])
const COMPARISONS: Record<string, { atLeast: boolean; strict: boolean; tex: string }> = {
  smallerEq: { atLeast: false, strict: false, tex: '\\le' },
  smaller: { atLeast: false, strict: true, tex: '<' },
  largerEq: { atLeast: true, strict: false, tex: '\\ge' },
  larger: { atLeast: true, strict: true, tex: '>' },
}
const MAX_LINE = 400
const MAX_LINES = 200
const MAX_DEPTH = 24
const MAX_MAGNITUDE = 1e15

/** The product's display units as mathjs writes them, in the order a result takes the first that fits. */
const PREFERRED: Array<[DisplayUnit, string]> = [
  ['kN', 'kN'], ['kN/m', 'kN/m'], ['kN/m²', 'kN/m^2'], ['kN/m³', 'kN/m^3'], ['kNm', 'kN m'], ['MPa', 'MPa'],
  ['m', 'm'], ['m²', 'm^2'], ['mm²', 'mm^2'], ['mm³', 'mm^3'], ['mm⁴', 'mm^4'], ['kg', 'kg'], ['kg/m²', 'kg/m^2'], ['kg/m', 'kg/m'], ['°', 'deg'],
]
const MATHJS_OF: Partial<Record<DisplayUnit, string>> = {
  mm: 'mm', m: 'm', N: 'N', kN: 'kN', MN: 'MN', kNm: 'kN m', 'kNm/m': 'kN m / m', MPa: 'MPa', GPa: 'GPa', 'kN/m': 'kN/m', 'kN/m²': 'kN/m^2',
  'kN/m³': 'kN/m^3', 'mm²': 'mm^2', 'mm²/m': 'mm^2/m', 'mm³': 'mm^3', 'mm⁴': 'mm^4', 'm²': 'm^2', rad: 'rad', '°': 'deg', kg: 'kg', 'kg/m': 'kg/m', 'kg/m²': 'kg/m^2', h: 'hour',
}

/** A display unit's value as a mathjs quantity (a plain number for units without a dimension here). */
export function sheetQuantity(v: SheetValue): Unit | number {
  const u = MATHJS_OF[v.unit]
  if (v.unit === '%') return v.value / 100
  if (v.unit === '‰') return v.value / 1000
  return u ? math.unit(v.value, u) : v.value
}

function isUnit(x: unknown): x is Unit {
  return typeof x === 'object' && x !== null && (x as { type?: string }).type === 'Unit'
}

/** A quantity's value in `unit` (as mathjs writes it, e.g. 'N mm'), or null when its dimension is another. */
export function quantityIn(q: CalcQuantity, unit: string): number | null {
  const v = q.unitValue
  if (!isUnit(v)) return null
  const target = math.unit(1, unit)
  if (!v.equalBase(target)) return null
  const x = v.toNumber(unit)
  return Number.isFinite(x) ? x : null
}

/** How a result is shown: the unit written after `to`, else the first display unit of its dimension, else as mathjs has it. */
function shownIn(value: Unit | number, explicit: string | null): { value: number; unit: string; display: DisplayUnit | null } {
  if (!isUnit(value)) return { value, unit: '', display: '' }
  const raw = (value as unknown as { value: number | null }).value
  if (raw !== null && !Number.isFinite(raw)) return { value: Number.NaN, unit: '', display: null }
  if (explicit !== null) {
    const display = (Object.entries(MATHJS_OF).find(([, m]) => m.replace(/\s/g, '') === explicit.replace(/\s/g, ''))?.[0] ?? null) as DisplayUnit | null
    return { value: value.toNumber(explicit), unit: display ?? explicit, display }
  }
  for (const [display, m] of PREFERRED) {
    const target = math.unit(m)
    if (value.equalBase(target)) {
      // a length under a metre reads better in mm
      if (display === 'm' && Math.abs(value.toNumber('m')) < 1) return { value: value.toNumber('mm'), unit: 'mm', display: 'mm' }
      return { value: value.toNumber(m), unit: display, display }
    }
  }
  if (value.dimensions.every((d) => d === 0)) return { value: value.toNumber(), unit: '', display: '' }
  const text = value.format({ precision: 14 })
  const unit = text.replace(/^[-+0-9.e\s]+/, '')
  return { value: value.toNumber(unit), unit, display: null }
}

function texName(name: string): string {
  const [base, sub] = name.split('_')
  const b = base!.length > 1 ? `\\mathit{${base}}` : base!
  return sub ? `${b}_{\\mathrm{${sub}}}` : b
}

function unitTexOf(unit: string): string {
  if (unit === '') return ''
  const written = unit.replace(/²/g, '^2').replace(/³/g, '^3').replace(/⁴/g, '^4')
  return `\\,\\mathrm{${written.replace(/\s+/g, '\\,').replace(/%/g, '\\%').replace(/°/g, '^{\\circ}')}}`
}

function numberTex(value: number, unit: string, display: DisplayUnit | null, precision: number): string {
  // a display unit of the product: written as every value of the sheet is
  if (display !== null && isDisplayUnit(display)) return valueTex(value * DISPLAY_UNITS[display].factor, { label: '', unit: display, precision })
  const { digits, exponent, negative } = numberParts(value, precision)
  const power = exponent === null ? '' : ` \\times 10^{${exponent}}`
  return `${negative ? '-' : ''}\\text{${digits.replace(/\u2009/g, '}\\,\\text{')}}${power}${unitTexOf(unit)}`
}

function precisionOf(display: DisplayUnit | null): number {
  if (display === null || display === '') return 3
  return ({ mm: 0, m: 2, kN: 1, kNm: 1, 'kN/m': 2, 'kN/m²': 2, MPa: 2, 'mm²': 0, 'mm³': 0, 'mm⁴': 0 } as Partial<Record<DisplayUnit, number>>)[display] ?? 2
}

interface ParsedLine {
  line: number
  kind: 'quantity' | 'check'
  name: string | null
  node: MathNode
  description: string
  /** the unit written after `to`, or null */
  explicit: string | null
}

/** One line: its quantity or check, or a problem in words. */
function parseLine(raw: string, line: number): ParsedLine | CalcProblem | null {
  const hash = raw.indexOf('#')
  const body = (hash >= 0 ? raw.slice(0, hash) : raw).trim()
  const description = hash >= 0 ? raw.slice(hash + 1).trim() : ''
  if (body === '') return null
  if (raw.length > MAX_LINE) return { line, name: null, message: `the line is longer than ${MAX_LINE} characters` }
  const isCheck = /^check\s/.test(body)
  const text = (isCheck ? body.slice(5) : body).replace(/≤/g, '<=').replace(/≥/g, '>=').replace(/·/g, '*').replace(/×/g, '*').replace(/²/g, '^2').replace(/³/g, '^3')
  let depth = 0
  for (const ch of text) {
    if (ch === '(' || ch === '[' || ch === '{') depth += 1
    else if (ch === ')' || ch === ']' || ch === '}') depth -= 1
    if (depth > MAX_DEPTH) return { line, name: null, message: `brackets nested deeper than ${MAX_DEPTH}` }
  }
  let node: MathNode
  try {
    node = math.parse(text)
  } catch (e) {
    return { line, name: null, message: `cannot read "${text}": ${(e as Error).message}` }
  }
  if (isCheck) {
    if (node.type !== 'OperatorNode' || !COMPARISONS[(node as unknown as { fn: string }).fn]) return { line, name: null, message: 'a check compares two values: check a <= b (or <, >=, >)' }
    return { line, kind: 'check', name: null, node, description, explicit: null }
  }
  if (node.type !== 'AssignmentNode') return { line, name: null, message: 'a line defines a quantity (name = expression) or is a check (check a <= b)' }
  const assign = node as unknown as { object: MathNode & { name?: string }; value: MathNode; index: unknown }
  const name = assign.object.type === 'SymbolNode' ? assign.object.name ?? '' : ''
  if (assign.object.type !== 'SymbolNode' || assign.index) return { line, name: null, message: 'only a plain name can be given a value (letters and digits, one _ for a subscript)' }
  if (!NAME.test(name)) return { line, name, message: `"${name}" is not a name: use letters and digits, with at most one _ before a subscript (w_f)` }
  if (RESERVED.has(name) || WRITTEN_UNITS.has(name) || FUNCTIONS.has(name)) return { line, name, message: `"${name}" is taken (a unit, a function or a word of the language): choose another name` }
  const value = assign.value
  const explicit = value.type === 'OperatorNode' && (value as unknown as { fn: string }).fn === 'to' ? (value as unknown as { args: MathNode[] }).args[1]!.toString() : null
  return { line, kind: 'quantity', name, node: value, description, explicit }
}

/** The forms an expression may use; the first that is not allowed, in words. */
function forbidden(node: MathNode, known: (name: string) => boolean, keys: (key: string) => string | null): string | null {
  let problem: string | null = null
  node.traverse((n, _path, parent) => {
    if (problem !== null) return
    switch (n.type) {
      case 'ConstantNode': {
        const v = (n as unknown as { value: unknown }).value
        const isKey = parent?.type === 'FunctionNode' && (parent as unknown as { fn: { name: string } }).fn.name === 'val'
        if (typeof v === 'string' && !isKey) problem = 'text appears only as the key of val("…")'
        else if (typeof v !== 'number' && typeof v !== 'string') problem = 'only numbers, units and names may appear'
        return
      }
      case 'SymbolNode': {
        const name = (n as unknown as { name: string }).name
        const isFunction = parent?.type === 'FunctionNode' && (parent as unknown as { fn: MathNode }).fn === n
        if (isFunction) return
        if (name === 'pi' || known(name) || math.Unit.isValuelessUnit(name)) return
        problem = `"${name}" is neither a quantity defined above nor a unit`
        return
      }
      case 'OperatorNode': {
        const fn = (n as unknown as { fn: string }).fn
        if (!OPERATORS.has(fn) && !COMPARISONS[fn]) problem = `the operator "${(n as unknown as { op: string }).op}" is not used in calculations`
        return
      }
      case 'ParenthesisNode':
        return
      case 'FunctionNode': {
        const fn = (n as unknown as { fn: MathNode & { name?: string }; args: MathNode[] })
        const name = fn.fn.type === 'SymbolNode' ? fn.fn.name ?? '' : ''
        if (name === 'val') {
          const arg = fn.args[0] as (MathNode & { value?: unknown }) | undefined
          if (fn.args.length !== 1 || arg?.type !== 'ConstantNode' || typeof arg.value !== 'string') problem = 'val takes one key in quotes: val("section.h")'
          else problem = keys(arg.value)
          return
        }
        if (!FUNCTIONS.has(name)) problem = `"${name || n.toString()}" is not a function of calculations (${[...FUNCTIONS].join(', ')})`
        return
      }
      default:
        problem = `this form (${n.type.replace(/Node$/, '').toLowerCase()}) is not used in calculations`
    }
  })
  return problem
}

/** Where two quantities of different dimensions meet in a sum or a comparison: their names and units. */
function dimensionClash(node: MathNode, evalNode: (n: MathNode) => unknown): string | null {
  let found: string | null = null
  node.traverse((n) => {
    if (found !== null || n.type !== 'OperatorNode') return
    const op = n as unknown as { fn: string; args: MathNode[] }
    if (!(op.fn === 'add' || op.fn === 'subtract' || COMPARISONS[op.fn] || op.fn === 'to')) return
    const [a, b] = op.args
    if (!a || !b) return
    try {
      const va = evalNode(a)
      if (op.fn === 'to') {
        if (isUnit(va) && !va.equalBase(math.unit(b.toString()))) found = `${a.toString()} (${dimensionText(va)}) cannot be written in ${b.toString()}`
        return
      }
      const vb = evalNode(b)
      const da = isUnit(va) ? va : null
      const db = isUnit(vb) ? vb : null
      const same = da && db ? da.equalBase(db) : !da && !db
      if (!same) found = `${op.fn === 'add' ? 'adding' : op.fn === 'subtract' ? 'subtracting' : 'comparing'} ${a.toString()} (${dimensionText(va)}) and ${b.toString()} (${dimensionText(vb)}): the units do not match`
    } catch {
      // a clash further down: the traversal reaches it
    }
  })
  return found
}

function dimensionText(v: unknown): string {
  if (!isUnit(v)) return 'a plain number'
  const shown = shownIn(v, null)
  return shown.unit === '' ? 'a plain number' : shown.unit
}

/**
 * Evaluates one block: its quantities in order, then its checks; a line that fails gives a problem
 * naming the line and the quantity, and the lines after it that use it give problems of their own.
 */
export function evaluateCalcBlock(text: string, ctx: CalcContext): CalcBlockResult {
  const quantities: CalcQuantity[] = []
  const checks: CalcBlockResult['checks'] = []
  const problems: CalcProblem[] = []
  const scope = new Map<string, unknown>()
  for (const [name, q] of ctx.earlier ?? []) scope.set(name, q.unitValue)
  const rawLines = text.replace(/\r\n?/g, '\n').split('\n')
  if (rawLines.length > MAX_LINES) return { quantities, checks, problems: [{ line: MAX_LINES + 1, name: null, message: `a calculation block holds at most ${MAX_LINES} lines` }] }
  const usedKeys = new Map<string, SheetValue>()
  const keyProblem = (key: string): string | null => {
    const v = ctx.lookup(key)
    if (!v) return `the sheet has no value "${key}"`
    usedKeys.set(key, v)
    return null
  }
  // val("key") → the sheet's value as a quantity; the only function of our own
  const valOf = (key: string): Unit | number => {
    const v = usedKeys.get(key) ?? ctx.lookup(key)
    if (!v) throw new Error(`the sheet has no value "${key}"`)
    return sheetQuantity(v)
  }
  const evaluate = (node: MathNode): unknown => node.compile().evaluate(new Map<string, unknown>([...scope, ['val', valOf]]))
  let checkCount = 0
  rawLines.forEach((raw, i) => {
    try {
      evaluateLine(raw, i + 1)
    } catch (e) {
      // anything unforeseen stays a problem of its line, never a blank sheet
      problems.push({ line: i + 1, name: null, message: (e as Error).message || 'this line cannot be evaluated' })
    }
  })
  return { quantities, checks, problems }

  function evaluateLine(raw: string, line: number): void {
    const parsed = parseLine(raw, line)
    if (parsed === null) return
    if ('message' in parsed) {
      problems.push(parsed)
      return
    }
    const bad = forbidden(parsed.node, (n) => scope.has(n), keyProblem)
    if (bad) {
      problems.push({ line, name: parsed.name, message: bad })
      return
    }
    let value: unknown
    try {
      value = evaluate(parsed.node)
    } catch (e) {
      const clash = dimensionClash(parsed.node, evaluate)
      problems.push({ line, name: parsed.name, message: clash ?? (e as Error).message })
      return
    }
    if (parsed.kind === 'check') {
      const op = parsed.node as unknown as { fn: string; args: MathNode[] }
      const rule = COMPARISONS[op.fn]!
      const lhs = evaluate(op.args[0]!) as Unit | number
      const rhs = evaluate(op.args[1]!) as Unit | number
      const shownR = shownIn(rhs, null)
      const unit = shownR.unit
      const actual = isUnit(lhs) ? lhs.toNumber(unit === '' ? undefined as unknown as string : isDisplayUnit(unit) && MATHJS_OF[unit] ? MATHJS_OF[unit]! : unit) : lhs
      const limit = shownR.value
      if (!Number.isFinite(actual) || !Number.isFinite(limit)) {
        problems.push({ line, name: null, message: 'the check gives a value out of range' })
        return
      }
      // utilisation: actual/limit for an upper bound, limit/actual for a lower one (as the engine's checks)
      const utilisation = rule.atLeast ? (actual > 0 ? limit / actual : Infinity) : (limit > 0 ? actual / limit : Infinity)
      const pass = Boolean(value)
      checkCount += 1
      const display: DisplayUnit = shownR.display !== null && isDisplayUnit(shownR.display) ? shownR.display : ''
      const texOf = (n: MathNode): string => n.toTex({ handler: texHandler(scope, usedKeys, 'symbols') })
      checks.push({
        id: `calc.${ctx.blockId}.${checkCount}`, group: 'own', title: parsed.description || `${op.args[0]!.toString()} ${rule.tex.replace('\\le', '≤').replace('\\ge', '≥')} ${op.args[1]!.toString()}`,
        clause: 'the engineer\'s own check', actual: fromShown(actual, display), limit: fromShown(limit, display), unit: display,
        utilisation: Number.isFinite(utilisation) ? Math.max(0, utilisation) : 99, pass,
        ...(display === '' && unit !== '' ? { note: `in ${unit}` } : {}),
        line, tex: `${texOf(op.args[0]!)} = ${numberTex(actual, unit, shownR.display, precisionOf(shownR.display))} ${rule.tex} ${numberTex(limit, unit, shownR.display, precisionOf(shownR.display))}`,
      })
      return
    }
    const name = parsed.name!
    if (!(isUnit(value) || typeof value === 'number')) {
      problems.push({ line, name, message: 'the result is not a number with a unit' })
      return
    }
    const shown = shownIn(value, parsed.explicit)
    if (!Number.isFinite(shown.value) || Math.abs(shown.value) > MAX_MAGNITUDE) {
      problems.push({ line, name, message: 'the result is out of range (too large, or a division by zero)' })
      return
    }
    const precision = precisionOf(shown.display)
    const expr = parsed.explicit !== null ? (parsed.node as unknown as { args: MathNode[] }).args[0]! : parsed.node
    const q: CalcQuantity = {
      name, description: parsed.description, line, value: shown.value, unit: shown.unit, precision, unitValue: value as Unit | number,
      tex: {
        name: texName(name),
        given: expr.filter((n) => (n.type === 'SymbolNode' && scope.has((n as unknown as { name: string }).name)) || (n.type === 'FunctionNode' && (n as unknown as { fn: { name?: string } }).fn.name === 'val')).length === 0,
        symbols: expr.toTex({ handler: texHandler(scope, usedKeys, 'symbols') }),
        numbers: expr.toTex({ handler: texHandler(scope, usedKeys, 'numbers') }),
        result: numberTex(shown.value, shown.unit, shown.display, precision),
      },
    }
    scope.set(name, value)
    quantities.push(q)
  }
}

/** An engine-unit value for a check shown in a display unit (the check tables convert back for display). */
function fromShown(value: number, unit: DisplayUnit): number {
  return value * DISPLAY_UNITS[unit].factor
}

function texHandler(scope: Map<string, unknown>, keys: Map<string, SheetValue>, mode: 'symbols' | 'numbers') {
  return (node: MathNode): string | undefined => {
    if (node.type === 'SymbolNode') {
      const name = (node as unknown as { name: string }).name
      if (scope.has(name)) {
        if (mode === 'symbols') return `{${texName(name)}}`
        const v = scope.get(name) as Unit | number
        const shown = shownIn(v, null)
        const t = numberTex(shown.value, shown.unit, shown.display, precisionOf(shown.display))
        return shown.value < 0 ? `{\\left(${t}\\right)}` : `{${t}}`
      }
      if (name === 'pi') return '{\\pi}'
      if (math.Unit.isValuelessUnit(name)) return `{\\mathrm{${name}}}`
      return undefined
    }
    if (node.type === 'FunctionNode' && (node as unknown as { fn: { name: string } }).fn.name === 'val') {
      const key = ((node as unknown as { args: Array<{ value: string }> }).args[0]!).value
      const v = keys.get(key)
      if (!v) return '\\text{—}'
      if (mode === 'symbols') return v.symbol ? `{${v.symbol}}` : `\\text{${v.label.replace(/[\\{}$&#^_%~]/g, '')}}`
      const t = numberTex(v.value, v.unit, v.unit, v.precision)
      return v.value < 0 ? `{\\left(${t}\\right)}` : `{${t}}`
    }
    return undefined
  }
}

/**
 * The problems a block has before any value is known: lines that do not read, forms that are not
 * allowed, names used before they are defined, keys the sheet does not have. `known` holds the names
 * of earlier blocks and gains this block's.
 */
export function lintCalcBlock(text: string, known: Set<string>, keyProblem: (key: string) => string | null): CalcProblem[] {
  const problems: CalcProblem[] = []
  const rawLines = text.replace(/\r\n?/g, '\n').split('\n')
  if (rawLines.length > MAX_LINES) return [{ line: MAX_LINES + 1, name: null, message: `a calculation block holds at most ${MAX_LINES} lines` }]
  rawLines.forEach((raw, i) => {
    const p = parseLine(raw, i + 1)
    if (p === null) return
    if ('message' in p) {
      problems.push(p)
      return
    }
    const bad = forbidden(p.node, (n) => known.has(n), keyProblem)
    if (bad) problems.push({ line: p.line, name: p.name, message: bad })
    if (p.kind === 'quantity' && p.name) {
      if (known.has(p.name)) problems.push({ line: p.line, name: p.name, message: `"${p.name}" is defined twice: give each quantity its own name` })
      known.add(p.name)
    }
  })
  return problems
}

/** The names a block defines, in order (for templates that show them by :val[calc.name]). */
export function calcNames(text: string): Array<{ name: string; line: number }> {
  const out: Array<{ name: string; line: number }> = []
  text.replace(/\r\n?/g, '\n').split('\n').forEach((raw, i) => {
    const p = parseLine(raw, i + 1)
    if (p && !('message' in p) && p.kind === 'quantity' && p.name) out.push({ name: p.name, line: i + 1 })
  })
  return out
}
