/**
 * parseTemplate: front matter + Markdown body → tokens, with every syntax problem collected and
 * every directive annotated with its template line. Needs no model; compile.ts binds the result.
 */
import { parseDocument } from 'yaml'
import { z } from 'zod'
import type { Token } from 'markdown-it'
import { TemplateSyntaxError } from './errors'
import type { TemplateError } from './errors'
import { md } from './markdown'
import type { BlockMeta, InlineMeta } from './markdown'
import { parseKey } from './syntax'

export const templateMetaSchema = z.strictObject({
  model: z.string({ error: 'name the engine model, e.g. "model: pt-member"' }).min(1),
  title: z.string({ error: 'give the template a title' }).min(1),
  version: z.union([z.string(), z.number()], { error: 'give the template a version, e.g. "version: 1.0.0"' }).transform(String),
  groups: z.array(z.string()).default([]),
  description: z.string().optional(),
})

export type TemplateMeta = z.output<typeof templateMetaSchema>

export interface ParsedTemplate {
  meta: TemplateMeta | null
  body: string
  /** 1-based line of the template on which the body starts */
  bodyLine: number
  tokens: Token[]
  errors: TemplateError[]
}

/** A `\val{…}` inside math: what it names and where it sits in the formula's text. */
export interface MathKey {
  key: string
  segments: string[]
  line: number
}

export interface MathMeta {
  [extra: string]: unknown
  keys: MathKey[]
}

const VAL_IN_MATH = /\\val\s*\{([^{}]*)\}/g

function splitFrontMatter(text: string): { yaml: string | null; body: string; bodyLine: number; closed: boolean } {
  const lines = text.split('\n')
  if (lines[0]?.trim() !== '---') return { yaml: null, body: text, bodyLine: 1, closed: true }
  const end = lines.findIndex((l, i) => i > 0 && (l.trim() === '---' || l.trim() === '...'))
  if (end < 0) return { yaml: lines.slice(1).join('\n'), body: '', bodyLine: lines.length + 1, closed: false }
  return { yaml: lines.slice(1, end).join('\n'), body: lines.slice(end + 1).join('\n'), bodyLine: end + 2, closed: true }
}

function parseMeta(yaml: string | null, errors: TemplateError[], hasEnd: boolean): TemplateMeta | null {
  if (yaml === null) {
    errors.push(new TemplateSyntaxError(1, 'a template starts with front matter between two "---" lines (model, title, version, groups)'))
    return null
  }
  if (!hasEnd) errors.push(new TemplateSyntaxError(1, 'the front matter is never closed: end it with a line "---"'))
  const doc = parseDocument(yaml, { prettyErrors: false, uniqueKeys: true })
  if (doc.errors.length > 0) {
    for (const e of doc.errors) errors.push(new TemplateSyntaxError((e.linePos?.[0]?.line ?? 1) + 1, `front matter: ${e.message.split('\n')[0]}`))
    return null
  }
  const parsed = templateMetaSchema.safeParse(doc.toJS())
  if (parsed.success) return parsed.data
  const yamlLines = yaml.split('\n')
  for (const issue of parsed.error.issues) {
    const field = issue.code === 'unrecognized_keys' ? issue.keys[0] : issue.path[0]
    const at = typeof field === 'string' ? yamlLines.findIndex((l) => new RegExp(`^${field}\\s*:`).test(l)) : -1
    const what = issue.code === 'unrecognized_keys'
      ? `unknown front matter field${issue.keys.length > 1 ? 's' : ''} ${issue.keys.join(', ')} (the fields are model, title, version, groups, description)`
      : `front matter "${String(issue.path.join('.'))}": ${issue.message}`
    errors.push(new TemplateSyntaxError(at >= 0 ? at + 2 : 1, what))
  }
  return null
}

/** 1-based line of each directive, and every syntax problem the parser recorded in `meta`. */
function annotate(tokens: Token[], bodyLine: number, bodyLines: readonly string[], errors: TemplateError[]): void {
  for (const token of tokens) {
    const line = token.map ? token.map[0] + bodyLine : undefined
    if (token.type === 'tb_block_open' || token.type === 'tb_bad_block') {
      const meta = token.meta as BlockMeta
      meta.line = line ?? bodyLine
      for (const p of meta.problems) errors.push(new TemplateSyntaxError(meta.line, p))
    }
    if (token.type === 'math_block') token.meta = mathMeta(token.content, mathStartLine(token, bodyLine, bodyLines), errors)
    if (token.type === 'inline' && token.children) annotateInline(token, line ?? bodyLine, errors)
  }
}

function mathStartLine(token: Token, bodyLine: number, bodyLines: readonly string[]): number {
  if (!token.map) return bodyLine
  // `$$` alone on its line: the formula starts on the next one
  return token.map[0] + bodyLine + (bodyLines[token.map[0]]?.trim() === '$$' ? 1 : 0)
}

function annotateInline(token: Token, line: number, errors: TemplateError[]): void {
  let cursor = 0
  for (const child of token.children ?? []) {
    if (child.type === 'tb_in' || child.type === 'tb_val' || child.type === 'tb_bad') {
      const meta = child.meta as InlineMeta
      meta.line = line + meta.offset
      if (meta.problem) errors.push(new TemplateSyntaxError(meta.line, meta.problem))
    }
    if (child.type === 'math_inline' || child.type === 'math_inline_block') {
      const at = token.content.indexOf(child.content, cursor)
      const before = at >= 0 ? at : cursor
      cursor = before + child.content.length
      const startLine = line + token.content.slice(0, before).split('\n').length - 1
      child.meta = mathMeta(child.content, startLine, errors)
    }
  }
}

function mathMeta(tex: string, startLine: number, errors: TemplateError[]): MathMeta {
  const meta: MathMeta = { keys: [] }
  for (const m of tex.matchAll(VAL_IN_MATH)) {
    const line = startLine + tex.slice(0, m.index).split('\n').length - 1
    const keyText = m[1]!.trim()
    const parsed = parseKey(keyText)
    if ('problem' in parsed) errors.push(new TemplateSyntaxError(line, `\\val{…} needs a key, but ${parsed.problem}`))
    else meta.keys.push({ key: keyText, segments: parsed.segments, line })
  }
  const bare = tex.replace(VAL_IN_MATH, '').match(/\\val(?![A-Za-z])/)
  if (bare) errors.push(new TemplateSyntaxError(startLine, 'write \\val{key} with the key in braces'))
  return meta
}

/** Front matter and body → tokens; syntax problems are collected, not thrown. */
export function parseTemplate(text: string): ParsedTemplate {
  const normalised = text.replace(/\r\n?/g, '\n')
  const errors: TemplateError[] = []
  const split = splitFrontMatter(normalised)
  const meta = parseMeta(split.yaml, errors, split.closed)
  const tokens = md.parse(split.body, {})
  annotate(tokens, split.bodyLine, split.body.split('\n'), errors)
  errors.sort((a, b) => a.line - b.line)
  return { meta, body: split.body, bodyLine: split.bodyLine, tokens, errors }
}
