import type { Role } from '../shared/types/roles'

declare module '#app' {
  interface PageMeta {
    /** roles that may open the page; the server checks again on every request */
    roles?: Role[]
    /** a page that needs no sign-in */
    public?: boolean
  }
}

export default defineNuxtRouteMiddleware(async (to) => {
  if (to.meta.public) return
  const { loggedIn, user } = useUserSession()
  if (!loggedIn.value) {
    return navigateTo({ path: '/signin', query: to.fullPath !== '/' ? { next: to.fullPath } : {} })
  }
  const roles = to.meta.roles
  if (roles && user.value && !roles.includes(user.value.role)) {
    throw createError({ statusCode: 403, statusMessage: 'Not for your role', message: `This page is for the ${roles.join(' or ')} role.` , fatal: true })
  }
})
