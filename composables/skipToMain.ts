/**
 * The skip link's action: focus the main content (and bring it into view) without a fragment
 * navigation. Following `#main` as a link would go through the router, which renders the page
 * again (on an error page it clears and shows the error anew) and can take the focus back away.
 */
export function skipToMain(event: MouseEvent) {
  const main = document.getElementById('main')
  if (!main) return
  event.preventDefault()
  main.focus({ preventScroll: true })
  main.scrollIntoView({ block: 'start' })
}
