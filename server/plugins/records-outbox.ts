/**
 * Sends the outbox without an operator: runs the outbox:send task every few seconds (runTask
 * never runs the same task twice at once). Stops when the server closes.
 */
export default defineNitroPlugin((nitroApp) => {
  if (import.meta.prerender) return
  const timer = setInterval(() => {
    runTask('outbox:send').catch((error: unknown) => {
      console.error('[outbox] run failed:', error instanceof Error ? error.message : error)
    })
  }, 2_000)
  timer.unref()
  nitroApp.hooks.hook('close', () => clearInterval(timer))
})
