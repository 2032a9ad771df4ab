import type { H3Event } from 'h3'
import { and, eq, inArray } from 'drizzle-orm'
import { PROJECT_ROLES, ROLE_LABELS, type ProjectRole, type Role } from '../../shared/types/roles'
import { ACCESS_RULES, type AccessRule, type RecordKind, type RouteKey } from './access-rules'

/** The caller as a route sees them: on a project's record, `role` is their role on that project. */
export interface Actor {
  id: number
  email: string
  name: string
  role: Role
  /** the account's office role (the same as `role` off a project) */
  accountRole: Role
  /** the project of the record the route names, when it names one */
  project: { id: number, jobNumber: string, name: string } | null
}

const RECORD_NAMES: Record<RecordKind, string> = {
  project: 'project',
  sheet: 'calc sheet',
  revision: 'revision',
  review: 'review',
  attachment: 'attachment',
}

/** The same answer as for a record that does not exist, so a record outside one's projects does not show. */
export function noSuchRecord(kind: RecordKind, id: number): never {
  throw createError({ statusCode: 404, message: `No ${RECORD_NAMES[kind]} with id ${id}` })
}

/** The rule of the route this request matched, as `METHOD /api/path/:param`. */
export function routeKeyOf(event: H3Event): string {
  const method = event.method === 'HEAD' ? 'GET' : event.method
  return `${method} ${event.context.matchedRoute?.path ?? event.path.split('?')[0]}`
}

function ruleOf(event: H3Event): AccessRule {
  const key = routeKeyOf(event)
  const rule = (ACCESS_RULES as Record<string, AccessRule>)[key]
  // fail closed: a route nobody wrote a rule for answers to nobody
  if (!rule) throw createError({ statusCode: 500, message: `No access rule for ${key}: the route is closed until one is written` })
  return rule
}

/** The project a record belongs to, or null when there is no such record. */
async function projectOf(kind: RecordKind, id: number): Promise<number | null> {
  const db = useDb()
  const t = tables
  const first = (rows: Array<{ projectId: number }>) => rows[0]?.projectId ?? null
  switch (kind) {
    case 'project':
      return first(await db.select({ projectId: t.projects.id }).from(t.projects).where(eq(t.projects.id, id)).limit(1))
    case 'sheet':
      return first(await db.select({ projectId: t.sheets.projectId }).from(t.sheets).where(eq(t.sheets.id, id)).limit(1))
    case 'revision':
      return first(await db.select({ projectId: t.sheets.projectId }).from(t.revisions).innerJoin(t.sheets, eq(t.sheets.id, t.revisions.sheetId)).where(eq(t.revisions.id, id)).limit(1))
    case 'review':
      return first(await db.select({ projectId: t.sheets.projectId }).from(t.reviews).innerJoin(t.sheets, eq(t.sheets.id, t.reviews.sheetId)).where(eq(t.reviews.id, id)).limit(1))
    case 'attachment':
      return first(await db.select({ projectId: t.sheets.projectId }).from(t.attachments).innerJoin(t.sheets, eq(t.sheets.id, t.attachments.sheetId)).where(eq(t.attachments.id, id)).limit(1))
  }
}

/** The caller's role on a project, or null when they are not a member. */
export async function projectRoleOf(userId: number, projectId: number): Promise<ProjectRole | null> {
  const m = tables.projectMembers
  const [row] = await useDb().select({ role: m.role }).from(m).where(and(eq(m.userId, userId), eq(m.projectId, projectId))).limit(1)
  return row?.role ?? null
}

/** The projects where the user holds one of these roles ('any': every project they are a member of). */
export async function memberProjectIds(userId: number, role: ProjectRole | 'any' = 'any'): Promise<number[]> {
  const m = tables.projectMembers
  const roles = role === 'any' ? [...PROJECT_ROLES] : [role]
  const rows = await useDb().select({ projectId: m.projectId }).from(m).where(and(eq(m.userId, userId), inArray(m.role, roles)))
  return rows.map(r => r.projectId)
}

/** The roles the user holds on any project, for the screens the app offers them. */
export async function projectRolesHeld(userId: number): Promise<ProjectRole[]> {
  const m = tables.projectMembers
  const rows = await useDb().selectDistinct({ role: m.role }).from(m).where(eq(m.userId, userId))
  return PROJECT_ROLES.filter(r => rows.some(x => x.role === r))
}

const article = (role: string) => (/^[aeiou]/i.test(role) ? 'an' : 'a')
const roleWords = (roles: readonly string[]) => roles.map(r => ROLE_LABELS[r as Role].toLowerCase()).join(' or ')

/**
 * The one access check of every route, from ACCESS_RULES: the caller's account, then (for a route
 * that names a record) their membership of the record's project and their role there.
 * @param recordId the `:id` the route names, for a `record` rule
 * @throws 401 when nobody is signed in; 403 when the caller's role may not do this; 404 when the
 * record does not exist or belongs to a project the caller is not a member of.
 */
export async function authorize(event: H3Event, recordId?: number): Promise<Actor> {
  const rule = ruleOf(event)
  if (rule.who === 'open') throw createError({ statusCode: 500, message: `${routeKeyOf(event)} is open to anyone: it needs no authorize()` })
  const user = await requireUser(event)
  const actor: Actor = { ...user, accountRole: user.role, project: null }
  if (rule.who === 'account') {
    const held = rule.lists && rule.lists !== 'any' && (await memberProjectIds(user.id, rule.lists)).length > 0
    if (rule.roles !== 'any' && !rule.roles.includes(user.role) && !held) {
      throw createError({ statusCode: 403, message: `This needs the ${roleWords(rule.roles)} role; you are signed in as ${article(user.role)} ${ROLE_LABELS[user.role].toLowerCase()}` })
    }
    return actor
  }
  if (user.role === 'admin') {
    throw createError({ statusCode: 403, message: 'An administrator manages people, project membership and templates, not engineering work: sign in with your own engineer, checker or records account' })
  }
  if (recordId === undefined) throw createError({ statusCode: 500, message: `${routeKeyOf(event)} names a ${rule.record}: authorize() needs its id` })
  const projectId = await projectOf(rule.record, recordId)
  if (projectId === null) noSuchRecord(rule.record, recordId)
  const role = await projectRoleOf(user.id, projectId)
  if (role === null) noSuchRecord(rule.record, recordId)
  const [project] = await useDb().select({ id: tables.projects.id, jobNumber: tables.projects.jobNumber, name: tables.projects.name }).from(tables.projects).where(eq(tables.projects.id, projectId)).limit(1)
  if (rule.roles !== 'any' && !rule.roles.includes(role)) {
    throw createError({ statusCode: 403, message: `On ${project!.name} (job ${project!.jobNumber}) you are ${article(role)} ${ROLE_LABELS[role].toLowerCase()}; this needs ${article(rule.roles[0]!)} ${roleWords(rule.roles)} of the project` })
  }
  return { ...actor, role, project: project! }
}
