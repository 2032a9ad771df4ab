/**
 * The engineer's calculation blocks (`::: calc`) in a report: evaluated in document order, each
 * seeing the quantities of the blocks above it and the sheet's values, then shown as worked
 * formulas, checks and the problems found, each problem at its template line.
 */
import type { Token } from 'markdown-it'
import { evaluateCalcBlock } from '../calc/quantities'
import type { CalcBlockResult, CalcQuantity, SheetValue } from '../calc/quantities'
import { escapeHtml } from './format'
import type { BlockMeta } from './markdown'
import { typeset } from './typeset'

/** Where the calculation blocks' results go: each block's result, and every quantity they define by name. */
export interface CalcResults {
  calc: Map<BlockMeta, CalcBlockResult>
  quantities: Map<string, CalcQuantity>
}

/**
 * The calculation blocks in document order: each one's quantities, checks and problems.
 * `sheetValue` gives the sheet's value of a key (a number, in display units), undefined where it has none.
 */
export function evaluateCalcBlocks(tokens: readonly Token[], sheetValue: (key: string) => SheetValue | undefined, into: CalcResults): void {
  let n = 0
  for (const token of tokens) {
    if (token.type !== 'tb_block_open') continue
    const meta = token.meta as BlockMeta
    if (meta.directive !== 'calc') continue
    n += 1
    const result = evaluateCalcBlock(meta.source ?? '', { lookup: sheetValue, earlier: into.quantities, blockId: String(n) })
    into.calc.set(meta, result)
    for (const q of result.quantities) into.quantities.set(q.name, q)
  }
}

/** One block's result as HTML; `firstLine` is the template line of the block's opening, to place its problems. */
export function renderCalc(result: CalcBlockResult | undefined, firstLine: number): string {
  if (!result) return ''
  const parts: string[] = []
  for (const q of result.quantities) {
    const tex = q.tex.given
      ? `${q.tex.name} = ${q.tex.result}`
      : `\\begin{aligned} ${q.tex.name} &= ${q.tex.symbols} \\\\ &= ${q.tex.numbers} \\\\ &= ${q.tex.result} \\end{aligned}`
    const what = q.description ? `<p class="tb-calc-what">${escapeHtml(q.description)}</p>` : ''
    parts.push(`<div class="tb-calc-quantity" data-name="${escapeHtml(q.name)}">${what}<div class="tb-math">${typeset(tex, true)}</div></div>`)
  }
  for (const c of result.checks) {
    const verdict = c.pass ? 'satisfied' : 'not satisfied'
    parts.push(`<div class="tb-calc-check ${c.pass ? 'tb-pass' : 'tb-fail'}" data-check="${escapeHtml(c.id)}"><p class="tb-calc-what">${escapeHtml(c.title)}: ${verdict}, utilisation ${escapeHtml(c.utilisation.toFixed(2))}</p><div class="tb-math">${typeset(c.tex, true)}</div></div>`)
  }
  for (const p of result.problems) {
    parts.push(`<p class="tb-calc-problem" role="note">Line ${firstLine + p.line}${p.name ? ` (${escapeHtml(p.name)})` : ''}: ${escapeHtml(p.message)}</p>`)
  }
  return `<div class="tb-calc">${parts.join('\n')}</div>\n`
}
