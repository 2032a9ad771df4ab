import { idParamSchema } from '../../../../shared/schemas/project'

export default defineEventHandler(async (event) => {
  const { id } = validParams(event, idParamSchema)
  await authorize(event)
  const template = await getTemplate(id)
  return { ...template, versions: await templateVersions(template.slug) }
})
