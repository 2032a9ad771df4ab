import type { H3Event } from 'h3'
import type { z } from 'zod'
import { describeFieldErrors, fieldErrors, type FieldLabels } from '../../shared/utils/validation'

/** A 400 that names each field at fault, in `message` (by its label when given) and in `data.fields`. */
export function invalidInput(error: z.ZodError, labels?: FieldLabels): never {
  const fields = fieldErrors(error)
  throw createError({ statusCode: 400, statusMessage: 'Invalid input', message: describeFieldErrors(fields, labels), data: { fields } })
}

/** The numbers and words a route takes from its address, as people call them. */
const ADDRESS_LABELS: FieldLabels = { id: 'Record number in the address', userId: 'Person number in the address', reference: 'Verification reference in the address' }

/** The body of a request, checked by `schema`; a message names each field at fault by its label in `labels`. */
export async function validBody<S extends z.ZodType>(event: H3Event, schema: S, labels: FieldLabels): Promise<z.output<S>> {
  let body: unknown
  try {
    body = await readBody(event)
  }
  catch {
    throw createError({ statusCode: 400, statusMessage: 'Invalid input', message: 'The request body is not valid JSON', data: { fields: { '(body)': 'not valid JSON' } } })
  }
  const result = schema.safeParse(body ?? {})
  if (!result.success) invalidInput(result.error, labels)
  return result.data
}

export function validParams<S extends z.ZodType>(event: H3Event, schema: S): z.output<S> {
  const result = schema.safeParse(getRouterParams(event, { decode: true }))
  if (!result.success) invalidInput(result.error, ADDRESS_LABELS)
  return result.data
}

export function validQuery<S extends z.ZodType>(event: H3Event, schema: S, labels: FieldLabels): z.output<S> {
  const result = schema.safeParse(getQuery(event))
  if (!result.success) invalidInput(result.error, labels)
  return result.data
}
