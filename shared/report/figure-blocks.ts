/**
 * The figures of a report (`::: figure`): a figure the model draws from the results, with the
 * engineer's quantities marked on it, or an image attached to the sheet; each numbered with its
 * caption. The caption comes in rendered: this module reads only what a figure needs.
 */
import { quantityIn } from '../calc/quantities'
import type { CalcQuantity } from '../calc/quantities'
import { resolvePath } from './bind'
import type { PathScope } from './bind'
import { escapeHtml } from './format'
import type { BlockMeta } from './markdown'
import type { FigureMark, ModelFigure } from './model'
import { markNames, parseKey } from './syntax'

export interface SheetImage { src: string; sha256: string }

/** What a figure block reads of the report it stands in. */
export interface FigureSource {
  /** the model's figures, by plot name */
  figures: Readonly<Record<string, ModelFigure>>
  /** the engine's results; null or undefined when the engine could not run */
  results: unknown
  /** the elements the enclosing each-blocks stand on, to resolve at=… */
  scopes: readonly PathScope[]
  /** the sheet's attached images by file name */
  images: Readonly<Record<string, SheetImage>>
  /** every quantity the calculation blocks define, by name */
  quantities: ReadonlyMap<string, CalcQuantity>
}

// A figure depends only on the results object and its `at`; the editor re-renders the same results often (memoised by input).
const figureCache = new WeakMap<object, Map<string, string>>()

function drawFigure(figure: ModelFigure, plot: string, results: unknown, at: string | undefined, marks: readonly FigureMark[]): string {
  if (typeof results !== 'object' || results === null) return figure.render(results, at, marks)
  let drawn = figureCache.get(results)
  if (!drawn) {
    drawn = new Map()
    figureCache.set(results, drawn)
  }
  const key = `${plot}\u0000${at ?? ''}\u0000${marks.map((m) => `${m.label}\u0001${m.axis}\u0001${m.value}`).join('\u0002')}`
  const cached = drawn.get(key)
  if (cached !== undefined) return cached
  const svg = figure.render(results, at, marks)
  drawn.set(key, svg)
  return svg
}

/**
 * The quantities a figure's mark=… names, each on the axis whose unit it converts to (the value
 * axis first, then the place along the member); those that fit neither, or are not defined, are
 * said in words under the figure.
 */
function figureMarks(list: string | undefined, figure: ModelFigure, quantities: ReadonlyMap<string, CalcQuantity>): { marks: FigureMark[]; notes: string[] } {
  const marks: FigureMark[] = []
  const notes: string[] = []
  if (list === undefined || !figure.marks) return { marks, notes }
  for (const name of markNames(list)) {
    const q = quantities.get(name)
    if (!q) {
      notes.push(`"${name}" cannot be marked: no calculation block gives it a value.`)
      continue
    }
    const onY = figure.marks.y ? quantityIn(q, figure.marks.y) : null
    const onX = onY === null && figure.marks.x ? quantityIn(q, figure.marks.x) : null
    if (onY !== null) marks.push({ label: name, axis: 'y', value: onY })
    else if (onX !== null) marks.push({ label: name, axis: 'x', value: onX })
    else notes.push(`"${name}" (${q.unit || 'a number without a unit'}) cannot be marked: this figure plots ${axisWords(figure.marks)}.`)
  }
  return { marks, notes }
}

/** What a figure's value axis plots, in words, by the engine unit it declares (as mathjs writes it). */
const AXIS_WORDS: Readonly<Record<string, string>> = { 'N mm': 'moments', N: 'forces', mm: 'lengths', MPa: 'stresses' }

function axisWords(axes: NonNullable<ModelFigure['marks']>): string {
  const y = axes.y ? AXIS_WORDS[axes.y] ?? axes.y : null
  return y ? `${y} along the member` : 'along the member'
}

/** An image attached to the sheet, as a numbered figure with its caption; the source only from the sheet's own list. */
function renderImageFigure(name: string, caption: string, images: Readonly<Record<string, SheetImage>>): string {
  const image = Object.hasOwn(images, name) ? images[name] : undefined
  const safe = image && (image.src.startsWith('/api/attachments/') || /^data:image\/(png|jpeg);base64,[A-Za-z0-9+/=]+$/.test(image.src))
  const alt = caption.replace(/<[^>]*>/g, '').trim() || name
  const drawing = image && safe
    ? `<img class="tb-image" src="${escapeHtml(image.src)}" alt="${escapeHtml(alt)}" data-sha256="${escapeHtml(image.sha256)}">`
    : `<p class="tb-missing">The image "${escapeHtml(name)}" is not attached to this sheet: attach it, or correct the name.</p>`
  return `<figure class="tb-figure" data-image="${escapeHtml(name)}">${drawing}${caption ? `<figcaption>${caption}</figcaption>` : ''}</figure>\n`
}

/** A figure block as HTML, around its caption (already rendered, trimmed; empty for none). */
export function renderFigure(meta: BlockMeta, caption: string, source: FigureSource): string {
  if (meta.attrs.image !== undefined) return renderImageFigure(meta.attrs.image, caption, source.images)
  const plot = meta.attrs.plot ?? ''
  const figure = source.figures[plot]
  let at: string | undefined
  if (meta.attrs.at !== undefined) {
    const parsed = parseKey(meta.attrs.at)
    const r = 'segments' in parsed ? resolvePath(parsed.segments, source.scopes) : null
    at = r?.kind === 'path' ? r.path : undefined
  }
  let drawing: string
  if (!figure) drawing = ''
  else if (source.results === null || source.results === undefined) drawing = '<p class="tb-missing">No results yet: the figure appears once the inputs are complete.</p>'
  else {
    const { marks, notes } = figureMarks(meta.attrs.mark, figure, source.quantities)
    try {
      drawing = drawFigure(figure, plot, source.results, at, marks)
    } catch (error) {
      drawing = `<p class="tb-missing">The figure could not be drawn: ${escapeHtml(error instanceof Error ? error.message : String(error))}</p>`
    }
    drawing += notes.map((note) => `<p class="tb-missing">${escapeHtml(note)}</p>`).join('')
  }
  return `<figure class="tb-figure" data-plot="${escapeHtml(plot)}">${drawing}${caption ? `<figcaption>${caption}</figcaption>` : ''}</figure>\n`
}
