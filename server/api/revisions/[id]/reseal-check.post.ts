import { revisionIdParams } from '../../../utils/records-schemas'

/** Re-renders a sealed revision and compares the bytes with the sealed PDF. */
export default defineEventHandler(async (event) => {
  const { id } = validParams(event, revisionIdParams)
  const user = await authorize(event, id)
  return resealCheck(event, id, user)
})
