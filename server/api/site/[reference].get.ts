import { z } from 'zod'

const siteParams = z.object({ reference: z.string().trim().min(1, 'Give the verification reference').max(40, 'A verification reference is 17 characters') })

/** The site view of an approved revision by the verification reference on its sealed PDF (the caller's projects only). */
export default defineEventHandler(async (event) => {
  const user = await authorize(event)
  const { reference } = validParams(event, siteParams)
  return siteView(reference, user)
})
