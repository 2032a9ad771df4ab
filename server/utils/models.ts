import type { z } from 'zod'
import { MODELS } from '../../shared/report/models'
import { compileSheet } from '../../shared/sheet/runtime'

/** The input schema of the engine model a template binds to. @throws 400 when there is none. */
export function inputSchemaFor(name: string): z.ZodType {
  const model = Object.hasOwn(MODELS, name) ? (MODELS[name] as { inputSchema?: z.ZodType }) : undefined
  if (!model?.inputSchema) throw createError({ statusCode: 400, message: `Model: no engine model named "${name}"`, data: { fields: { model: `Unknown model ${name}` } } })
  return model.inputSchema
}

/**
 * A template text must load against its model before it is published.
 * @throws 400 listing every problem with its line number.
 */
export function checkTemplate(text: string): { title: string, model: string } {
  const compiled = compileSheet(text)
  if (!compiled.ok) {
    throw createError({
      statusCode: 400,
      statusMessage: 'Template does not load',
      message: `Template text: the template cannot be loaded —\n${compiled.errors.join('\n')}`,
      data: { fields: { body: compiled.errors.join('; ') }, problems: compiled.errors },
    })
  }
  return { title: compiled.meta.title, model: compiled.meta.model }
}
