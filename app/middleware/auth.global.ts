// Pages need a session, except the sign-in and password pages; a page that names a permission
// (definePageMeta({ permission })) sends other roles home with a note instead of a broken page.
import { can, type Permission } from '#shared/roles'

const publicPages = new Set(['/sign-in', '/set-password', '/forgot-password'])

declare module '#app' {
  interface PageMeta {
    permission?: Permission
  }
}

export default defineNuxtRouteMiddleware((to) => {
  const { loggedIn, user } = useUserSession()
  if (!loggedIn.value && !publicPages.has(to.path)) {
    return navigateTo({ path: '/sign-in', query: to.fullPath !== '/' ? { next: to.fullPath } : {} })
  }
  const permission = to.meta.permission
  if (permission && !can(user.value?.role, permission)) {
    return navigateTo({ path: '/', query: { denied: to.path } })
  }
})
