import type { FieldErrors } from '~/shared/utils/validation'

interface ApiErrorShape {
  data?: { message?: string, statusMessage?: string, data?: { fields?: FieldErrors } }
  message?: string
  statusCode?: number
}

/** The server's own message for a failed $fetch, or a plain fallback. */
export function apiErrorMessage(error: unknown): string {
  const e = error as ApiErrorShape
  return e?.data?.message || e?.message || 'Something went wrong; try again'
}

/** Field → message map from a 400 with `data.fields`, for showing errors beside fields. */
export function apiFieldErrors(error: unknown): FieldErrors {
  return (error as ApiErrorShape)?.data?.data?.fields ?? {}
}
