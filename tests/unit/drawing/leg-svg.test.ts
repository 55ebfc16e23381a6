// The printable leg schematic: a well-formed, self-contained SVG document for every topology, each position
// labelled with its name and stress, and drawn into the design report PDF (read back with pdftotext).

import { execFileSync } from 'node:child_process'
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { createRequire } from 'node:module'
import { tmpdir } from 'node:os'
import { dirname, join } from 'node:path'
import { SaxesParser } from 'saxes'
import { describe, expect, it } from 'vitest'
import { drawLeg, SYMBOL } from '../../../shared/drawing/leg'
import { escapeXml, legSchematicSvg } from '../../../shared/drawing/leg-svg'
import { evaluateStress, legLayout, type LegLayout, type StressInput, type StressResult, type TopologyId } from '../../../shared/engine'
import { designReportPdf, loadFontsFromNodeModules, type DesignReport } from '../../../server/exports/design-pdf'

interface Parsed {
  elements: { name: string, attributes: Record<string, string> }[]
  /** text of each <text> element, its tspans joined by a space */
  texts: string[]
  title: string
}

/** Parses with a strict XML parser (saxes throws on any well-formedness error). */
function parseSvg(svg: string): Parsed {
  const parser = new SaxesParser()
  const out: Parsed = { elements: [], texts: [], title: '' }
  let pieces: string[] | null = null
  let inTitle = false
  parser.on('opentag', (tag) => {
    out.elements.push({ name: tag.name, attributes: tag.attributes as Record<string, string> })
    if (tag.name === 'text') pieces = []
    if (tag.name === 'tspan' && pieces) pieces.push('')
    if (tag.name === 'title') inTitle = true
  })
  parser.on('text', (text) => {
    if (inTitle) out.title += text
    if (!pieces) return
    if (pieces.length === 0) pieces.push('')
    pieces[pieces.length - 1] += text
  })
  parser.on('closetag', (tag) => {
    if (tag.name === 'text' && pieces) {
      out.texts.push(pieces.map(p => p.trim()).filter(Boolean).join(' '))
      pieces = null
    }
    if (tag.name === 'title') inTitle = false
  })
  parser.write(svg).close()
  return out
}

/** A stress input on a 1100 V link (1200 V worst case); cascaded H-bridge: 600 V cells (650 V worst case). */
function inputFor(topology: TopologyId, levels: number): StressInput {
  if (topology === 'matrix') {
    return { topology, inputLineVoltageRms: 400, lineVoltageRms: 280, phaseCurrentRms: 30, powerFactor: 0.85, fundamentalHz: 50, switchingHz: 10000, modulation: 'space-vector' }
  }
  const chb = topology === 'cascaded-h-bridge'
  const halfLink = chb ? ((levels - 1) / 2) * 600 : 550
  return {
    topology,
    levels,
    dcVoltage: chb ? 600 : 1100,
    dcVoltageMax: chb ? 650 : 1200,
    // modulation index 0.8: Û_ph = 0.8 · half link
    lineVoltageRms: (0.8 * halfLink * Math.sqrt(3)) / Math.SQRT2,
    phaseCurrentRms: 250,
    powerFactor: 0.9,
    fundamentalHz: 50,
    switchingHz: 3000,
    modulation: 'sine',
  }
}

/**
 * Every topology and several level counts, with the blocking voltage the S1 label must show at the worst-case
 * link (1200 V; cascaded cells 650 V; matrix 400 V input), each from its published source.
 */
const CASES: { topology: TopologyId, levels?: number, first: string, blocking: string, source: string }[] = [
  { topology: 'two-level', levels: 2, first: 'S1', blocking: '1.2 kV', source: 'full DC link per switch; Mohan, Undeland, Robbins, Power Electronics, 3rd ed., ch. 8' },
  { topology: 'diode-clamped', levels: 3, first: 'S1', blocking: '600 V', source: 'V_dc/2 per switch; Nabae, Takahashi, Akagi, IEEE TIA 1981' },
  { topology: 'diode-clamped', levels: 5, first: 'S1', blocking: '300 V', source: 'V_dc/(N−1) per switch; Rodríguez, Lai, Peng, IEEE TIE 2002' },
  { topology: 'diode-clamped', levels: 9, first: 'S1', blocking: '150 V', source: 'V_dc/(N−1) per switch; Rodríguez, Lai, Peng, IEEE TIE 2002' },
  { topology: 't-type', levels: 3, first: 'S1', blocking: '1.2 kV', source: 'outer switches block the full link; Schweizer, Kolar, IEEE TPEL 2013' },
  { topology: 'anpc', levels: 3, first: 'S1', blocking: '600 V', source: 'V_dc/2 per switch; Brückner, Bernet, Güldner, IEEE TIE 2005' },
  { topology: 'flying-capacitor', levels: 3, first: 'S1', blocking: '600 V', source: 'V_dc/(N−1) per switch; Meynard, Foch, PESC 1992' },
  { topology: 'flying-capacitor', levels: 5, first: 'S1', blocking: '300 V', source: 'V_dc/(N−1) per switch; Meynard, Foch, PESC 1992' },
  { topology: 'cascaded-h-bridge', levels: 5, first: 'S1', blocking: '650 V', source: 'cell voltage per switch; Malinowski, Gopakumar, Rodríguez, Pérez, IEEE TIE 2010' },
  { topology: 'cascaded-h-bridge', levels: 9, first: 'S1', blocking: '650 V', source: 'cell voltage per switch; Malinowski, Gopakumar, Rodríguez, Pérez, IEEE TIE 2010' },
  { topology: 'matrix', first: 'SR+', blocking: '566 V', source: '√2 · 400 V input line peak; Wheeler et al., IEEE TIE 2002' },
]

