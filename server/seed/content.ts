import type { MySql2Database } from 'drizzle-orm/mysql2'
import type * as schema from '../database/schema'

export interface SeedOwners {
  projectId: number
  engineerId: number
  adminId: number
}

/** Built-in templates and the demo calc sheets; filled in once the template library exists. */
export async function seedContent(_db: MySql2Database<typeof schema>, _owners: SeedOwners) {}
