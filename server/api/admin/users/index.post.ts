import { USER_FIELD_LABELS, userCreateSchema } from '../../../../shared/schemas/auth'

export default defineEventHandler(async (event) => {
  const admin = await authorize(event)
  const body = await validBody(event, userCreateSchema, USER_FIELD_LABELS)
  const user = await createUser(body)
  await recordAudit(event, { action: 'user.created', subject: user.email, actorId: admin.id, detail: { role: user.role } })
  setResponseStatus(event, 201)
  return user
})
