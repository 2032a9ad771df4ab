import { idParamSchema } from '../../../../shared/schemas/project'

export default defineEventHandler(async (event) => {
  const { id } = validParams(event, idParamSchema)
  const user = await requireRole(event, 'engineer', 'admin')
  return upgradeTemplate(id, user.id)
})
