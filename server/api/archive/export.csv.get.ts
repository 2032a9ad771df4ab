import { ARCHIVE_QUERY_LABELS, archiveQuery } from '../../utils/records-schemas'

export default defineEventHandler(async (event) => {
  const query = validQuery(event, archiveQuery, ARCHIVE_QUERY_LABELS)
  const user = await authorize(event)
  const csv = registerCsv(await wholeRegister(query, user.id))
  setResponseHeaders(event, {
    'content-type': 'text/csv; charset=utf-8',
    'content-disposition': `attachment; filename="archive-register-${new Date().toISOString().slice(0, 10)}.csv"`,
  })
  return csv
})
