// Direct access to the test MariaDB (as the application user), for asserting what was written.
import mysql from 'mysql2/promise'

export async function withDb<T>(fn: (conn: mysql.Connection) => Promise<T>): Promise<T> {
  const conn = await mysql.createConnection({
    host: process.env.NUXT_DATABASE_HOST,
    port: Number(process.env.NUXT_DATABASE_PORT),
    user: process.env.NUXT_DATABASE_USER,
    password: process.env.NUXT_DATABASE_PASSWORD,
    database: process.env.NUXT_DATABASE_NAME,
  })
  try {
    return await fn(conn)
  }
  finally {
    await conn.end()
  }
}

export async function countRows(table: string, where = '1=1', params: unknown[] = []) {
  return withDb(async (conn) => {
    const [rows] = await conn.query(`SELECT COUNT(*) AS n FROM \`${table}\` WHERE ${where}`, params)
    return Number((rows as Array<{ n: number }>)[0]!.n)
  })
}
