import { projectCreateSchema } from '../../../shared/schemas/project'

export default defineEventHandler(async (event) => {
  const body = await validBody(event, projectCreateSchema)
  const user = await requireRole(event, 'engineer', 'admin')
  setResponseStatus(event, 201)
  return createProject(body, user.id)
})
