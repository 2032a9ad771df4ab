/** The shared Chromium goes with the server. */
export default defineNitroPlugin((nitroApp) => {
  nitroApp.hooks.hook('close', () => closeBrowser())
})
