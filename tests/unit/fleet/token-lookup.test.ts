// A busy API client whose cached token owner just expired: the requests that miss at once share one query
// (they would otherwise take every pool connection), but a request that starts after a change to the owner
// (authChanged: revoke, disable, role) never joins a lookup that started before it.
import { beforeAll, describe, expect, it, vi } from 'vitest'
import type { H3Event } from 'h3'

interface Pending { resolve: (rows: unknown[]) => void }
const tokenQueries: Pending[] = []
const db = {
  $client: { listen: (_channel: string, _onNotify: unknown, onListen: () => void) => { onListen(); return Promise.resolve() } },
  execute: (query: { queryChunks?: unknown[] }) => {
    const text = JSON.stringify(query.queryChunks ?? '')
    if (!text.includes('api_tokens')) return Promise.resolve([]) // pg_notify of authChanged
    return new Promise<unknown[]>(resolve => tokenQueries.push({ resolve }))
  },
}
vi.stubGlobal('useDb', () => db)
vi.stubGlobal('getHeader', (event: { headers: Record<string, string> }, name: string) => event.headers[name])

let currentUser: typeof import('../../../server/utils/auth').currentUser
let authChanged: typeof import('../../../server/utils/auth-cache').authChanged
beforeAll(async () => {
  ({ currentUser } = await import('../../../server/utils/auth'))
  ;({ authChanged } = await import('../../../server/utils/auth-cache'))
})

const request = (token: string) => ({ path: '/api/v1/stress', headers: { authorization: `Bearer ${token}` }, context: {} }) as unknown as H3Event
const owner = { id: 7, email: 'engineer@example.com', name: 'E', role: 'design-engineer', disabled: false, locale: null }
const settle = () => new Promise(r => setTimeout(r, 0))

describe('token owner lookups', () => {
  it('shares one query among the requests that miss the cache at the same moment', async () => {
    const calls = Array.from({ length: 20 }, () => currentUser(request('token-a')))
    await settle()
    expect(tokenQueries).toHaveLength(1)
    tokenQueries.shift()!.resolve([owner])
    const users = await Promise.all(calls)
    expect(users.every(u => u?.id === 7 && u.role === 'design-engineer')).toBe(true)
    // and the owner is cached now: no query at all
    expect((await currentUser(request('token-a')))?.id).toBe(7)
    expect(tokenQueries).toHaveLength(0)
  })

  it('does not let a request that starts after a change join a lookup that started before it', async () => {
    const before = currentUser(request('token-b'))
    await settle()
    expect(tokenQueries).toHaveLength(1)
    await authChanged(7) // e.g. the token was revoked (committed) while that lookup ran
    const after = currentUser(request('token-b'))
    await settle()
    expect(tokenQueries).toHaveLength(2)
    tokenQueries[0]!.resolve([owner]) // read before the revocation
    tokenQueries[1]!.resolve([]) // read after it: no such token
    tokenQueries.length = 0
    expect((await before)?.id).toBe(7)
    expect(await after).toBeNull()
    // what the older lookup read was not kept: the next request asks again
    const next = currentUser(request('token-b'))
    await settle()
    expect(tokenQueries).toHaveLength(1)
    tokenQueries.shift()!.resolve([])
    expect(await next).toBeNull()
  })

  it('a failed lookup fails every request that shared it, and the next one asks again', async () => {
    const calls = [currentUser(request('token-c')), currentUser(request('token-c'))]
    await settle()
    expect(tokenQueries).toHaveLength(1)
    const failing = tokenQueries.shift()! as unknown as { resolve: (v: unknown) => void }
    // a rejected query (database unreachable)
    failing.resolve(Promise.reject(Object.assign(new Error('connect ECONNREFUSED'), { code: 'ECONNREFUSED' })))
    for (const c of calls) await expect(c).rejects.toThrow(/ECONNREFUSED/)
    const again = currentUser(request('token-c'))
    await settle()
    expect(tokenQueries).toHaveLength(1)
    tokenQueries.shift()!.resolve([owner])
    expect((await again)?.id).toBe(7)
  })
})
