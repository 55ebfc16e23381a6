// The zod schemas of the public API: PRODUCT.md field table, clear messages with field paths.
import { describe, expect, it } from 'vitest'
import { z } from 'zod'
import { designInputSchema, stressInputSchema } from '../../../shared/schemas/stress'

const body = { topology: 'diode-clamped', levels: 3, dcVoltage: 1100, dcVoltageMax: 1200, lineVoltageRms: 690, phaseCurrentRms: 250, powerFactor: -0.9, fundamentalHz: 50, switchingHz: 3000, modulation: 'space-vector', overshootVoltage: 80, includeWaveform: true }
const issues = (r: { success: boolean, error?: z.ZodError }) => (r.error?.issues ?? []).map(i => ({ path: i.path.join('.'), message: i.message }))

describe('stressInputSchema', () => {
  it('accepts every PRODUCT.md field and the optional extras', () => {
    const r = stressInputSchema.safeParse({ ...body, strayInductance: 50e-9, currentSlope: 1e9, clampDiodeUnitVoltage: 1200 })
    expect(r.success).toBe(true)
  })

  it.each([
    { patch: { topology: 'npc' }, path: 'topology', text: /one of/ },
    { patch: { levels: 3.5 }, path: 'levels', text: /whole number/ },
    { patch: { levels: 11 }, path: 'levels', text: /3…9/ },
    { patch: { powerFactor: -1.2 }, path: 'powerFactor', text: /at least −1/ },
    { patch: { dcVoltage: 'high' }, path: 'dcVoltage', text: /must be a number/ },
    { patch: { switchingHz: undefined }, path: 'switchingHz', text: /required/ },
    { patch: { modulation: 'six-step' }, path: 'modulation', text: /two-level/ },
    { patch: { lineVoltageRms: undefined }, path: 'lineVoltageRms', text: /required.*unless modulation is six-step/ },
    { patch: { includeWaveform: 'yes' }, path: 'includeWaveform', text: /true or false/ },
    { patch: { topology: 'matrix', inputLineVoltageRms: undefined }, path: 'inputLineVoltageRms', text: /required/ },
  ])('$path: $text', ({ patch, path, text }) => {
    const r = stressInputSchema.safeParse({ ...body, ...patch })
    expect(r.success).toBe(false)
    const found = issues(r)
    expect(found.map(i => i.path)).toContain(path)
    expect(found.find(i => i.path === path)!.message).toMatch(text)
  })

  it('six-step may leave out lineVoltageRms (it follows from the DC link)', () => {
    const r = stressInputSchema.safeParse({ ...body, topology: 'two-level', levels: 2, modulation: 'six-step', lineVoltageRms: undefined })
    expect(r.success).toBe(true)
    expect(r.data!.lineVoltageRms).toBe(0)
  })
})

describe('designInputSchema', () => {
  const point = { name: 'Rated', lineVoltageRms: 400, phaseCurrentRms: 100, powerFactor: 0.9, fundamentalHz: 50 }
  const design = { machineSide: { topology: 'two-level', dcVoltage: 700, switchingHz: 4000, modulation: 'sine', operatingPoints: [point] } }

  it('accepts a design with grid side and partial derating', () => {
    const r = designInputSchema.safeParse({ ...design, gridSide: { topology: 'two-level', switchingHz: 4000, modulation: 'sine', operatingPoints: [{ ...point, powerFactor: -0.95 }] }, derating: { semiconductorVoltageUtilisation: 0.6 }, capacitorRippleTarget: 10 })
    expect(r.success).toBe(true)
  })

  it.each([
    { input: { ...design, machineSide: { ...design.machineSide, operatingPoints: [] } }, path: 'machineSide.operatingPoints' },
    { input: { ...design, machineSide: { ...design.machineSide, operatingPoints: Array.from({ length: 51 }, (_, k) => ({ ...point, name: `p${k}` })) } }, path: 'machineSide.operatingPoints' },
    { input: { ...design, machineSide: { ...design.machineSide, operatingPoints: [{ ...point, name: '' }] } }, path: 'machineSide.operatingPoints.0.name' },
    { input: { ...design, machineSide: { ...design.machineSide, operatingPoints: [point, point] } }, path: 'machineSide.operatingPoints.1.name' },
    { input: { ...design, derating: { capacitorRippleUtilisation: 0 } }, path: 'derating.capacitorRippleUtilisation' },
    { input: { ...design, gridSide: { ...design.machineSide, topology: 'anpc' } }, path: 'gridSide.topology' },
    { input: { ...design, machineSide: { ...design.machineSide, levels: 3 } }, path: 'machineSide.levels' },
    { input: { ...design, machineSide: { ...design.machineSide, switchingHz: 1000, operatingPoints: [{ ...point, fundamentalHz: 1500 }] } }, path: 'machineSide.switchingHz' },
    { input: { ...design, machineSide: { ...design.machineSide, operatingPoints: [{ ...point, fundamentalHz: 5000 }] } }, path: 'machineSide.operatingPoints.0.fundamentalHz' },
    { input: { ...design, machineSide: { ...design.machineSide, operatingPoints: [{ ...point, powerFactorSense: 'capacitive' }] } }, path: 'machineSide.operatingPoints.0.powerFactorSense' },
  ])('refuses at $path', ({ input, path }) => {
    const r = designInputSchema.safeParse(input)
    expect(r.success).toBe(false)
    expect(issues(r).map(i => i.path)).toContain(path)
  })

  it('can be described as JSON schema for the API document', () => {
    expect(() => z.toJSONSchema(stressInputSchema, { target: 'openapi-3.0', io: 'input', unrepresentable: 'any' })).not.toThrow()
    expect(() => z.toJSONSchema(designInputSchema, { target: 'openapi-3.0', io: 'input', unrepresentable: 'any' })).not.toThrow()
  })
})
