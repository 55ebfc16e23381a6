import { readdirSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import { beforeAll, describe, expect, it } from 'vitest'
import { can, restrictedFields, roles, sees, type Role } from '../../shared/roles'
import { client, signInAs, type Client } from '../support/api'
import { expectedFor, routeTable } from './route-table'

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
          if (allowed) expect(expectedFor(route), `${route.method} ${route.path} as ${role}: ${r.status}`).toContain(r.status)
          else expect(r.status).toBe(403)
          expect(r.status).toBeLessThan(500)
        })
      }
    })
  }
})

// Which fields each role receives (shared/roles.ts restrictedFields), not only the status code.
describe('fields each role receives', () => {
  const input = {
    machineSide: {
      topology: 'two-level', levels: 2, dcVoltage: 650, dcVoltageMax: 750, switchingHz: 6000, modulation: 'space-vector', overshootVoltage: 60,
      operatingPoints: [{ name: 'Rated', lineVoltageRms: 400, phaseCurrentRms: 120, powerFactor: 0.9, fundamentalHz: 50 }],
    },
  }
  let designId = 0
  let bomId = 0
  let lineKey = ''
  beforeAll(async () => {
    const eng = await signInAs('design-engineer')
    const design = await eng.json('POST', '/api/designs', { name: `fields-${Date.now()}`, input })
    designId = design.body.id
    for (const p of (await eng.json('GET', `/api/designs/${designId}/parts`)).body.positions) {
      const c = p.candidates[0]
      await eng.json('PUT', `/api/designs/${designId}/parts`, { side: p.side, position: p.position, partVersionId: c.partVersionId, seriesCount: c.seriesCount, parallelCount: c.parallelCount })
    }
    const released = await eng.json('POST', `/api/designs/${designId}/bom/release`)
    bomId = released.body.id
    const buyer = await signInAs('purchasing')
    const bom = await buyer.json('GET', `/api/boms/${bomId}`)
    lineKey = bom.body.snapshot.lines[0].key
    await buyer.json('PUT', `/api/boms/${bomId}/lines/${encodeURIComponent(lineKey)}`, { supplier: 'Field Check Supplier', orderReference: 'PO-FIELDS', status: 'quoted' })
  })

  for (const role of roles) {
    it(`${role}: released BOM ${sees(role, 'purchase') ? 'with' : 'without'} purchasing's fields`, async () => {
      const r = await client((await signInAs(role)).cookie).json('GET', `/api/boms/${bomId}`)
      if (!can(role, 'bom:read')) return expect(r.status).toBe(403)
      expect(r.status).toBe(200)
      const entry = r.body.purchase[lineKey] ?? {}
      for (const field of restrictedFields.purchase.purchaseEntry) {
        if (sees(role, 'purchase') && ['supplier', 'orderReference', 'status'].includes(field)) expect(entry, field).toHaveProperty(field)
        if (!sees(role, 'purchase')) expect(entry, field).not.toHaveProperty(field)
      }
      const supplierShown = r.body.snapshot.lines.some((l: { supplier: string | null }) => l.supplier)
      expect(supplierShown).toBe(sees(role, 'purchase'))
    })

    it(`${role}: a design's parts ${sees(role, 'catalogue') ? 'with' : 'without'} catalogue data`, async () => {
      const r = await client((await signInAs(role)).cookie).json('GET', `/api/designs/${designId}/parts`)
      if (!can(role, 'designs:read')) return expect(r.status).toBe(403)
      expect(r.status).toBe(200)
      for (const p of r.body.positions) {
        for (const field of restrictedFields.catalogue.position) {
          if (sees(role, 'catalogue')) expect(p, field).toHaveProperty(field)
          else expect(p, field).not.toHaveProperty(field)
        }
        for (const field of restrictedFields.catalogue.evaluation) {
          if (!sees(role, 'catalogue')) expect(p.assigned.evaluation ?? {}, field).not.toHaveProperty(field)
        }
        if (!sees(role, 'catalogue')) expect(p.assigned.part).not.toHaveProperty('priceBreaks')
      }
    })
  }
})
