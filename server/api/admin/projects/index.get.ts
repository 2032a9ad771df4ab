/** Every project and who works on it, for the administrator who assigns people. */
export default defineEventHandler(async (event) => {
  await authorize(event)
  return projectsWithMembers()
})
