#!/usr/bin/env node
// The project's own MariaDB: Debian's mariadb-server, a private data directory, loopback only.
// Usage: node scripts/db.mjs start|stop|status [--test]
//   start  installs the system packages when missing (as root), initialises the data directory,
//          starts mariadbd on 127.0.0.1, creates the database and the application user, migrates.
//   stop   shuts the instance down cleanly.
// The demo instance lives in .data/ on port 3406; the test instance in .data-test/ on port 3407,
// so tests never touch the demo data. Both are settings (see `settings` below), so several
// instances and test runs can live on one machine side by side.
import { spawn, spawnSync, execFileSync } from 'node:child_process'
import { generateKeyPairSync, randomBytes } from 'node:crypto'
import { existsSync, mkdirSync, readFileSync, writeFileSync, openSync } from 'node:fs'
import { dirname, join, resolve } from 'node:path'
import { fileURLToPath } from 'node:url'

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..')

/** Tables whose rows may never change once written: the app user gets SELECT and INSERT only. */
export const APPEND_ONLY_TABLES = ['revisions', 'reviews', 'seals', 'audit_events', 'attachments', 'templates', 'log_leaves', 'log_heads', 'office_details', 'comment_states']

/**
 * Every port and folder of a run, from the environment with today's values as defaults:
 * TENDONBOOK_DATA_DIR (.data), TENDONBOOK_DB_PORT (3406), TENDONBOOK_MAIL_PORT (2526) for the demo;
 * TENDONBOOK_TEST_DATA_DIR (.data-test), TENDONBOOK_TEST_DB_PORT (3407), TENDONBOOK_TEST_MAIL_PORT
 * (2527, e2e +10) and TENDONBOOK_TEST_APP_PORT (3100, e2e +1) for `npm test`. PORT is the app's.
 */
export function settings(test = false, env = process.env) {
  const number = (name, fallback) => envPorts(env, name, [fallback])[0]
  return test
    ? { base: resolve(root, env.TENDONBOOK_TEST_DATA_DIR || '.data-test'), dbPort: number('TENDONBOOK_TEST_DB_PORT', 3407), mailPort: number('TENDONBOOK_TEST_MAIL_PORT', 2527), appPort: number('TENDONBOOK_TEST_APP_PORT', 3100) }
    : { base: resolve(root, env.TENDONBOOK_DATA_DIR || '.data'), dbPort: number('TENDONBOOK_DB_PORT', 3406), mailPort: number('TENDONBOOK_MAIL_PORT', 2526), appPort: number('PORT', 3000) }
}

/** Ports from a variable holding one port or a comma-separated list (the fallback when unset). */
export function envPorts(env, name, fallback) {
  const raw = env[name]
  if (raw === undefined || raw === '') return fallback
  const values = String(raw).split(',').map(part => Number(part.trim()))
  if (values.length !== fallback.length || values.some(v => !Number.isInteger(v) || v < 1 || v > 65535)) {
    const what = fallback.length === 1 ? 'a port number' : `${fallback.length} comma-separated port numbers`
    throw new Error(`${name} must be ${what} from 1 to 65535, not "${raw}"`)
  }
  return values
}

export function instance(test = false) {
  const { base, dbPort, mailPort, appPort } = settings(test)
  return {
    name: test ? 'test' : 'demo',
    base,
    dataDir: join(base, 'mariadb'),
    runDir: join(base, 'run'),
    socket: join(base, 'run', 'mysqld.sock'),
    pidFile: join(base, 'run', 'mysqld.pid'),
    logFile: join(base, 'mariadb.log'),
    port: dbPort,
    mailPort,
    appPort,
    database: test ? 'tendonbook_test' : 'tendonbook',
    user: 'tendonbook',
  }
}

function log(message) {
  process.stdout.write(`[db] ${message}\n`)
}

function onPath(command) {
  return spawnSync('sh', ['-c', `command -v ${command}`], { stdio: 'ignore' }).status === 0
}

export function findMariadbd() {
  for (const candidate of ['/usr/sbin/mariadbd', '/usr/bin/mariadbd']) if (existsSync(candidate)) return candidate
  return onPath('mariadbd') ? 'mariadbd' : null
}

/** Debian packages the product needs: the database server and the Chromium that prints PDFs. */
export function ensureSystemPackages() {
  const missing = []
  if (!findMariadbd()) missing.push('mariadb-server')
  if (!existsSync('/usr/bin/chromium')) missing.push('chromium')
  if (!onPath('pdftoppm')) missing.push('poppler-utils')
  if (missing.length === 0) return
  const command = `apt-get update && apt-get install -y ${missing.join(' ')}`
  if (typeof process.getuid !== 'function' || process.getuid() !== 0) {
    process.stderr.write(`Tendonbook needs Debian packages that are not installed: ${missing.join(', ')}.\nRun this once as root, then try again:\n  sudo sh -c '${command}'\n`)
    process.exit(1)
  }
  log(`installing ${missing.join(', ')} with apt-get (once per machine)`)
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' }
  const apt = ['-o', 'DPkg::Lock::Timeout=180', '-y', '-q']
  execFileSync('apt-get', ['-o', 'DPkg::Lock::Timeout=180', '-q', 'update'], { stdio: 'inherit', env })
  execFileSync('apt-get', [...apt, 'install', '--no-install-recommends', ...missing], { stdio: 'inherit', env })
  if (!findMariadbd()) throw new Error('mariadb-server was installed but mariadbd is still not found')
}

