import { archiveQuery } from '../../utils/records-schemas'

export default defineEventHandler(async (event) => {
  const query = validQuery(event, archiveQuery)
  const user = await authorize(event)
  return { register: await archiveRegister(query, user.id), awaiting: await awaitingSeal(user.id) }
})
