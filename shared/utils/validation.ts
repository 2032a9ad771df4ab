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

/**
 * Labels from a map whose keys may stand for list elements with `*`, numbered from 1 where the
 * label says `{n}`: `{ 'comments.*.text': 'Comment {n}' }` calls `comments.2.text` "Comment 3".
 * A body that is not an object at all, `(body)`, is "The request".
 */
export function labelsFrom(map: Record<string, string>): (path: string) => string {
  return (path) => {
    const exact = map[path] ?? (path === '(body)' ? 'The request' : undefined)
    if (exact) return exact
    const numbers: number[] = []
    const pattern = path.split('.').map(seg => (/^\d+$/.test(seg) ? (numbers.push(Number(seg) + 1), '*') : seg)).join('.')
    const label = map[pattern] ?? map[pattern.split('.')[0]!]
    return label ? label.replace(/\{n\}/g, () => String(numbers.shift() ?? '')) : path
  }
}

function labelOf(labels: FieldLabels | undefined, path: string): string {
  if (!labels) return path
  return typeof labels === 'function' ? labels(path) : labelsFrom(labels)(path)
}

/**
 * One line naming each field at fault, e.g. "jobNumber: Enter the job number", or with labels
 * "Calc reference: Enter the calc reference".
 */
export function describeFieldErrors(errors: FieldErrors, labels?: FieldLabels): string {
  return Object.entries(errors).map(([field, message]) => `${labelOf(labels, field)}: ${message}`).join('; ')
}
