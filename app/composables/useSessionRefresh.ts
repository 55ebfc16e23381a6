/**
 * Re-reads the signed-in user from the server (role, name; disabled ends the session). When a session that
 * was signed in has ended, returns where to go: the sign-in page with a note saying why.
 */
export function useSessionRefresh() {
  const { loggedIn, session, fetch } = useUserSession()
  return async function refresh(): Promise<string | null> {
    const wasSignedIn = loggedIn.value
    await fetch()
    if (!wasSignedIn || loggedIn.value) return null
    const ended = (session.value as { ended?: string } | null)?.ended === 'disabled' ? 'disabled' : 'ended'
    return `/sign-in?ended=${ended}`
  }
}
