import { revisionIdParams } from '../../../utils/records-schemas'

/**
 * What the print page shows: the frozen report and the title block, nothing that changes after
 * approval, and once sealed the page of every section as the seal printed them, for a person
 * opening the page (a render names its pages itself).
 */
export default defineEventHandler(async (event) => {
  const { id } = validParams(event, revisionIdParams)
  const user = await authorize(event, id)
  const detail = await getRevisionDetail(id, user)
  return { ...await printViewOf(detail), sealedPages: await sealedSectionPages(detail) }
})
