/**
 * renderReport: a compiled template with inputs and results → HTML, the list of sections (for the
 * editor's jump links), every check with the section it is shown in, and the keys that had no value.
 * The same code serves the editor (mode 'edit': live input fields), the frozen view and print.
 * Output depends only on its arguments: the same inputs give the same bytes (frozen revisions are
 * hashed and printed). Formulas are typeset in typeset.ts, the engineer's calculation blocks are
 * evaluated and shown by calc-blocks.ts, and figures are drawn by figure-blocks.ts.
 */
import type { Env, Renderer, Token } from 'markdown-it'
import type { CheckResult } from '../engine/contract'
import { formatQuantity, fromEngine } from '../utils/units'
import { describeKey, inputPath, resolvePath } from './bind'
import type { KeyInfo, PathScope } from './bind'
import { evaluateCalcBlocks, renderCalc } from './calc-blocks'
import type { CompiledTemplate } from './compile'
import { renderFigure } from './figure-blocks'
import type { FigureSource, SheetImage } from './figure-blocks'
import { checkPrecision, escapeHtml, inputText, valueTex, valueText } from './format'
import { isLocalImage, md } from './markdown'
import type { BlockMeta, InlineMeta } from './markdown'
import type { ReportModel } from './model'
import type { MathMeta } from './parse'
import { CALC_PREFIX, parseKey } from './syntax'
import { tallyByGroup, tallyChecks, tallyText } from './tally'
import { typeset } from './typeset'
import type { CalcBlockResult, CalcQuantity, SheetValue } from '../calc/quantities'

export type { SheetImage } from './figure-blocks'

export type RenderMode = 'edit' | 'frozen' | 'print'

export interface RenderOptions {
  inputs: unknown
  /** the engine's results; null or undefined when the engine could not run */
  results: unknown
  mode: RenderMode
  /** the words an editable drop-down shows for an option id of the input at `path` (default: the id) */
  optionLabel?: (path: string, option: string) => string
  /**
   * the sheet's attached images by file name, for ::: figure{image=…}: where to load each (a URL in
   * the editor, the bytes as a data: URI in a frozen revision) and its SHA-256
   */
  images?: Readonly<Record<string, SheetImage>>
}

export interface ReportSection {
  id: string
  title: string
  level: number
}

export interface ReportCheck extends CheckResult {
  /** the id of the section whose check table shows this check first, or null if no table shows it */
  sectionId: string | null
}

export interface UnresolvedKey {
  key: string
  path: string
  line: number
}

export interface RenderedReport {
  html: string
  sections: ReportSection[]
  checks: ReportCheck[]
  unresolved: UnresolvedKey[]
  /** concrete result or input path → the id of the first section that shows its value */
  keySections: Record<string, string>
}

/** One part of a report between two top-level headings, keyed by the id of the heading that opens it. */
export interface ReportPart {
  key: string
  html: string
}

/**
 * A report in parts: `open` + every part's html + `close` is exactly the report's html. The editor
 * patches part by part, so a change leaves the parts whose html did not change untouched.
 */
export interface RenderedReportParts extends RenderedReport {
  parts: { open: string; sections: ReportPart[]; close: string }
}

/** Ends every report. */
export const REPORT_CAUTION = 'Results are for a competent engineer to verify. The local code, its national annex and licensed practice govern.'

interface ReportEnv {
  model: ReportModel
  inputs: unknown
  completedInputs: unknown
  results: unknown
  mode: RenderMode
  optionLabel: (path: string, option: string) => string
  checks: readonly CheckResult[]
  scopes: PathScope[]
  ids: Map<string, number>
  fieldIds: Map<string, number>
  sections: ReportSection[]
  currentSection: string | null
  checkHome: Map<string, string>
  /** where a summary table (no group) showed a check, for checks no group table shows */
  checkSummary: Map<string, string>
  unresolved: UnresolvedKey[]
  keySections: Map<string, string>
  images: Readonly<Record<string, SheetImage>>
  /** each calculation block's result, and every quantity they define by name */
  calc: Map<BlockMeta, CalcBlockResult>
  quantities: Map<string, CalcQuantity>
  /** how many blocks that wrap their content in an element (checks, figure, overview, calc) enclose the tokens being rendered */
  wrapDepth: number
  /** how many template blocks of any kind (each included) enclose them */
  blockDepth: number
}

