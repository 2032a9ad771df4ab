/** The history log's latest signed head and the heads published before it (records register). */
export default defineEventHandler(async (event) => {
  await authorize(event)
  return logRegister()
})
