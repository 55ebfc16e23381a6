import { readdirSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import { beforeAll, describe, expect, it } from 'vitest'
import { can, roles, type Role } from '../../shared/roles'
import { client, signInAs, type Client } from '../support/api'
import { routeTable } from './route-table'

const apiDir = new URL('../../server/api', import.meta.url).pathname

function routeFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const p = join(dir, name)
    return statSync(p).isDirectory() ? routeFiles(p) : [relative(apiDir, p)]
  })
}

describe('role matrix', () => {
  const clients = {} as Record<Role, Client>
  beforeAll(async () => {
    for (const role of roles) clients[role] = await signInAs(role)
  })

  it('lists every route file of server/api', () => {
    const listed = new Set(routeTable.map(r => r.file))
    expect(routeFiles(apiDir).filter(f => !listed.has(f))).toEqual([])
  })

  for (const route of routeTable) {
    describe(`${route.method} ${route.path}`, () => {
      it('signed out: 401 unless public', async () => {
        const r = await client().request(route.method, route.path, route.body)
        if (route.access === 'public') expect(r.status).not.toBe(401)
        else expect(r.status).toBe(401)
        expect(r.status).toBeLessThan(500)
      })
      for (const role of roles) {
        const allowed = route.access === 'public' || route.access === 'signed-in' || can(role, route.access)
        it(`${role}: ${allowed ? 'allowed' : '403'}`, async () => {
          // Sign-out ends the session server-side (every copy of the cookie): it gets a session of its own.
          const c = route.file === 'auth/logout.post.ts' ? await signInAs(role) : client(clients[role].cookie)
          const r = await c.request(route.method, route.path, route.body)
          if (allowed) expect([401, 403]).not.toContain(r.status)
          else expect(r.status).toBe(403)
          expect(r.status).toBeLessThan(500)
        })
      }
    })
  }
})