/** Secrets kept beside the data (never committed): database password, session password. */
export function secrets(inst) {
  const file = join(inst.base, 'secrets.json')
  if (existsSync(file)) return JSON.parse(readFileSync(file, 'utf8'))
  mkdirSync(inst.base, { recursive: true })
  const value = {
    dbPassword: randomBytes(18).toString('base64url'),
    sessionPassword: randomBytes(32).toString('base64url'),
  }
  writeFileSync(file, JSON.stringify(value, null, 2), { mode: 0o600 })
  return value
}

/**
 * The Ed25519 key that signs the history log's tree heads: made once beside the data, mode 0600,
 * never in the database (whoever can write the database must not be able to sign) nor committed.
 */
export function logSigningKeyPath(inst) {
  const file = join(inst.base, 'log-signing-key.pem')
  if (existsSync(file)) return file
  mkdirSync(inst.base, { recursive: true })
  const { privateKey } = generateKeyPairSync('ed25519')
  try {
    writeFileSync(file, privateKey.export({ type: 'pkcs8', format: 'pem' }), { mode: 0o600, flag: 'wx' })
  }
  catch (error) {
    // another process made it first: theirs is the key
    if (error.code !== 'EEXIST') throw error
  }
  return file
}

export function admin(inst, args, options = {}) {
  return spawnSync('mariadb-admin', ['--no-defaults', `--socket=${inst.socket}`, '-uroot', ...args], { encoding: 'utf8', ...options })
}

export function alive(inst) {
  return existsSync(inst.socket) && admin(inst, ['--connect-timeout=2', 'ping']).status === 0
}

export async function waitUntilAlive(inst, seconds) {
  const until = Date.now() + seconds * 1000
  while (Date.now() < until) {
    if (alive(inst)) return true
    await new Promise(r => setTimeout(r, 250))
  }
  return false
}

export function initialise(inst) {
  if (existsSync(join(inst.dataDir, 'mysql'))) return
  log(`initialising a private data directory in ${inst.dataDir}`)
  mkdirSync(inst.dataDir, { recursive: true })
  const result = spawnSync('mariadb-install-db', [
    '--no-defaults', `--datadir=${inst.dataDir}`, '--user=root',
    '--auth-root-authentication-method=normal', '--skip-test-db',
  ], { encoding: 'utf8' })
  if (result.status !== 0) throw new Error(`mariadb-install-db failed:\n${result.stdout}\n${result.stderr}`)
}

/** Starts mariadbd for `inst`; `extra` arguments come last and so win (e.g. Galera's settings). */
export async function startServer(inst, extra = []) {
  if (alive(inst)) {
    log(`MariaDB (${inst.name}) already running on 127.0.0.1:${inst.port}`)
    return
  }
  mkdirSync(inst.runDir, { recursive: true })
  const out = openSync(inst.logFile, 'a')
  // mariadbd keeps the first --user it is given: a caller's own (in `extra`) replaces root here
  const user = extra.find(arg => arg.startsWith('--user=')) ?? '--user=root'
  const child = spawn(findMariadbd(), [
    '--no-defaults', `--datadir=${inst.dataDir}`, user,
    '--bind-address=127.0.0.1', `--port=${inst.port}`, `--socket=${inst.socket}`,
    `--pid-file=${inst.pidFile}`, `--log-error=${inst.logFile}`, '--skip-name-resolve',
    '--character-set-server=utf8mb4', '--collation-server=utf8mb4_unicode_ci',
    '--log-bin-trust-function-creators=1', '--secure-timestamp=YES',
    '--innodb-buffer-pool-size=128M', '--max-connections=200', ...extra.filter(arg => arg !== user),
  ], { detached: true, stdio: ['ignore', out, out] })
  child.unref()
  if (!(await waitUntilAlive(inst, 60))) {
    throw new Error(`MariaDB did not answer within 60 s; see ${inst.logFile}`)
  }
  log(`MariaDB (${inst.name}) started on 127.0.0.1:${inst.port}`)
}

export async function rootConnection(inst, database) {
  const mysql = await import('mysql2/promise')
  return mysql.createConnection({ socketPath: inst.socket, user: 'root', database, multipleStatements: false })
}

