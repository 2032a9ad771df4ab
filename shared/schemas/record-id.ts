import { z } from 'zod'

/**
 * A record's id: a positive whole number, sent as a number (JSON) or as its digits (a path, a query,
 * a form's select). Nothing else is read as a number: z.coerce would take `true` as 1, `[5]` as 5,
 * `"0x10"` as 16 or `" 7 "` as 7, and so act on a record nobody named.
 */
export function recordId(message: string) {
  return z.preprocess(
    value => (typeof value === 'string' && /^[0-9]{1,15}$/.test(value) ? Number(value) : value),
    z.number({ message }).int(message).positive(message),
  )
}
