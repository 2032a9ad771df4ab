import { idParamSchema } from '../../../../shared/schemas/project'
import { draftSaveSchema, sheetFieldLabel } from '../../../../shared/schemas/sheet'

export default defineEventHandler(async (event) => {
  const { id } = validParams(event, idParamSchema)
  const body = await validBody(event, draftSaveSchema, sheetFieldLabel)
  const user = await requireRole(event, 'engineer', 'admin')
  return saveDraft(id, body, user.id)
})
