/**
 * The Markdown parser of the template language: markdown-it with raw HTML off, math delimiters
 * from @vscode/markdown-it-katex, and two rules of our own — inline directives (`:in[key]`,
 * `:val[key]`) and blocks (`::: name{attrs}` … `:::`). Parsing only records what it finds in the
 * tokens' `meta`; binding to a model and rendering happen elsewhere.
 */
import markdownit from 'markdown-it'
import type { MarkdownIt, StateBlock, StateInline } from 'markdown-it'
import * as katexPluginModule from '@vscode/markdown-it-katex'
import { BLOCK_CLOSE, BLOCK_DIRECTIVES, BLOCK_OPEN, INLINE_DIRECTIVES, parseAttributes, parseKey } from './syntax'
import type { BlockDirective, InlineDirective } from './syntax'

/** meta of an inline directive token ('tb_in' / 'tb_val') or of a malformed one ('tb_bad') */
export interface InlineMeta {
  [extra: string]: unknown
  directive?: InlineDirective
  key?: string
  segments?: string[]
  problem?: string
  /** newlines before the directive inside its inline block */
  offset: number
  /** 1-based template line, set when the template is compiled */
  line?: number
}

/** meta of a block's opening token ('tb_block_open') or of a stray ':::' line ('tb_bad_block') */
export interface BlockMeta {
  [extra: string]: unknown
  name: string
  directive?: BlockDirective
  attrs: Record<string, string>
  problems: string[]
  line?: number
  /** a calculation block's own text (its lines are not Markdown), and the 0-based body line of its first line */
  source?: string
  sourceLine?: number
}

type KatexPlugin = (md: MarkdownIt, options?: object) => MarkdownIt

/** The plugin is CommonJS with a default export; bundlers and Node's ESM loader unwrap it differently. */
function katexPlugin(): KatexPlugin {
  const mod = katexPluginModule as unknown as { default?: KatexPlugin | { default?: KatexPlugin } }
  const first = mod.default
  if (typeof first === 'function') return first
  if (first && typeof first.default === 'function') return first.default
  throw new Error('@vscode/markdown-it-katex did not load')
}

const INLINE = /:([a-z][a-z0-9-]*)\[([^\]\n]*)\]/y

function inlineDirective(state: StateInline, silent: boolean): boolean {
  const start = state.pos
  if (state.src.charCodeAt(start) !== 0x3a /* : */) return false
  if (start > 0 && /[A-Za-z0-9_]/.test(state.src[start - 1]!)) return false
  INLINE.lastIndex = start
  const m = INLINE.exec(state.src)
  if (!m || m.index !== start) return false
  if (!silent) {
    const name = m[1]!
    const keyText = m[2]!.trim()
    const meta: InlineMeta = { offset: countNewlines(state.src, start) }
    if (!(INLINE_DIRECTIVES as readonly string[]).includes(name)) {
      meta.problem = `unknown directive ":${name}[…]": the inline directives are ${INLINE_DIRECTIVES.map((d) => `:${d}[key]`).join(' and ')}`
    } else {
      const parsed = parseKey(keyText)
      if ('problem' in parsed) meta.problem = `:${name}[…] needs a key, but ${parsed.problem}`
      else Object.assign(meta, { directive: name as InlineDirective, key: keyText, segments: parsed.segments })
    }
    const token = state.push(meta.problem ? 'tb_bad' : `tb_${name}`, '', 0)
    token.content = m[0]
    token.meta = meta
  }
  state.pos = start + m[0].length
  return true
}

function countNewlines(text: string, end: number): number {
  let n = 0
  for (let i = 0; i < end; i += 1) if (text.charCodeAt(i) === 10) n += 1
  return n
}

function lineText(state: StateBlock, line: number): string {
  return state.src.slice(state.bMarks[line]! + state.tShift[line]!, state.eMarks[line]!)
}

