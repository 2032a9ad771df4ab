import { fileURLToPath } from 'node:url'
import { defineConfig } from 'vitest/config'

const root = fileURLToPath(new URL('.', import.meta.url))
const alias = { '~': root, '@': root, '#shared': `${root}shared` }

// `npm run test:cluster` only (scripts/test-cluster.mjs starts the cluster, S3, SMTP and the two
// instances first); `npm test` never picks these files up. One file at a time, in order: they
// share the running cluster and one of them stops and restarts a node.
export default defineConfig({
  resolve: { alias },
  test: {
    name: 'cluster',
    include: ['tests/cluster/**/*.test.ts'],
    environment: 'node',
    setupFiles: ['tests/setup/http.ts'],
    testTimeout: 180_000,
    hookTimeout: 180_000,
    fileParallelism: false,
    sequence: { concurrent: false },
  },
})
