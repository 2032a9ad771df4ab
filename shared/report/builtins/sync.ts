/**
 * Rewrites texts.ts from the Markdown sources (run with `npx tsx shared/report/builtins/sync.ts`
 * from the repository root). JSON string literals are valid TypeScript, so no escaping is needed.
 */
import { readFileSync, writeFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { BUILTIN_FILES, LANGUAGE_DOC_FILE } from './sources'

const root = fileURLToPath(new URL('../../../', import.meta.url))

export function textsModule(read: (file: string) => string): string {
  const entries = [...BUILTIN_FILES, LANGUAGE_DOC_FILE].map((f) => `/** ${f.file} */\nexport const ${f.constant} = ${JSON.stringify(read(f.file))}\n`)
  return `// The texts of ${[...BUILTIN_FILES, LANGUAGE_DOC_FILE].map((f) => f.file).join(', ')}, kept identical by a unit test.\n// Do not edit: change the Markdown and run \`npx tsx shared/report/builtins/sync.ts\`.\n\n${entries.join('\n')}`
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  writeFileSync(`${root}shared/report/builtins/texts.ts`, textsModule((file) => readFileSync(`${root}${file}`, 'utf8')))
}