const VAL_IN_MATH = /\\val\s*\{([^{}]*)\}/g
// Marks a summary row's section until every check table has been placed (NUL never survives markdown-it's input normalisation).
const HOME_MARK = /\u0000home:(\d+)\u0000/g
// A front-page link to the section that shows a key or a check group, placed once the whole body is rendered.
const REF_MARK = /\u0000ref:(key|group):([^\u0000]*)\u0000/g
// Marks where a top-level heading starts a part of the report; removed before the html leaves the renderer.
const PART_MARK = '\u0000part\u0000'

/**
 * A value at a dot path: undefined where a key is missing (unresolved), null where the path passes
 * through a value that does not exist (the engine's null: a part that does not apply shows as —).
 */
function valueAt(data: unknown, path: string): unknown {
  if (data === null || data === undefined) return undefined
  let node: unknown = data
  for (const part of path.split('.')) {
    if (node === null) return null
    if (typeof node !== 'object') return undefined
    node = (node as Record<string, unknown>)[part]
  }
  return node
}

function lookup(env: ReportEnv, info: KeyInfo, path: string): unknown {
  if (info.source === 'result') return valueAt(env.results, path)
  const typed = valueAt(env.inputs, inputPath(path))
  if (typed !== undefined || env.completedInputs === undefined) return typed
  // the engine ran and completed the input: a field it left out is an optional one not given
  return valueAt(env.completedInputs, inputPath(path)) ?? null
}

function resolveValue(env: ReportEnv, segments: readonly string[], key: string, line: number, use: 'input' | 'value' = 'value'): { text: string; tex: string; missing: boolean; words?: boolean } {
  if (segments[0] === CALC_PREFIX && segments.length === 2 && !env.scopes.some((s) => s.name === CALC_PREFIX)) {
    const q = env.quantities.get(segments[1]!)
    if (!q) return { text: '—', tex: '\\text{—}', missing: true }
    const digits = q.value.toFixed(q.precision)
    return { text: `${digits}${q.unit ? `\u202f${q.unit}` : ''}`, tex: q.tex.result, missing: false }
  }
  const r = resolvePath(segments, env.scopes)
  if (r.kind === 'index') return { text: String(r.index + 1), tex: `\\text{${r.index + 1}}`, missing: false }
  const info = describeKey(env.model, r.pattern, use)
  const value = info ? lookup(env, info, r.path) : undefined
  if (env.currentSection !== null && !env.keySections.has(r.path)) env.keySections.set(r.path, env.currentSection)
  if (value === undefined) {
    env.unresolved.push({ key, path: r.path, line })
    return { text: '—', tex: '\\text{—}', missing: true }
  }
  // a list of numbers takes the unit and decimals of its elements
  const spec = info?.spec ?? (info?.kind === 'array' ? describeKey(env.model, `${r.pattern}[]`, use)?.spec : undefined)
  // a value in words (a reason, a rule) wraps with the prose; a number stays whole with its unit
  return { text: valueText(value, spec), tex: valueTex(value, spec), missing: false, ...(typeof value === 'string' ? { words: true } : {}) }
}

function slug(text: string): string {
  return text
    .replace(/:[a-z]+\[[^\]]*\]/g, '')
    .replace(/\$[^$]*\$/g, '')
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60)
    .replace(/-+$/, '')
}

function uniqueId(seen: Map<string, number>, base: string): string {
  const count = seen.get(base) ?? 0
  seen.set(base, count + 1)
  return count === 0 ? base : `${base}-${count + 1}`
}

function plainText(children: readonly Token[], env: ReportEnv): string {
  return children
    .map((c) => {
      if (c.type === 'text' || c.type === 'code_inline') return c.content
      if (c.type === 'softbreak' || c.type === 'hardbreak') return ' '
      if (c.type === 'tb_val' || c.type === 'tb_in') {
        const meta = c.meta as InlineMeta
        return resolveValue(env, meta.segments!, meta.key!, meta.line ?? 0, c.type === 'tb_in' ? 'input' : 'value').text
      }
      if (c.type === 'math_inline') return c.content.replace(VAL_IN_MATH, '').trim()
      return ''
    })
    .join('')
    .replace(/\s+/g, ' ')
    .trim()
}

