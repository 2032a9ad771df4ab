import type { z } from 'zod'
import { memberInputSchema } from '../../shared/engine/schema'
import { designMember } from '../../shared/engine/design/member'
import { compileSheet, starterInputsFor } from '../../shared/sheet/runtime'
import type { Template } from '../database/schema'

export interface BoundModel {
  inputSchema: z.ZodType
  run: (inputs: unknown) => ReturnType<typeof designMember>
}

const MODELS: Record<string, BoundModel> = {
  'pt-member': { inputSchema: memberInputSchema, run: inputs => designMember(inputs) },
}

/** @throws 400 when a template names a model this server does not have. */
export function modelFor(name: string): BoundModel {
  const model = MODELS[name]
  if (!model) throw createError({ statusCode: 400, message: `model: no engine model named "${name}"`, data: { fields: { model: `Unknown model ${name}` } } })
  return model
}

/** The inputs a new sheet starts from: the template's own starter (built-ins name theirs by slug). */
export function starterInputs(template: Pick<Template, 'slug' | 'model'>) {
  return starterInputsFor(template.slug)
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
      message: `body: the template cannot be loaded —\n${compiled.errors.join('\n')}`,
      data: { fields: { body: compiled.errors.join('; ') }, problems: compiled.errors },
    })
  }
  return { title: compiled.meta.title, model: compiled.meta.model }
}
