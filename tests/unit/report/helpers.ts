/** Helpers for the renderer's tests: a template around a body, and a scan of the HTML's tags. */
import { compileTemplate } from '../../../shared/report/compile'
import type { CompiledTemplate } from '../../../shared/report/compile'
import { renderReport } from '../../../shared/report/render'
import type { RenderedReport, RenderMode } from '../../../shared/report/render'
import { BEAM_INPUT, beamModel, runBeam } from './fixtures/beam-model'

export const FRONT = '---\nmodel: test-beam\ntitle: Test sheet\nversion: 1.0.0\ngroups: [geometry, loads]\n---\n'
/** the body starts on this line of the template (the front matter above has six lines) */
export const BODY_LINE = 7

export function template(body: string): string {
  return FRONT + body
}

export function compileBody(body: string): CompiledTemplate {
  return compileTemplate(template(body), beamModel)
}

export function renderBody(body: string, mode: RenderMode = 'frozen', inputs: unknown = BEAM_INPUT): RenderedReport {
  const results = runBeam(inputs)
  return renderReport(compileBody(body), { inputs, results, mode })
}

/** The rendered HTML without KaTeX's markup, to read the prose around formulas. */
export function withoutMath(html: string): string {
  return html.replace(/<span class="katex">[\s\S]*?<\/annotation><\/semantics><\/math><\/span>/g, '[math]')
}

export interface Tag {
  name: string
  attrs: Array<{ name: string; value: string }>
}

/** Every start tag in the HTML with its attributes (a small scanner after the WHATWG tokenizer's states). */
export function startTags(html: string): Tag[] {
  const tags: Tag[] = []
  for (const m of html.matchAll(/<([A-Za-z][A-Za-z0-9-]*)((?:\s+[^\s"'>/=]+(?:\s*=\s*(?:"[^"]*"|'[^']*'|[^\s"'=<>`]+))?)*)\s*\/?>/g)) {
    const attrs = [...m[2]!.matchAll(/([^\s"'>/=]+)(?:\s*=\s*(?:"([^"]*)"|'([^']*)'|([^\s"'=<>`]+)))?/g)].map((a) => ({
      name: a[1]!.toLowerCase(),
      value: a[2] ?? a[3] ?? a[4] ?? '',
    }))
    tags.push({ name: m[1]!.toLowerCase(), attrs })
  }
  return tags
}
