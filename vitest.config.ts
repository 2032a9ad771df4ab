import { fileURLToPath } from 'node:url'
import { defineConfig } from 'vitest/config'

const root = fileURLToPath(new URL('.', import.meta.url))
const alias = { '~': root, '@': root, '#shared': `${root}shared` }

// Three projects: unit (pure code), integration (real MariaDB + Nitro server), e2e (real Chromium).
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
          environment: 'node',
          globalSetup: ['tests/setup/server.ts'],
          setupFiles: ['tests/setup/http.ts'],
          testTimeout: 60_000,
          hookTimeout: 180_000,
          fileParallelism: false,
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
        },
      },
    ],
  },
})
