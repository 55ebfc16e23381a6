// Pages need a session, except the sign-in and password pages; a page that names a permission
// (definePageMeta({ permission })) sends other roles home with a note instead of a broken page.
// Every client-side navigation first re-reads the user from the server, so a role change applies at once
// and a disabled account's open tab goes to sign-in.
import { can, type Permission } from '#shared/roles'

const publicPages = new Set(['/sign-in', '/set-password', '/forgot-password'])

declare module '#app' {
  interface PageMeta {
    permission?: Permission
  }
}

export default defineNuxtRouteMiddleware(async (to) => {
  const { loggedIn, user, session } = useUserSession()
  // the server has just read the session for the first render: no second request while hydrating
  if (import.meta.client && !useNuxtApp().isHydrating && loggedIn.value) {
    const signIn = await useSessionRefresh()()
    if (signIn && !publicPages.has(to.path)) return navigateTo(signIn + (to.fullPath !== '/' ? `&next=${encodeURIComponent(to.fullPath)}` : ''))
  }
  if (!loggedIn.value && !publicPages.has(to.path)) {
    // a page (re)loaded with a cookie whose session has ended says why, as an open tab does
    const ended = (session.value as { ended?: string } | null)?.ended
    return navigateTo({ path: '/sign-in', query: { ...(ended ? { ended } : {}), ...(to.fullPath !== '/' ? { next: to.fullPath } : {}) } })
  }
  const permission = to.meta.permission
  if (permission && !can(user.value?.role, permission)) {
    return navigateTo({ path: '/', query: { denied: to.path } })
  }
})
