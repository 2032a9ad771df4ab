import { issueBody, revisionIdParams } from '../../../utils/records-schemas'

/** Issue revision: the server recomputes and freezes the sheet's current inputs. */
export default defineEventHandler(async (event) => {
  const { id } = validParams(event, revisionIdParams)
  const { note } = await validBody(event, issueBody)
  const user = await requireRole(event, 'engineer', 'admin')
  setResponseStatus(event, 201)
  return issueRevision(event, id, note, user)
})