function render(topology: TopologyId, levels?: number, title?: string): { layout: LegLayout, result: StressResult, svg: string } {
  const layout = legLayout(topology, levels)
  const result = evaluateStress(inputFor(topology, layout.levels))
  const svg = legSchematicSvg(layout, { devices: result.devices, capacitors: result.capacitors }, title ? { title } : {})
  return { layout, result, svg }
}

const count = (text: string, part: string) => text.split(part).length - 1
/** The font the report falls back to for text inside the SVG. */
const robotoRegular = join(dirname(createRequire(import.meta.url).resolve('pdfmake/package.json')), 'fonts', 'Roboto', 'Roboto-Regular.ttf')
const fontkit = createRequire(import.meta.url)('fontkit') as { openSync(path: string): { hasGlyphForCodePoint(codePoint: number): boolean } }

describe.each(CASES)('leg schematic SVG: $topology, N = $levels', ({ topology, levels, first, blocking, source }) => {
  const { layout, result, svg } = render(topology, levels, 'Machine side')
  const parsed = parseSvg(svg)

  it('is one well-formed <svg> document with the SVG namespace and a usable viewBox', () => {
    expect(svg.startsWith('<svg ')).toBe(true)
    expect(svg.endsWith('</svg>')).toBe(true)
    const root = parsed.elements[0]!
    expect(root.name).toBe('svg')
    expect(root.attributes.xmlns).toBe('http://www.w3.org/2000/svg')
    const box = (root.attributes.viewBox ?? '').split(/\s+/).map(Number)
    expect(box).toHaveLength(4)
    expect(box.every(Number.isFinite)).toBe(true)
    expect(box[2]).toBeGreaterThan(100)
    expect(box[3]).toBeGreaterThan(100)
    // declared size equals the viewBox: one SVG unit is one point when the report embeds it
    expect(Number(root.attributes.width)).toBe(box[2])
    expect(Number(root.attributes.height)).toBe(box[3])
    expect(parsed.elements.filter(e => e.name === 'svg')).toHaveLength(1)
  })

  it('names every position of the layout, devices and capacitors', () => {
    const words = new Set(parsed.texts.flatMap(t => t.split(' ')))
    for (const item of layout.items) expect(words.has(item.name), item.name).toBe(true)
  })

  it(`labels ${first} with its blocking voltage and RMS current (${blocking}: ${source})`, () => {
    const label = parsed.texts.find(t => t.startsWith(`${first} `))
    expect(label).toMatch(new RegExp(`^${first.replace('+', '\\+')} ${blocking} · [0-9.]+ [mk]?A$`))
  })

  it('writes a stress beside every device and capacitor the engine rated', () => {
    const labelled = new Map(parsed.texts.filter(t => t.includes(' · ')).map(t => [t.split(' ')[0]!, t]))
    // The matrix converter's input filter capacitors sit on the input lines, outside the leg drawn here.
    const inLeg = result.capacitors.filter(c => c.role !== 'filter')
    for (const d of [...result.devices, ...inLeg]) expect(labelled.get(d.name), d.name).toMatch(/ [0-9.]+ [kM]?V · [0-9.]+ [mk]?A$/)
  })

  it('draws every placed part with the shared symbol paths (the page draws the same ones)', () => {
    const parts = drawLeg(layout, { labelWidth: () => 40 }).parts
    expect(count(svg, `d="${SYMBOL.switch.gate}"`)).toBe(parts.filter(p => p.shape === 'switch').length)
    expect(count(svg, `d="${SYMBOL.antiParallelDiode.triangle}"`)).toBe(parts.filter(p => p.diodeName).length)
    expect(count(svg, `d="${SYMBOL.diode.triangle}"`)).toBe(parts.filter(p => p.shape === 'diode').length)
    expect(count(svg, `d="${SYMBOL.capacitor.plates}"`)).toBe(parts.filter(p => p.shape === 'capacitor').length)
  })

  it('holds no script, event handler, link, image or foreign object', () => {
    expect(svg).not.toMatch(/<script/i)
    expect(svg).not.toMatch(/href\s*=\s*["']?\s*(https?:|\/\/)/i)
    expect(svg).not.toMatch(/\son[a-z]+\s*=/i)
    for (const e of parsed.elements) {
      expect(['script', 'foreignObject', 'image', 'use', 'a', 'style'], e.name).not.toContain(e.name)
      for (const name of Object.keys(e.attributes)) {
        expect(name, `${e.name} ${name}`).not.toMatch(/^on|href$/i)
      }
    }
  })

  it('says which converter it shows', () => {
    expect(parsed.title).toMatch(/^Machine side: /)
    expect(parsed.texts.some(t => t.startsWith('Machine side: '))).toBe(true)
  })

  it('uses only characters the report font can print', () => {
    const font = fontkit.openSync(robotoRegular)
    const missing = [...new Set([...parsed.texts.join('')])].filter(ch => !font.hasGlyphForCodePoint(ch.codePointAt(0)!))
    expect(missing).toEqual([])
  })
})

describe('leg schematic SVG: text is escaped', () => {
  it('escapes the five XML special characters', () => {
    expect(escapeXml(`a<b>&"c"'d'`)).toBe('a&lt;b&gt;&amp;&quot;c&quot;&apos;d&apos;')
  })

  it('keeps names and titles with < and & as text, never as markup', () => {
    const base = legLayout('two-level', 2)
    const odd = 'C<dc>&"1"'
    const layout: LegLayout = { ...base, items: base.items.map(i => (i.kind === 'capacitor' ? { ...i, name: odd } : i)) }
    const result = evaluateStress(inputFor('two-level', 2))
    const svg = legSchematicSvg(layout, { devices: result.devices, capacitors: result.capacitors.map(c => ({ ...c, name: odd })) }, { title: 'Grid & <machine>' })
    expect(svg).not.toContain('C<dc>')
    expect(svg).not.toContain('<machine>')
    const parsed = parseSvg(svg)
    expect(parsed.texts.some(t => t.startsWith(`${odd} `) && t.includes(' · '))).toBe(true)
    expect(parsed.title).toMatch(/^Grid & <machine>: /)
    expect(parsed.elements.map(e => e.name)).not.toContain('dc')
    expect(parsed.elements.map(e => e.name)).not.toContain('machine')
  })

  it('labels a position the engine did not rate with its name alone', () => {
    const layout = legLayout('diode-clamped', 3)
    const svg = legSchematicSvg(layout, { devices: [] })
    const texts = parseSvg(svg).texts
    expect(texts).toContain('S1')
    expect(texts).toContain('Dc1+')
    expect(texts.some(t => t.includes(' · ') && !t.startsWith('Labels') && !t.startsWith('Capacitors'))).toBe(false)
  })
})

const PDFTOTEXT = '/usr/bin/pdftotext'
const hasPdfToText = existsSync(PDFTOTEXT)

function pdfText(pdf: Buffer): string {
  const dir = mkdtempSync(join(tmpdir(), 'leg-svg-'))
  try {
    const file = join(dir, 'report.pdf')
    writeFileSync(file, pdf)
    return execFileSync(PDFTOTEXT, ['-enc', 'UTF-8', file, '-'], { encoding: 'utf8' })
  }
  finally {
    rmSync(dir, { recursive: true, force: true })
  }
}

describe.skipIf(!hasPdfToText)(`design report PDF with the schematic (read back with ${PDFTOTEXT})`, () => {
  // Empty tables: every position name found in the text comes from the drawing.
  const report = (svg: string): DesignReport => ({
    designName: 'Schematic check',
    revision: 1,
    author: 'Test',
    date: '2026-01-15T09:00:00Z',
    inputs: [],
    operatingPoints: [],
    devices: [],
    capacitors: [],
    warnings: [],
    schematicSvg: svg,
    safetyNote: 'Invented safety note for the test.',
  })

  it.each([
    { topology: 'diode-clamped' as const, levels: 3, names: ['Dc1+', 'Dc1-', 'S1', 'D4', 'Cdc1', 'Cdc2'], stress: '600 V · ' },
    { topology: 'flying-capacitor' as const, levels: 5, names: ['S1', 'S8', 'Cf1', 'Cf3', 'Cdc'], stress: '300 V · ' },
    { topology: 'matrix' as const, levels: undefined, names: ['SR+', 'DT-', 'SS-'], stress: '566 V · ' },
  ])('$topology N = $levels: the position names and stresses are text in the PDF', async ({ topology, levels, names, stress }) => {
    const { svg } = render(topology, levels, 'Machine side')
    const pdf = await designReportPdf(report(svg), await loadFontsFromNodeModules())
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-')
    const text = pdfText(pdf)
    // the report replaces a drawing that fails with a note: it must not have
    expect(text).not.toContain('could not be drawn')
    const words = new Set(text.split(/\s+/))
    for (const name of names) expect(words.has(name), name).toBe(true)
    expect(text).toContain(stress)
    expect(text).toContain('Machine side: ')
  }, 30000)
})
