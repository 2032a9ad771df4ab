import { revisionIdParams } from '../../../utils/records-schemas'

/** What the print page shows: the frozen report and the title block, nothing that changes after approval. */
export default defineEventHandler(async (event) => {
  const { id } = validParams(event, revisionIdParams)
  const user = await authorize(event, id)
  return printViewOf(await getRevisionDetail(id, user))
})
