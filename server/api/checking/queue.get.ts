export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'checker', 'admin')
  return checkQueue(user)
})