function blockDirective(state: StateBlock, startLine: number, endLine: number, silent: boolean): boolean {
  if (state.sCount[startLine]! - state.blkIndent >= 4) return false
  const first = lineText(state, startLine)
  if (!first.startsWith(':::')) return false
  if (silent) return true

  const open = BLOCK_OPEN.exec(first)
  if (!open) {
    const token = state.push('tb_bad_block', '', 0)
    token.map = [startLine, startLine + 1]
    token.content = first
    const problem = BLOCK_CLOSE.test(first)
      ? 'this ":::" closes no block'
      : `cannot read the block line "${first}": write ::: name{attr=value …}`
    const meta: BlockMeta = { name: '', attrs: {}, problems: [problem] }
    token.meta = meta
    state.line = startLine + 1
    return true
  }

  const name = open[1]!
  const meta: BlockMeta = { name, attrs: {}, problems: [] }
  if ((BLOCK_DIRECTIVES as readonly string[]).includes(name)) meta.directive = name as BlockDirective
  else meta.problems.push(`unknown block "::: ${name}": the blocks are ${BLOCK_DIRECTIVES.map((b) => `::: ${b}{…}`).join(', ')}`)
  const attrs = parseAttributes(open[2] ?? '')
  if ('problem' in attrs) meta.problems.push(attrs.problem)
  else meta.attrs = attrs.attrs

  // The matching ':::' is the first one that balances the blocks opened inside; fenced code is skipped.
  let depth = 1
  let fence: string | null = null
  let next = startLine + 1
  for (; next < endLine; next += 1) {
    const text = lineText(state, next)
    if (text.length > 0 && state.sCount[next]! < state.blkIndent) break
    const fenceMark = /^(`{3,}|~{3,})/.exec(text)
    if (fenceMark) {
      if (fence === null) fence = fenceMark[1]!
      else if (fenceMark[1]!.startsWith(fence)) fence = null
      continue
    }
    if (fence !== null) continue
    if (BLOCK_OPEN.test(text)) depth += 1
    else if (BLOCK_CLOSE.test(text)) {
      depth -= 1
      if (depth === 0) break
    }
  }
  const closed = depth === 0 && next < endLine
  if (!closed) meta.problems.push(`the block "::: ${name}" is never closed: end it with a line ":::"`)

  if (name === 'calc') {
    // a calculation block's lines are its own language, not Markdown: kept as text
    meta.source = Array.from({ length: next - startLine - 1 }, (_, k) => state.src.slice(state.bMarks[startLine + 1 + k]!, state.eMarks[startLine + 1 + k]!)).join('\n')
    meta.sourceLine = startLine + 1
    const openToken = state.push('tb_block_open', 'div', 1)
    openToken.block = true
    openToken.map = [startLine, next]
    openToken.meta = meta
    const closeToken = state.push('tb_block_close', 'div', -1)
    closeToken.block = true
    state.line = closed ? next + 1 : next
    return true
  }

  const oldParent = state.parentType
  const oldLineMax = state.lineMax
  state.parentType = 'container' as string as typeof state.parentType
  state.lineMax = next
  const openToken = state.push('tb_block_open', 'div', 1)
  openToken.block = true
  openToken.map = [startLine, next]
  openToken.meta = meta
  state.md.block.tokenize(state, startLine + 1, next)
  const closeToken = state.push('tb_block_close', 'div', -1)
  closeToken.block = true
  state.parentType = oldParent
  state.lineMax = oldLineMax
  state.line = closed ? next + 1 : next
  return true
}

/** Links may go to the web or a mail address or within the page; nothing else (no javascript:, data:, file:). */
function validateLink(url: string): boolean {
  const u = url.trim().toLowerCase()
  if (/^[a-z][a-z0-9+.-]*:/.test(u)) return /^(https?|mailto):/.test(u)
  return true
}

/** An image source that loads nothing from elsewhere: a relative path, no scheme, no host. */
export function isLocalImage(src: string): boolean {
  const s = src.trim().toLowerCase()
  return s.length > 0 && !/^[a-z][a-z0-9+.-]*:/.test(s) && !s.startsWith('//') && !s.startsWith('\\')
}

function createParser(): MarkdownIt {
  const md = new markdownit('default', { html: false, linkify: false, typographer: false })
  md.validateLink = validateLink
  katexPlugin()(md, { throwOnError: false })
  md.inline.ruler.after('escape', 'tb_directive', inlineDirective)
  md.block.ruler.before('fence', 'tb_block', blockDirective, { alt: ['paragraph', 'reference', 'blockquote', 'list'] })
  return md
}

/** One parser for the whole app: rules read everything per render from `env`, never from module state. */
export const md: MarkdownIt = createParser()
