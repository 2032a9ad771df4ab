import { revisionIdParams } from '../../../utils/records-schemas'

/**
 * Where a seal or reseal check of the revision stands on this server: `{ running: false }` when none
 * is, with `findingPages: true` while this server finds its page numbers after its approval (a seal
 * started then waits for them).
 */
export default defineEventHandler(async (event) => {
  const { id } = validParams(event, revisionIdParams)
  await authorize(event, id)
  const progress = sealProgressOf(id)
  if (progress) return { running: true as const, ...progress }
  return numberingRevision(id) ? { running: false as const, findingPages: true as const } : { running: false as const }
})
