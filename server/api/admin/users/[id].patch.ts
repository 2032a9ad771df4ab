import { USER_FIELD_LABELS, userUpdateSchema } from '../../../../shared/schemas/auth'
import { idParamSchema } from '../../../../shared/schemas/project'

export default defineEventHandler(async (event) => {
  const { id } = validParams(event, idParamSchema)
  const admin = await authorize(event)
  const body = await validBody(event, userUpdateSchema, USER_FIELD_LABELS)
  const { before, after } = await updateUser(id, body, admin.id)
  if (before.role !== after.role) await recordAudit(event, { action: 'user.role', subject: after.email, actorId: admin.id, detail: { from: before.role, to: after.role } })
  if (before.disabled !== after.disabled) await recordAudit(event, { action: after.disabled ? 'user.disabled' : 'user.enabled', subject: after.email, actorId: admin.id })
  return after
})
