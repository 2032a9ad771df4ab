import { idParamSchema, MEMBER_FIELD_LABELS, memberSetSchema } from '../../../../../../shared/schemas/project'

/** Puts a person on the project in a role there (or changes their role on it). */
export default defineEventHandler(async (event) => {
  const { id } = validParams(event, idParamSchema)
  const admin = await authorize(event)
  const body = await validBody(event, memberSetSchema, MEMBER_FIELD_LABELS)
  return setMember(event, id, body, admin)
})
