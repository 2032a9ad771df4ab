/**
 * Formulas, tables and code that are wider than their box scroll inside it; a box that scrolls
 * joins the tab order (tabindex 0), so the keyboard can scroll it too (WCAG 2.1.1).
 *
 * Reading a box's widths lays it out, and the report's parts off screen are not laid out until they
 * come near (content-visibility: auto), so the boxes are not all measured on every change. A box is
 * measured when its size changes (a ResizeObserver per box, which also follows the window's width),
 * when what is inside it changes while its part is on screen, and when its part comes on screen. All
 * are measured once when the page mounts.
 */
const SCROLL_BOXES = '.tb-math, table, pre, .tb-overview, .katex-display, .overflow-x-auto'

function boxesIn(node: Element): HTMLElement[] {
  const inside = [...node.querySelectorAll<HTMLElement>(SCROLL_BOXES)]
  return node instanceof HTMLElement && node.matches(SCROLL_BOXES) ? [node, ...inside] : inside
}

export function useScrollBoxes(root: Ref<HTMLElement | null | undefined>) {
  let mutations: MutationObserver | undefined
  let sizes: ResizeObserver | undefined
  // boxes whose content changed, measured before the next frame if their part is on screen
  const changed = new Set<HTMLElement>()
  let frame = 0

  function mark(boxes: readonly HTMLElement[]) {
    // every width read first, then every write: a write between reads would lay the page out again
    const found = boxes.filter(box => box.isConnected).map(box => ({ box, scrolls: box.scrollWidth > box.clientWidth + 1 && getComputedStyle(box).overflowX !== 'visible' }))
    for (const { box, scrolls } of found) {
      if (scrolls && !box.hasAttribute('tabindex')) {
        box.tabIndex = 0
        box.dataset.scrollBox = ''
      }
      else if (!scrolls && box.dataset.scrollBox !== undefined) {
        box.removeAttribute('tabindex')
        delete box.dataset.scrollBox
      }
    }
  }

  function adopt(node: Element) {
    for (const box of boxesIn(node)) sizes!.observe(box)
  }
  function drop(node: Element) {
    for (const box of boxesIn(node)) sizes!.unobserve(box)
  }

  function stop() {
    mutations?.disconnect()
    sizes?.disconnect()
    if (frame) cancelAnimationFrame(frame)
    frame = 0
    changed.clear()
  }

  function measureChanged() {
    frame = 0
    const shown = [...changed].filter(box => box.checkVisibility?.({ contentVisibilityAuto: true }) ?? true)
    changed.clear()
    mark(shown)
  }
  function changedInside(node: Node) {
    const box = (node instanceof Element ? node : node.parentElement)?.closest<HTMLElement>(SCROLL_BOXES)
    if (!box) return
    changed.add(box)
    frame ||= requestAnimationFrame(measureChanged)
  }
  // a part that comes near the screen is laid out: measure the boxes in it
  function partShown(event: Event) {
    const { skipped } = event as Event & { skipped?: boolean }
    if (skipped === false && event.target instanceof Element) for (const box of boxesIn(event.target)) changedInside(box)
  }

  watch(root, (el, _old, onCleanup) => {
    stop()
    if (!el) return
    sizes = new ResizeObserver(entries => mark(entries.map(e => e.target as HTMLElement)))
    mutations = new MutationObserver((records) => {
      for (const record of records) {
        for (const node of record.removedNodes) if (node instanceof Element) drop(node)
        for (const node of record.addedNodes) if (node instanceof Element) adopt(node)
        changedInside(record.target)
      }
    })
    mutations.observe(el, { childList: true, subtree: true, characterData: true })
    el.addEventListener('contentvisibilityautostatechange', partShown, { capture: true })
    onCleanup(() => el.removeEventListener('contentvisibilityautostatechange', partShown, { capture: true }))
    adopt(el)
    requestAnimationFrame(() => mark(boxesIn(el)))
  }, { immediate: true, flush: 'post' })
  onBeforeUnmount(stop)
}
