export default defineEventHandler(async (event) => {
  const user = await authorize(event)
  return listProjects(user.id)
})
