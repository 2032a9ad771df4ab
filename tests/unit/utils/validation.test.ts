import { describe, expect, it } from 'vitest'
import { PROJECT_FIELD_LABELS, projectCreateSchema } from '../../../shared/schemas/project'
import { userCreateSchema } from '../../../shared/schemas/auth'
import { ISSUE_FIELD_LABELS } from '../../../shared/schemas/issue'
import { describeFieldErrors, fieldErrors, labelsFrom } from '../../../shared/utils/validation'

describe('shared form schemas', () => {
  it('names every field at fault', () => {
    const result = projectCreateSchema.safeParse({ jobNumber: '', name: 'x' })
    expect(result.success).toBe(false)
    const errors = fieldErrors(result.error!)
    expect(Object.keys(errors).sort()).toEqual(['jobNumber', 'name'])
    expect(describeFieldErrors(errors)).toMatch(/^jobNumber: .+; name: .+$/)
    expect(describeFieldErrors(errors, PROJECT_FIELD_LABELS)).toMatch(/^Job number: .+; Project name: .+$/)
  })

  it('calls an element of a list by its number from 1, and a body that is no object the request', () => {
    const label = labelsFrom(ISSUE_FIELD_LABELS)
    expect(label('replies.2.text')).toBe('Reply 3')
    expect(label('replies.0')).toBe('Reply 1')
    expect(label('replies')).toBe('Replies to the comments')
    expect(label('(body)')).toBe('The request')
    expect(labelsFrom({ 'rows.*.cells.*': 'Row {n}, cell {n}' })('rows.1.cells.4')).toBe('Row 2, cell 5')
  })

  it('trims and fills defaults', () => {
    expect(projectCreateSchema.parse({ jobNumber: ' 2417 ', name: ' Alder Yard podium ' })).toEqual({ jobNumber: '2417', name: 'Alder Yard podium', client: '', site: '' })
  })

  it('asks for passwords of at least 12 characters and a known role', () => {
    const errors = fieldErrors(userCreateSchema.safeParse({ email: 'a@b.co', name: 'Ann', role: 'boss', password: '12345678901' }).error!)
    expect(errors.password).toMatch(/12 characters/)
    expect(errors.role).toMatch(/engineer, checker, records, admin/)
  })
})