function renderMath(token: Token, display: boolean, env: ReportEnv): string {
  const keys = (token.meta as MathMeta | null)?.keys ?? []
  let n = 0
  const tex = token.content.replace(VAL_IN_MATH, (whole: string) => {
    const k = keys[n]
    n += 1
    return k ? resolveValue(env, k.segments, k.key, k.line).tex : whole
  })
  return display ? `<div class="tb-math">${typeset(tex, true)}</div>\n` : typeset(tex, false)
}

function renderInput(meta: InlineMeta, env: ReportEnv): string {
  const r = resolvePath(meta.segments!, env.scopes)
  if (r.kind !== 'path') return ''
  const info = describeKey(env.model, r.pattern, 'input')
  const spec = info?.spec
  if (!info || !spec) return ''
  const value = lookup(env, info, r.path)
  if (value === undefined) env.unresolved.push({ key: meta.key!, path: r.path, line: meta.line ?? 0 })
  const fieldPath = inputPath(r.path)
  const key = escapeHtml(fieldPath)
  if (env.mode !== 'edit') return `<span class="tb-field tb-frozen" data-key="${key}">${escapeHtml(valueText(value, spec))}</span>`

  const id = uniqueId(env.fieldIds, `tb-in-${fieldPath.replace(/\./g, '-')}`)
  const label = escapeHtml(spec.label)
  const unit = spec.unit ? `<span class="tb-unit">${escapeHtml(spec.unit)}</span>` : ''
  const options = info.field?.options
  const whole = info.kind === 'array'
  let control: string
  if (options && !whole) {
    const chosen = typeof value === 'string' ? value : ''
    const items = options.map((o) => `<option value="${escapeHtml(o)}"${o === chosen ? ' selected' : ''}>${escapeHtml(env.optionLabel(fieldPath, o))}</option>`).join('')
    control = `<select class="tb-input" id="${id}" data-key="${key}" aria-label="${label}">${items}</select>`
  } else {
    const kind = whole ? 'list' : 'number'
    const mode = whole ? 'text' : 'decimal'
    control = `<input class="tb-input" type="text" inputmode="${mode}" autocomplete="off" spellcheck="false" id="${id}" data-key="${key}" data-kind="${kind}" data-unit="${escapeHtml(spec.unit)}" aria-label="${label}" value="${escapeHtml(inputText(value, spec))}">`
  }
  return `<span class="tb-field">${control}${unit}</span>`
}

/** markdown-it hands every rule the env given to render(); ours travels in it under one name. */
function stateOf(env: Env | undefined): ReportEnv {
  return env?.report as ReportEnv
}

function installRules(renderer: Renderer): void {
  const rules = renderer.rules
  const defaultImage = rules.image!
  rules.tb_val = (tokens, idx, _o, env) => {
    const meta = tokens[idx]!.meta as InlineMeta
    const v = resolveValue(stateOf(env), meta.segments!, meta.key!, meta.line ?? 0)
    return v.missing ? `<span class="tb-val tb-missing">—</span>` : `<span class="tb-val${v.words ? ' tb-words' : ''}">${escapeHtml(v.text)}</span>`
  }
  rules.tb_in = (tokens, idx, _o, env) => renderInput(tokens[idx]!.meta as InlineMeta, stateOf(env))
  rules.tb_bad = (tokens, idx) => `<span class="tb-bad">${escapeHtml(tokens[idx]!.content)}</span>`
  rules.tb_bad_block = () => ''
  rules.tb_block_open = () => ''
  rules.tb_block_close = () => ''
  rules.math_inline = (tokens, idx, _o, env) => renderMath(tokens[idx]!, false, stateOf(env))
  rules.math_inline_block = (tokens, idx, _o, env) => renderMath(tokens[idx]!, true, stateOf(env))
  rules.math_block = (tokens, idx, _o, env) => renderMath(tokens[idx]!, true, stateOf(env))
  rules.heading_open = (tokens, idx, _o, rawEnv) => {
    const env = stateOf(rawEnv)
    const token = tokens[idx]!
    const inline = tokens[idx + 1]
    const level = Number(token.tag.slice(1))
    const title = inline?.children ? plainText(inline.children, env) : ''
    const base = `sec-${slug(inline?.content ?? '') || 'part'}${env.scopes.map((s) => `-${s.index + 1}`).join('')}`
    const id = uniqueId(env.ids, base)
    env.sections.push({ id, title, level })
    env.currentSection = id
    // a heading among the report's own top-level elements (not in a list, quote or a block's element) opens a part
    const topLevel = env.wrapDepth === 0 && token.level === env.blockDepth
    return `${topLevel ? PART_MARK : ''}<${token.tag} id="${id}">`
  }
  rules.image = (tokens, idx, options, env, self) => {
    const token = tokens[idx]!
    if (isLocalImage(String(token.attrGet('src') ?? ''))) return defaultImage(tokens, idx, options, env, self)
    const alt = self.renderInlineAsText(token.children ?? [], options, env)
    return `<span class="tb-image-blocked">[image not shown: ${escapeHtml(alt || 'no description')}]</span>`
  }
}

