// Placeholder until shared/engine and shared/report are committed: issuing refuses with a clear message.
import type { CheckResult } from '../../shared/engine/contract'

export interface FrozenRun {
  inputs: unknown
  results: { checks: CheckResult[] } & Record<string, unknown>
  engineVersion: string
  html: string
  sections: Array<{ id: string, title: string, level: number }>
}

export function freezeRun(_model: string, _templateBody: string, _inputs: unknown): FrozenRun {
  throw createError({ statusCode: 503, message: 'The design engine is not available in this build' })
}

export function resultSpecFor(_path: string) {
  return undefined
}
