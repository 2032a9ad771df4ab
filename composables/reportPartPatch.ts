import morphdom from 'morphdom'
import { ref, type Directive } from 'vue'

/** The report's own fields: one being typed into keeps its element and its value while a patch lands. */
const isField = (el: Element) => el.tagName === 'INPUT' || el.tagName === 'SELECT' || el.tagName === 'TEXTAREA'

interface Part { html: string, firstHtml: string }

/** DOM work the patches do before they let the browser draw a frame */
const PATCH_SLICE_MS = 6

/** Parts whose newer html waits to be patched in, in the order they came (document order). */
const waiting = new Map<HTMLElement, string>()
let draining = false

/** True while changed parts are still being patched in (the report says so with data-patching). */
export const reportPatching = ref(false)

/**
 * `v-report-part="part"`: a report part's new html goes into the page as a patch of what is there
 * (morphdom). Elements, text and attributes that did not change stay as they were, so the browser
 * restyles and lays out only what changed, and the report's own fields keep their elements — the
 * browser's form autofill then has no new fields to read, and a field being typed into is left
 * alone. The element is made with the part's first html (`v-html`, also on the server); this
 * follows every later html. Changed parts are patched a few per frame, outside Vue's render: after
 * each PATCH_SLICE_MS of DOM work (or at once when a key is waiting) the browser draws a frame, so
 * a key pressed while a report lands paints in the next frame; a newer html of a part still waiting
 * takes its place.
 */
export const vReportPart: Directive<HTMLElement, Part> = {
  mounted(el, { value }) {
    if (value.html !== value.firstHtml) patchPart(el, value.html)
  },
  updated(el, { value, oldValue }) {
    if (value.html === oldValue?.html) return
    waiting.set(el, value.html)
    // after Vue's update has run every part's hook, so one slice counts the DOM work of them all
    if (!draining) {
      draining = true
      reportPatching.value = true
      queueMicrotask(() => void drain())
    }
  },
  unmounted(el) {
    waiting.delete(el)
  },
}

async function drain() {
  let sliceStart = performance.now()
  for (let next = waiting.entries().next(); !next.done; next = waiting.entries().next()) {
    const [el, html] = next.value
    waiting.delete(el)
    if (el.isConnected) patchPart(el, html)
    if (waiting.size && (performance.now() - sliceStart > PATCH_SLICE_MS || inputPending())) {
      await afterNextFrame()
      sliceStart = performance.now()
    }
  }
  draining = false
  reportPatching.value = false
}

function patchPart(el: HTMLElement, html: string) {
  const next = document.createElement('div')
  next.innerHTML = html
  morphdom(el, next, {
    childrenOnly: true,
    onBeforeElUpdated: (from, to) => !(from === document.activeElement && isField(from)) && !from.isEqualNode(to),
  })
}

/** A key press is waiting (Chromium tells; elsewhere the slice time alone decides). */
function inputPending(): boolean {
  return (navigator as { scheduling?: { isInputPending?: () => boolean } }).scheduling?.isInputPending?.() ?? false
}

/** Resolves once the browser has drawn a frame (or soon, where no frame comes: a hidden tab). */
function afterNextFrame() {
  return new Promise<void>((resolve) => {
    const fallback = setTimeout(resolve, 50)
    requestAnimationFrame(() => {
      clearTimeout(fallback)
      setTimeout(resolve, 0)
    })
  })
}
