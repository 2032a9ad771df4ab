/**
 * Formulas, tables and code that are wider than their box scroll inside it; a box that scrolls
 * joins the tab order (tabindex 0), so the keyboard can scroll it too (WCAG 2.1.1). Watches the
 * element's content as it is re-rendered and its width as the window changes.
 */
const SCROLL_BOXES = '.tb-math, table, pre, .tb-overview, .katex-display, .overflow-x-auto'

export function useScrollBoxes(root: Ref<HTMLElement | null | undefined>) {
  let mutations: MutationObserver | undefined
  let sizes: ResizeObserver | undefined
  let pending = false

  function mark() {
    pending = false
    const el = root.value
    if (!el) return
    for (const box of el.querySelectorAll<HTMLElement>(SCROLL_BOXES)) {
      const scrolls = box.scrollWidth > box.clientWidth + 1 && getComputedStyle(box).overflowX !== 'visible'
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
  function schedule() {
    if (pending) return
    pending = true
    requestAnimationFrame(mark)
  }

  watch(root, (el) => {
    mutations?.disconnect()
    sizes?.disconnect()
    if (!el) return
    mutations = new MutationObserver(schedule)
    mutations.observe(el, { childList: true, subtree: true })
    sizes = new ResizeObserver(schedule)
    sizes.observe(el)
    schedule()
  }, { immediate: true, flush: 'post' })
  onBeforeUnmount(() => {
    mutations?.disconnect()
    sizes?.disconnect()
  })
}
