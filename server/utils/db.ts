import { drizzle } from 'drizzle-orm/mysql2'
import mysql from 'mysql2/promise'
import * as schema from '../database/schema'

export const tables = schema

/** Where the database is: `database.hosts` ("host:port,host:port…", e.g. Galera nodes, preferred first), else `host` and `port`. */
export function databaseHosts(database: { host: string, port: number | string, hosts?: string }) {
  const listed = String(database.hosts ?? '').split(',').map(s => s.trim()).filter(Boolean)
  if (listed.length === 0) return [{ host: database.host, port: Number(database.port) }]
  return listed.map((entry) => {
    const at = entry.lastIndexOf(':')
    const port = at > 0 ? Number(entry.slice(at + 1)) : Number(database.port)
    if (!Number.isInteger(port) || port < 1 || port > 65535) throw new Error(`database.hosts: "${entry}" is not host:port`)
    return { host: at > 0 ? entry.slice(0, at) : entry, port }
  })
}

type ErrorLike = { code?: string, errno?: number, cause?: unknown }

/** The error and its causes (Drizzle wraps the driver's error in its own). */
function causes(error: unknown): ErrorLike[] {
  const out: ErrorLike[] = []
  for (let e = error, depth = 0; e && typeof e === 'object' && depth < 5; e = (e as ErrorLike).cause, depth++) out.push(e as ErrorLike)
  return out
}

/**
 * A write that lost to a concurrent one: an InnoDB deadlock, or under Galera a certification
 * conflict at commit (another node committed a change to the same rows first). Both are 1213.
 */
export function isWriteConflict(error: unknown) {
  return causes(error).some(e => e.code === 'ER_LOCK_DEADLOCK' || e.errno === 1213)
}

/** The statement never reached a working server: nothing ran, so running it elsewhere is safe. */
const NOT_SENT = new Set(['ECONNREFUSED', 'EHOSTUNREACH', 'ENOTFOUND', 'PROTOCOL_ENQUEUE_AFTER_FATAL_ERROR', 'PROTOCOL_ENQUEUE_AFTER_QUIT'])
/** The connection broke or the node is not serving (1047: a Galera node outside the primary component). */
const LOST = new Set(['ECONNRESET', 'EPIPE', 'ETIMEDOUT', 'PROTOCOL_CONNECTION_LOST', 'ER_SERVER_SHUTDOWN', 'ER_CONNECTION_KILLED', 'ER_UNKNOWN_COM_ERROR'])
const NODE_NOT_READY = 1047

/** mysql2's word for a pooled connection the server closed (KILL, restart) before the command went out; it has no code. */
const CLOSED_BEFORE_SENT = /can't add new command when connection is in closed state/i

function isNotSent(error: unknown) {
  return causes(error).some(e => (e.code && NOT_SENT.has(e.code)) || e.errno === NODE_NOT_READY || CLOSED_BEFORE_SENT.test(String((e as { message?: unknown }).message ?? '')))
}

export function isConnectionLost(error: unknown) {
  return isNotSent(error) || causes(error).some(e => e.code !== undefined && LOST.has(e.code))
}

const READ_ONLY = /^\s*(select|show)\b/i

/**
 * mysql2 pools over an ordered list of hosts, with the Pool surface Drizzle uses (query, execute,
 * getConnection). It serves from the current host; when that host refuses connections or is not
 * ready it moves to the next one and stays there. A statement outside a transaction is repeated on
 * the next host when it never ran, or when it only reads; a transaction is never repeated here
 * once it has begun.
 */
class FailoverPool {
  private pools: Array<mysql.Pool | undefined> = []
  private current = 0
  constructor(private readonly hosts: Array<{ host: string, port: number }>, private readonly options: mysql.PoolOptions) {}

  private pool(index: number) {
    this.pools[index] ??= mysql.createPool({ ...this.options, ...this.hosts[index] })
    return this.pools[index]!
  }

