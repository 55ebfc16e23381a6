// After any 401 or 403 from our API, re-read the user: a changed role shows at once in the navigation and
// guards, and a session that has ended (account disabled, signed out elsewhere) goes to sign-in with a note.
import { can } from '#shared/roles'

const QUIET = /^\/api\/(?:_auth\/session|auth\/login)/

export default defineNuxtPlugin(() => {
  const refresh = useSessionRefresh()
  const route = useRoute()
  let running: Promise<void> | null = null
  function afterRefusal() {
    running ??= (async () => {
      const signIn = await refresh()
      if (signIn && route.path !== '/sign-in') await navigateTo(signIn + (route.fullPath !== '/' ? `&next=${encodeURIComponent(route.fullPath)}` : ''))
      else if (route.meta.permission && !can(useUserSession().user.value?.role, route.meta.permission)) await navigateTo({ path: '/', query: { denied: route.path } })
    })().finally(() => { running = null })
  }
  globalThis.$fetch = (globalThis.$fetch as unknown as typeof import('ofetch').$fetch).create({
    onResponseError({ request, response }) {
      const url = typeof request === 'string' ? request : request instanceof Request ? new URL(request.url).pathname : String(request)
      if ((response.status === 401 || response.status === 403) && url.startsWith('/api/') && !QUIET.test(url)) afterRefusal()
    },
  }) as unknown as typeof globalThis.$fetch
})
