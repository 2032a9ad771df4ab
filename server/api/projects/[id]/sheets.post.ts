import { idParamSchema } from '../../../../shared/schemas/project'
import { sheetCreateSchema, sheetFieldLabel } from '../../../../shared/schemas/sheet'

export default defineEventHandler(async (event) => {
  const { id } = validParams(event, idParamSchema)
  const user = await authorize(event, id)
  const body = await validBody(event, sheetCreateSchema, sheetFieldLabel)
  setResponseStatus(event, 201)
  return createSheet(id, body, user.id)
})
