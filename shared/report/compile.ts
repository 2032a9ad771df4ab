/**
 * compileTemplate: a parsed template bound to a model. Every key, block attribute and front matter
 * field is checked against the model, and every problem is collected with its line; a template with
 * any problem does not load (TemplateLoadError lists them all).
 */
import type { Token } from 'markdown-it'
import { INPUT_PREFIX, describeKey, isModelName, resolvePattern, suggestKeys } from './bind'
import type { PatternScope } from './bind'
import { TemplateKeyError, TemplateLoadError, TemplateSyntaxError } from './errors'
import type { TemplateError } from './errors'
import type { BlockMeta, InlineMeta } from './markdown'
import type { ModelFigure, ReportModel } from './model'
import { parseTemplate } from './parse'
import type { MathMeta, TemplateMeta } from './parse'
import { BLOCK_ATTRIBUTES, CALC_PREFIX, isName, markNames, parseKey } from './syntax'
import { calcNames, lintCalcBlock } from '../calc/quantities'

export interface CompiledTemplate {
  meta: TemplateMeta
  model: ReportModel
  /** the template text as given (it is what a frozen revision stores) */
  text: string
  tokens: readonly Token[]
  /** every key pattern the template uses, sorted */
  keys: readonly string[]
}

type Use = 'in' | 'val' | 'each' | 'at'


function frontMatterLine(text: string, field: string): number {
  const lines = text.replace(/\r\n?/g, '\n').split('\n')
  const at = lines.findIndex((l) => new RegExp(`^${field}\\s*:`).test(l))
  return at >= 0 ? at + 1 : 1
}

/** What one check of a template gathers and consults as it walks the body. */
interface BodyCheck {
  model: ReportModel
  errors: TemplateError[]
  /** every key pattern the template uses */
  used: Set<string>
  /** the quantities the template's calculation blocks define (calc.name keys), wherever they stand */
  calcDefined: ReadonlySet<string>
  /** names defined so far by the calculation blocks, in document order */
  calcKnown: Set<string>
}

function checkKey(check: BodyCheck, key: string, segments: readonly string[], use: Use, line: number, scopes: readonly PatternScope[]): string | null {
  const { model, errors, used } = check
  if (segments[0] === CALC_PREFIX && !scopes.some((s) => s.name === CALC_PREFIX)) {
    const name = segments[1]
    if (use !== 'val') errors.push(new TemplateKeyError(line, key, `"${key}" is a quantity of a calculation block: show it with :val[${key}]`))
    else if (segments.length !== 2 || name === undefined || !check.calcDefined.has(name)) errors.push(new TemplateKeyError(line, key, `no calculation block defines "${segments.slice(1).join('.')}"`))
    return null
  }
  const resolved = resolvePattern(segments, scopes)
  if (resolved.kind === 'bad') {
    errors.push(new TemplateKeyError(line, key, resolved.problem))
    return null
  }
  if (resolved.kind === 'unchecked') return null
  if (resolved.kind === 'index') {
    if (use !== 'val') errors.push(new TemplateKeyError(line, key, `"${key}" is an element number; only :val[…] and \\val{…} can show it`))
    return null
  }
  const { pattern } = resolved
  const info = describeKey(model, pattern, use === 'in' ? 'input' : 'value')
  if (!info) {
    const other = describeKey(model, pattern, use === 'in' ? 'value' : 'input')
    if (use === 'in' && other) errors.push(new TemplateKeyError(line, key, `:in[…] takes an input field, but "${key}" is a result: show it with :val[${key}]`))
    else if (use !== 'in' && other && other.kind !== 'object') errors.push(new TemplateKeyError(line, key, `"${key}" is an input field, not a result: show its value with :val[${INPUT_PREFIX}${key}] or its field with :in[${key}]`))
    else {
      const hint = suggestKeys(model, pattern)
      errors.push(new TemplateKeyError(line, key, `unknown key "${key}": the model ${model.id} has no ${use === 'in' ? 'input field' : 'input or result'} of that name${hint.length ? ` (did you mean ${hint.join(', ')}?)` : ''}`))
    }
    return null
  }
  used.add(pattern)
  const element = describeKey(model, `${pattern}[]`, use === 'in' ? 'input' : 'value')
  if (use === 'in') {
    if (info.kind === 'object') errors.push(new TemplateKeyError(line, key, `"${key}" is a group of inputs: name one field in it`))
  } else if (use === 'val') {
    const listOfValues = info.kind === 'array' && element?.kind === 'leaf'
    if (info.kind === 'object' || (info.kind === 'array' && !listOfValues)) {
      errors.push(new TemplateKeyError(line, key, `"${key}" is a group of values, not one value: name a value inside it, or repeat over it with ::: each`))
    }
  } else if (use === 'each') {
    if (info.kind !== 'array') errors.push(new TemplateKeyError(line, key, `::: each{in=…} repeats over a list, but "${key}" is not one`))
    return `${pattern}[]`
  }
  return pattern
}

