import { memberParamSchema } from '../../../../../../shared/schemas/project'

/** Takes a person off the project. */
export default defineEventHandler(async (event) => {
  const { id, userId } = validParams(event, memberParamSchema)
  const admin = await authorize(event)
  return removeMember(event, id, userId, admin)
})
