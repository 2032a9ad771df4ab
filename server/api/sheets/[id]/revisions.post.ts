import { issueBody, revisionIdParams } from '../../../utils/records-schemas'
import { ISSUE_FIELD_LABELS } from '../../../../shared/schemas/issue'

/** Issue revision: the server recomputes and freezes the draft the engineer is looking at. */
export default defineEventHandler(async (event) => {
  const { id } = validParams(event, revisionIdParams)
  const user = await authorize(event, id)
  const body = await validBody(event, issueBody, ISSUE_FIELD_LABELS)
  setResponseStatus(event, 201)
  // a retried request answers with the first result; two issues of one sheet at once (on two
  // database nodes) conflict at commit, and the loser runs again
  return idempotent(event, user.id, { id, ...body }, () => withRetry(() => issueRevision(event, id, body, user), 'Someone else issued this sheet a moment ago: reload the sheet and try again'))
})
