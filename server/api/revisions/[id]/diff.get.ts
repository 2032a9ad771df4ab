import { diffQuery, revisionIdParams } from '../../../utils/records-schemas'

export default defineEventHandler(async (event) => {
  const { id } = validParams(event, revisionIdParams)
  const { against } = validQuery(event, diffQuery)
  await requireUser(event)
  return revisionDiff(id, against)
})
