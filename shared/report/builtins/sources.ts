/**
 * The built-in templates and the language doc, by file. The Markdown files are the source of truth;
 * texts.ts carries the same texts as string constants so the browser needs no file access and no
 * build step. A unit test keeps the two identical; after editing a Markdown file run
 * `npx tsx shared/report/builtins/sync.ts` to rewrite texts.ts.
 */
export const BUILTIN_FILES = [
  { id: 'pt-slab-strip', file: 'content-templates/pt-slab-strip.md', constant: 'PT_SLAB_STRIP' },
  { id: 'pt-band-beam', file: 'content-templates/pt-band-beam.md', constant: 'PT_BAND_BEAM' },
  { id: 'pt-section-check', file: 'content-templates/pt-section-check.md', constant: 'PT_SECTION_CHECK' },
] as const

export const LANGUAGE_DOC_FILE = { file: 'docs/template-language.md', constant: 'TEMPLATE_LANGUAGE_DOC' } as const

export type BuiltinId = (typeof BUILTIN_FILES)[number]['id']
