/**
 * A report part's html cut into its top-level blocks: each block is one element (or comment) with
 * the text that follows it up to the next one, so the page can compare a part block by block and
 * parse only the blocks that changed. Reads the well-formed html this renderer writes; anything it
 * cannot follow (a raw-text element, an unclosed tag) gives null and the caller patches the part whole.
 */

/** HTML's void elements: a start tag with no end tag. */
const VOID = new Set(['area', 'base', 'br', 'col', 'embed', 'hr', 'img', 'input', 'link', 'meta', 'source', 'track', 'wbr'])
/**
 * Elements whose text is not markup: this reader does not follow them. (The renderer escapes every
 * text, so RCDATA elements — textarea, and title, which the report's SVG figures use — read as any other.)
 */
const RAW_TEXT = new Set(['script', 'style', 'xmp', 'iframe', 'noembed', 'noframes', 'noscript', 'plaintext'])

export interface TopLevelBlock {
  html: string
  /** the top-level element's tag name (lower case), '#comment', or '#text' for text before the first element */
  tag: string
  /** the DOM nodes it makes at the top level: the element (or comment), then its following text if any */
  nodes: 1 | 2
}

/** The end of a tag that starts at `from` ('<'), past its closing '>', with quoted attribute values skipped; -1 if none. */
function tagEnd(html: string, from: number): number {
  let quote = ''
  for (let i = from + 1; i < html.length; i += 1) {
    const c = html[i]!
    if (quote) {
      if (c === quote) quote = ''
    }
    else if (c === '"' || c === '\'') quote = c
    else if (c === '>') return i + 1
  }
  return -1
}

export function topLevelBlocks(html: string): TopLevelBlock[] | null {
  const blocks: TopLevelBlock[] = []
  let depth = 0
  let start = 0
  let tag = '#text'
  // where the current top-level element (or comment) ends: text after it is a node of its own
  let lastEnd = 0
  let i = html.indexOf('<')
  if (i < 0) return html ? [{ html, tag, nodes: 1 }] : []
  // a block ends where the next top-level element starts
  const close = (at: number) => {
    if (at <= start) return
    const piece = html.slice(start, at)
    if (tag === '#text') blocks.push({ html: piece, tag, nodes: 1 })
    else blocks.push({ html: piece, tag, nodes: at > lastEnd ? 2 : 1 })
    start = at
  }
  while (i >= 0) {
    if (html.startsWith('<!--', i)) {
      const end = html.indexOf('-->', i + 4)
      if (end < 0) return null
      if (depth === 0) {
        close(i)
        tag = '#comment'
        lastEnd = end + 3
      }
      i = html.indexOf('<', end + 3)
      continue
    }
    const end = tagEnd(html, i)
    if (end < 0) return null
    const closing = html[i + 1] === '/'
    const name = /^<\/?([A-Za-z][A-Za-z0-9-]*)/.exec(html.slice(i, Math.min(end, i + 40)))?.[1]?.toLowerCase()
    if (!name) return null
    if (closing) {
      depth -= 1
      if (depth < 0) return null
      if (depth === 0) lastEnd = end
    }
    else {
      if (RAW_TEXT.has(name)) return null
      if (depth === 0) {
        close(i)
        tag = name
      }
      const selfClosing = VOID.has(name) || html[end - 2] === '/'
      if (selfClosing) {
        if (depth === 0) lastEnd = end
      }
      else depth += 1
    }
    i = html.indexOf('<', end)
  }
  if (depth !== 0) return null
  close(html.length)
  return blocks
}
