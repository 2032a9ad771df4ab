import { archiveQuery } from '../../utils/records-schemas'

export default defineEventHandler(async (event) => {
  const query = validQuery(event, archiveQuery)
  await requireRole(event, 'records', 'admin')
  return { register: await archiveRegister(query), awaiting: await awaitingSeal() }
})
