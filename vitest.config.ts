import { fileURLToPath } from 'node:url'
import { defineConfig } from 'vitest/config'

const root = fileURLToPath(new URL('.', import.meta.url))
const alias = { '~': root, '@': root, '#shared': `${root}shared` }

// The hardening suites of tests/integration (hostile bodies, tampering, faults, web attacks) run as
// their own project once the others are done; they add their figures to the closing table. Vitest
// runs groups in `groupOrder`: unit (0) in parallel, then integration and e2e (1) one file at a
// time as before, then hardening (2) alone. (A project left at 0 without file parallelism would
// be put after every numbered group.)
const HARDENING = ['tests/integration/hostile-bodies.test.ts', 'tests/integration/tampering.test.ts', 'tests/integration/faults.test.ts', 'tests/integration/web-attacks.test.ts']

// Projects: unit (pure code), integration (real MariaDB + Nitro server), e2e (real Chromium), hardening.
// `npm test` (scripts/test.mjs) starts the test database and runs them all; `vitest run --project unit`
// runs the pure tests alone without any service.
export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'unit',
          include: ['tests/unit/**/*.test.ts'],
          environment: 'node',
          // seeded property tests run whole designs; on a busy two-core machine 5 s is too tight
          testTimeout: 60_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'integration',
          include: ['tests/integration/**/*.test.ts'],
          exclude: HARDENING,
          environment: 'node',
          globalSetup: ['tests/setup/server.ts'],
          setupFiles: ['tests/setup/http.ts'],
          testTimeout: 60_000,
          hookTimeout: 180_000,
          fileParallelism: false,
          sequence: { groupOrder: 1 },
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/setup/server.ts'],
          setupFiles: ['tests/setup/http.ts'],
          testTimeout: 120_000,
          hookTimeout: 180_000,
          fileParallelism: false,
          sequence: { groupOrder: 1 },
        },
      },
      {
        resolve: { alias },
        test: {
          // fuzzing, tampering as root, stopping the database: alone, after every other project,
          // so that row counts are exact and no other test sees the faults
          name: 'hardening',
          include: HARDENING,
          environment: 'node',
          globalSetup: ['tests/setup/server.ts'],
          setupFiles: ['tests/setup/http.ts'],
          testTimeout: 300_000,
          hookTimeout: 180_000,
          fileParallelism: false,
          sequence: { groupOrder: 2 },
        },
      },
    ],
  },
})
