// Runs scripts/seed.ts (TypeScript, through tsx) against an instance's database.
import { spawnSync } from 'node:child_process'
import { dirname, join, resolve } from 'node:path'
import { fileURLToPath } from 'node:url'
import { serverEnv } from './db.mjs'

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..')

export function seed(inst) {
  const result = spawnSync(process.execPath, ['--import', 'tsx', join(root, 'scripts', 'seed.ts')], {
    cwd: root, stdio: 'inherit', env: { ...process.env, ...serverEnv(inst) },
  })
  if (result.status !== 0) throw new Error('seeding the demo data failed')
}