installRules(md.renderer)

function matchingClose(tokens: readonly Token[], open: number): number {
  let depth = 0
  for (let i = open; i < tokens.length; i += 1) {
    if (tokens[i]!.type === 'tb_block_open') depth += 1
    else if (tokens[i]!.type === 'tb_block_close') {
      depth -= 1
      if (depth === 0) return i
    }
  }
  return tokens.length
}

function renderTokens(tokens: readonly Token[], env: ReportEnv): string {
  let out = ''
  let run: Token[] = []
  for (let i = 0; i < tokens.length; i += 1) {
    const token = tokens[i]!
    if (token.type !== 'tb_block_open') {
      run.push(token)
      continue
    }
    out += md.renderer.render(run, md.options, { report: env })
    run = []
    const end = matchingClose(tokens, i)
    out += renderBlock(token.meta as BlockMeta, tokens.slice(i + 1, end), env)
    i = end
  }
  return out + md.renderer.render(run, md.options, { report: env })
}

function renderBlock(meta: BlockMeta, inner: readonly Token[], env: ReportEnv): string {
  const wraps = meta.directive !== 'each' && meta.directive !== undefined
  env.blockDepth += 1
  if (wraps) env.wrapDepth += 1
  try {
    return renderBlockContent(meta, inner, env)
  } finally {
    env.blockDepth -= 1
    if (wraps) env.wrapDepth -= 1
  }
}

function renderBlockContent(meta: BlockMeta, inner: readonly Token[], env: ReportEnv): string {
  if (meta.directive === 'each') return renderEach(meta, inner, env)
  if (meta.directive === 'checks') return renderChecks(meta, inner, env)
  if (meta.directive === 'figure') return renderFigure(meta, renderTokens(inner, env).trim(), figureSource(env))
  if (meta.directive === 'overview') return renderOverview(inner, env)
  if (meta.directive === 'calc') return renderCalc(env.calc.get(meta), meta.line ?? 0)
  return renderTokens(inner, env)
}

