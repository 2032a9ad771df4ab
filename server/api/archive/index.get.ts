import { ARCHIVE_QUERY_LABELS, archiveQuery } from '../../utils/records-schemas'

export default defineEventHandler(async (event) => {
  const query = validQuery(event, archiveQuery, ARCHIVE_QUERY_LABELS)
  const user = await authorize(event)
  const { rows, total, page, pageSize } = await archiveRegister(query, user.id)
  return { register: rows, total, page, pageSize, awaiting: await awaitingSeal(user.id) }
})
