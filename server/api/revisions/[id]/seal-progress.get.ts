import { revisionIdParams } from '../../../utils/records-schemas'

/** Where a seal or reseal check of the revision stands on this server: `{ running: false }` when none is. */
export default defineEventHandler(async (event) => {
  const { id } = validParams(event, revisionIdParams)
  await authorize(event, id)
  const progress = sealProgressOf(id)
  return progress ? { running: true as const, ...progress } : { running: false as const }
})
