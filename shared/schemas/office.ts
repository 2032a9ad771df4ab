import { z } from 'zod'

/** One schema for the office-details form and the route that saves a new version of them. */
export const officeDetailsSchema = z.object({
  name: z.string().trim().min(2, 'Enter the office\'s name (at least 2 characters)').max(160, 'The office\'s name is at most 160 characters'),
  /** 'keep' keeps the logo in force, 'remove' prints without one; a new file replaces it either way */
  logo: z.enum(['keep', 'remove'], { message: 'logo is keep or remove' }).default('keep'),
})

export type OfficeDetailsBody = z.infer<typeof officeDetailsSchema>

export const OFFICE_LOGO_MAX_BYTES = 512 * 1024
