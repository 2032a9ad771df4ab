import { existsSync, readdirSync, readFileSync } from 'node:fs'
import { dirname, join, resolve } from 'node:path'
import { fileURLToPath } from 'node:url'
import { and, desc, eq } from 'drizzle-orm'
import type { MySql2Database } from 'drizzle-orm/mysql2'
import * as schema from '../database/schema'
import { appendToLog } from '../database/history-log'
import { compileSheet, starterInputsFor } from '../../shared/sheet/runtime'
import { memberInputSchema } from '../../shared/engine/input/schema'
import { DEMO_PS3 } from '../../shared/engine/input/demo'
import { PS3_OWN_TEXT } from './sheet-texts'

export interface SeedOwners {
  projectId: number
  engineerId: number
  adminId: number
}

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..')

/** The demo calc sheets of design.md §6, each made from a built-in template. */
const DEMO_SHEETS = [
  { reference: 'PS-2', title: 'Podium slab strip, grid 1–5', partOfStructure: 'Podium slab, level 1', template: /slab-strip/ },
  { reference: 'BB-1', title: 'Band beam on grid C', partOfStructure: 'Podium band beams, level 1', template: /band-beam/ },
  { reference: 'PS-3', title: 'Podium edge strip with cantilever, grid A', partOfStructure: 'Podium slab, level 1', template: /slab-strip/, inputs: DEMO_PS3, text: PS3_OWN_TEXT },
] as Array<{ reference: string, title: string, partOfStructure: string, template: RegExp, inputs?: unknown, text?: (templateText: string) => string }>

type Db = MySql2Database<typeof schema>

/**
 * Built-in templates from content-templates/: a new immutable version whenever the file's text
 * differs from the newest stored version; unchanged files add nothing.
 */
export async function syncBuiltinTemplates(db: Db, adminId: number) {
  const dir = join(root, 'content-templates')
  const files = existsSync(dir) ? readdirSync(dir).filter(f => f.endsWith('.md')).sort() : []
  const ids: Record<string, number> = {}
  for (const file of files) {
    const slug = file.replace(/\.md$/, '')
    const body = readFileSync(join(dir, file), 'utf8')
    const compiled = compileSheet(body)
    if (!compiled.ok) throw new Error(`content-templates/${file} does not load:\n${compiled.errors.join('\n')}`)
    const [latest] = await db.select().from(schema.templates).where(eq(schema.templates.slug, slug)).orderBy(desc(schema.templates.version)).limit(1)
    if (latest && latest.body === body) {
      ids[slug] = latest.id
      continue
    }
    // a template version is history: it joins the log in the transaction that writes it
    ids[slug] = await db.transaction(async (tx) => {
      const [row] = await tx.insert(schema.templates).values({
        slug, version: (latest?.version ?? 0) + 1, title: compiled.meta.title, model: compiled.meta.model, body, builtin: true, publishedBy: adminId,
      }).$returningId()
      await appendToLog(tx, [{ kind: 'template', id: row!.id }])
      return row!.id
    })
  }
  return ids
}

/** The demo office's details for the title block (invented, like the rest of the demo), set once as its admin would. */
export const DEMO_OFFICE_NAME = 'Harrow & Vane Structural Engineers (fictional)'

async function seedOfficeDetails(db: Db, adminId: number) {
  const [any] = await db.select({ id: schema.officeDetails.id }).from(schema.officeDetails).limit(1)
  if (any) return
  // office details are history: the version joins the log in the transaction that writes it
  await db.transaction(async (tx) => {
    const [row] = await tx.insert(schema.officeDetails).values({ name: DEMO_OFFICE_NAME, createdBy: adminId, createdAt: new Date() }).$returningId()
    await appendToLog(tx, [{ kind: 'office-details', id: row!.id }])
  })
}

export async function seedContent(db: Db, owners: SeedOwners) {
  const templates = await syncBuiltinTemplates(db, owners.adminId)
  await seedOfficeDetails(db, owners.adminId)
  for (const demo of DEMO_SHEETS) {
    const slug = Object.keys(templates).find(s => demo.template.test(s))
    if (!slug) continue
    const [exists] = await db.select({ id: schema.sheets.id }).from(schema.sheets)
      .where(and(eq(schema.sheets.projectId, owners.projectId), eq(schema.sheets.reference, demo.reference))).limit(1)
    if (exists) continue
    // a sheet whose engineer wrote into it keeps its own text, made from its template version's
    const [template] = demo.text ? await db.select({ body: schema.templates.body }).from(schema.templates).where(eq(schema.templates.id, templates[slug]!)).limit(1) : []
    await db.insert(schema.sheets).values({
      projectId: owners.projectId, reference: demo.reference, title: demo.title, partOfStructure: demo.partOfStructure,
      templateId: templates[slug]!, inputs: demo.inputs ? memberInputSchema.parse(demo.inputs) : starterInputsFor(slug),
      body: demo.text && template ? demo.text(template.body) : null,
      createdBy: owners.engineerId, updatedBy: owners.engineerId,
    })
  }
}
