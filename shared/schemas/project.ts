import { z } from 'zod'
import { textField } from './text'
import { PROJECT_ROLES } from '../types/roles'
import { recordId } from './record-id'

/** One schema for the project form and the route that creates a project. */
export const projectCreateSchema = z.object({
  jobNumber: textField('Job number').trim()
    .min(1, 'Enter the job number')
    .max(32, 'Job number is at most 32 characters')
    .regex(/^[A-Za-z0-9][A-Za-z0-9./_-]*$/, 'Job number may hold letters, digits and . / _ - only'),
  name: textField('Project name').trim().min(3, 'Project name must be at least 3 characters').max(160, 'Project name is at most 160 characters'),
  client: textField('Client').trim().max(160, 'Client is at most 160 characters').default(''),
  site: textField('Site').trim().max(200, 'Site is at most 200 characters').default(''),
})

export const PROJECT_FIELD_LABELS = { jobNumber: 'Job number', name: 'Project name', client: 'Client', site: 'Site' }

export type ProjectCreateBody = z.infer<typeof projectCreateSchema>

export const idParamSchema = z.object({
  id: recordId('must be a positive whole number'),
})

/** One schema for the membership form of the people page and the route that adds a member or changes their role. */
export const memberSetSchema = z.object({
  userId: recordId('Choose a person'),
  role: z.enum(PROJECT_ROLES, { message: 'Choose the role on the project: engineer, checker or records' }),
})

export const MEMBER_FIELD_LABELS = { userId: 'Person', role: 'Role on the project' }

export type MemberSetBody = z.infer<typeof memberSetSchema>

export const memberParamSchema = z.object({
  id: recordId('must be a positive whole number'),
  userId: recordId('must be a positive whole number'),
})
