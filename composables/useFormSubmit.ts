import type { z } from 'zod'
import { fieldErrors, type FieldErrors } from '~/shared/utils/validation'

/**
 * A form that validates with the same zod schema as its route, then calls `action`: field errors
 * from the schema or from the server's 400/409 land beside the fields, anything else in `message`.
 */
export function useFormSubmit<S extends z.ZodType>(schema: S, action: (data: z.output<S>) => Promise<void>) {
  const errors = ref<FieldErrors>({})
  const message = ref('')
  const busy = ref(false)

  async function submit(values: unknown): Promise<boolean> {
    message.value = ''
    const parsed = schema.safeParse(values)
    if (!parsed.success) {
      errors.value = fieldErrors(parsed.error)
      return false
    }
    errors.value = {}
    busy.value = true
    try {
      await action(parsed.data)
      return true
    }
    catch (error) {
      errors.value = apiFieldErrors(error)
      message.value = apiErrorMessage(error)
      return false
    }
    finally {
      busy.value = false
    }
  }

  return { errors, message, busy, submit }
}
