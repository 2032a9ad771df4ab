import { and, asc, count, desc, eq } from 'drizzle-orm'
import type { H3Event } from 'h3'
import type { ProjectCreateBody } from '../../shared/schemas/project'

/** The projects the user is a member of, with their role on each. */
export async function listProjects(userId: number) {
  const p = tables.projects
  const s = tables.sheets
  const m = tables.projectMembers
  return useDb()
    .select({ id: p.id, jobNumber: p.jobNumber, name: p.name, client: p.client, site: p.site, createdAt: p.createdAt, yourRole: m.role, sheetCount: count(s.id) })
    .from(p)
    .innerJoin(m, and(eq(m.projectId, p.id), eq(m.userId, userId)))
    .leftJoin(s, eq(s.projectId, p.id))
    .groupBy(p.id, m.role)
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
  const m = tables.projectMembers
  const members = await useDb().select({ userId: m.userId, name: tables.users.name, role: m.role })
    .from(m).innerJoin(tables.users, eq(tables.users.id, m.userId)).where(eq(m.projectId, id)).orderBy(asc(tables.users.name))
  return { ...project, sheets, members }
}

/**
 * A new project, whose creator is its first member, as its engineer.
 * @throws 409 when the job number is taken.
 */
export async function createProject(event: H3Event, body: ProjectCreateBody, user: { id: number, email: string }) {
  const db = useDb()
  const [existing] = await db.select({ id: tables.projects.id }).from(tables.projects).where(eq(tables.projects.jobNumber, body.jobNumber)).limit(1)
  if (existing) {
    throw createError({ statusCode: 409, message: `Job number: job ${body.jobNumber} already exists`, data: { fields: { jobNumber: `Job ${body.jobNumber} already exists` } } })
  }
  const id = await historyTransaction(async (tx) => {
    const [{ id }] = await tx.insert(tables.projects).values({ ...body, createdBy: user.id }).$returningId()
    await tx.insert(tables.projectMembers).values({ projectId: id, userId: user.id, role: 'engineer', addedBy: user.id })
    await recordAudit(event, { action: 'member.added', subject: `${body.jobNumber} ${user.email}`, actorId: user.id, detail: { projectId: id, role: 'engineer' } }, tx)
    return id
  })
  return getProject(id)
}
