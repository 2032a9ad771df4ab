import type { H3Event } from 'h3'
import { and, asc, eq } from 'drizzle-orm'
import type { MemberSetBody } from '../../shared/schemas/project'
import { ROLE_LABELS } from '../../shared/types/roles'

type Admin = { id: number }

/** Every project with its members, for the administrator's membership page (no engineering content). */
export async function projectsWithMembers() {
  const p = tables.projects
  const m = tables.projectMembers
  const u = tables.users
  const projects = await useDb().select({ id: p.id, jobNumber: p.jobNumber, name: p.name }).from(p).orderBy(asc(p.jobNumber))
  const members = await useDb().select({ projectId: m.projectId, userId: u.id, name: u.name, email: u.email, role: m.role, disabled: u.disabled })
    .from(m).innerJoin(u, eq(u.id, m.userId)).orderBy(asc(u.name))
  return projects.map(project => ({ ...project, members: members.filter(x => x.projectId === project.id).map(({ projectId: _, ...x }) => x) }))
}

async function projectNamed(projectId: number) {
  const [project] = await useDb().select().from(tables.projects).where(eq(tables.projects.id, projectId)).limit(1)
  if (!project) throw createError({ statusCode: 404, message: `No project with id ${projectId}` })
  return project
}

/**
 * Puts a person on a project in a role there, or changes their role on it.
 * @throws 404 for no such project; 400 for no such person, an administrator or a disabled account.
 */
export async function setMember(event: H3Event, projectId: number, body: MemberSetBody, admin: Admin) {
  const project = await projectNamed(projectId)
  const [person] = await useDb().select().from(tables.users).where(eq(tables.users.id, body.userId)).limit(1)
  const refuse = (message: string): never => { throw createError({ statusCode: 400, message: `Person: ${message}`, data: { fields: { userId: message } } }) }
  if (!person) refuse('there is no such person')
  if (person!.role === 'admin') refuse(`${person!.name} is an administrator, and administrators are not members of projects: engineering work is done under an engineer, checker or records account`)
  if (person!.disabled) refuse(`${person!.name}'s account is disabled; enable it first`)
  const m = tables.projectMembers
  const where = and(eq(m.projectId, projectId), eq(m.userId, body.userId))
  const subject = `${project.jobNumber} ${person!.email}`
  await historyTransaction(async (tx) => {
    const [current] = await tx.select().from(m).where(where).for('update')
    if (current?.role === body.role) return
    if (current) await tx.update(m).set({ role: body.role }).where(where)
    else await tx.insert(m).values({ projectId, userId: body.userId, role: body.role, addedBy: admin.id })
    await recordAudit(event, current
      ? { action: 'member.role', subject, actorId: admin.id, detail: { projectId, from: current.role, to: body.role } }
      : { action: 'member.added', subject, actorId: admin.id, detail: { projectId, role: body.role } }, tx)
  })
  return { project: { id: project.id, jobNumber: project.jobNumber, name: project.name }, member: { userId: person!.id, name: person!.name, role: body.role }, message: `${person!.name} is ${ROLE_LABELS[body.role].toLowerCase()} on ${project.name} (job ${project.jobNumber})` }
}

/** Takes a person off a project: from now on its records answer them as if they did not exist. */
export async function removeMember(event: H3Event, projectId: number, userId: number, admin: Admin) {
  const project = await projectNamed(projectId)
  const m = tables.projectMembers
  const where = and(eq(m.projectId, projectId), eq(m.userId, userId))
  const [person] = await useDb().select({ name: tables.users.name, email: tables.users.email }).from(tables.users).where(eq(tables.users.id, userId)).limit(1)
  await historyTransaction(async (tx) => {
    const [current] = await tx.select().from(m).where(where).for('update')
    if (!current || !person) throw createError({ statusCode: 404, message: `${person?.name ?? `Person ${userId}`} is not a member of ${project.name} (job ${project.jobNumber})` })
    await tx.delete(m).where(where)
    await recordAudit(event, { action: 'member.removed', subject: `${project.jobNumber} ${person.email}`, actorId: admin.id, detail: { projectId, role: current.role } }, tx)
  })
  return { message: `${person!.name} is no longer on ${project.name} (job ${project.jobNumber})` }
}
