import { drizzle } from 'drizzle-orm/mysql2'
import mysql from 'mysql2/promise'
import * as schema from '../database/schema'

export const tables = schema

let pool: mysql.Pool | undefined
let db: ReturnType<typeof drizzle<typeof schema>> | undefined

/** One mysql2 pool for the process, one Drizzle instance over it. */
export function useDb() {
  if (!db) {
    const { database } = useRuntimeConfig()
    pool = mysql.createPool({
      host: database.host,
      port: Number(database.port),
      user: database.user,
      password: database.password,
      database: database.name,
      connectionLimit: 10,
      timezone: 'Z',
      dateStrings: false,
    })
    db = drizzle(pool, { schema, mode: 'default' })
  }
  return db
}

export type Db = ReturnType<typeof useDb>

/** The mysql2 pool under useDb(), for libraries that speak to MariaDB themselves. */
export function usePool() {
  useDb()
  return pool!
}

export async function closeDb() {
  await pool?.end()
  pool = undefined
  db = undefined
}
