import { and, desc, eq, max } from 'drizzle-orm'
import { alias } from 'drizzle-orm/mysql-core'
import type { DraftSaveBody, SheetCreateBody } from '../../shared/schemas/sheet'
import { fieldErrors } from '../../shared/utils/validation'
import { starterInputsFor } from '../../shared/sheet/runtime'
import { describeInputErrors } from '../../shared/sheet/labels'
import { resizeSpanLists } from '../../shared/sheet/spans'
import { setPath } from '../../shared/utils/paths'
import { toEngine } from '../../shared/utils/units'
import { mergeTemplateText } from '../../shared/sheet/text-merge'
import type { MergeConflict } from '../../shared/sheet/text-merge'

/** @throws 400 naming each input field at fault: by label in `message`, by path (`inputs.…`) in `data.fields`. */
export function validateInputs(model: string, inputs: unknown) {
  const result = inputSchemaFor(model).safeParse(inputs)
  if (!result.success) {
    const fields = Object.fromEntries(Object.entries(fieldErrors(result.error)).map(([k, v]) => [`inputs.${k}`, v]))
    throw createError({ statusCode: 400, statusMessage: 'Invalid input', message: describeInputErrors(fields), data: { fields } })
  }
  return result.data
}

export async function getSheet(id: number) {
  const s = tables.sheets
  const t = tables.templates
  const p = tables.projects
  const author = alias(tables.users, 'author')
  const editor = alias(tables.users, 'editor')
  const [row] = await useDb()
    .select({
      sheet: s,
      template: { id: t.id, slug: t.slug, version: t.version, title: t.title, model: t.model, body: t.body },
      project: { id: p.id, jobNumber: p.jobNumber, name: p.name, client: p.client, site: p.site },
      createdByName: author.name,
      updatedByName: editor.name,
    })
    .from(s)
    .innerJoin(t, eq(t.id, s.templateId))
    .innerJoin(p, eq(p.id, s.projectId))
    .innerJoin(author, eq(author.id, s.createdBy))
    .innerJoin(editor, eq(editor.id, s.updatedBy))
    .where(eq(s.id, id))
    .limit(1)
  if (!row) throw createError({ statusCode: 404, message: `No calc sheet with id ${id}` })
  const latest = await latestTemplateVersion(row.template.slug)
  return { ...row.sheet, template: row.template, project: row.project, createdByName: row.createdByName, updatedByName: row.updatedByName, newerTemplateVersion: latest > row.template.version ? latest : null }
}

async function latestTemplateVersion(slug: string) {
  const [row] = await useDb().select({ v: max(tables.templates.version) }).from(tables.templates).where(eq(tables.templates.slug, slug))
  return row?.v ?? 0
}

/**
 * What a new sheet starts from: another sheet of the project (its inputs copied), or the template's
 * starter inputs with the spans the engineer gave (metres), the per-span lists resized with them.
 * @throws 400 naming `copyFrom` when that sheet is not in the project or binds to another model.
 */
async function startingInputs(projectId: number, template: { slug: string, model: string }, body: SheetCreateBody): Promise<unknown> {
  if (body.copyFrom !== undefined) {
    const [source] = await useDb().select({ inputs: tables.sheets.inputs, model: tables.templates.model }).from(tables.sheets)
      .innerJoin(tables.templates, eq(tables.templates.id, tables.sheets.templateId))
      .where(and(eq(tables.sheets.id, body.copyFrom), eq(tables.sheets.projectId, projectId))).limit(1)
    if (!source) throw createError({ statusCode: 400, message: 'Start from: that sheet is not in this project', data: { fields: { copyFrom: 'Not a sheet of this project' } } })
    if (source.model !== template.model) {
      const message = 'That sheet is made for another kind of member than this template; choose a template of the same kind'
      throw createError({ statusCode: 400, message: `Start from: ${message}`, data: { fields: { copyFrom: message } } })
    }
    return source.inputs
  }
  const starter = starterInputsFor(template.slug)
  if (!body.spans) return starter
  const resized = resizeSpanLists(starter as Record<string, unknown>, body.spans.length)
  return setPath(resized, 'geometry.spans', body.spans.map(m => toEngine(m, 'm')))
}

