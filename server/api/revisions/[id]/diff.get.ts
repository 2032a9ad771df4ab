import { DIFF_QUERY_LABELS, diffQuery, revisionIdParams } from '../../../utils/records-schemas'

export default defineEventHandler(async (event) => {
  const { id } = validParams(event, revisionIdParams)
  await authorize(event, id)
  const { against } = validQuery(event, diffQuery, DIFF_QUERY_LABELS)
  return revisionDiff(id, against)
})
