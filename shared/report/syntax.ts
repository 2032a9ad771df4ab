/**
 * The small grammar of the template language's own forms: keys, attribute lists and the names of
 * the directives. Everything a template can say is one of these forms; anything else is Markdown.
 *
 *   key        = position | name ( "." ( name | index | position ) )*   e.g. loads.sdl, spans.2, s.label, drapes.#s
 *   position   = "#" name        the position of the element a local name stands for: alone it prints
 *                                the element's number (from 1), inside a key it picks that position
 *   attributes = "{" ( attr ( " "+ attr )* )? "}"                 e.g. {group=transfer}, {in=sections as=s}
 *   attr       = name "=" ( bare | '"' text '"' )    bare: letters, digits and _ . # , -
 *
 * A list in an attribute (each's is=…) separates its values with commas.
 */

export const INLINE_DIRECTIVES = ['in', 'val'] as const
export type InlineDirective = (typeof INLINE_DIRECTIVES)[number]

export const BLOCK_DIRECTIVES = ['checks', 'figure', 'each', 'overview', 'calc'] as const
export type BlockDirective = (typeof BLOCK_DIRECTIVES)[number]

/** Which attributes each block takes, and which of them are required. */
export const BLOCK_ATTRIBUTES: Record<BlockDirective, { required: readonly string[]; optional: readonly string[] }> = {
  checks: { required: [], optional: ['group'] },
  figure: { required: [], optional: ['plot', 'at', 'image', 'mark'] },
  each: { required: ['in', 'as'], optional: ['where', 'is'] },
  overview: { required: [], optional: [] },
  calc: { required: [], optional: [] },
}

const NAME = /^[A-Za-z_][A-Za-z0-9_]*$/
const SEGMENT = /^(?:[A-Za-z_][A-Za-z0-9_]*|\d+|#[A-Za-z_][A-Za-z0-9_]*)$/
const POSITION = /^#[A-Za-z_][A-Za-z0-9_]*$/

/** :val[calc.name] shows a quantity a calculation block defines */
export const CALC_PREFIX = 'calc'

/** The names a figure's mark=… lists, separated by commas (spaces around them ignored). */
export function markNames(list: string): string[] {
  return list.split(',').map((s) => s.trim()).filter((s) => s.length > 0)
}

/** `#s`: the position of the element the local name s stands for. */
export function isPosition(segment: string): boolean {
  return POSITION.test(segment)
}

/** The segments of a key, or a reason why the text is not a key. */
export function parseKey(text: string): { segments: string[] } | { problem: string } {
  if (text.length === 0) return { problem: 'an empty key' }
  if (text.length > 200) return { problem: 'a key longer than 200 characters' }
  const segments = text.split('.')
  if (segments.length === 1 && POSITION.test(text)) return { segments }
  for (let i = 0; i < segments.length; i += 1) {
    const s = segments[i]!
    if (i === 0 && !NAME.test(s)) return { problem: `"${text}" is not a key: it must start with a name (letters, digits, _)` }
    if (!SEGMENT.test(s)) return { problem: `"${text}" is not a key: "${s}" is neither a name, an index nor a position (#name)` }
  }
  return { segments }
}

export function isName(text: string): boolean {
  return NAME.test(text)
}

/** `spans.2.x` → `spans[].x`: the pattern under which the catalogue lists a concrete path. */
export function patternOf(segments: readonly string[]): string {
  return segments.map((s) => (/^\d+$/.test(s) || POSITION.test(s) ? '[]' : s)).join('.').replace(/\.\[\]/g, '[]')
}

/** Attribute list text (between the braces) → map, or the first problem. Values are plain text. */
export function parseAttributes(text: string): { attrs: Record<string, string> } | { problem: string } {
  const attrs: Record<string, string> = {}
  const re = /\s*([A-Za-z][A-Za-z0-9_-]*)=(?:"([^"{}\n]*)"|([A-Za-z0-9_.#,-]+))\s*/y
  let pos = 0
  while (pos < text.length) {
    if (/^\s+$/.test(text.slice(pos))) break
    re.lastIndex = pos
    const m = re.exec(text)
    if (!m) return { problem: `cannot read the attributes "{${text}}": write name=value pairs separated by spaces, quoting values with spaces` }
    const name = m[1]!
    if (Object.prototype.hasOwnProperty.call(attrs, name)) return { problem: `the attribute "${name}" is given twice` }
    attrs[name] = m[2] ?? m[3] ?? ''
    pos = re.lastIndex
  }
  return { attrs }
}

/** The opening line of a block: `::: name{attrs}` (the colons may be followed by spaces). */
export const BLOCK_OPEN = /^:::\s*([A-Za-z][A-Za-z0-9_-]*)\s*(?:\{([^}\n]*)\})?\s*$/
/** The closing line of a block. */
export const BLOCK_CLOSE = /^:::\s*$/
