import { asc, count, desc, eq } from 'drizzle-orm'
import type { ProjectCreateBody } from '../../shared/schemas/project'

export async function listProjects() {
  const p = tables.projects
  const s = tables.sheets
  return useDb()
    .select({ id: p.id, jobNumber: p.jobNumber, name: p.name, client: p.client, site: p.site, createdAt: p.createdAt, sheetCount: count(s.id) })
    .from(p)
    .leftJoin(s, eq(s.projectId, p.id))
    .groupBy(p.id)
    .orderBy(desc(p.createdAt), desc(p.id))
}

export async function getProject(id: number) {
  const [project] = await useDb().select().from(tables.projects).where(eq(tables.projects.id, id)).limit(1)
  if (!project) throw createError({ statusCode: 404, message: `No project with id ${id}` })
  const s = tables.sheets
  const t = tables.templates
  const sheets = await useDb()
    .select({ id: s.id, reference: s.reference, title: s.title, partOfStructure: s.partOfStructure, updatedAt: s.updatedAt, templateTitle: t.title, templateVersion: t.version })
    .from(s)
    .innerJoin(t, eq(t.id, s.templateId))
    .where(eq(s.projectId, id))
    .orderBy(asc(s.reference))
  return { ...project, sheets }
}

/** @throws 409 when the job number is taken. */
export async function createProject(body: ProjectCreateBody, userId: number) {
  const db = useDb()
  const [existing] = await db.select({ id: tables.projects.id }).from(tables.projects).where(eq(tables.projects.jobNumber, body.jobNumber)).limit(1)
  if (existing) {
    throw createError({ statusCode: 409, message: `jobNumber: job ${body.jobNumber} already exists`, data: { fields: { jobNumber: `Job ${body.jobNumber} already exists` } } })
  }
  const [{ id }] = await db.insert(tables.projects).values({ ...body, createdBy: userId }).$returningId()
  return getProject(id)
}