function checkBlock(check: BodyCheck, meta: BlockMeta, scopes: PatternScope[]): PatternScope | null {
  const { model, errors } = check
  const line = meta.line ?? 1
  if (!meta.directive || meta.problems.length > 0) return meta.directive === 'each' && isName(meta.attrs.as ?? '') ? { name: meta.attrs.as!, pattern: null } : null
  const { directive, attrs } = meta
  const allowed = BLOCK_ATTRIBUTES[directive]
  const all = [...allowed.required, ...allowed.optional]
  for (const name of Object.keys(attrs)) {
    if (!all.includes(name)) errors.push(new TemplateSyntaxError(line, `::: ${directive} takes no attribute "${name}" (it takes ${all.join(', ')})`))
  }
  for (const name of allowed.required) {
    if (attrs[name] === undefined) errors.push(new TemplateSyntaxError(line, `::: ${directive} needs the attribute ${name}=…`))
  }
  if (directive === 'checks' && attrs.group !== undefined && !model.checkGroups.includes(attrs.group)) {
    errors.push(new TemplateSyntaxError(line, `unknown check group "${attrs.group}": the model ${model.id} has ${model.checkGroups.join(', ')} (leave the group out for every check)`))
  }
  if (directive === 'calc') {
    if (scopes.length > 0) errors.push(new TemplateSyntaxError(line, 'a calculation block stands on its own, not inside ::: each'))
    const keyProblem = (key: string): string | null => {
      const parsed = parseKey(key)
      if ('problem' in parsed) return `val("…") needs a key, but ${parsed.problem}`
      const before = errors.length
      checkKey(check, key, parsed.segments, 'val', line, [])
      const found = errors.splice(before)
      return found.length > 0 ? found.map((e) => e.detail).join('; ') : null
    }
    for (const p of lintCalcBlock(meta.source ?? '', check.calcKnown, keyProblem)) {
      errors.push(new TemplateSyntaxError(line + p.line, `calculation${p.name ? ` of ${p.name}` : ''}: ${p.message}`))
    }
  }
  if (directive === 'overview' && !model.overview) {
    errors.push(new TemplateSyntaxError(line, `the model ${model.id} has no front page of results: remove the ::: overview block`))
  }
  if (directive === 'figure' && (attrs.plot === undefined) === (attrs.image === undefined)) {
    errors.push(new TemplateSyntaxError(line, '::: figure takes plot=… (a figure of the results) or image=… (an image attached to the sheet, by its file name), one of them'))
  }
  if (directive === 'figure' && attrs.image !== undefined && attrs.at !== undefined) {
    errors.push(new TemplateSyntaxError(line, 'an attached image takes no at=…'))
  }
  if (directive === 'figure' && attrs.plot !== undefined) {
    const figure = model.figures[attrs.plot]
    if (!figure) errors.push(new TemplateSyntaxError(line, `unknown figure "${attrs.plot}": the model ${model.id} draws ${Object.keys(model.figures).join(', ')}`))
    else if (attrs.at !== undefined) checkAt(check, attrs.at, figure.at, line, scopes)
    if (figure && attrs.mark !== undefined) checkMarks(check, attrs.mark, figure, line)
  }
  if (directive === 'figure' && attrs.image !== undefined && attrs.mark !== undefined) {
    errors.push(new TemplateSyntaxError(line, 'an attached image takes no mark=…'))
  }
  if (directive === 'each') {
    const local = attrs.as ?? ''
    if (!isName(local)) {
      errors.push(new TemplateSyntaxError(line, `::: each needs as=name, a local name for the element (letters, digits, _)`))
      return null
    }
    if (isModelName(model, local)) errors.push(new TemplateSyntaxError(line, `the local name "${local}" hides a key of the model: choose another`))
    if (scopes.some((s) => s.name === local)) errors.push(new TemplateSyntaxError(line, `the local name "${local}" is already in use by an enclosing each`))
    const parsed = parseKey(attrs.in ?? '')
    if ('problem' in parsed) {
      errors.push(new TemplateSyntaxError(line, `::: each{in=…} needs a key, but ${parsed.problem}`))
      return { name: local, pattern: null }
    }
    const pattern = checkKey(check, attrs.in!, parsed.segments, 'each', line, scopes)
    const scope = { name: local, pattern }
    if ((attrs.where === undefined) !== (attrs.is === undefined)) {
      errors.push(new TemplateSyntaxError(line, '::: each takes where=… and is=… together: where names a value of the element, is lists the values to keep, separated by commas'))
    } else if (attrs.where !== undefined) {
      const where = parseKey(attrs.where)
      if ('problem' in where) errors.push(new TemplateSyntaxError(line, `where=… needs a key, but ${where.problem}`))
      else if (where.segments[0] !== local) errors.push(new TemplateSyntaxError(line, `where=… names a value of the element, so it starts with the local name: where=${local}.…`))
      else checkKey(check, attrs.where, where.segments, 'val', line, [...scopes, scope])
    }
    return scope
  }
  return null
}

