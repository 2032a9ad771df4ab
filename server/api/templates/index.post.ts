import { TEMPLATE_FIELD_LABELS, templatePublishSchema } from '../../../shared/schemas/sheet'

export default defineEventHandler(async (event) => {
  const admin = await authorize(event)
  const body = await validBody(event, templatePublishSchema, TEMPLATE_FIELD_LABELS)
  const published = await publishTemplate(body, admin.id)
  await recordAudit(event, { action: 'template.published', subject: `${published.slug} v${published.version}`, actorId: admin.id })
  setResponseStatus(event, 201)
  return published
})
