import { defineConfig } from 'drizzle-kit'

// drizzle-kit 0.31 has no MariaDB dialect; the mysql dialect's SQL runs on MariaDB 10.11.
// `generate` needs no database; migrations are applied by scripts/db.mjs with drizzle-orm's migrator.
export default defineConfig({
  dialect: 'mysql',
  schema: ['./server/database/schema.ts', './server/database/schema-records.ts'],
  out: './drizzle',
})
