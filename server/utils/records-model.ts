// The frozen run of an issue: the engine recomputed on the server from the sheet's inputs, and the
// report rendered from the sheet's own template version, through the same sheet runtime the
// editor uses (shared/sheet/runtime.ts), so the frozen document is what the engineer saw.
import type { SheetImage } from '../../shared/report/render'
import type { CheckResult } from '../../shared/engine/contract'
import { designMember, type Design } from '../../shared/engine/member/design'
import { compileSheet, renderSheet } from '../../shared/sheet/runtime'

export interface FrozenRun {
  /** the complete input the engine ran on (defaults filled in) */
  inputs: unknown
  results: { checks: CheckResult[] } & Record<string, unknown>
  engineVersion: string
  html: string
  sections: Array<{ id: string, title: string, level: number }>
}

/**
 * @throws EngineInputError naming the input at fault; 409 when the template no longer loads or
 * binds to another model than the sheet's.
 */
export function freezeRun(model: string, templateBody: string, inputs: unknown, images: Readonly<Record<string, SheetImage>> = {}): FrozenRun {
  const compiled = compileSheet(templateBody)
  if (!compiled.ok) throw createError({ statusCode: 409, message: `The sheet's template does not load: ${compiled.errors.join('; ')}` })
  if (compiled.meta.model !== model) throw createError({ statusCode: 409, message: `The template binds to "${compiled.meta.model}", the sheet to "${model}"` })
  const design = designMember(inputs)
  const report = renderSheet(compiled.template, design.input, design, 'frozen', { images })
  // the engineer's own checks (calculation blocks) are checks of the revision like the engine's
  const own = report.checks.filter(c => c.group === 'own').map(({ sectionId: _s, ...c }) => c)
  return {
    inputs: design.input,
    results: (own.length ? { ...design, checks: [...design.checks, ...own] } : design) as unknown as FrozenRun['results'],
    engineVersion: design.engineVersion,
    html: report.html,
    sections: report.sections.map(s => ({ id: s.id, title: s.title, level: s.level })),
  }
}

/** Where a frozen report shows each check and value: its sections, check homes and key homes. */
export interface ReportMap {
  sections: Array<{ id: string, title: string, level: number }>
  checkSections: Record<string, string>
  keySections: Record<string, string>
}

// A frozen revision never changes, so its map is kept by content hash; a few dozen cover a checker's session.
const reportMaps = new Map<string, ReportMap>()
const REPORT_MAPS_KEPT = 64

/**
 * Renders a frozen revision again, from its own template text, inputs and results, to learn which
 * section shows each check and value. @throws 409 when the frozen template no longer loads.
 */
export function reportMapOf(rev: { contentHash: string, templateBody: string, inputs: unknown, results: unknown }): ReportMap {
  const kept = reportMaps.get(rev.contentHash)
  if (kept) return kept
  const compiled = compileSheet(rev.templateBody)
  if (!compiled.ok) throw createError({ statusCode: 409, message: `The revision's template no longer loads: ${compiled.errors.join('; ')}` })
  const report = renderSheet(compiled.template, rev.inputs, rev.results as Design, 'frozen')
  const map = { sections: report.sections, checkSections: report.checkSections, keySections: report.keySections }
  if (reportMaps.size >= REPORT_MAPS_KEPT) reportMaps.delete(reportMaps.keys().next().value!)
  reportMaps.set(rev.contentHash, map)
  return map
}
