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

/** One line naming each field at fault, e.g. "jobNumber: Enter the job number". */
export function describeFieldErrors(errors: FieldErrors): string {
  return Object.entries(errors).map(([field, message]) => `${field}: ${message}`).join('; ')
}
