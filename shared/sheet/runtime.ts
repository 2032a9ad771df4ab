/**
 * The sheet runtime shared by the editor (browser), the template preview and the server: run the
 * engine on a sheet's inputs, compile a template against its model, render the report. Pure
 * TypeScript over the engine and the report renderer.
 */
import { EngineInputError } from '../engine/contract'
import { designMember, type Design } from '../engine/member/design'
import { memberInputSchema, type MemberInput } from '../engine/input/schema'
import { DEMO_BB1, DEMO_PS2 } from '../engine/input/demo'
import { compileTemplate, parseTemplate, renderReportParts, TemplateLoadError, type CompiledTemplate, type RenderMode, type RenderOptions, type TemplateMeta } from '../report'
import { MODELS } from '../report/models'

export type SheetRun = { ok: true, design: Design } | { ok: false, field: string, message: string }

const STARTERS: Array<{ match: RegExp, inputs: unknown }> = [
  { match: /band-beam/, inputs: DEMO_BB1 },
  { match: /.*/, inputs: DEMO_PS2 },
]

/** Starter inputs for a new sheet made from the template `slug` (complete, defaults filled in). */
export function starterInputsFor(slug: string): MemberInput {
  const found = STARTERS.find(s => s.match.test(slug))!
  return memberInputSchema.parse(found.inputs)
}

/** Runs the engine; bad input comes back as the field it names, never as an exception. */
export function runSheet(inputs: unknown, options: { proposal?: boolean } = {}): SheetRun {
  try {
    return { ok: true, design: designMember(inputs, { proposal: options.proposal ?? true }) }
  }
  catch (error) {
    if (error instanceof EngineInputError) return { ok: false, field: error.field, message: error.message.replace(`${error.field}: `, '') }
    return { ok: false, field: '(engine)', message: error instanceof Error ? error.message : String(error) }
  }
}

export type SheetCompile =
  | { ok: true, template: CompiledTemplate, meta: TemplateMeta }
  | { ok: false, errors: string[] }

const compiledCache = new Map<string, SheetCompile>()

/** Compiles a template text against the model its front matter names; every problem with its line. */
export function compileSheet(text: string): SheetCompile {
  const cached = compiledCache.get(text)
  if (cached) return cached
  let result: SheetCompile
  const parsed = parseTemplate(text)
  const model = parsed.meta ? MODELS[parsed.meta.model] : undefined
  if (parsed.meta && !model) {
    result = { ok: false, errors: [`line 1: the model "${parsed.meta.model}" is not known to this version of Tendonbook`] }
  }
  else {
    try {
      const template = compileTemplate(text, model!)
      result = { ok: true, template, meta: template.meta }
    }
    catch (error) {
      result = { ok: false, errors: error instanceof TemplateLoadError ? error.errors.map(e => e.message) : [String((error as Error).message)] }
    }
  }
  if (compiledCache.size > 20) compiledCache.clear()
  compiledCache.set(text, result)
  return result
}

export function renderSheet(template: CompiledTemplate, inputs: unknown, design: Design | null, mode: RenderMode, words: Pick<RenderOptions, 'optionLabel' | 'images'> = {}) {
  const { parts: _parts, ...report } = renderSheetParts(template, inputs, design, mode, words)
  return report
}

/** renderSheet with the html also in parts, one per top-level heading, for the editor to patch part by part. */
export function renderSheetParts(template: CompiledTemplate, inputs: unknown, design: Design | null, mode: RenderMode, words: Pick<RenderOptions, 'optionLabel' | 'images'> = {}) {
  const report = renderReportParts(template, { inputs, results: design, mode, ...words })
  const checkSections: Record<string, string> = {}
  for (const c of report.checks) if (c.sectionId) checkSections[c.id] = c.sectionId
  return { ...report, checkSections }
}

/** The engine's proposal as an input patch, or the reason there is none. */
export function proposalOf(design: Design): { patch: Record<string, unknown> | null, reason: string } {
  const p = design.proposal
  if (!p.feasible && p.reason === 'not computed') return { patch: null, reason: 'Working out the proposal…' }
  if (p.feasible && p.inputPatch) return { patch: p.inputPatch as Record<string, unknown>, reason: 'Apply the least force and the eccentricities that pass every stress check' }
  return { patch: null, reason: p.reason ?? 'No proposal' }
}
