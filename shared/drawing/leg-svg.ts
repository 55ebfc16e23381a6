// The leg schematic as a standalone SVG document for print (the design report PDF): the page's geometry and
// symbols from ./leg, in black and greys, each position labelled with its name and stress. No scripts, no links.
import { drawnUnitText, topologyById, type LegLayout } from '../engine'
import { formatSi } from '../utils/format'
import { capacitorStressText, drawLeg, FRAME, insetGeometry, LABEL_GAP, labelBaselines, labelLines, labelWidthOf, SYMBOL, WIRE, type LabelLine, type PlacedPart } from './leg'

/** Worst-case stresses per position (the engine's DeviceEnvelope and CapacitorEnvelope fit as they are). */
export interface LegStresses {
  /** blockingVoltage in V (steady state), currentRms in A; seriesCount: unit devices in series at the position */
  devices: { name: string, blockingVoltage: number, currentRms: number, seriesCount?: number }[]
  /** voltage in V (DC), rippleCurrentRms in A */
  capacitors?: { name: string, voltage: number, rippleCurrentRms: number }[]
}

export interface LegSvgOptions {
  /** which converter, written before the heading above the drawing, e.g. "Machine side" */
  title?: string
}

const INK = '#000000'
const WIRE_INK = '#1f1f1f'
const SOFT_INK = '#3d3d3d'
const PAPER = '#ffffff'
const FONT = 'Roboto, Helvetica, Arial, sans-serif'
/** px, text sizes as on the page (labels 11 / 10.5, notes 11 / 10.5, overview 10) */
const TEXT = { name: 11, stress: 10.5, rail: 11, caption: 10.5, inset: 10, title: 12 } as const
/** px per character of a 10.5 px italic caption, as the drawing's own estimate */
const CAPTION_CHAR = 5.8
/** Below this magnitude a stress is numerical noise of the integration: printed as 0. */
const NOISE_FLOOR = 1e-6

/** Text and attribute values made safe for XML. */
export function escapeXml(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&apos;')
}

/** Glyphs the report font (Roboto) lacks are dropped for print: the elision mark ⋮ sits beside a dashed wire that says the same. */
const printable = (text: string) => text.replace(/⋮\s*/g, '')

const num = (v: number) => String(Math.round(v * 10) / 10)
const quantity = (v: number, unit: string) => formatSi(Math.abs(v) < NOISE_FLOOR ? 0 : v, unit, 3)

/** ` name="value"` pairs, escaped; undefined values are left out. */
function attrs(a: Record<string, string | number | undefined>): string {
  return Object.entries(a)
    .map(([k, v]) => (v === undefined ? '' : ` ${k}="${typeof v === 'number' ? num(v) : escapeXml(v)}"`))
    .join('')
}

const el = (name: string, a: Record<string, string | number | undefined>, body?: string) =>
  body === undefined ? `<${name}${attrs(a)}/>` : `<${name}${attrs(a)}>${body}</${name}>`

function symbol(p: PlacedPart): string {
  const stroke = SYMBOL.stroke
  if (p.shape === 'switch') {
    const s = SYMBOL.switch
    const d = SYMBOL.antiParallelDiode
    const body = [
      el('g', { 'fill': 'none', 'stroke': INK, 'stroke-width': stroke, 'stroke-linecap': 'round', 'stroke-linejoin': 'round' }, [
        el('path', { d: s.collector }),
        el('path', { 'd': s.channel, 'stroke-width': stroke + 1 }),
        el('path', { d: s.emitter }),
        el('path', { d: s.gate }),
      ].join('')),
      el('path', { d: s.arrow, fill: INK }),
    ]
    if (p.diodeName) {
      body.push(
        el('g', { 'fill': 'none', 'stroke': INK, 'stroke-width': stroke, 'stroke-linejoin': 'round' }, el('path', { d: d.leads }) + el('path', { d: d.bar })),
        el('path', { 'd': d.triangle, 'fill': PAPER, 'stroke': INK, 'stroke-width': stroke, 'stroke-linejoin': 'round' }),
        ...d.joints.map(j => el('circle', { cx: j.x, cy: j.y, r: d.jointRadius, fill: INK })),
      )
    }
    return body.join('')
  }
  if (p.shape === 'diode') {
    const s = SYMBOL.diode
    return el('path', { 'd': s.leads, 'fill': 'none', 'stroke': INK, 'stroke-width': stroke })
      + el('path', { 'd': s.triangle, 'fill': PAPER, 'stroke': INK, 'stroke-width': stroke, 'stroke-linejoin': 'round' })
  }
  const s = SYMBOL.capacitor
  return el('path', { 'd': s.leads, 'fill': 'none', 'stroke': INK, 'stroke-width': stroke })
    + el('path', { 'd': s.plates, 'fill': 'none', 'stroke': INK, 'stroke-width': stroke + 1.2 })
}