export async function createDatabaseAndUser(inst, password) {
  const conn = await rootConnection(inst)
  try {
    await conn.query(`CREATE DATABASE IF NOT EXISTS \`${inst.database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`)
    for (const host of ['127.0.0.1', 'localhost']) {
      await conn.query(`CREATE USER IF NOT EXISTS '${inst.user}'@'${host}' IDENTIFIED BY ?`, [password])
      await conn.query(`ALTER USER '${inst.user}'@'${host}' IDENTIFIED BY ?`, [password])
    }
  }
  finally {
    await conn.end()
  }
}

/**
 * Runs the migrations under the named lock `tendonbook-migrate`, so two starters on one server run
 * them one after the other (the second finds nothing left to do). GET_LOCK is local to one server:
 * on a Galera cluster it is not replicated, so migrations must only ever be run against one node
 * (scripts/cluster.mjs runs them against node 1, before any app instance starts); the DDL itself
 * replicates to the other nodes in total order.
 */
export async function migrate(inst) {
  const { drizzle } = await import('drizzle-orm/mysql2')
  const { migrate: runMigrations } = await import('drizzle-orm/mysql2/migrator')
  const conn = await rootConnection(inst, inst.database)
  try {
    const [[{ locked }]] = await conn.query("SELECT GET_LOCK('tendonbook-migrate', 120) AS locked")
    if (locked !== 1) throw new Error('another migration has held the lock tendonbook-migrate for two minutes')
    try {
      await runMigrations(drizzle(conn), { migrationsFolder: join(root, 'drizzle') })
    }
    finally {
      await conn.query("SELECT RELEASE_LOCK('tendonbook-migrate')")
    }
  }
  finally {
    await conn.end()
  }
}

/**
 * Table-level grants: full DML on working tables, SELECT + INSERT only on append-only ones, so
 * the application cannot rewrite history even if its own code tried to.
 */
export async function grant(inst) {
  const conn = await rootConnection(inst, inst.database)
  try {
    const [rows] = await conn.query('SELECT table_name AS name FROM information_schema.tables WHERE table_schema = ?', [inst.database])
    for (const host of ['127.0.0.1', 'localhost']) {
      const who = `'${inst.user}'@'${host}'`
      await conn.query(`REVOKE ALL PRIVILEGES, GRANT OPTION FROM ${who}`)
      for (const { name } of rows) {
        if (name.startsWith('__drizzle')) continue
        const privileges = APPEND_ONLY_TABLES.includes(name) ? 'SELECT, INSERT' : 'SELECT, INSERT, UPDATE, DELETE'
        await conn.query(`GRANT ${privileges} ON \`${inst.database}\`.\`${name}\` TO ${who}`)
      }
    }
    await conn.query('FLUSH PRIVILEGES')
  }
  finally {
    await conn.end()
  }
}

export async function start({ test = false } = {}) {
  ensureSystemPackages()
  const inst = instance(test)
  const { dbPassword } = secrets(inst)
  initialise(inst)
  await startServer(inst)
  await createDatabaseAndUser(inst, dbPassword)
  await migrate(inst)
  await grant(inst)
  log(`database ${inst.database} migrated`)
  return inst
}

export async function stop({ test = false } = {}) {
  const inst = instance(test)
  if (!alive(inst)) {
    log(`MariaDB (${inst.name}) is not running`)
    return
  }
  const result = admin(inst, ['shutdown'])
  if (result.status !== 0) throw new Error(`mariadb-admin shutdown failed: ${result.stderr}`)
  log(`MariaDB (${inst.name}) stopped`)
}

/** Runtime environment for Nitro pointing at an instance. */
export function serverEnv(inst) {
  const { dbPassword, sessionPassword } = secrets(inst)
  return {
    NUXT_DATABASE_HOST: '127.0.0.1',
    NUXT_DATABASE_PORT: String(inst.port),
    NUXT_DATABASE_USER: inst.user,
    NUXT_DATABASE_PASSWORD: dbPassword,
    NUXT_DATABASE_NAME: inst.database,
    NUXT_SESSION_PASSWORD: sessionPassword,
    NUXT_STORAGE_BASE: join(inst.base, 'files'),
    NUXT_LOG_SIGNING_KEY_PATH: logSigningKeyPath(inst),
  }
}

const isMain = process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)
if (isMain) {
  const [command] = process.argv.slice(2)
  const test = process.argv.includes('--test')
  const actions = { start: () => start({ test }), stop: () => stop({ test }), status: async () => log(alive(instance(test)) ? 'running' : 'stopped') }
  const action = actions[command]
  if (!action) {
    process.stderr.write('usage: node scripts/db.mjs start|stop|status [--test]\n')
    process.exit(2)
  }
  action().catch((error) => {
    process.stderr.write(`[db] ${error.message}\n`)
    process.exit(1)
  })
}
