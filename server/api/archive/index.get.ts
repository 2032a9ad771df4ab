import { ARCHIVE_QUERY_LABELS, archiveQuery } from '../../utils/records-schemas'

export default defineEventHandler(async (event) => {
  const query = validQuery(event, archiveQuery, ARCHIVE_QUERY_LABELS)
  const user = await authorize(event)
  return { register: await archiveRegister(query, user.id), awaiting: await awaitingSeal(user.id) }
})
