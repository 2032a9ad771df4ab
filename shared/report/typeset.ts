/**
 * The report's formulas typeset with KaTeX, and the cache of those already typeset, which the
 * editor's page hands to the worker that renders its report so the worker's first render is warm.
 */
import katex from 'katex'
import { escapeHtml } from './format'

const KATEX_OPTIONS = {
  trust: false,
  maxSize: 10,
  maxExpand: 1000,
  throwOnError: false,
  strict: 'ignore',
  errorColor: '#a33b2f',
  output: 'htmlAndMathml',
} as const

// KaTeX output depends only on the TeX and the mode; most formulas repeat from one keystroke to the next.
const typesetCache = new Map<string, string>()
const TYPESET_CACHE_SIZE = 4000

/** The formulas typeset so far (key, html), for another thread's renderer to start from. */
export function typesetCacheEntries(): Array<[string, string]> {
  return [...typesetCache]
}

/** Starts this thread's formula cache from another's: KaTeX's output depends only on the TeX and the mode. */
export function seedTypesetCache(entries: ReadonlyArray<readonly [string, string]>): void {
  for (const [key, html] of entries.slice(0, TYPESET_CACHE_SIZE - typesetCache.size)) typesetCache.set(key, html)
}

/** The HTML (and MathML) of a formula, inline or displayed; TeX KaTeX cannot read shows as itself, marked. */
export function typeset(tex: string, display: boolean): string {
  const key = `${display ? 'D' : 'I'}${tex}`
  const cached = typesetCache.get(key)
  if (cached !== undefined) return cached
  let html: string
  try {
    html = katex.renderToString(tex, { ...KATEX_OPTIONS, displayMode: display })
  } catch {
    html = `<span class="tb-math-error">${escapeHtml(tex)}</span>`
  }
  if (typesetCache.size >= TYPESET_CACHE_SIZE) typesetCache.clear()
  typesetCache.set(key, html)
  return html
}
