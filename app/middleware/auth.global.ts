// Pages need a session, except the sign-in and password pages.
const publicPages = new Set(['/sign-in', '/set-password', '/forgot-password'])

export default defineNuxtRouteMiddleware((to) => {
  const { loggedIn } = useUserSession()
  if (!loggedIn.value && !publicPages.has(to.path)) {
    return navigateTo({ path: '/sign-in', query: to.fullPath !== '/' ? { next: to.fullPath } : {} })
  }
})
