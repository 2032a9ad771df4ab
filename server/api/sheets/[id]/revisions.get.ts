import { revisionIdParams } from '../../../utils/records-schemas'

export default defineEventHandler(async (event) => {
  const { id } = validParams(event, revisionIdParams)
  await authorize(event, id)
  return listSheetRevisions(id)
})
