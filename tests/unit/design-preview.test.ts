// Issue 14 item 7 and issue 10 item 7: the design page's results answer carries what the visible panels need
// (decimated waveform, rounded figures) and the waveform of the operating point the user chose.
import { beforeAll, describe, expect, it, vi } from 'vitest'
import type { DesignInput } from '#shared/engine/types'
import { decimationIndices } from '#shared/utils/decimate'

// The Nitro auto-imports the service reaches (the worker bundle gets the same stand-ins).
vi.stubGlobal('withEngine', <T>(f: () => T) => f())
vi.stubGlobal('createError', (e: { statusCode: number, message: string, data?: unknown }) => Object.assign(new Error(e.message), e))

let previewDesign: typeof import('~~/server/services/designs').previewDesign
beforeAll(async () => { ({ previewDesign } = await import('~~/server/services/designs')) })

const npc: DesignInput = {
  machineSide: {
    topology: 'diode-clamped', levels: 3, dcVoltage: 1100, dcVoltageMax: 1250, switchingHz: 4000, modulation: 'space-vector', overshootVoltage: 100,
    operatingPoints: [
      { name: 'Rated motoring', lineVoltageRms: 690, phaseCurrentRms: 390, powerFactor: 0.86, fundamentalHz: 50 },
      { name: 'Regenerative braking', lineVoltageRms: 690, phaseCurrentRms: 300, powerFactor: -0.8, fundamentalHz: 50 },
      { name: 'Low-frequency start', lineVoltageRms: 70, phaseCurrentRms: 450, powerFactor: 0.3, fundamentalHz: 5 },
    ],
  },
}
const peak = (v: number[]) => Math.max(...v.map(Math.abs))

describe('compact design preview', () => {
  it('an NPC design with three operating points answers in under 60 kB, the full answer is several times larger', () => {
    const compact = JSON.stringify(previewDesign(npc, { compact: true }))
    const full = JSON.stringify(previewDesign(npc))
    expect(compact.length).toBeLessThan(60_000)
    expect(full.length).toBeGreaterThan(3 * compact.length)
  })

  it('keeps every figure the tables show to 6 significant digits and the envelope provenance', () => {
    const full = previewDesign(npc).result.converters[0]!
    const compact = previewDesign(npc, { compact: true }).result.converters[0]!
    for (const [i, d] of full.envelope.devices.entries()) {
      const c = compact.envelope.devices[i]!
      expect(c.provenance).toEqual(d.provenance)
      expect(c.currentRms).toBeCloseTo(d.currentRms, 2)
      expect(c.requiredVoltageRating).toBeCloseTo(d.requiredVoltageRating!, 2)
    }
    expect(compact.points[1]!.devices[0]!.currentRms).toBeCloseTo(full.points[1]!.devices[0]!.currentRms, 2)
    expect(compact.points[1]!.devices[0]).not.toHaveProperty('provenance')
  })

  it('the decimated waveform keeps the extremes of every series; full resolution keeps every sample', () => {
    const full = previewDesign(npc, { compact: true, resolution: 'full' }).extras.machine!
    const slim = previewDesign(npc, { compact: true }).extras.machine!
    expect(full.resolution).toBe('full')
    expect(full.waveform!.time.length).toBe(full.samples)
    expect(slim.resolution).toBe('decimated')
    expect(slim.waveform!.time.length).toBeLessThanOrEqual(1200)
    expect(slim.waveform!.time.length).toBeLessThan(full.samples)
    for (const series of ['lineVoltage', 'poleVoltage', 'phaseCurrent'] as const) {
      expect(peak(slim.waveform![series])).toBeCloseTo(peak(full.waveform![series]), -1)
    }
    // Independent check of the bucket rule: the indices hold each series' overall minimum and maximum.
    const w = full.waveform!
    const picked = decimationIndices(w.time.length, [w.lineVoltage], 200)
    const values = picked.map(i => w.lineVoltage[i]!)
    expect(Math.max(...values)).toBe(Math.max(...w.lineVoltage))
    expect(Math.min(...values)).toBe(Math.min(...w.lineVoltage))
  })

  it('the waveform and spectrum of the chosen operating point, not the first', () => {
    const first = previewDesign(npc, { compact: true }).extras.machine!
    const start = previewDesign(npc, { compact: true, machinePoint: 2 }).extras.machine!
    expect(start.pointName).toBe('Low-frequency start')
    expect(start.pointIndex).toBe(2)
    // 5 Hz: the period is 200 ms instead of 20 ms; the fundamental line sits at 5 Hz.
    expect(start.waveform!.time.at(-1)!).toBeGreaterThan(0.15)
    expect(first.waveform!.time.at(-1)!).toBeLessThan(0.021)
    expect(start.spectrum!.find(l => l.order === 1)!.frequency).toBe(5)
    expect(peak(start.waveform!.phaseCurrent)).toBeGreaterThan(peak(first.waveform!.phaseCurrent))
  })

  it('refuses a point the design does not have, naming the field', () => {
    expect(() => previewDesign(npc, { compact: true, machinePoint: 3 })).toThrow(/Operating point shown/)
  })
})
