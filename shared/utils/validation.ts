import type { z } from 'zod'

/** Field path → first message, for showing errors beside form fields. */
export type FieldErrors = Record<string, string>

export function fieldErrors(error: z.ZodError): FieldErrors {
  const out: FieldErrors = {}
  for (const issue of error.issues) {
    const path = issue.path.map(String).join('.') || '(body)'
    if (!(path in out)) out[path] = issue.message
  }
  return out
}

/** How a field is called where people read it: a map of labels, or a function of the path. */
export type FieldLabels = Record<string, string> | ((path: string) => string)

function labelOf(labels: FieldLabels | undefined, path: string): string {
  if (!labels) return path
  return typeof labels === 'function' ? labels(path) : labels[path] ?? path
}

/**
 * One line naming each field at fault, e.g. "jobNumber: Enter the job number", or with labels
 * "Calc reference: Enter the calc reference".
 */
export function describeFieldErrors(errors: FieldErrors, labels?: FieldLabels): string {
  return Object.entries(errors).map(([field, message]) => `${labelOf(labels, field)}: ${message}`).join('; ')
}
