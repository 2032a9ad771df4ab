import morphdom from 'morphdom'
import type { Directive } from 'vue'

/** The report's own fields: one being typed into keeps its element and its value while a patch lands. */
const isField = (el: Element) => el.tagName === 'INPUT' || el.tagName === 'SELECT' || el.tagName === 'TEXTAREA'

interface Part { html: string, firstHtml: string }

/**
 * `v-report-part="part"`: a report part's new html goes into the page as a patch of what is there
 * (morphdom). Elements, text and attributes that did not change stay as they were, so the browser
 * restyles and lays out only what changed, and the report's own fields keep their elements — the
 * browser's form autofill then has no new fields to read, and a field being typed into is left
 * alone. The element is made with the part's first html (`v-html`, also on the server); this
 * follows every later html.
 */
export const vReportPart: Directive<HTMLElement, Part> = {
  mounted(el, { value }) {
    if (value.html !== value.firstHtml) patchPart(el, value.html)
  },
  updated(el, { value, oldValue }) {
    if (value.html !== oldValue?.html) patchPart(el, value.html)
  },
}

function patchPart(el: HTMLElement, html: string) {
  const next = document.createElement('div')
  next.innerHTML = html
  morphdom(el, next, {
    childrenOnly: true,
    onBeforeElUpdated: (from, to) => !(from === document.activeElement && isField(from)) && !from.isEqualNode(to),
  })
}
