import { z } from 'zod'
import { ROLES } from '../types/roles'

export const signinSchema = z.object({
  email: z.string().trim().toLowerCase().email('Enter a valid e-mail address'),
  password: z.string().min(1, 'Enter your password').max(200, 'Password is too long'),
})

export const passwordSchema = z.string()
  .min(12, 'Password must be at least 12 characters')
  .max(200, 'Password must be at most 200 characters')

export const userCreateSchema = z.object({
  email: z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(254),
  name: z.string().trim().min(2, 'Enter the person’s name').max(120, 'Name is too long'),
  role: z.enum(ROLES, { message: `Role must be one of ${ROLES.join(', ')}` }),
  password: passwordSchema,
})

export const userUpdateSchema = z.object({
  role: z.enum(ROLES, { message: `Role must be one of ${ROLES.join(', ')}` }).optional(),
  disabled: z.boolean().optional(),
  name: z.string().trim().min(2).max(120).optional(),
  password: passwordSchema.optional(),
}).refine(v => Object.keys(v).length > 0, { message: 'Nothing to change' })

export type SigninBody = z.infer<typeof signinSchema>
export type UserCreateBody = z.infer<typeof userCreateSchema>
export type UserUpdateBody = z.infer<typeof userUpdateSchema>
