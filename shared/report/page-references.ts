/**
 * Page numbers in a printed report. Chromium cannot number pages for a contents list, so printing
 * runs twice: the first PDF tells on which page each section heading landed (its named
 * destination), the second prints the contents and the front page's references with those numbers.
 * The numbers travel to the print page as one short text: the page of each listed section, in order.
 */
import { escapeHtml } from './format'

export interface PrintedSection {
  id: string
  title: string
  level: number
}

/** The sections a printed contents lists: the two top levels of headings. */
export function contentsSections<T extends PrintedSection>(sections: readonly T[]): T[] {
  const top = Math.min(...sections.map(s => s.level))
  return sections.filter(s => s.level <= top + 1)
}

/** '3.3.4.7': the page of each section, in the order given; a section not found prints as 0. */
export function encodePages(sections: readonly PrintedSection[], pageOf: ReadonlyMap<string, number>): string {
  return sections.map(s => pageOf.get(s.id) ?? 0).join('.')
}

/** The inverse of encodePages; anything malformed gives no numbers at all (the placeholders print). */
export function decodePages(sections: readonly PrintedSection[], text: unknown): Map<string, number> {
  if (typeof text !== 'string' || !/^\d{1,4}(\.\d{1,4})*$/.test(text)) return new Map()
  const pages = text.split('.').map(Number)
  if (pages.length !== sections.length) return new Map()
  return new Map(sections.map((s, i) => [s.id, pages[i]!]))
}

/**
 * The report's links to its own sections (the front page's `a.tb-xref`) with the page they lead to,
 * as `data-page` for the print stylesheet to show. Where the page is not known yet, `placeholder`:
 * '00' for a render that finds the pages, so that it lays the text out as wide as the next; null
 * (no `data-page`, so no number) for a print view opened by a person before any seal numbered it.
 */
export function withPageReferences(html: string, pageOf: ReadonlyMap<string, number>, placeholder: string | null = '00'): string {
  return html.replace(/<a class="tb-xref" href="#([^"]+)">/g, (match, id: string) => {
    const page = pageOf.get(id)
    const shown = page ? String(page) : placeholder
    return shown === null ? match : `<a class="tb-xref" href="#${id}" data-page="${escapeHtml(shown)}">`
  })
}
