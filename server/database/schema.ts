import { sql } from 'drizzle-orm'
import {
  bigint, boolean, datetime, index, int, json, mediumtext, mysqlEnum, mysqlTable, uniqueIndex, varchar,
} from 'drizzle-orm/mysql-core'

/** The four roles of design.md §2. */
import { PROJECT_ROLES, ROLES } from '../../shared/types/roles'
export { PROJECT_ROLES, ROLES }
export type { ProjectRole, Role } from '../../shared/types/roles'

// MariaDB rejects drizzle's serial(): ids are plain auto-increment ints.
const id = () => int('id').autoincrement().primaryKey()
const createdAt = () => datetime('created_at', { mode: 'date', fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`)

export const users = mysqlTable('users', {
  id: id(),
  email: varchar('email', { length: 254 }).notNull(),
  name: varchar('name', { length: 120 }).notNull(),
  // scrypt hash from nuxt-auth-utils' hashPassword
  passwordHash: varchar('password_hash', { length: 255 }).notNull(),
  role: mysqlEnum('role', ROLES).notNull(),
  disabled: boolean('disabled').notNull().default(false),
  // bumped on disable, role change or password change: older session cookies stop working
  sessionVersion: int('session_version').notNull().default(1),
  createdAt: createdAt(),
}, t => [uniqueIndex('users_email_unique').on(t.email)])

export const projects = mysqlTable('projects', {
  id: id(),
  jobNumber: varchar('job_number', { length: 32 }).notNull(),
  name: varchar('name', { length: 160 }).notNull(),
  client: varchar('client', { length: 160 }).notNull().default(''),
  site: varchar('site', { length: 200 }).notNull().default(''),
  createdBy: int('created_by').notNull().references(() => users.id, { onDelete: 'restrict' }),
  createdAt: createdAt(),
}, t => [uniqueIndex('projects_job_number_unique').on(t.jobNumber)])

/**
 * Who works on a project, and as what: every route reads a project's records only for its members
 * (server/utils/access-rules.ts). A working table like `users`: a change of membership is an audit
 * event (`member.added`, `member.role`, `member.removed`), so the history of who had access is in
 * the append-only, hash-chained audit trail rather than in this row.
 */
export const projectMembers = mysqlTable('project_members', {
  id: id(),
  projectId: int('project_id').notNull().references(() => projects.id, { onDelete: 'restrict' }),
  userId: int('user_id').notNull().references(() => users.id, { onDelete: 'restrict' }),
  role: mysqlEnum('role', PROJECT_ROLES).notNull(),
  addedBy: int('added_by').notNull().references(() => users.id, { onDelete: 'restrict' }),
  createdAt: createdAt(),
}, t => [
  uniqueIndex('project_members_project_user_unique').on(t.projectId, t.userId),
  index('project_members_user_idx').on(t.userId),
])

/** One row per published template version: never changed once written. */
export const templates = mysqlTable('templates', {
  id: id(),
  slug: varchar('slug', { length: 80 }).notNull(),
  version: int('version').notNull(),
  title: varchar('title', { length: 200 }).notNull(),
  model: varchar('model', { length: 60 }).notNull(),
  body: mediumtext('body').notNull(),
  builtin: boolean('builtin').notNull().default(false),
  publishedBy: int('published_by').references(() => users.id, { onDelete: 'restrict' }),
  createdAt: createdAt(),
}, t => [uniqueIndex('templates_slug_version_unique').on(t.slug, t.version)])

/** The live draft of a calc sheet: inputs in engine units, bound to one template version. */
export const sheets = mysqlTable('sheets', {
  id: id(),
  projectId: int('project_id').notNull().references(() => projects.id, { onDelete: 'restrict' }),
  reference: varchar('reference', { length: 32 }).notNull(),
  title: varchar('title', { length: 200 }).notNull(),
  partOfStructure: varchar('part_of_structure', { length: 200 }).notNull().default(''),
  templateId: int('template_id').notNull().references(() => templates.id, { onDelete: 'restrict' }),
  inputs: json('inputs').notNull(),
  // the sheet's own text once the engineer edits it (null: the text of its template version as
  // published); that template version is the base when a newer version is merged into it
  body: mediumtext('body'),
  // optimistic concurrency for the background save
  draftVersion: int('draft_version').notNull().default(1),
  createdBy: int('created_by').notNull().references(() => users.id, { onDelete: 'restrict' }),
  updatedBy: int('updated_by').notNull().references(() => users.id, { onDelete: 'restrict' }),
  createdAt: createdAt(),
  updatedAt: datetime('updated_at', { mode: 'date', fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`),
}, t => [
  uniqueIndex('sheets_project_reference_unique').on(t.projectId, t.reference),
  index('sheets_project_idx').on(t.projectId),
])

/**
 * Sign-in attempt counters of rate-limiter-flexible's MySQL store (server/utils/signin-limit.ts),
 * in the exact shape it expects: `account:<e-mail>|<address>` and `address:<address>` keys, points
 * used, expiry in ms since the epoch.
 */
export const signinLimits = mysqlTable('signin_limits', {
  key: varchar('key', { length: 255 }).primaryKey(),
  points: int('points').notNull().default(0),
  expire: bigint('expire', { mode: 'number', unsigned: true }),
})

/** One row per sign-in: the sealed cookie names it, and signing out ends it on the server. */
export const userSessions = mysqlTable('user_sessions', {
  id: varchar('id', { length: 64 }).primaryKey(),
  userId: int('user_id').notNull().references(() => users.id, { onDelete: 'restrict' }),
  createdAt: createdAt(),
  endedAt: datetime('ended_at', { mode: 'date', fsp: 3 }),
}, t => [index('user_sessions_user_idx').on(t.userId)])

/**
 * The first result of a state-changing request sent with an `Idempotency-Key` header, per user:
 * a retry with the same key gets this result back instead of acting twice. `status_code` is null
 * while the first request is still running.
 */
export const idempotencyKeys = mysqlTable('idempotency_keys', {
  id: int('id').autoincrement().primaryKey(),
  userId: int('user_id').notNull().references(() => users.id, { onDelete: 'restrict' }),
  idempotencyKey: varchar('idempotency_key', { length: 100 }).notNull(),
  route: varchar('route', { length: 200 }).notNull(),
  requestHash: varchar('request_hash', { length: 64 }).notNull(),
  statusCode: int('status_code'),
  response: json('response'),
  createdAt: createdAt(),
}, t => [uniqueIndex('idempotency_keys_user_key_unique').on(t.userId, t.idempotencyKey)])

export type User = typeof users.$inferSelect
export type Project = typeof projects.$inferSelect
export type ProjectMember = typeof projectMembers.$inferSelect
export type Template = typeof templates.$inferSelect
export type Sheet = typeof sheets.$inferSelect

// The records side (revisions, reviews, seals, attachments, audit events, outbox) lives in its own file.
export * from './schema-records'
