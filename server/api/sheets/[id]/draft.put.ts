import { idParamSchema } from '../../../../shared/schemas/project'
import { draftSaveSchema, sheetFieldLabel } from '../../../../shared/schemas/sheet'

/** Any engineer of the project saves the draft (the office's practice: whoever is on the job edits it); the sheet records who saved last, and each revision its issuer. */
export default defineEventHandler(async (event) => {
  const { id } = validParams(event, idParamSchema)
  const user = await authorize(event, id)
  const body = await validBody(event, draftSaveSchema, sheetFieldLabel)
  return saveDraft(id, body, user.id)
})
