/**
 * The built-in calc-sheet templates as text, for the browser and the server alike, and the
 * template-language doc for the in-app help page.
 */
import { BUILTIN_FILES } from './sources'
import type { BuiltinId } from './sources'
import { PT_BAND_BEAM, PT_SECTION_CHECK, PT_SLAB_STRIP, TEMPLATE_LANGUAGE_DOC } from './texts'

export { BUILTIN_FILES, TEMPLATE_LANGUAGE_DOC }
export type { BuiltinId }

export interface BuiltinTemplate {
  id: BuiltinId
  /** the Markdown file it comes from, relative to the repository root */
  file: string
  text: string
}

const TEXTS: Record<BuiltinId, string> = {
  'pt-slab-strip': PT_SLAB_STRIP,
  'pt-band-beam': PT_BAND_BEAM,
  'pt-section-check': PT_SECTION_CHECK,
}

export const BUILTIN_TEMPLATES: readonly BuiltinTemplate[] = BUILTIN_FILES.map((f) => ({ id: f.id, file: f.file, text: TEXTS[f.id] }))

export function builtinTemplate(id: string): BuiltinTemplate | undefined {
  return BUILTIN_TEMPLATES.find((t) => t.id === id)
}
