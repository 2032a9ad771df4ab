import { idParamSchema } from '../../../../shared/schemas/project'

export default defineEventHandler(async (event) => {
  const { id } = validParams(event, idParamSchema)
  await requireUser(event)
  return getSheet(id)
})
