import { templatePublishSchema } from '../../../shared/schemas/sheet'

export default defineEventHandler(async (event) => {
  const admin = await authorize(event)
  const body = await validBody(event, templatePublishSchema)
  const published = await publishTemplate(body, admin.id)
  await recordAudit(event, { action: 'template.published', subject: `${published.slug} v${published.version}`, actorId: admin.id })
  setResponseStatus(event, 201)
  return published
})
