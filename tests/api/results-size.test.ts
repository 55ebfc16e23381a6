// Issue 14 item 7 and issue 10 item 7: an edit's answer carries what the visible panels need (under 60 kB for an
// NPC design with three operating points), the waveform of a chosen point, every sample on request; the parts
// page's HTML stays under 150 kB for every demo design, with the rest of the candidates on request.
import { describe, expect, it } from 'vitest'
import { signInAs } from '../support/api'

const npcThreePoints = {
  machineSide: {
    topology: 'diode-clamped', levels: 3, dcVoltage: 1100, dcVoltageMax: 1250, switchingHz: 4000, modulation: 'space-vector', overshootVoltage: 100,
    operatingPoints: [
      { name: 'Rated motoring', lineVoltageRms: 690, phaseCurrentRms: 390, powerFactor: 0.86, fundamentalHz: 50 },
      { name: 'Regenerative braking', lineVoltageRms: 690, phaseCurrentRms: 300, powerFactor: -0.8, fundamentalHz: 50 },
      { name: 'Low-frequency start', lineVoltageRms: 70, phaseCurrentRms: 450, powerFactor: 0.3, fundamentalHz: 5 },
    ],
  },
}

/** Bytes of the decoded answer body (what the page parses; the wire may be compressed further). */
async function sized(r: Response) {
  const bytes = new Uint8Array(await r.arrayBuffer())
  return { status: r.status, bytes: bytes.byteLength, text: new TextDecoder().decode(bytes) }
}

describe('the design results answer', () => {
  it('an edit of an NPC design with three operating points answers in under 60 kB, with the panels\' data', async () => {
    const api = await signInAs('design-engineer')
    const r = await sized(await api.request('POST', '/api/designs/preview', npcThreePoints))
    expect(r.status).toBe(200)
    console.log(`preview answer: ${r.bytes} bytes`)
    expect(r.bytes).toBeLessThan(60_000)
    const body = JSON.parse(r.text)
    expect(body.result.converters[0].points).toHaveLength(3)
    expect(body.result.converters[0].envelope.devices[0].provenance.method).toMatch(/\w/)
    const m = body.extras.machine
    expect(m).toMatchObject({ pointName: 'Rated motoring', pointIndex: 0, resolution: 'decimated' })
    expect(m.waveform.time.length).toBeLessThan(m.samples)
    expect(m.spectrum[0].order).toBe(1)
  })

  it('every sample on request; another operating point\'s waveform by its index; a point the design lacks is refused', async () => {
    const api = await signInAs('viewer')
    const full = await api.json('POST', '/api/designs/preview?resolution=full', npcThreePoints)
    expect(full.status).toBe(200)
    expect(full.body.extras.machine.resolution).toBe('full')
    expect(full.body.extras.machine.waveform.time.length).toBe(full.body.extras.machine.samples)

    const start = await api.json('POST', '/api/designs/preview?machinePoint=2', npcThreePoints)
    expect(start.status).toBe(200)
    expect(start.body.extras.machine).toMatchObject({ pointName: 'Low-frequency start', pointIndex: 2 })
    expect(start.body.extras.machine.spectrum.find((l: { order: number }) => l.order === 1).frequency).toBe(5)

    const missing = await api.json('POST', '/api/designs/preview?machinePoint=3', npcThreePoints)
    expect(missing.status).toBe(422)
    expect(missing.body.message).toMatch(/^Operating point shown: the converter has 3 operating points/)
    const wrong = await api.json('POST', '/api/designs/preview?resolution=huge', npcThreePoints)
    expect(wrong.status).toBe(400)
  })

  it('a saved design\'s results take the same choices', async () => {
    const api = await signInAs('design-engineer')
    const list = await api.json('GET', '/api/designs')
    const npc = (list.body as { id: number, name: string }[]).find(d => d.name === 'Pump drive 690 V / 400 kW')!
    const r = await sized(await api.request('GET', `/api/designs/${npc.id}/results?machinePoint=1`))
    expect(r.status).toBe(200)
    expect(r.bytes).toBeLessThan(60_000)
    expect(JSON.parse(r.text).extras.machine.pointName).toBe('Regenerative braking')
  })
})

describe('the parts page', () => {
  it('is under 150 kB of HTML for every demo design, with the best 4 candidates per position on the page and more on request', async () => {
    const api = await signInAs('design-engineer')
    const list = await api.json('GET', '/api/designs')
    const demo = (list.body as { id: number, name: string }[]).filter(d => /Pump drive|Dynamometer|MV fan|Battery inverter/.test(d.name))
    expect(demo.length).toBeGreaterThanOrEqual(4)
    const sizes: Record<string, number> = {}
    for (const d of demo) {
      const page = await sized(await api.request('GET', `/designs/${d.id}/parts`))
      expect(page.status).toBe(200)
      sizes[d.name] = page.bytes
      expect(page.text).toContain('Parts for every position')
      expect(page.bytes, d.name).toBeLessThan(150_000)
    }
    console.log('parts page HTML bytes', sizes)

    const largest = demo.find(d => sizes[d.name] === Math.max(...Object.values(sizes)))!
    const top = await api.json('GET', `/api/designs/${largest.id}/parts?limit=5`)
    const more = await api.json('GET', `/api/designs/${largest.id}/parts?limit=50`)
    type P = { position: string, side: string, candidates: unknown[], fitting: number }
    for (const p of top.body.positions as P[]) {
      expect(p.candidates.length).toBeLessThanOrEqual(5)
      expect(p.candidates.length).toBe(Math.min(5, p.fitting))
      const wider = (more.body.positions as P[]).find(x => x.position === p.position && x.side === p.side)!
      expect(wider.candidates.length).toBe(Math.min(50, p.fitting))
      // The first five of the longer list are the same five, in the same order.
      expect(wider.candidates.slice(0, p.candidates.length)).toEqual(p.candidates)
    }
  })
})