/** A new sheet keeps the template version it was made with. */
export async function createSheet(projectId: number, body: SheetCreateBody, userId: number) {
  const db = useDb()
  const [project] = await db.select({ id: tables.projects.id }).from(tables.projects).where(eq(tables.projects.id, projectId)).limit(1)
  if (!project) throw createError({ statusCode: 404, message: `No project with id ${projectId}` })
  const [template] = await db.select().from(tables.templates).where(eq(tables.templates.id, body.templateId)).limit(1)
  if (!template) throw createError({ statusCode: 400, message: 'Template: no such template', data: { fields: { templateId: 'No such template' } } })
  const [taken] = await db.select({ id: tables.sheets.id }).from(tables.sheets)
    .where(and(eq(tables.sheets.projectId, projectId), eq(tables.sheets.reference, body.reference))).limit(1)
  if (taken) throw createError({ statusCode: 409, message: `Calc reference: ${body.reference} is already used in this project`, data: { fields: { reference: 'Already used in this project' } } })
  const inputs = validateInputs(template.model, await startingInputs(projectId, template, body))
  const [{ id }] = await db.insert(tables.sheets).values({
    projectId, reference: body.reference, title: body.title, partOfStructure: body.partOfStructure,
    templateId: template.id, inputs, createdBy: userId, updatedBy: userId,
  }).$returningId()
  return getSheet(id)
}

/**
 * Background save of the draft. Optimistic concurrency: a save based on an older draft version
 * is refused with 409, so two tabs never silently overwrite each other.
 */
export async function saveDraft(id: number, body: DraftSaveBody, userId: number) {
  const sheet = await getSheet(id)
  const inputs = validateInputs(sheet.template.model, body.inputs)
  // the sheet's own text: kept as typed; the same text as the template's is no text of its own
  const text = body.body === undefined ? {} : { body: body.body === null || body.body === sheet.template.body ? null : body.body }
  const result = await useDb().update(tables.sheets)
    .set({ inputs, ...text, draftVersion: body.draftVersion + 1, updatedBy: userId, updatedAt: new Date() })
    .where(and(eq(tables.sheets.id, id), eq(tables.sheets.draftVersion, body.draftVersion)))
  const affected = (result as unknown as [{ affectedRows: number }])[0].affectedRows
  if (affected !== 1) {
    throw createError({ statusCode: 409, message: 'This sheet was changed elsewhere since you opened it; reload to see the latest draft', data: { draftVersion: sheet.draftVersion } })
  }
  return { draftVersion: body.draftVersion + 1, savedAt: new Date().toISOString() }
}

/**
 * Move a sheet to a newer version of its template (an explicit act: sheets keep their version
 * otherwise). A sheet with its own text gets the template's change merged into it three ways (the
 * version it follows is the base); lines both changed stay between markers, listed in `conflicts`,
 * for the engineer to resolve before the sheet can be issued.
 */
export async function upgradeTemplate(id: number, userId: number) {
  const sheet = await getSheet(id)
  const [latest] = await useDb().select().from(tables.templates).where(eq(tables.templates.slug, sheet.template.slug)).orderBy(desc(tables.templates.version)).limit(1)
  if (!latest || latest.version === sheet.template.version) return { ...sheet, conflicts: [] as MergeConflict[] }
  validateInputs(latest.model, sheet.inputs)
  const merged = sheet.body === null ? null : mergeTemplateText(sheet.template.body, sheet.body, latest.body)
  await useDb().update(tables.sheets).set({
    templateId: latest.id, ...(merged ? { body: merged.text } : {}), updatedBy: userId, updatedAt: new Date(), draftVersion: sheet.draftVersion + 1,
  }).where(eq(tables.sheets.id, id))
  return { ...(await getSheet(id)), conflicts: merged?.conflicts ?? [] }
}
