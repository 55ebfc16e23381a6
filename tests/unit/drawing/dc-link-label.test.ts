// The DC link drawn on the leg schematic agrees with the capacitor table: the flying-capacitor leg draws its link
// string (the table's Cdc row: N − 1 units of one level step each) as one capacitor across DC+ and DC−, so its
// label gives the voltage across the whole link and the units in series; split links label each capacitor alone.
import { describe, expect, it } from 'vitest'
import { capacitorStressText } from '../../../shared/drawing/leg'
import { legSchematicSvg } from '../../../shared/drawing/leg-svg'
import { evaluateStress, legLayout, type StressInput, type TopologyId } from '../../../shared/engine'
import { formatSi } from '../../../shared/utils/format'

/** 1100 V nominal, 1200 V worst-case link; modulation index 0.8. */
function input(topology: TopologyId, levels: number): StressInput {
  return {
    topology, levels, dcVoltage: 1100, dcVoltageMax: 1200,
    lineVoltageRms: (0.8 * 550 * Math.sqrt(3)) / Math.SQRT2, phaseCurrentRms: 250, powerFactor: 0.9,
    fundamentalHz: 50, switchingHz: 3000, modulation: 'sine',
  }
}

const volts = (v: number) => formatSi(v, 'V', 3)
const amperes = (a: number) => formatSi(a, 'A', 3)

/** The texts of the SVG's <text> elements, tspans joined by a space. */
function texts(svg: string): string[] {
  return [...svg.matchAll(/<text[^>]*>(.*?)<\/text>/g)].map(m => m[1]!.replace(/<tspan[^>]*>/g, ' ').replace(/<\/tspan>/g, '').replace(/\s+/g, ' ').trim())
}

describe('the flying-capacitor leg\'s DC-link label', () => {
  // The link of an N-level flying-capacitor leg holds the whole V_dc, the flying capacitor k the k-th level step
  // V_dc·k/(N−1): Meynard, Foch, IEEE PESC 1992; Rodríguez, Lai, Peng, IEEE TIE 49(4) 2002.
  it.each([3, 4, 5, 9])('N = %i: the drawn Cdc stands for the table\'s units in series and is labelled with the whole link', (levels) => {
    const layout = legLayout('flying-capacitor', levels)
    const result = evaluateStress(input('flying-capacitor', levels))
    const row = result.capacitors.find(c => c.name === 'Cdc')!
    const drawn = layout.items.find(i => i.name === 'Cdc')!
    // the table: N − 1 units of one level step (V_dc,max/(N−1)); the drawing: one symbol spanning them all
    expect(row.count).toBe(levels - 1)
    expect(row.voltage).toBeCloseTo(1200 / (levels - 1), 6)
    expect(drawn.seriesUnits).toBe(row.count)
    expect(drawn.seriesUnits! * row.voltage).toBeCloseTo(1200, 6)

    const label = texts(legSchematicSvg(layout, { devices: result.devices, capacitors: result.capacitors })).find(t => t.startsWith('Cdc '))
    expect(label).toBe(`Cdc ${volts(1200)} = ${levels - 1} × ${volts(row.voltage)} · ${amperes(row.rippleCurrentRms)}`)
  })

  it('flying capacitors keep their own voltage (k level steps, one symbol each)', () => {
    const layout = legLayout('flying-capacitor', 4)
    const result = evaluateStress(input('flying-capacitor', 4))
    for (const k of [1, 2]) {
      const cap = result.capacitors.find(c => c.name === `Cf${k}`)!
      expect(cap.voltage).toBeCloseTo((1200 * k) / 3, 6)
      expect(layout.items.find(i => i.name === `Cf${k}`)!.seriesUnits).toBeUndefined()
      const label = texts(legSchematicSvg(layout, { devices: result.devices, capacitors: result.capacitors })).find(t => t.startsWith(`Cf${k} `))
      expect(label).toBe(`Cf${k} ${volts(cap.voltage)} · ${amperes(cap.rippleCurrentRms)}`)
    }
  })
})

describe('split DC links', () => {
  // Each capacitor of a diode-clamped or NPC link holds one level step, drawn one by one (Nabae, Takahashi,
  // Akagi, IEEE TIA 1981): no series note on their labels.
  it.each([['diode-clamped', 3], ['diode-clamped', 5], ['t-type', 3], ['two-level', 2]] as const)('%s, N = %i: every link capacitor is drawn and labelled alone', (topology, levels) => {
    const layout = legLayout(topology, levels)
    const result = evaluateStress(input(topology, levels))
    const caps = layout.items.filter(i => i.kind === 'capacitor')
    expect(caps.length).toBeGreaterThan(0)
    for (const c of caps) expect(c.seriesUnits).toBeUndefined()
    const svgTexts = texts(legSchematicSvg(layout, { devices: result.devices, capacitors: result.capacitors }))
    for (const c of result.capacitors) expect(svgTexts).toContain(`${c.name} ${volts(c.voltage)} · ${amperes(c.rippleCurrentRms)}`)
  })
})

describe('capacitorStressText', () => {
  it('writes the voltage across a string and its units, or the one capacitor\'s voltage', () => {
    expect(capacitorStressText({ voltage: 400, rippleCurrentRms: 31.25 }, 3, volts, amperes)).toBe('1.2 kV = 3 × 400 V · 31.3 A')
    expect(capacitorStressText({ voltage: 600, rippleCurrentRms: 12 }, undefined, volts, amperes)).toBe('600 V · 12 A')
    expect(capacitorStressText({ voltage: 600, rippleCurrentRms: 12 }, 1, volts, amperes)).toBe('600 V · 12 A')
  })
})
