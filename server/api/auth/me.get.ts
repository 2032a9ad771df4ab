/** The signed-in user, with the roles they hold on projects (the screens the app offers follow them). */
export default defineEventHandler(async (event) => {
  const user = await authorize(event)
  const { accountRole: _, project: __, ...me } = user
  return { ...me, projectRoles: await projectRolesHeld(user.id) }
})
