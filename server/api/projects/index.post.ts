import { PROJECT_FIELD_LABELS, projectCreateSchema } from '../../../shared/schemas/project'

/** A new project; the engineer who creates it is its first member, as its engineer. */
export default defineEventHandler(async (event) => {
  const user = await authorize(event)
  const body = await validBody(event, projectCreateSchema, PROJECT_FIELD_LABELS)
  setResponseStatus(event, 201)
  return createProject(event, body, user)
})
