import { idParamSchema } from '../../../../shared/schemas/project'
import { sheetCreateSchema, sheetFieldLabel } from '../../../../shared/schemas/sheet'

export default defineEventHandler(async (event) => {
  const { id } = validParams(event, idParamSchema)
  const body = await validBody(event, sheetCreateSchema, sheetFieldLabel)
  const user = await requireRole(event, 'engineer', 'admin')
  setResponseStatus(event, 201)
  return createSheet(id, body, user.id)
})