function renderEach(meta: BlockMeta, inner: readonly Token[], env: ReportEnv): string {
  const parsed = parseKey(meta.attrs.in ?? '')
  if ('problem' in parsed) return ''
  const r = resolvePath(parsed.segments, env.scopes)
  if (r.kind !== 'path') return ''
  const info = describeKey(env.model, r.pattern, 'value')
  const list = info ? lookup(env, info, r.path) : undefined
  if (!Array.isArray(list)) {
    if (list === undefined) env.unresolved.push({ key: meta.attrs.in!, path: r.path, line: meta.line ?? 0 })
    return ''
  }
  const local = meta.attrs.as!
  const where = meta.attrs.where === undefined ? null : parseKey(meta.attrs.where)
  const keep = new Set((meta.attrs.is ?? '').split(',').map((v) => v.trim()).filter(Boolean))
  const selected: PathScope[] = []
  for (let i = 0; i < list.length; i += 1) {
    const scope = { name: local, path: `${r.path}.${i}`, index: i }
    if (where && 'segments' in where) {
      const w = resolvePath(where.segments, [...env.scopes, scope])
      const wInfo = w.kind === 'path' ? describeKey(env.model, w.pattern, 'value') : undefined
      const value = w.kind === 'path' && wInfo ? lookup(env, wInfo, w.path) : undefined
      if (!keep.has(String(value))) continue
    }
    selected.push(scope)
  }
  const each = (tokens: readonly Token[]): string => {
    let out = ''
    for (const scope of selected) {
      env.scopes.push(scope)
      out += renderTokens(tokens, env)
      env.scopes.pop()
    }
    return out
  }
  // A block that holds one table repeats the table's body rows, not the whole table.
  const bodyOpen = inner.findIndex((t) => t.type === 'tbody_open')
  const bodyClose = inner.findIndex((t) => t.type === 'tbody_close')
  if (inner[0]?.type === 'table_open' && inner[inner.length - 1]?.type === 'table_close' && bodyOpen > 0 && bodyClose > bodyOpen) {
    // an empty list says so in one row across the table rather than leaving a bare header
    const columns = inner.slice(0, bodyOpen).filter((t) => t.type === 'th_open').length
    const body = selected.length > 0 ? each(inner.slice(bodyOpen + 1, bodyClose)) : `<tr class="tb-none"><td colspan="${Math.max(1, columns)}">None.</td></tr>\n`
    return renderTokens(inner.slice(0, bodyOpen + 1), env) + body + renderTokens(inner.slice(bodyClose), env)
  }
  return each(inner)
}

function checkCell(value: number, unit: CheckResult['unit']): string {
  return escapeHtml(formatQuantity(value, unit, checkPrecision(unit)))
}

function renderChecks(meta: BlockMeta, inner: readonly Token[], env: ReportEnv): string {
  const group = meta.attrs.group
  const note = renderTokens(inner, env)
  if (env.results === null || env.results === undefined) {
    return `<div class="tb-checks">${note}<p class="tb-missing">No results yet: the checks appear once the inputs are complete.</p></div>\n`
  }
  const rows = env.checks.filter((c) => group === undefined || c.group === group)
  const here = env.currentSection
  const homes = group !== undefined ? env.checkHome : env.checkSummary
  if (here !== null) for (const c of rows) if (!homes.has(c.id)) homes.set(c.id, here)
  if (rows.length === 0) return `<div class="tb-checks">${note}<p class="tb-checks-none">No checks in this group.</p></div>\n`

  const counted = tallyChecks(rows)
  const tally = tallyText(counted)
  const body = rows
    .map((c) => {
      const index = env.checks.indexOf(c)
      const section = group === undefined ? `\u0000home:${index}\u0000` : escapeHtml(here ?? '')
      const title = escapeHtml(c.title) + (c.note ? `<br><small>${escapeHtml(c.note)}</small>` : '')
      return `<tr class="tb-check ${c.pass ? 'tb-pass' : 'tb-fail'}" data-check="${escapeHtml(c.id)}" data-section="${section}">`
        + `<td>${title}</td><td>${escapeHtml(c.location ?? '')}</td><td class="tb-clause">${clauseHtml(c.clause)}</td>`
        + `<td class="tb-num">${checkCell(c.actual, c.unit)}</td><td class="tb-num">${checkCell(c.limit, c.unit)}</td>`
        + `<td class="tb-num">${Number.isFinite(c.utilisation) ? c.utilisation.toFixed(2) : '—'}</td>`
        + `<td class="tb-verdict">${c.pass ? 'pass' : 'fail'}</td></tr>`
    })
    .join('\n')
  return `<div class="tb-checks"${group ? ` data-group="${escapeHtml(group)}"` : ''}>${note}`
    + `<p class="tb-checks-tally${counted.fail ? ' tb-fail' : ' tb-pass'}">${escapeHtml(tally)}</p>\n`
    + '<table class="tb-check-table"><thead><tr><th>Check</th><th>Location</th><th>Clause</th><th>Actual</th><th>Limit</th><th>Utilisation</th><th>Result</th></tr></thead>\n'
    + `<tbody>\n${body}\n</tbody></table></div>\n`
}

