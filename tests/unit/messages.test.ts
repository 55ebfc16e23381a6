import { describe, expect, it } from 'vitest'
import { designInputSchema } from '../../shared/schemas/stress'
import { loginSchema } from '../../shared/schemas/auth'
import { plainIssues, plainMessage, plainSummary } from '../../shared/schemas/messages'
import { blankDesignInput } from './support/blank-design'

// Every message names the field by the label the form shows and says what to do; no machine key is left in it.
const MACHINE_KEYS = /\b(powerFactor|phaseCurrentRms|lineVoltageRms|fundamentalHz|dcVoltage(Max)?|switchingHz|overshootVoltage|[a-z]+Utilisation|junctionMarginC|heatsinkTemperatureC)\b|Too small|Too big|expected number/

function issuesFor(input: unknown) {
  const r = designInputSchema.safeParse(input)
  if (r.success) throw new Error('accepted')
  return plainIssues(r.error.issues.map(i => ({ path: i.path.join('.'), message: i.message })))
}

describe('validation messages in plain words', () => {
  it('a power factor above 1 names "Power factor" and what to enter', () => {
    const input = blankDesignInput()
    input.machineSide.operatingPoints[0]!.powerFactor = 1.2
    const [issue] = issuesFor(input)
    expect(issue).toEqual({ path: 'machineSide.operatingPoints.0.powerFactor', message: 'Power factor must be at most 1: enter that or less.' })
    expect(plainSummary(issue, '')).toBe('Operating point 1: Power factor must be at most 1: enter that or less.')
  })

  it('each field error of the design form is free of machine keys and zod wording', () => {
    const input = blankDesignInput() as unknown as Record<string, Record<string, unknown>>
    Object.assign(input.machineSide!, { dcVoltage: -5, switchingHz: 'fast', overshootVoltage: -1 })
    ;(input.machineSide!.operatingPoints as Record<string, unknown>[])[0]!.phaseCurrentRms = -3
    input.derating = { semiconductorVoltageUtilisation: 1.5, heatsinkTemperatureC: 200 }
    const issues = issuesFor(input)
    expect(issues.length).toBeGreaterThanOrEqual(6)
    for (const i of issues) {
      expect(i.message, i.path).not.toMatch(MACHINE_KEYS)
      expect(i.message, i.path).toMatch(/: (enter|fill|choose|give|use)/)
    }
    const byPath = Object.fromEntries(issues.map(i => [i.path, i.message]))
    expect(byPath['machineSide.dcVoltage']).toBe('DC link, nominal must be at least 1 V: enter that or more.')
    expect(byPath['machineSide.switchingHz']).toBe('Switching frequency must be a number: enter a value in Hz.')
    expect(byPath['derating.semiconductorVoltageUtilisation']).toBe('Semiconductor voltage use must be at most 100 %: enter that or less.')
    expect(byPath['derating.heatsinkTemperatureC']).toBe('Heatsink temperature must be at most 150 °C: enter that or less.')
  })

  it('a bound with its own unit is said once (input limits of the engine)', () => {
    expect(plainMessage('machineSide.dcVoltage', 'dcVoltage must be at most 100 kV (V, nominal DC link; per cell for cascaded-h-bridge)')).toBe('DC link, nominal must be at most 100 kV: enter that or less.')
    expect(plainMessage('machineSide.dcVoltage', 'dcVoltage must be at most 1000 (V, nominal DC link)')).toBe('DC link, nominal must be at most 1000 V: enter that or less.')
  })

  it('zod\'s own wording is rewritten (sign-in form)', () => {
    const r = loginSchema.safeParse({ email: 'x', password: '' })
    expect(r.success).toBe(false)
    if (r.success) return
    for (const i of plainIssues(r.error.issues.map(i => ({ path: i.path.join('.'), message: i.message })))) {
      expect(i.message).not.toMatch(MACHINE_KEYS)
      expect(i.message).toMatch(/(e-mail|password)/i)
      expect(i.message).toMatch(/enter/i)
    }
  })

  it('the engine\'s messages name labels too', () => {
    expect(plainMessage('machineSide.dcVoltageMax', 'dcVoltageMax must be at least dcVoltage (V, worst-case DC link)'))
      .toBe('DC link, worst case must be at least “DC link, nominal”: enter that or more.')
    expect(plainMessage('machineSide.switchingHz', 'switchingHz must be above fundamentalHz for PWM (switching-period averaging needs f_sw ≫ f)'))
      .not.toMatch(MACHINE_KEYS)
    expect(plainMessage('x', 'Too small: expected number to be >=0')).toBe('X must be at least 0: enter 0 or more.')
  })
})
