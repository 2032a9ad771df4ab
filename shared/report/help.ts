/**
 * The template-language doc as HTML for the app's help page. It is prose about templates, not a
 * template, so it goes through plain Markdown (raw HTML off) with heading ids, never the renderer.
 */
import markdownit from 'markdown-it'
import { TEMPLATE_LANGUAGE_DOC } from './builtins/index'

const plain = markdownit('default', { html: false, linkify: false, typographer: false })

function headingId(text: string, seen: Map<string, number>): string {
  const base = `doc-${text.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '') || 'part'}`
  const count = seen.get(base) ?? 0
  seen.set(base, count + 1)
  return count === 0 ? base : `${base}-${count + 1}`
}

/** The doc as HTML, with an id on every heading for the page's table of contents. */
export function templateLanguageHelpHtml(markdown: string = TEMPLATE_LANGUAGE_DOC): { html: string; headings: Array<{ id: string; title: string; level: number }> } {
  const tokens = plain.parse(markdown, {})
  const seen = new Map<string, number>()
  const headings: Array<{ id: string; title: string; level: number }> = []
  tokens.forEach((t, i) => {
    if (t.type !== 'heading_open') return
    const title = tokens[i + 1]?.content ?? ''
    const id = headingId(title, seen)
    t.attrSet('id', id)
    headings.push({ id, title, level: Number(t.tag.slice(1)) })
  })
  return { html: plain.renderer.render(tokens, plain.options, {}), headings }
}
