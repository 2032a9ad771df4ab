import { desc, eq } from 'drizzle-orm'
import type { TemplatePublishBody } from '../../shared/schemas/sheet'

/** The newest version of every template, built-in and office. */
export async function listTemplates() {
  const t = tables.templates
  const rows = await useDb()
    .select({ id: t.id, slug: t.slug, version: t.version, title: t.title, model: t.model, builtin: t.builtin, createdAt: t.createdAt })
    .from(t)
    .orderBy(t.slug, desc(t.version))
  const newest = new Map<string, (typeof rows)[number] & { versions: number }>()
  for (const row of rows) {
    const seen = newest.get(row.slug)
    if (seen) seen.versions += 1
    else newest.set(row.slug, { ...row, versions: 1 })
  }
  return [...newest.values()].sort((a, b) => Number(b.builtin) - Number(a.builtin) || a.title.localeCompare(b.title))
}

export async function getTemplate(id: number) {
  const [row] = await useDb().select().from(tables.templates).where(eq(tables.templates.id, id)).limit(1)
  if (!row) throw createError({ statusCode: 404, message: `No template with id ${id}` })
  return row
}

export async function templateVersions(slug: string) {
  const t = tables.templates
  return useDb().select({ id: t.id, version: t.version, title: t.title, builtin: t.builtin, createdAt: t.createdAt }).from(t).where(eq(t.slug, slug)).orderBy(desc(t.version))
}

/**
 * Publish a template text as a new immutable version. It must load against its model: every key
 * resolves, front matter is complete. @throws 400 listing each problem with its line number.
 */
export async function publishTemplate(body: TemplatePublishBody, adminId: number | null, builtin = false) {
  const loaded = checkTemplate(body.body)
  return historyTransaction(async (tx) => {
    const [existing] = await tx.select({ v: tables.templates.version, builtin: tables.templates.builtin }).from(tables.templates).where(eq(tables.templates.slug, body.slug)).orderBy(desc(tables.templates.version)).limit(1)
    if (existing && existing.builtin && !builtin) {
      throw createError({ statusCode: 409, message: `Short name: ${body.slug} is a built-in template; publish an office copy under another short name`, data: { fields: { slug: 'Built-in template: choose another short name' } } })
    }
    const version = (existing?.v ?? 0) + 1
    const [{ id }] = await tx.insert(tables.templates).values({
      slug: body.slug, version, title: loaded.title, model: loaded.model, body: body.body, builtin, publishedBy: adminId,
    }).$returningId()
    await logWrittenRow(tx, 'template', id)
    return { id, slug: body.slug, version, title: loaded.title, model: loaded.model }
  })
}
