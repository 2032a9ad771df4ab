/**
 * Server side: the built-in templates read from their Markdown files (the source of truth), for
 * seeding the templates table. Not for the browser (node:fs).
 */
import { readFile } from 'node:fs/promises'
import { join } from 'node:path'
import type { BuiltinTemplate } from './index'
import { BUILTIN_FILES } from './sources'

export async function loadBuiltinTemplates(root: string = process.cwd()): Promise<BuiltinTemplate[]> {
  return Promise.all(BUILTIN_FILES.map(async (f) => ({ id: f.id, file: f.file, text: await readFile(join(root, f.file), 'utf8') })))
}
