import { userCreateSchema } from '../../../../shared/schemas/auth'

export default defineEventHandler(async (event) => {
  const admin = await authorize(event)
  const body = await validBody(event, userCreateSchema)
  const user = await createUser(body)
  await recordAudit(event, { action: 'user.created', subject: user.email, actorId: admin.id, detail: { role: user.role } })
  setResponseStatus(event, 201)
  return user
})
