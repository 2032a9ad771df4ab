/**
 * The editor's live run: the engine on the sheet's inputs and the report rendered in parts, as one
 * step that the editor runs off its main thread (workers/sheet-run.ts) so a keystroke paints before
 * the engine starts. Pure TypeScript over the sheet runtime; the same step runs synchronously when a
 * sheet loads (and on the server while it renders the page).
 */
import type { CheckResult } from '../engine/contract'
import type { Design } from '../engine/member/design'
import type { ReportCheck, ReportPart, ReportSection, SheetImage } from '../report/render'
import { optionLabel } from './labels'
import { compileSheet, proposalOf, renderSheetParts, runSheet, type SheetCompile } from './runtime'

export interface LiveRequest {
  seq: number
  /** the inputs as the editor keys them (what a proposal applies to) */
  key: string
  /** the validated inputs to run, or null to render the last inputs that ran (a field is invalid) */
  inputs: unknown | null
  text: string
  images: Readonly<Record<string, SheetImage>>
  /** with the proposal search (the costly part), or without it while typing goes on */
  proposal: boolean
}

export type LiveRunState = { ok: true } | { ok: false, field: string, message: string }

export interface LiveReport {
  open: string
  parts: ReportPart[]
  close: string
  sections: ReportSection[]
  checks: ReportCheck[]
  checkSections: Record<string, string>
}

export interface LiveOutcome {
  seq: number
  key: string
  /** whether this run searched for the proposal */
  full: boolean
  /** the run of these inputs; null when none ran (the request carried no inputs) */
  run: LiveRunState | null
  proposal: { patch: Record<string, unknown> | null, reason: string } | null
  /** the engine's checks of the run the report shows (for a sheet whose text does not load) */
  designChecks: CheckResult[] | null
  /** the report of the last inputs that ran; null when nothing ran yet or no text ever loaded */
  report: LiveReport | null
}

/** A live runner keeps the last inputs that ran and the last text that loaded, as the editor shows them. */
export function createLiveRunner() {
  let lastGood: { inputs: unknown, design: Design } | null = null
  let lastLoaded: Extract<SheetCompile, { ok: true }> | null = null
  return {
    reset() {
      lastGood = null
      lastLoaded = null
    },
    run(request: LiveRequest): LiveOutcome {
      const run = request.inputs === null ? null : runSheet(request.inputs, { proposal: request.proposal })
      if (run?.ok) lastGood = { inputs: request.inputs, design: run.design }
      const compiled = compileSheet(request.text)
      if (compiled.ok) lastLoaded = compiled
      const report = lastLoaded && lastGood
        ? renderSheetParts(lastLoaded.template, lastGood.inputs, lastGood.design, 'edit', { optionLabel, images: request.images })
        : null
      return {
        seq: request.seq,
        key: request.key,
        full: request.proposal,
        run: run === null ? null : run.ok ? { ok: true } : { ok: false, field: run.field, message: run.message },
        proposal: run?.ok ? proposalOf(run.design) : null,
        designChecks: lastGood?.design.checks ?? null,
        report: report && {
          open: report.parts.open,
          parts: report.parts.sections,
          close: report.parts.close,
          sections: report.sections,
          checks: report.checks,
          checkSections: report.checkSections,
        },
      }
    },
  }
}
