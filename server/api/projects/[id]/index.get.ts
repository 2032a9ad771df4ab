import { idParamSchema } from '../../../../shared/schemas/project'

export default defineEventHandler(async (event) => {
  const { id } = validParams(event, idParamSchema)
  const user = await authorize(event, id)
  return { ...await getProject(id), yourRole: user.role }
})
