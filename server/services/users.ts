import { asc, eq, sql } from 'drizzle-orm'
import type { UserCreateBody, UserUpdateBody } from '../../shared/schemas/auth'

const publicColumns = {
  id: tables.users.id,
  email: tables.users.email,
  name: tables.users.name,
  role: tables.users.role,
  disabled: tables.users.disabled,
  createdAt: tables.users.createdAt,
}

export function listUsers() {
  return useDb().select(publicColumns).from(tables.users).orderBy(asc(tables.users.name))
}

export async function getUser(id: number) {
  const [user] = await useDb().select(publicColumns).from(tables.users).where(eq(tables.users.id, id)).limit(1)
  if (!user) throw createError({ statusCode: 404, message: `No user with id ${id}` })
  return user
}

/** @throws 409 when the e-mail is taken. */
export async function createUser(body: UserCreateBody) {
  const db = useDb()
  const [existing] = await db.select({ id: tables.users.id }).from(tables.users).where(eq(tables.users.email, body.email)).limit(1)
  if (existing) throw createError({ statusCode: 409, message: `E-mail: ${body.email} already has an account`, data: { fields: { email: 'Already has an account' } } })
  const passwordHash = await hashPassword(body.password)
  const [{ id }] = await db.insert(tables.users).values({ email: body.email, name: body.name, role: body.role, passwordHash }).$returningId()
  return getUser(id)
}

/** Role, disabled flag or password changes bump the session version: old sessions end at once. */
export async function updateUser(id: number, body: UserUpdateBody, actorId: number) {
  const before = await getUser(id)
  if (id === actorId && (body.disabled === true || (body.role && body.role !== 'admin'))) {
    throw createError({ statusCode: 409, message: 'You cannot disable yourself or remove your own administrator role' })
  }
  const changes: Record<string, unknown> = {}
  if (body.name !== undefined) changes.name = body.name
  if (body.role !== undefined) changes.role = body.role
  if (body.disabled !== undefined) changes.disabled = body.disabled
  if (body.password !== undefined) changes.passwordHash = await hashPassword(body.password)
  const revokes = body.role !== undefined && body.role !== before.role
    || body.disabled !== undefined && body.disabled !== before.disabled
    || body.password !== undefined
  await useDb().update(tables.users)
    .set({ ...changes, ...(revokes ? { sessionVersion: sql`${tables.users.sessionVersion} + 1` } : {}) })
    .where(eq(tables.users.id, id))
  return { before, after: await getUser(id) }
}