  private async run<T>(fn: (pool: mysql.Pool) => Promise<T>, mayRepeat: (error: unknown) => boolean): Promise<T> {
    let lastError: unknown
    for (let tries = 0; tries < this.hosts.length; tries++) {
      const index = this.current
      try {
        return await fn(this.pool(index))
      }
      catch (error) {
        if (!isConnectionLost(error)) throw error
        lastError = error
        if (this.current === index) {
          this.current = (index + 1) % this.hosts.length
          const next = this.hosts[this.current]!
          console.warn(`[db] ${this.hosts[index]!.host}:${this.hosts[index]!.port} is unavailable (${(error as ErrorLike).code ?? error}); using ${next.host}:${next.port}`)
        }
        if (!mayRepeat(error)) throw error
      }
    }
    throw lastError
  }

  query(...args: Parameters<mysql.Pool['query']>) {
    const text = typeof args[0] === 'string' ? args[0] : (args[0] as { sql?: string }).sql ?? ''
    return this.run(pool => (pool.query as (...a: unknown[]) => Promise<unknown>)(...args), error => isNotSent(error) || READ_ONLY.test(text))
  }

  execute(...args: Parameters<mysql.Pool['execute']>) {
    const text = typeof args[0] === 'string' ? args[0] : (args[0] as { sql?: string }).sql ?? ''
    return this.run(pool => (pool.execute as (...a: unknown[]) => Promise<unknown>)(...args), error => isNotSent(error) || READ_ONLY.test(text))
  }

  /**
   * A connection for a transaction, checked with a ping first: a pooled connection whose server
   * went away is dropped and the next host tried, before the transaction has begun.
   */
  getConnection() {
    return this.run(async (pool) => {
      const conn = await pool.getConnection()
      try {
        await conn.ping()
        return conn
      }
      catch (error) {
        conn.destroy()
        throw error
      }
    }, () => true)
  }

  /** The current host's mysql2 pool, for libraries that speak to MariaDB themselves. */
  currentPool() {
    return this.pool(this.current)
  }

  async end() {
    await Promise.all(this.pools.map(p => p?.end()))
    this.pools = []
  }
}

let pool: FailoverPool | undefined
let db: ReturnType<typeof drizzle<typeof schema>> | undefined

/**
 * One connection pool for the process (failing over between `database.hosts`), one Drizzle
 * instance over it. Its transactions answer in the user's words when they cannot commit: 409 when
 * a concurrent change to the same rows won (see `withRetry`), 503 when the database went away.
 */
export function useDb() {
  if (!db) {
    const { database } = useRuntimeConfig()
    pool = new FailoverPool(databaseHosts(database), {
      user: database.user,
      password: database.password,
      database: database.name,
      connectionLimit: 10,
      connectTimeout: 5_000,
      enableKeepAlive: true,
      timezone: 'Z',
      dateStrings: false,
    })
    const made = drizzle(pool as unknown as mysql.Pool, { schema, mode: 'default' })
    const transaction = made.transaction.bind(made)
    made.transaction = ((fn, config) => transaction(fn, config).catch((error: unknown) => {
      throw inUserWords(error)
    })) as typeof made.transaction
    db = made
  }
  return db
}

function inUserWords(error: unknown) {
  if (isWriteConflict(error)) {
    return createError({ statusCode: 409, message: 'Someone else changed the same record a moment ago, so nothing was saved: try again', cause: error })
  }
  if (isConnectionLost(error)) {
    return createError({ statusCode: 503, message: 'The database connection was lost before the change was confirmed: reload to see whether it was saved, then try again', cause: error })
  }
  return error
}

export type Db = ReturnType<typeof useDb>

/**
 * Runs `fn` (a whole transaction) again when it lost a write conflict, a few times with a short,
 * growing, jittered wait; then answers 409 with `message`. Only for work whose transaction has
 * no effect outside the database.
 */
export async function withRetry<T>(fn: () => Promise<T>, message: string, attempts = 4): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await fn()
    }
    catch (error) {
      if (!isWriteConflict(error)) throw error
      if (attempt >= attempts) throw createError({ statusCode: 409, message, cause: error })
      await new Promise(r => setTimeout(r, 25 * 2 ** attempt + Math.random() * 50))
    }
  }
}

/** The mysql2 pool under useDb(), for libraries that speak to MariaDB themselves. */
export function usePool() {
  useDb()
  return pool!.currentPool()
}

export async function closeDb() {
  await pool?.end()
  pool = undefined
  db = undefined
}