/** A clause reference never breaks inside itself ("EN 1992-1-1 5.10.2.2(5)"): only between references. */
function clauseHtml(clause: string): string {
  return clause.split(/,\s*/).map((part) => `<span class="tb-nobreak">${escapeHtml(part)}</span>`).join(', ')
}

function xref(kind: 'key' | 'group', target: string): string {
  return `\u0000ref:${kind}:${target}\u0000`
}

/**
 * The front page of results: the member in one line, the governing utilisation of each check group
 * and the model's governing quantities, each linked to the section that shows it (in print the link
 * carries the page number).
 */
function renderOverview(inner: readonly Token[], env: ReportEnv): string {
  const note = renderTokens(inner, env)
  const overview = env.model.overview
  if (!overview) return ''
  if (env.results === null || env.results === undefined) {
    return `<div class="tb-overview">${note}<p class="tb-missing">No results yet: the front page appears once the inputs are complete.</p></div>\n`
  }
  const { member, rows } = overview(env.results)
  const label = (group: string) => env.model.groupLabels?.[group] ?? group
  const groups = tallyByGroup(env.checks).map((g) => {
    const worst = g.governing!
    const verdict = g.fail ? `${g.fail} of ${g.count} fail` : `all ${g.count} pass`
    return `<tr class="${g.fail ? 'tb-fail' : 'tb-pass'}"><td>${escapeHtml(label(g.group))}</td>`
      + `<td class="tb-num">${worst.utilisation.toFixed(2)}</td><td>${escapeHtml(worst.title)}${worst.location ? `, ${escapeHtml(worst.location)}` : ''}</td>`
      + `<td class="tb-verdict">${verdict}</td><td class="tb-ref">${xref('group', g.group)}</td></tr>`
  }).join('\n')
  const values = rows.map((r) => `<tr><td>${escapeHtml(r.label)}</td><td>${escapeHtml(r.value)}</td><td class="tb-ref">${r.key ? xref('key', r.key) : ''}</td></tr>`).join('\n')
  return `<div class="tb-overview" data-overview="true">${note}<p class="tb-overview-member">${escapeHtml(member)}</p>\n`
    + '<table class="tb-overview-checks"><thead><tr><th>Checks</th><th>Governing utilisation</th><th>Where</th><th>Result</th><th>See</th></tr></thead>\n'
    + `<tbody>\n${groups}\n</tbody></table>\n`
    + `<table class="tb-overview-values"><thead><tr><th>Quantity</th><th>Value</th><th>See</th></tr></thead>\n<tbody>\n${values}\n</tbody></table></div>\n`
}

/** The part of the report a figure block reads. */
function figureSource(env: ReportEnv): FigureSource {
  return { figures: env.model.figures, results: env.results, scopes: env.scopes, images: env.images, quantities: env.quantities }
}

/** A heading's title and its text both look a key up; list each place once. */
function uniqueUnresolved(list: readonly UnresolvedKey[]): UnresolvedKey[] {
  const seen = new Set<string>()
  return list.filter((u) => {
    const id = `${u.line}\u0000${u.path}`
    if (seen.has(id)) return false
    seen.add(id)
    return true
  })
}

/**
 * Where a rendered report shows each check: the section ids its check rows carry. Reads the frozen
 * HTML of a revision issued by any version of this renderer (the row format has not changed).
 */
