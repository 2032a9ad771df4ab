import { describe, expect, it } from 'vitest'
import { projectCreateSchema } from '../../../shared/schemas/project'
import { userCreateSchema } from '../../../shared/schemas/auth'
import { describeFieldErrors, fieldErrors } from '../../../shared/utils/validation'

describe('shared form schemas', () => {
  it('names every field at fault', () => {
    const result = projectCreateSchema.safeParse({ jobNumber: '', name: 'x' })
    expect(result.success).toBe(false)
    const errors = fieldErrors(result.error!)
    expect(Object.keys(errors).sort()).toEqual(['jobNumber', 'name'])
    expect(describeFieldErrors(errors)).toMatch(/^jobNumber: .+; name: .+$/)
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
