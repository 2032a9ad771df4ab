// Seeds the demo scenario of design.md §6 once: demo users, the project "Alder Yard podium" and,
// when the built-in templates are present, its calc sheets. Re-running keeps existing data.
// Run by scripts/start.mjs and scripts/test.mjs with the database environment of db.mjs.
import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'
import { and, eq } from 'drizzle-orm'
import { drizzle } from 'drizzle-orm/mysql2'
import mysql from 'mysql2/promise'
import * as schema from '../server/database/schema'
import { DEMO_PROJECT, DEMO_USERS } from '../server/seed/demo-users'
import { seedContent } from '../server/seed/content'

// The same scrypt driver and defaults that nuxt-auth-utils' hashPassword uses.
const hasher = new Hash(new Scrypt({}))

async function main() {
  const pool = mysql.createPool({
    host: process.env.NUXT_DATABASE_HOST,
    port: Number(process.env.NUXT_DATABASE_PORT),
    user: process.env.NUXT_DATABASE_USER,
    password: process.env.NUXT_DATABASE_PASSWORD,
    database: process.env.NUXT_DATABASE_NAME,
    timezone: 'Z',
  })
  const db = drizzle(pool, { schema, mode: 'default' })
  try {
    const ids: Record<string, number> = {}
    for (const user of DEMO_USERS) {
      const [existing] = await db.select({ id: schema.users.id }).from(schema.users).where(eq(schema.users.email, user.email)).limit(1)
      if (existing) {
        ids[user.role] = existing.id
        continue
      }
      const passwordHash = await hasher.make(user.password)
      const [row] = await db.insert(schema.users).values({ email: user.email, name: user.name, role: user.role, passwordHash }).$returningId()
      ids[user.role] = row!.id
    }
    let [project] = await db.select({ id: schema.projects.id }).from(schema.projects).where(eq(schema.projects.jobNumber, DEMO_PROJECT.jobNumber)).limit(1)
    if (!project) {
      const [row] = await db.insert(schema.projects).values({ ...DEMO_PROJECT, createdBy: ids.engineer! }).$returningId()
      project = row!
    }
    // the demo engineer, checker and records clerk work on the demo project (the admin never is a member)
    for (const role of schema.PROJECT_ROLES) {
      const where = and(eq(schema.projectMembers.projectId, project.id), eq(schema.projectMembers.userId, ids[role]!))
      const [member] = await db.select({ id: schema.projectMembers.id }).from(schema.projectMembers).where(where).limit(1)
      if (!member) await db.insert(schema.projectMembers).values({ projectId: project.id, userId: ids[role]!, role, addedBy: ids.admin! })
    }
    await seedContent(db, { projectId: project.id, engineerId: ids.engineer!, adminId: ids.admin! })
    process.stdout.write('[seed] demo data in place\n')
  }
  finally {
    await pool.end()
  }
}

main().catch((error) => {
  process.stderr.write(`[seed] ${error instanceof Error ? error.stack : String(error)}\n`)
  process.exit(1)
})
