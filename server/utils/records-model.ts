// The frozen run of an issue: the engine recomputed on the server from the sheet's inputs, and the
// report rendered from the sheet's own template version, through the same sheet runtime the
// editor uses (shared/sheet/runtime.ts), so the frozen document is what the engineer saw.
import type { CheckResult } from '../../shared/engine/contract'
import { specFor } from '../../shared/engine/results/specs'
import { designMember } from '../../shared/engine/member/design'
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
export function freezeRun(model: string, templateBody: string, inputs: unknown): FrozenRun {
  const compiled = compileSheet(templateBody)
  if (!compiled.ok) throw createError({ statusCode: 409, message: `The sheet's template does not load: ${compiled.errors.join('; ')}` })
  if (compiled.meta.model !== model) throw createError({ statusCode: 409, message: `The template binds to "${compiled.meta.model}", the sheet to "${model}"` })
  const design = designMember(inputs)
  const report = renderSheet(compiled.template, design.input, design, 'frozen')
  return {
    inputs: design.input,
    results: design as unknown as FrozenRun['results'],
    engineVersion: design.engineVersion,
    html: report.html,
    sections: report.sections.map(s => ({ id: s.id, title: s.title, level: s.level })),
  }
}

/** Label, unit and precision of a result path, for the diff. */
export function resultSpecFor(path: string) {
  return specFor(path)
}
