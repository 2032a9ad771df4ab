import morphdom from 'morphdom'
import { ref, type Directive } from 'vue'
import { topLevelBlocks, type TopLevelBlock } from '~/shared/report/top-level-blocks'

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
    partShown(el, value.firstHtml)
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
  try {
    // a key pressed while the engine's answer came in paints before any part is patched
    if (inputPending()) await afterNextFrame()
    let sliceStart = performance.now()
    for (let next = waiting.entries().next(); !next.done; next = waiting.entries().next()) {
      const [el, html] = next.value
      waiting.delete(el)
      if (el.isConnected) patchOrReplace(el, html)
      if (waiting.size && (performance.now() - sliceStart > PATCH_SLICE_MS || inputPending())) {
        await afterNextFrame()
        sliceStart = performance.now()
      }
    }
  }
  finally {
    draining = false
    reportPatching.value = false
  }
}

/** A patch that fails on something unforeseen still leaves the part showing its new html. */
function patchOrReplace(el: HTMLElement, html: string) {
  try {
    patchPart(el, html)
  }
  catch (error) {
    console.error('The report part could not be patched; it is shown afresh', error)
    shownBlocks.delete(el)
    el.innerHTML = html
    shownHtml.set(el, html)
  }
}

/** The html each part's element shows now, and its top-level blocks with their nodes once read. */
const shownHtml = new WeakMap<HTMLElement, string>()
const shownBlocks = new WeakMap<HTMLElement, ShownBlock[]>()
interface ShownBlock extends TopLevelBlock { dom: ChildNode[] }

const keepFocusedField = (from: Element, to: Element) => !(from === document.activeElement && isField(from)) && !from.isEqualNode(to)

/** The part's element shows this html (as made by v-html): later patches compare against it. */
export function partShown(el: HTMLElement, html: string) {
  shownHtml.set(el, html)
}

/** Patches a part's element to show this html, touching only what changed; says how. */
export function patchPart(el: HTMLElement, html: string): 'unchanged' | 'blocks' | 'whole' {
  if (shownHtml.get(el) === html) return 'unchanged'
  const byBlocks = patchBlocks(el, html)
  if (!byBlocks) {
    shownBlocks.delete(el)
    const whole = document.createElement('div')
    whole.innerHTML = html
    morphdom(el, whole, { childrenOnly: true, onBeforeElUpdated: keepFocusedField })
  }
  shownHtml.set(el, html)
  return byBlocks ? 'blocks' : 'whole'
}

function parsed(html: string): DocumentFragment & ParentNode {
  const template = document.createElement('template')
  template.innerHTML = html
  return template.content
}

/** Nodes grouped as the blocks made them, or null where they do not match (then the part is patched whole). */
function grouped(nodes: ArrayLike<ChildNode>, blocks: readonly TopLevelBlock[]): ShownBlock[] | null {
  if (blocks.reduce((n, b) => n + b.nodes, 0) !== nodes.length) return null
  const out: ShownBlock[] = []
  let at = 0
  for (const block of blocks) {
    const dom = Array.from({ length: block.nodes }, (_, k) => nodes[at + k]!)
    at += block.nodes
    const first = dom[0]!
    const fits = block.tag === '#text'
      ? first.nodeType === Node.TEXT_NODE
      : block.tag === '#comment' ? first.nodeType === Node.COMMENT_NODE : first.nodeType === Node.ELEMENT_NODE && first.nodeName.toLowerCase() === block.tag
    if (!fits || (block.nodes === 2 && dom[1]!.nodeType !== Node.TEXT_NODE)) return null
    out.push({ ...block, dom })
  }
  return out
}

/**
 * Patches only the top-level blocks that changed: the blocks both htmls share at the start and at
 * the end are left alone (not even parsed); a changed block is morphed into its element in place
 * (so a report field in it keeps its element), or, where the count of blocks changed, the changed
 * run is replaced. False where the part cannot be read as blocks.
 */
function patchBlocks(el: HTMLElement, html: string): boolean {
  const before = shownBlocks.get(el) ?? grouped(el.childNodes, topLevelBlocks(shownHtml.get(el) ?? '') ?? [])
  const next = topLevelBlocks(html)
  if (!before || !next || before.length === 0) return false
  let head = 0
  while (head < before.length && head < next.length && before[head]!.html === next[head]!.html) head += 1
  let tail = 0
  while (tail < before.length - head && tail < next.length - head && before.at(-1 - tail)!.html === next.at(-1 - tail)!.html) tail += 1
  const oldRun = before.slice(head, before.length - tail)
  const newRun = next.slice(head, next.length - tail)
  const fresh = grouped(parsed(newRun.map(b => b.html).join('')).childNodes, newRun)
  if (!fresh) return false
  if (oldRun.length === newRun.length && oldRun.every((b, k) => b.tag === newRun[k]!.tag)) {
    oldRun.forEach((old, k) => {
      const now = fresh[k]!
      if (old.tag === '#text' || old.tag === '#comment') {
        if (old.dom[0]!.nodeValue !== now.dom[0]!.nodeValue) old.dom[0]!.nodeValue = now.dom[0]!.nodeValue
      }
      else morphdom(old.dom[0]!, now.dom[0]!, { onBeforeElUpdated: keepFocusedField })
      const [oldText, newText] = [old.dom[1], now.dom[1]]
      if (oldText && newText) {
        if (oldText.nodeValue !== newText.nodeValue) oldText.nodeValue = newText.nodeValue
      }
      else if (oldText) oldText.remove()
      else if (newText) old.dom[0]!.after(newText)
      now.dom = newText ? [old.dom[0]!, oldText ?? newText] : [old.dom[0]!]
    })
  }
  else {
    // a focused field in the run would lose its element: patch the part whole, which keeps it
    const focused = document.activeElement
    if (focused && oldRun.some(b => b.dom.some(n => n === focused || n.contains(focused)))) return false
    const after = oldRun.at(-1)?.dom.at(-1)?.nextSibling ?? before[head + oldRun.length]?.dom[0] ?? null
    el.insertBefore(parsedRun(fresh), after)
    for (const b of oldRun) for (const n of b.dom) n.remove()
  }
  shownBlocks.set(el, [...before.slice(0, head), ...fresh, ...before.slice(before.length - tail)])
  return true
}

/** The nodes of freshly parsed blocks, in order, as one fragment. */
function parsedRun(blocks: readonly ShownBlock[]): DocumentFragment {
  const fragment = document.createDocumentFragment()
  for (const b of blocks) fragment.append(...b.dom)
  return fragment
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
