// Sign-in throttling: after MAX_FAILURES failed attempts for one e-mail (or from one address)
// within WINDOW_MS, further attempts get 429 until the window passes. In memory: one server process.
const MAX_FAILURES = 5
const MAX_FAILURES_PER_IP = 30
const WINDOW_MS = 15 * 60 * 1000
const failures = new Map<string, number[]>()

function recent(key: string, now: number) {
  const list = (failures.get(key) ?? []).filter(t => now - t < WINDOW_MS)
  failures.set(key, list)
  return list
}

/** Seconds until another attempt is allowed, or 0. */
export function signInBlockedFor(email: string, ip: string): number {
  const now = Date.now()
  const byEmail = recent(`e:${email}`, now)
  const byIp = recent(`i:${ip}`, now)
  const blocked = byEmail.length >= MAX_FAILURES ? byEmail : byIp.length >= MAX_FAILURES_PER_IP ? byIp : null
  return blocked ? Math.ceil((blocked[0]! + WINDOW_MS - now) / 1000) : 0
}

export function recordSignInFailure(email: string, ip: string) {
  const now = Date.now()
  recent(`e:${email}`, now).push(now)
  recent(`i:${ip}`, now).push(now)
}

export function clearSignInFailures(email: string) {
  failures.delete(`e:${email}`)
}
