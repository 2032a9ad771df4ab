import { idParamSchema } from '../../../../shared/schemas/project'

export default defineEventHandler(async (event) => {
  const { id } = validParams(event, idParamSchema)
  const user = await authorize(event, id)
  return upgradeTemplate(id, user.id)
})