function checkAt(check: BodyCheck, at: string, wanted: string | undefined, line: number, scopes: readonly PatternScope[]): void {
  const { errors } = check
  if (!wanted) {
    errors.push(new TemplateSyntaxError(line, 'this figure takes no at=…'))
    return
  }
  const parsed = parseKey(at)
  if ('problem' in parsed) {
    errors.push(new TemplateSyntaxError(line, `at=… needs a key, but ${parsed.problem}`))
    return
  }
  const pattern = checkKey(check, at, parsed.segments, 'at', line, scopes)
  if (pattern !== null && pattern !== wanted) errors.push(new TemplateKeyError(line, at, `at=${at} must name one element of ${wanted.replace(/\[\]$/, '')} (e.g. an each over it)`))
}

/** mark=…: the quantities a figure marks, names of calculation blocks' quantities separated by commas. */
function checkMarks(check: BodyCheck, list: string, figure: ModelFigure, line: number): void {
  if (!figure.marks) {
    check.errors.push(new TemplateSyntaxError(line, 'this figure takes no mark=…: quantities can be marked on the figures of moments, shears, forces and deflections'))
    return
  }
  for (const name of markNames(list)) {
    if (!check.calcDefined.has(name)) check.errors.push(new TemplateKeyError(line, name, `mark=…: no calculation block defines "${name}"`))
  }
}

function checkBody(model: ReportModel, tokens: readonly Token[], errors: TemplateError[]): Set<string> {
  // every quantity the blocks define may be shown anywhere; inside the blocks, only those above
  const calcDefined = new Set(tokens.filter((t) => t.type === 'tb_block_open' && (t.meta as BlockMeta).directive === 'calc').flatMap((t) => calcNames((t.meta as BlockMeta).source ?? '').map((n) => n.name)))
  const check: BodyCheck = { model, errors, used: new Set(), calcDefined, calcKnown: new Set() }
  const frames: Array<PatternScope | null> = []
  const scopes = (): PatternScope[] => frames.filter((f): f is PatternScope => f !== null)
  const visit = (token: Token): void => {
    if (token.type === 'tb_block_open') frames.push(checkBlock(check, token.meta as BlockMeta, scopes()))
    else if (token.type === 'tb_block_close') frames.pop()
    else if (token.type === 'tb_in' || token.type === 'tb_val') {
      const meta = token.meta as InlineMeta
      checkKey(check, meta.key!, meta.segments!, meta.directive!, meta.line ?? 1, scopes())
    } else if (token.type === 'math_inline' || token.type === 'math_block' || token.type === 'math_inline_block') {
      for (const k of (token.meta as MathMeta | null)?.keys ?? []) checkKey(check, k.key, k.segments, 'val', k.line, scopes())
    }
    for (const child of token.children ?? []) visit(child)
  }
  for (const token of tokens) visit(token)
  return check.used
}

/** Every problem of a template against a model, sorted by line; empty when it loads. */
export function lintTemplate(text: string, model: ReportModel): TemplateError[] {
  return bind(text, model).errors
}

function bind(text: string, model: ReportModel): { errors: TemplateError[]; compiled?: CompiledTemplate } {
  const parsed = parseTemplate(text)
  const errors = [...parsed.errors]
  if (parsed.meta) {
    if (parsed.meta.model !== model.id) errors.push(new TemplateSyntaxError(frontMatterLine(text, 'model'), `the template is for the model "${parsed.meta.model}", not "${model.id}"`))
    for (const g of parsed.meta.groups) {
      if (!model.inputGroups.includes(g)) errors.push(new TemplateSyntaxError(frontMatterLine(text, 'groups'), `unknown input group "${g}": the model ${model.id} has ${model.inputGroups.join(', ')}`))
    }
  }
  const used = checkBody(model, parsed.tokens, errors)
  errors.sort((a, b) => a.line - b.line)
  if (errors.length > 0 || !parsed.meta) return { errors }
  return { errors, compiled: { meta: parsed.meta, model, text, tokens: parsed.tokens, keys: [...used].sort() } }
}

/** Binds a template to a model; throws TemplateLoadError listing every problem with its line. */
export function compileTemplate(text: string, model: ReportModel): CompiledTemplate {
  const { errors, compiled } = bind(text, model)
  if (!compiled) throw new TemplateLoadError(errors)
  return compiled
}
