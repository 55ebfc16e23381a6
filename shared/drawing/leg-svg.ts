// The leg schematic as a standalone SVG document for print (the design report PDF): the one renderer of
// ./leg-render in the report's theme (black and greys), with a heading and the key to the labels. No scripts, no links.
import { drawnUnitText, topologyById, type LegLayout } from '../engine'
import { formatSi } from '../utils/format'
import { capacitorStressText, SYMBOL } from './leg'
import { renderLeg, type LegTheme, type SvgChild } from './leg-render'

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

/** The renderer's element tree as XML text. */
export function serialiseSvg(nodes: readonly SvgChild[]): string {
  return nodes.map(n => (typeof n === 'string' ? escapeXml(n) : el(n.tag, n.attrs, n.children.length ? serialiseSvg(n.children) : undefined))).join('')
}

/** The report's look: black and greys on white, sizes as attributes, the font's missing glyphs dropped. */
const PRINT: LegTheme = {
  ink: () => INK,
  triangle: () => PAPER,
  dot: INK,
  wire: WIRE_INK,
  paper: PAPER,
  frame: { 'fill': 'none', 'stroke': SOFT_INK, 'stroke-width': 0.8 },
  terminal: { 'stroke': INK, 'stroke-width': SYMBOL.stroke },
  inset: {
    input: SOFT_INK,
    output: detailed => ({ 'stroke': detailed ? INK : SOFT_INK, 'stroke-width': detailed ? 2 : 1.2 }),
    // The detailed output phase is shaded grey: it still reads in black and white.
    crosspoint: detailed => ({ 'fill': detailed ? '#c8c8c8' : PAPER, 'stroke': detailed ? INK : SOFT_INK, 'stroke-width': 1.2 }),
  },
  text: (role) => {
    switch (role) {
      case 'name': return { 'font-size': TEXT.name, 'font-weight': 'bold', 'fill': INK }
      case 'stress': return { 'font-size': TEXT.stress, 'fill': SOFT_INK }
      case 'frame': return { 'font-size': TEXT.rail, 'fill': SOFT_INK }
      case 'terminal':
      case 'rail': return { 'font-size': TEXT.rail, 'fill': INK }
      case 'caption': return { 'font-size': TEXT.caption, 'font-style': 'italic', 'fill': SOFT_INK }
      case 'inset-title': return { 'font-size': TEXT.caption, 'fill': SOFT_INK }
      case 'inset-input': return { 'font-size': TEXT.inset, 'fill': SOFT_INK }
      case 'inset-output': return { 'font-size': TEXT.inset, 'font-weight': 'normal', 'fill': INK }
      case 'inset-output-detailed': return { 'font-size': TEXT.inset, 'font-weight': 'bold', 'fill': INK }
    }
  },
  printable,
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
  const { drawing, nodes } = renderLeg({ layout, nameText, stressText, theme: PRINT })
  const out = [serialiseSvg(nodes)]

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