/** One line of text at (x, y). */
function textLine(x: number, y: number, text: string, style: Record<string, string | number | undefined>): string {
  return el('text', { x, y, ...style }, escapeXml(printable(text)))
}

/**
 * One phase leg as a complete SVG document: symbols, wiring, terminals and notes as on the design page, each
 * position labelled "name stress" (devices: blocking voltage · RMS current; capacitors: DC voltage · RMS ripple).
 */
export function legSchematicSvg(layout: LegLayout, stresses: LegStresses, options: LegSvgOptions = {}): string {
  const devices = new Map(stresses.devices.map(d => [d.name, d]))
  const capacitors = new Map((stresses.capacitors ?? []).map(c => [c.name, c]))
  const seriesUnits = new Map(layout.items.map(i => [i.name, i.seriesUnits]))
  const nameText = (name: string) => {
    const series = devices.get(name)?.seriesCount ?? 1
    return series > 1 ? `${name} ×${series}` : name
  }
  const stressText = (name: string) => {
    const d = devices.get(name)
    if (d) return `${quantity(d.blockingVoltage, 'V')} · ${quantity(d.currentRms, 'A')}`
    const c = capacitors.get(name)
    if (c) return capacitorStressText(c, seriesUnits.get(name), v => quantity(v, 'V'), a => quantity(a, 'A'))
    return ''
  }
  const linesOf = (p: Pick<PlacedPart, 'name' | 'diodeName' | 'namesOnly'>): LabelLine[] => labelLines(p, nameText, stressText)
  const drawing = drawLeg(layout, { labelWidth: (name, diodeName) => labelWidthOf(linesOf({ name, diodeName })) })

  const out: string[] = []
  for (const f of drawing.frames) {
    out.push(el('rect', { 'x': f.x, 'y': f.y, 'width': f.w, 'height': f.h, 'rx': FRAME.radius, 'fill': 'none', 'stroke': SOFT_INK, 'stroke-width': 0.8, 'stroke-dasharray': FRAME.dash }))
    out.push(textLine(f.x + FRAME.labelDx, f.y + FRAME.labelDy, f.label, { 'font-size': TEXT.rail, 'fill': SOFT_INK }))
  }
  for (const w of drawing.wires) {
    out.push(el('path', { 'd': w.d, 'fill': 'none', 'stroke': WIRE_INK, 'stroke-width': WIRE.stroke, 'stroke-dasharray': w.dashed ? WIRE.dash : undefined, 'stroke-linecap': 'square' }))
  }
  for (const d of drawing.dots) out.push(el('circle', { cx: d.x, cy: d.y, r: WIRE.dotRadius, fill: INK }))
  for (const p of drawing.parts) {
    out.push(el('g', { transform: `translate(${num(p.x)} ${num(p.y)}) rotate(${p.rotation})` }, symbol(p)))
  }
  // Labels after every symbol so no part is drawn over a label.
  for (const p of drawing.parts) {
    const lines = linesOf(p)
    labelBaselines(p.label, lines.length).forEach((y, k) => {
      const line = lines[k]!
      const name = el('tspan', { 'font-size': TEXT.name, 'font-weight': 'bold', 'fill': INK }, escapeXml(line.name))
      const stress = line.stress ? el('tspan', { 'dx': LABEL_GAP, 'font-size': TEXT.stress, 'fill': SOFT_INK }, escapeXml(line.stress)) : ''
      out.push(el('text', { 'x': p.label.x, y, 'text-anchor': p.label.anchor }, name + stress))
    })
  }
  for (const t of drawing.terminals) {
    out.push(el('circle', { 'cx': t.x, 'cy': t.y, 'r': WIRE.terminalRadius, 'fill': PAPER, 'stroke': INK, 'stroke-width': SYMBOL.stroke }))
    out.push(textLine(t.x + t.dx, t.y + t.dy, t.text, { 'text-anchor': t.anchor, 'font-size': TEXT.rail, 'fill': INK }))
  }
  for (const n of drawing.notes) {
    const style = n.tone === 'rail'
      ? { 'text-anchor': n.anchor, 'font-size': TEXT.rail, 'fill': INK }
      : { 'text-anchor': n.anchor, 'font-size': TEXT.caption, 'font-style': 'italic', 'fill': SOFT_INK }
    out.push(textLine(n.x, n.y, n.text, style))
  }
  if (drawing.inset) {
    const g = insetGeometry(drawing.inset)
    const body = [textLine(g.title.x, g.title.y, g.title.text, { 'font-size': TEXT.caption, 'fill': SOFT_INK })]
    for (const i of g.inputs) {
      body.push(el('path', { 'd': i.d, 'stroke': SOFT_INK, 'stroke-width': 1.2 }))
      body.push(textLine(i.label.x, i.label.y, i.label.text, { 'text-anchor': 'end', 'font-size': TEXT.inset, 'fill': SOFT_INK }))
    }
    for (const o of g.outputs) {
      body.push(el('path', { 'd': o.d, 'stroke': o.detailed ? INK : SOFT_INK, 'stroke-width': o.detailed ? 2 : 1.2 }))
      body.push(textLine(o.label.x, o.label.y, o.label.text, { 'text-anchor': 'middle', 'font-size': TEXT.inset, 'font-weight': o.detailed ? 'bold' : 'normal', 'fill': INK }))
      // The detailed output phase is shaded grey: it still reads in black and white.
      for (const b of o.crosspoints) body.push(el('rect', { 'x': b.x, 'y': b.y, 'width': b.size, 'height': b.size, 'rx': b.radius, 'fill': o.detailed ? '#c8c8c8' : PAPER, 'stroke': o.detailed ? INK : SOFT_INK, 'stroke-width': 1.2 }))
    }
    out.push(el('g', { transform: `translate(${num(drawing.inset.x)} ${num(drawing.inset.y)})` }, body.join('')))
  }

  // Heading above and the key to the labels below the drawing, inside the document so it stands alone.
  const hasCapacitors = layout.items.some(i => i.kind === 'capacitor')
  const key = ['Labels: position, blocking voltage (steady state) · RMS current', ...(hasCapacitors ? ['Capacitors: DC voltage · RMS ripple current'] : [])]
  const kind = topologyById[layout.topology]?.label ?? layout.topology
  const shape = `${kind}, ${drawnUnitText(layout.topology, layout.levels)}`
  const heading = options.title ? `${options.title}: ${shape}` : shape
  const headingHeight = 22
  const keyTop = drawing.minY + drawing.height
  key.forEach((text, k) => out.push(textLine(drawing.minX + 14, keyTop + 2 + k * 14, text, { 'font-size': TEXT.caption, 'font-style': 'italic', 'fill': SOFT_INK })))
  out.push(textLine(drawing.minX + 14, drawing.minY - 4, heading, { 'font-size': TEXT.title, 'font-weight': 'bold', 'fill': INK }))

  const textWidth = Math.max(...key.map(k => k.length * CAPTION_CHAR), heading.length * 6.6) + 28
  const minX = drawing.minX
  const minY = drawing.minY - headingHeight
  const width = Math.ceil(Math.max(drawing.width, textWidth))
  const height = drawing.height + headingHeight + key.length * 14 + 6
  return `<svg${attrs({ 'xmlns': 'http://www.w3.org/2000/svg', 'viewBox': `${minX} ${minY} ${width} ${height}`, 'width': width, 'height': height, 'font-family': FONT, 'role': 'img' })}>`
    + el('title', {}, escapeXml(heading))
    + el('rect', { x: minX, y: minY, width, height, fill: PAPER })
    + out.join('')
    + '</svg>'
}