export function checkSectionsIn(html: string): Record<string, string> {
  const homes: Record<string, string> = {}
  for (const m of html.matchAll(/<tr class="tb-check [^"]*" data-check="([^"]*)" data-section="([^"]*)"/g)) {
    const id = m[1]!.replace(/&quot;/g, '"').replace(/&#39;/g, '\'').replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&amp;/g, '&')
    if (m[2] && !(id in homes)) homes[id] = m[2]
  }
  return homes
}

/** Renders a compiled template; never throws for missing values (they show as — and are listed). */
export function renderReport(compiled: CompiledTemplate, options: RenderOptions): RenderedReport {
  const { parts: _parts, ...report } = renderReportParts(compiled, options)
  return report
}

/** The same render as renderReport, with its html also given in parts (one per top-level heading). */
export function renderReportParts(compiled: CompiledTemplate, options: RenderOptions): RenderedReportParts {
  const { model } = compiled
  const hasResults = options.results !== null && options.results !== undefined
  const env: ReportEnv = {
    model,
    inputs: options.inputs,
    completedInputs: hasResults && model.inputOf ? model.inputOf(options.results) : undefined,
    results: options.results,
    mode: options.mode,
    optionLabel: options.optionLabel ?? ((_path, option) => option),
    checks: hasResults ? model.checksOf(options.results) : [],
    scopes: [],
    ids: new Map(),
    fieldIds: new Map(),
    sections: [],
    currentSection: null,
    checkHome: new Map(),
    checkSummary: new Map(),
    unresolved: [],
    keySections: new Map(),
    calc: new Map(),
    quantities: new Map(),
    images: options.images ?? {},
    wrapDepth: 0,
    blockDepth: 0,
  }
  // the engineer's calculations first: their checks join the tables and the summary wherever those stand
  evaluateCalcBlocks(compiled.tokens, (key) => sheetValue(env, key), { calc: env.calc, quantities: env.quantities })
  // a frozen revision's results already hold them: each check once
  const known = new Set(env.checks.map((c) => c.id))
  const own = [...env.calc.values()].flatMap((r) => r.checks.map(({ line: _line, tex: _tex, ...c }) => c)).filter((c) => !known.has(c.id))
  if (own.length > 0) env.checks = [...env.checks, ...own]
  const body = renderTokens(compiled.tokens, env)
  const homeOf = (c: CheckResult): string | null => env.checkHome.get(c.id) ?? env.checkSummary.get(c.id) ?? null
  const sectionLink = (id: string | null | undefined): string => {
    const section = id ? env.sections.find((s) => s.id === id) : undefined
    return section ? `<a class="tb-xref" href="#${escapeHtml(section.id)}">${escapeHtml(section.title)}</a>` : ''
  }
  const placed = body
    .replace(HOME_MARK, (_, i: string) => escapeHtml(homeOf(env.checks[Number(i)]!) ?? ''))
    .replace(REF_MARK, (_, kind: string, target: string) => {
      if (kind === 'key') return sectionLink(env.keySections.get(target))
      const worst = tallyChecks(env.checks.filter((c) => c.group === target)).governing
      return sectionLink(worst ? env.checkHome.get(worst.id) ?? env.checkSummary.get(worst.id) : null)
    })
  const open = `<article class="tb-report tb-mode-${options.mode}" data-model="${escapeHtml(model.id)}">\n`
  const close = '</article>\n'
  const sections = partsOf(placed)
  sections.push({ key: 'caution', html: `<aside class="tb-caution" role="note"><p>${escapeHtml(REPORT_CAUTION)}</p></aside>\n` })
  return {
    html: open + sections.map((s) => s.html).join('') + close,
    parts: { open, sections, close },
    sections: env.sections,
    checks: env.checks.map((c) => ({ ...c, sectionId: homeOf(c) })),
    unresolved: uniqueUnresolved(env.unresolved),
    keySections: Object.fromEntries(env.keySections),
  }
}

/** The body cut at its part marks; each part keyed by the id of the heading that opens it ('lead' before the first). */
function partsOf(body: string): ReportPart[] {
  const pieces = body.split(PART_MARK)
  const parts: ReportPart[] = []
  if (pieces[0] !== '') parts.push({ key: 'lead', html: pieces[0]! })
  for (const html of pieces.slice(1)) parts.push({ key: /^<h[1-6] id="([^"]*)"/.exec(html)![1]!, html })
  return parts
}

/** A sheet key's value for a calculation block: a finite number, in the unit the sheet shows it in. */
function sheetValue(env: ReportEnv, key: string): SheetValue | undefined {
  const parsed = parseKey(key)
  if ('problem' in parsed) return undefined
  const r = resolvePath(parsed.segments, [])
  if (r.kind !== 'path') return undefined
  const info = describeKey(env.model, r.pattern, 'value')
  const spec = info?.spec
  if (!info || !spec) return undefined
  const v = lookup(env, info, r.path)
  if (typeof v !== 'number' || !Number.isFinite(v)) return undefined
  return { value: fromEngine(v, spec.unit), unit: spec.unit, precision: spec.precision, ...(spec.symbol ? { symbol: spec.symbol } : {}), label: spec.label }
}
