import { describe, expect, it } from 'vitest'
import { signinSchema, userCreateSchema, userUpdateSchema } from '../../../shared/schemas/auth'
import { projectCreateSchema } from '../../../shared/schemas/project'
import { sheetCreateSchema, templatePublishSchema } from '../../../shared/schemas/sheet'
import { textField } from '../../../shared/schemas/text'
import { archiveQuery, issueBody, reviewBody, verifyQueryBody } from '../../../server/utils/records-schemas'
import { canonicalJson } from '../../../shared/log/canonical'
import { fieldErrors } from '../../../shared/utils/validation'

const LONE = 'a\ud800b'

describe('text with a broken character', () => {
  it('is refused by the shared text field, naming the field by its label; whole emoji pass', () => {
    const note = textField('Note')
    expect(note.safeParse('slab \ud83d\ude00').success).toBe(true)
    const result = note.safeParse(LONE)
    expect(result.success).toBe(false)
    expect(result.error!.issues[0]!.message).toBe('Note: contains a broken character')
    expect(note.safeParse('\udc00').success).toBe(false)
  })

  it.each([
    ['signin email', signinSchema, { email: LONE, password: 'x' }, 'email', 'E-mail'],
    ['signin password', signinSchema, { email: 'a@b.co', password: LONE }, 'password', 'Password'],
    ['new user name', userCreateSchema, { email: 'a@b.co', name: LONE, role: 'engineer', password: 'long-enough-password' }, 'name', 'Name'],
    ['user update name', userUpdateSchema, { name: `Al${LONE}` }, 'name', 'Name'],
    ['project site', projectCreateSchema, { jobNumber: '1', name: 'Yard', site: LONE }, 'site', 'Site'],
    ['project client', projectCreateSchema, { jobNumber: '1', name: 'Yard', client: LONE }, 'client', 'Client'],
    ['sheet title', sheetCreateSchema, { reference: 'PS-2', title: `Slab ${LONE}`, templateId: 1 }, 'title', 'Title'],
    ['part of structure', sheetCreateSchema, { reference: 'PS-2', title: 'Slab', partOfStructure: LONE, templateId: 1 }, 'partOfStructure', 'Part of structure'],
    ['template text', templatePublishSchema, { slug: 'office-slab', body: `${'x'.repeat(30)}${LONE}` }, 'body', 'Template text'],
    ['issue note', issueBody, { note: LONE, draftVersion: 1 }, 'note', 'Note for the checker'],
    ['comment', reviewBody, { decision: 'return', comments: [{ text: LONE }] }, 'comments.0.text', 'Comment'],
    ['comment section', reviewBody, { decision: 'return', comments: [{ anchor: LONE, text: 'ok' }] }, 'comments.0.anchor', 'Section'],
    ['archive search', archiveQuery, { q: LONE }, 'q', 'Search'],
    ['verify query', verifyQueryBody, { query: LONE }, 'query', 'Hash or reference'],
  ] as const)('%s', (_, schema, body, field, label) => {
    const result = (schema as { safeParse: (v: unknown) => { success: boolean, error?: import('zod').ZodError } }).safeParse(body)
    expect(result.success).toBe(false)
    expect(fieldErrors(result.error!)[field]).toBe(`${label}: contains a broken character`)
  })

  it('has no canonical JSON form, so it can never be hashed by mistake', () => {
    expect(() => canonicalJson({ note: LONE })).toThrow(/broken character/)
    expect(canonicalJson({ note: '\ud83d\ude00' })).toBe('{"note":"\ud83d\ude00"}')
  })
})
