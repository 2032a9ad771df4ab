import { z } from 'zod'

/**
 * Text typed by a person, for every schema that takes text. A lone UTF-16 surrogate (half of an
 * emoji cut in two, or `\ud800` sent on purpose) is refused here: MariaDB would store U+FFFD in
 * its place, so the stored row would no longer be the text that was hashed and checked.
 * `label` is the field's name as the form shows it.
 */
export function textField(label: string) {
  return z.string({ message: `${label}: enter text` })
    .refine(value => value.isWellFormed(), { message: `${label}: contains a broken character`, abort: true })
}
