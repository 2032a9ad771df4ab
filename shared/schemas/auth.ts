import { z } from 'zod'
import { ROLES } from '../types/roles'
import { textField } from './text'

export const signinSchema = z.object({
  email: textField('E-mail').trim().toLowerCase().email('Enter a valid e-mail address'),
  password: textField('Password').min(1, 'Enter your password').max(200, 'Password is too long'),
})

export const passwordSchema = textField('Password')
  .min(12, 'Password must be at least 12 characters')
  .max(200, 'Password must be at most 200 characters')

export const userCreateSchema = z.object({
  email: textField('E-mail').trim().toLowerCase().email('Enter a valid e-mail address').max(254),
  name: textField('Name').trim().min(2, 'Enter the person’s name').max(120, 'Name is too long'),
  role: z.enum(ROLES, { message: `Role must be one of ${ROLES.join(', ')}` }),
  password: passwordSchema,
})

export const userUpdateSchema = z.object({
  role: z.enum(ROLES, { message: `Role must be one of ${ROLES.join(', ')}` }).optional(),
  disabled: z.boolean({ message: 'Account disabled: yes or no' }).optional(),
  name: textField('Name').trim().min(2, 'Enter the person’s name').max(120, 'Name is too long').optional(),
  password: passwordSchema.optional(),
}).refine(v => Object.keys(v).length > 0, { message: 'Nothing to change: give a new name, role, password or whether the account is disabled' })

/** The sign-in form's and the people page's fields, as the forms label them. */
export const SIGNIN_FIELD_LABELS = { email: 'E-mail', password: 'Password' }
export const USER_FIELD_LABELS = { email: 'E-mail', name: 'Name', role: 'Role', password: 'Password', disabled: 'Account disabled' }

export type SigninBody = z.infer<typeof signinSchema>
export type UserCreateBody = z.infer<typeof userCreateSchema>
export type UserUpdateBody = z.infer<typeof userUpdateSchema>
