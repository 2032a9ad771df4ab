import { revisionIdParams } from '../../../utils/records-schemas'
import { CAUTION } from '../../../utils/print-templates'

/** What the print page shows: the frozen report and the title block, nothing that changes after approval. */
export default defineEventHandler(async (event) => {
  const { id } = validParams(event, revisionIdParams)
  const user = await requireUser(event)
  const detail = await getRevisionDetail(id, user)
  return { id: detail.id, titleBlock: titleBlockOf(detail), reportHtml: detail.reportHtml, caution: CAUTION }
})
