import { z } from 'zod'
import { textField } from './text'
import { recordId } from './record-id'

/** One schema for the new-sheet form and the route that creates a sheet. */
export const sheetCreateSchema = z.object({
  reference: textField('Calc reference').trim()
    .min(1, 'Enter the calc reference')
    .max(32, 'Calc reference is at most 32 characters')
    .regex(/^[A-Za-z0-9][A-Za-z0-9./_-]*$/, 'Calc reference may hold letters, digits and . / _ - only'),
  title: textField('Title').trim().min(3, 'Title must be at least 3 characters').max(200, 'Title is at most 200 characters'),
  partOfStructure: textField('Part of structure').trim().max(200, 'Part of structure is at most 200 characters').default(''),
  templateId: recordId('Choose a template'),
  /** span lengths in metres, as typed; left out: the template's starter spans */
  spans: z.array(z.number({ message: 'Enter the span length in metres' }).min(1, 'A span must be at least 1 m').max(40, 'A span must not exceed 40 m'))
    .min(1, 'Give at least one span').max(10, 'At most 10 spans').optional(),
  /** another sheet of the project whose inputs the new sheet starts from */
  copyFrom: recordId('Choose the sheet to start from').optional(),
}).refine(b => !(b.spans && b.copyFrom), { path: ['spans'], message: 'Either give the spans or start from another sheet, not both' })

export type SheetCreateBody = z.infer<typeof sheetCreateSchema>

const SHEET_FIELD_LABELS: Record<string, string> = {
  reference: 'Calc reference', title: 'Title', partOfStructure: 'Part of structure', templateId: 'Template',
  spans: 'Spans', copyFrom: 'Start from', inputs: 'Inputs', draftVersion: 'Draft version', body: 'Sheet text', '(body)': 'Request',
}

/** The new-sheet form's and the sheet routes' fields, in people's words ("spans.1" is "Span 2"). */
export function sheetFieldLabel(path: string): string {
  const span = /^spans\.(\d+)$/.exec(path)
  if (span) return `Span ${Number(span[1]) + 1}`
  return SHEET_FIELD_LABELS[path] ?? path
}

/**
 * A background save of the draft: the inputs (engine units), the version it was based on and, when
 * the engineer has written it, the sheet's own text (null: back to the template's text; left out:
 * unchanged). A text with problems is kept (nothing typed is lost); it is checked when issuing.
 */
export const draftSaveSchema = z.object({
  inputs: z.record(z.string(), z.unknown(), { message: 'The inputs must be an object' }),
  draftVersion: z.number({ message: 'The draft version must be a number' }).int().positive(),
  body: textField('Sheet text').max(400_000, 'The sheet\'s text is too long (400 000 characters at most)').nullable().optional(),
})

export type DraftSaveBody = z.infer<typeof draftSaveSchema>

export const templatePublishSchema = z.object({
  slug: textField('Short name').trim().min(3, 'Enter a short name of at least 3 characters').max(80)
    .regex(/^[a-z0-9][a-z0-9-]*$/, 'Short name may hold lower-case letters, digits and - only'),
  body: textField('Template text').min(20, 'The template is empty').max(400_000, 'The template is too long (400 000 characters at most)'),
})

export const TEMPLATE_FIELD_LABELS = { slug: 'Short name', body: 'Template text' }

export type TemplatePublishBody = z.infer<typeof templatePublishSchema>
