import { z } from 'zod'
import { textField } from './text'

/** One schema for the new-sheet form and the route that creates a sheet. */
export const sheetCreateSchema = z.object({
  reference: textField('Calc reference').trim()
    .min(1, 'Enter the calc reference')
    .max(32, 'Calc reference is at most 32 characters')
    .regex(/^[A-Za-z0-9][A-Za-z0-9./_-]*$/, 'Calc reference may hold letters, digits and . / _ - only'),
  title: textField('Title').trim().min(3, 'Title must be at least 3 characters').max(200, 'Title is at most 200 characters'),
  partOfStructure: textField('Part of structure').trim().max(200, 'Part of structure is at most 200 characters').default(''),
  templateId: z.coerce.number({ message: 'Choose a template' }).int().positive('Choose a template'),
})

export type SheetCreateBody = z.infer<typeof sheetCreateSchema>

/** A background save of the draft: the inputs (engine units) and the version it was based on. */
export const draftSaveSchema = z.object({
  inputs: z.record(z.string(), z.unknown(), { message: 'inputs must be an object' }),
  draftVersion: z.number({ message: 'draftVersion must be a number' }).int().positive(),
})

export type DraftSaveBody = z.infer<typeof draftSaveSchema>

export const templatePublishSchema = z.object({
  slug: textField('Short name').trim().min(3, 'Enter a short name of at least 3 characters').max(80)
    .regex(/^[a-z0-9][a-z0-9-]*$/, 'Short name may hold lower-case letters, digits and - only'),
  body: textField('Template text').min(20, 'The template is empty').max(400_000, 'The template is too long (400 000 characters at most)'),
})

export type TemplatePublishBody = z.infer<typeof templatePublishSchema>
