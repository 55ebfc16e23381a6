// Geometry of the leg schematic: turns the engine's layout hints (slots and nodes) into SVG primitives.
// Pure drawing: no stresses, no engineering; the page component and the printed report add the text.
import { topologyById, type LegLayout, type LegLayoutItem } from '../engine'
import type { LegDrawingKind } from '../engine/model'

/** Clockwise degrees; the symbol's first node (collector / cathode / +) is at the top at 0. */
export type Rotation = 0 | 90 | 180 | 270

export interface LabelSpot {
  x: number
  y: number
  anchor: 'start' | 'middle' | 'end'
  /** middle: the text block is centred on y; bottom: the block ends at y (label above a horizontal part) */
  valign: 'middle' | 'bottom'
}

export interface PlacedPart {
  shape: 'switch' | 'diode' | 'capacitor'
  x: number
  y: number
  rotation: Rotation
  /** position name of the switch, lone diode or capacitor */
  name: string
  /** anti-parallel diode drawn beside the switch */
  diodeName?: string
  label: LabelSpot
  /** repeated cascaded cells: names only, the stresses are on the first cell */
  namesOnly?: boolean
}

export interface Wire { d: string, dashed?: boolean }
export interface Terminal { x: number, y: number, text: string, anchor: 'start' | 'middle' | 'end', dx: number, dy: number }
export interface Note { x: number, y: number, text: string, anchor: 'start' | 'middle' | 'end', tone: 'rail' | 'caption' | 'cell' }
export interface Frame { x: number, y: number, w: number, h: number, label: string }

/** Small 3×3 overview of the matrix converter: which crosspoints the detail shows. */
export interface MatrixInset { x: number, y: number, inputs: string[], outputs: string[], detailed: number }

export interface LegDrawing {
  minX: number
  minY: number
  width: number
  height: number
  wires: Wire[]
  dots: { x: number, y: number }[]
  terminals: Terminal[]
  parts: PlacedPart[]
  notes: Note[]
  frames: Frame[]
  inset?: MatrixInset
}

export interface DrawOptions {
  /** px, width of the label the component writes for a part (names plus stresses) */
  labelWidth: (name: string, diodeName?: string) => number
}

/** px: symbol terminals sit this far from the part's centre. */
export const TERMINAL = 30
const ROW = 70
/** px, pitch of a part's label lines (one line per position: the switch, then its anti-parallel diode) */
export const LABEL_LINE = 14

/**
 * Part symbols in the part's own frame (px): first node (collector / cathode / +) at (0, −TERMINAL), second at
 * (0, +TERMINAL), before the part's rotation. One copy for the page and the printed report, so they draw alike.
 */
export const SYMBOL = {
  /** px, stroke width of a part; wires are a little lighter */
  stroke: 1.5,
  switch: {
    /** pointer target (page only) */
    hitBox: { x: -26, y: -30, w: 26, h: 60 },
    collector: 'M0 -30 V-13 L-9 -7',
    /** drawn 1 px heavier than the leads */
    channel: 'M-9 -12 V12',
    emitter: 'M-9 7 L0 13 V30',
    gate: 'M-14 -10 V10 M-14 8 H-23',
    /** filled emitter arrow */
    arrow: 'M0 13 L-6.5 12.6 L-3.2 8 Z',
  },
  /** the diode drawn beside a switch, joined to its collector and emitter leads */
  antiParallelDiode: {
    hitBox: { x: 3, y: -24, w: 22, h: 48 },
    leads: 'M0 -20 H15 V-6 M0 20 H15 V6',
    bar: 'M9 -6 H21',
    triangle: 'M15 -6 L9 6 H21 Z',
    joints: [{ x: 0, y: -20 }, { x: 0, y: 20 }],
    jointRadius: 2.2,
  },
  /** lone or clamp diode, cathode at the top */
  diode: {
    hitBox: { x: -13, y: -30, w: 26, h: 60 },
    leads: 'M0 -30 V-8 M0 8 V30 M-8 -8 H8',
    triangle: 'M0 -8 L-8 8 H8 Z',
  },
  capacitor: {
    hitBox: { x: -17, y: -30, w: 34, h: 60 },
    leads: 'M0 -30 V-5 M0 5 V30',
    /** drawn 1.2 px heavier than the leads */
    plates: 'M-14 -5 H14 M-14 5 H14',
  },
} as const

/** px: wire stroke, junction dot and open terminal circle. */
export const WIRE = { stroke: 1.4, dash: '5 4', dotRadius: 2.8, terminalRadius: 4 } as const

/** Cell frame of a cascaded H-bridge: corner radius, dash and where its label sits (px from the top-left corner). */
export const FRAME = { radius: 8, dash: '4 3', labelDx: 10, labelDy: 15 } as const

/** One line of a part's label: the position name (with its series count) and its stress, or no stress. */
export interface LabelLine { name: string, stress: string }

/** A placed part's label lines: its own position, then its anti-parallel diode; repeated cells show names only. */
export function labelLines(
  p: Pick<PlacedPart, 'name' | 'diodeName' | 'namesOnly'>,
  nameText: (name: string) => string,
  stressText: (name: string) => string,
): LabelLine[] {
  const names = p.diodeName ? [p.name, p.diodeName] : [p.name]
  return names.map(n => ({ name: nameText(n), stress: p.namesOnly ? '' : stressText(n) }))
}

/**
 * A capacitor symbol's stress: its voltage and ripple current, as the capacitor table gives them; a DC-link string
 * drawn as one symbol (`seriesUnits`) shows the voltage across it and its units, "1.20 kV = 3 × 400 V · 31 A".
 */
export function capacitorStressText(
  c: { voltage: number, rippleCurrentRms: number },
  seriesUnits: number | undefined,
  voltage: (volts: number) => string,
  current: (amperes: number) => string,
): string {
  const across = seriesUnits && seriesUnits > 1 ? `${voltage(seriesUnits * c.voltage)} = ${seriesUnits} × ${voltage(c.voltage)}` : voltage(c.voltage)
  return `${across} · ${current(c.rippleCurrentRms)}`
}

/** px, the gap between a label's name and its stress */
export const LABEL_GAP = 5

/** px, estimated label width: names in 11 px semibold, stresses in 10.5 px (narrow digits, spaces, dots). */
export function labelWidthOf(lines: LabelLine[]): number {
  return Math.ceil(Math.max(...lines.map(l => l.name.length * 6.8 + (l.stress ? LABEL_GAP + l.stress.length * 4.8 : 0))) + 4)
}

/** Baseline y (px) of each label line of a part. */
export function labelBaselines(label: LabelSpot, lines: number): number[] {
  const first = label.valign === 'middle' ? label.y - ((lines - 1) * LABEL_LINE) / 2 + 4 : label.y - (lines - 1) * LABEL_LINE - 3
  return Array.from({ length: lines }, (_, k) => first + k * LABEL_LINE)
}

/** px, grid pitch of the matrix converter's 3×3 overview */
const INSET_PITCH = 34

/** The matrix overview's lines, crosspoint boxes and labels, relative to the inset's corner (px). */
export function insetGeometry(inset: MatrixInset) {
  const span = 3 * INSET_PITCH
  return {
    title: { x: 0, y: -2, text: '3×3 overview' },
    inputs: inset.inputs.map((text, k) => ({ d: `M0 ${20 + k * INSET_PITCH} H${span + 10}`, label: { x: -6, y: 24 + k * INSET_PITCH, text } })),
    outputs: inset.outputs.map((text, j) => {
      const x = 22 + j * INSET_PITCH
      return {
        d: `M${x} 8 V${span + 12}`,
        detailed: j === inset.detailed,
        label: { x, y: span + 26, text },
        crosspoints: inset.inputs.map((_, k) => ({ x: x - 6, y: 20 + k * INSET_PITCH - 6, size: 12, radius: 2 })),
      }
    }),
  }
}

class Canvas {
  wires: Wire[] = []
  dots: { x: number, y: number }[] = []
  terminals: Terminal[] = []
  parts: PlacedPart[] = []
  notes: Note[] = []
  frames: Frame[] = []
  inset?: MatrixInset
  private box = { x0: Infinity, y0: Infinity, x1: -Infinity, y1: -Infinity }

  constructor(private labelWidth: DrawOptions['labelWidth']) {}

  grow(x: number, y: number) {
    this.box.x0 = Math.min(this.box.x0, x)
    this.box.y0 = Math.min(this.box.y0, y)
    this.box.x1 = Math.max(this.box.x1, x)
    this.box.y1 = Math.max(this.box.y1, y)
  }

  wire(points: [number, number][], dashed = false) {
    if (points.length < 2) return
    points.forEach(([x, y]) => this.grow(x, y))
    this.wires.push({ d: points.map(([x, y], i) => `${i ? 'L' : 'M'}${round(x)} ${round(y)}`).join(' '), dashed })
  }

  dot(x: number, y: number) { this.dots.push({ x, y }) }

  part(p: PlacedPart, lines: number) {
    this.parts.push(p)
    this.grow(p.x - 26, p.y - 26)
    this.grow(p.x + 26, p.y + 26)
    const w = this.labelWidth(p.name, p.diodeName)
    const h = lines * LABEL_LINE
    const { x, y, anchor, valign } = p.label
    const left = anchor === 'start' ? x : anchor === 'end' ? x - w : x - w / 2
    const top = valign === 'middle' ? y - h / 2 : y - h
    this.grow(left, top)
    this.grow(left + w, top + h)
  }

  terminal(t: Terminal) {
    this.terminals.push(t)
    this.grow(t.x - 6, t.y - 6)
    this.grow(t.x + 6, t.y + 6)
    const textX = t.x + t.dx
    const w = t.text.length * 6.5
    this.grow(t.anchor === 'end' ? textX - w : t.anchor === 'middle' ? textX - w / 2 : textX + w, t.y + t.dy + 4)
    this.grow(textX, t.y + t.dy - 10)
  }

  note(n: Note) {
    this.notes.push(n)
    const w = n.text.length * (n.tone === 'caption' ? 5.8 : 6.5)
    this.grow(n.anchor === 'end' ? n.x - w : n.anchor === 'middle' ? n.x - w / 2 : n.x, n.y - 11)
    this.grow(n.anchor === 'end' ? n.x : n.anchor === 'middle' ? n.x + w / 2 : n.x + w, n.y + 4)
  }

  frame(f: Frame) {
    this.frames.push(f)
    this.grow(f.x, f.y)
    this.grow(f.x + f.w, f.y + f.h)
  }

  finish(margin = 14): LegDrawing {
    const { x0, y0, x1, y1 } = this.box
    const ok = Number.isFinite(x0)
    return {
      minX: ok ? Math.floor(x0 - margin) : 0,
      minY: ok ? Math.floor(y0 - margin) : 0,
      width: ok ? Math.ceil(x1 - x0 + 2 * margin) : 100,
      height: ok ? Math.ceil(y1 - y0 + 2 * margin) : 60,
      wires: this.wires,
      dots: this.dots,
      terminals: this.terminals,
      parts: this.parts,
      notes: this.notes,
      frames: this.frames,
      inset: this.inset,
    }
  }
}

const round = (v: number) => Math.round(v * 10) / 10

interface Parts {
  switches: LegLayoutItem[]
  /** switch name → its anti-parallel diode */
  antiParallel: Map<string, LegLayoutItem>
  /** diodes and clamp diodes drawn on their own */
  loneDiodes: LegLayoutItem[]
  capacitors: LegLayoutItem[]
}

function sortParts(items: LegLayoutItem[]): Parts {
  const switches = items.filter(i => i.kind === 'switch')
  const switchNames = new Set(switches.map(s => s.name))
  const antiParallel = new Map<string, LegLayoutItem>()
  const loneDiodes: LegLayoutItem[] = []
  for (const i of items) {
    if (i.kind === 'diode' && i.antiParallelTo && switchNames.has(i.antiParallelTo)) antiParallel.set(i.antiParallelTo, i)
    else if (i.kind === 'diode' || i.kind === 'clamp-diode') loneDiodes.push(i)
  }
  return { switches, antiParallel, loneDiodes, capacitors: items.filter(i => i.kind === 'capacitor') }
}

/** Draws one phase leg of any supported topology; unknown shapes fall back to a plain grid of parts. */
export function drawLeg(layout: LegLayout, options: DrawOptions): LegDrawing {
  const parts = sortParts(layout.items)
  const rule = DRAWING_RULES[topologyById[layout.topology]?.presentation.drawing as LegDrawingKind] ?? drawGrid
  return rule(layout, parts, options)
}

const partFor = (p: Parts, item: LegLayoutItem): Pick<PlacedPart, 'shape' | 'name' | 'diodeName'> => ({
  shape: item.kind === 'switch' ? 'switch' : item.kind === 'capacitor' ? 'capacitor' : 'diode',
  name: item.name,
  ...(item.kind === 'switch' && p.antiParallel.has(item.name) ? { diodeName: p.antiParallel.get(item.name)!.name } : {}),
})
const lineCount = (p: Pick<PlacedPart, 'diodeName'>) => (p.diodeName ? 2 : 1)
/** px, widest label among the items (with their anti-parallel diodes) */
const widest = (p: Parts, o: DrawOptions, items: LegLayoutItem[]) =>
  Math.max(40, ...items.map(i => o.labelWidth(i.name, partFor(p, i).diodeName)))

/**
 * Series string between the DC rails (two-level, diode-clamped, T-type, active NPC): the string on the right,
 * split capacitors on the left, clamp parts as horizontal chains from a DC tap bus to the string junctions.
 */
function drawStack(layout: LegLayout, p: Parts, o: DrawOptions): LegDrawing {
  const c = new Canvas(o.labelWidth)
  const stringColumn = Math.max(...p.switches.map(s => s.column))
  const string = p.switches.filter(s => s.column === stringColumn).sort((a, b) => a.row - b.row)
  const inner = [...p.switches.filter(s => s.column !== stringColumn), ...p.loneDiodes]
  const lastRow = Math.max(...string.map(s => s.row), 0)
  const yTop = 0
  const yBottom = (lastRow + 1) * ROW
  const yRow = (row: number) => yTop + (row + 0.5) * ROW
  const xS = 0

  // DC nodes from the negative rail up, evenly spaced between the rails.
  const dcNodes = layout.dcNodes.length >= 2 ? layout.dcNodes : ['dc0', 'dc1']
  const yDc = new Map(dcNodes.map((n, k) => [n, yBottom - (k * (yBottom - yTop)) / (dcNodes.length - 1)]))
  const innerTaps = dcNodes.slice(1, -1)

  // Chains of inner parts by row, walked from the tap (left) to the string (right).
  const byRow = new Map<number, LegLayoutItem[]>()
  for (const i of inner) byRow.set(i.row, [...(byRow.get(i.row) ?? []), i])
  const chains = [...byRow].map(([row, items]) => {
    const ordered = [...items].sort((a, b) => a.column - b.column)
    const tap = ordered.flatMap(i => i.nodes).find(n => yDc.has(n)) ?? innerTaps[0] ?? dcNodes[0]!
    return { row, y: yRow(row), items: ordered, tap }
  })
  const longest = Math.max(0, ...chains.map(ch => ch.items.length))
  const CHAIN_PITCH = Math.max(120, widest(p, o, inner) + 16)
  const chainX = (k: number) => xS - 100 - k * CHAIN_PITCH
  // Buses stay clear of the labels centred above the leftmost chain parts.
  const leftmost = chains.filter(ch => ch.items.length === longest).map(ch => ch.items[0]!)
  const chainLeft = longest ? Math.min(chainX(longest - 1) - TERMINAL, chainX(longest - 1) - widest(p, o, leftmost) / 2 + 6) : xS
  const busStep = 24
  const busLeft = chainLeft - 24 - Math.max(0, innerTaps.length - 1) * busStep
  const busX = new Map(innerTaps.map((t, i) => [t, busLeft + i * busStep]))
  const xC = innerTaps.length ? busLeft - 56 : longest ? chainLeft - 60 : xS - 140

  // Rails.
  c.wire([[xC - 34, yTop], [xS, yTop]])
  c.wire([[xC - 34, yBottom], [xS, yBottom]])
  c.note({ x: xC - 40, y: yTop + 4, text: 'DC+', anchor: 'end', tone: 'rail' })
  c.note({ x: xC - 40, y: yBottom + 4, text: 'DC−', anchor: 'end', tone: 'rail' })

  // Capacitor stack.
  const caps = [...p.capacitors].sort((a, b) => (yDc.get(a.nodes[0]) ?? 0) - (yDc.get(b.nodes[0]) ?? 0))
  let yWire = yTop
  caps.forEach((cap, k) => {
    const hi = yDc.get(cap.nodes[0]) ?? yTop + (k * (yBottom - yTop)) / caps.length
    const lo = yDc.get(cap.nodes[1]) ?? yTop + ((k + 1) * (yBottom - yTop)) / caps.length
    const y = (hi + lo) / 2
    c.wire([[xC, hi], [xC, y - TERMINAL]])
    c.wire([[xC, y + TERMINAL], [xC, lo]])
    c.part({ ...partFor(p, cap), x: xC, y, rotation: 0, label: { x: xC - 22, y, anchor: 'end', valign: 'middle' } }, 1)
    yWire = lo
  })
  if (!caps.length) c.wire([[xC, yTop], [xC, yBottom]])
  else if (yWire < yBottom) c.wire([[xC, yWire], [xC, yBottom]])

  // The string, top to bottom.
  let y = yTop
  for (const s of string) {
    const yc = yRow(s.row)
    c.wire([[xS, y], [xS, yc - TERMINAL]])
    const part = partFor(p, s)
    c.part({ ...part, x: xS, y: yc, rotation: 0, label: { x: xS + 30, y: yc, anchor: 'start', valign: 'middle' } }, lineCount(part))
    y = yc + TERMINAL
  }
  c.wire([[xS, y], [xS, yBottom]])

  // Output: between the string part ending at the output node and the one starting there.
  const upper = string.find(s => s.nodes[1] === layout.outputNode)
  const lower = string.find(s => s.nodes[0] === layout.outputNode)
  const outRow = upper && lower ? (upper.row + lower.row) / 2 : lastRow / 2
  const yOut = yRow(outRow)
  const xOut = xS + 40 + widest(p, o, string)
  c.wire([[xS, yOut], [xOut, yOut]])
  c.dot(xS, yOut)
  c.terminal({ x: xOut, y: yOut, text: 'out', anchor: 'start', dx: 10, dy: 4 })

  // Chains and their tap buses.
  const busSpan = new Map<string, [number, number]>()
  const touch = (tap: string, yy: number) => {
    const s = busSpan.get(tap) ?? [yy, yy]
    busSpan.set(tap, [Math.min(s[0], yy), Math.max(s[1], yy)])
  }
  const busJoins: { tap: string, y: number }[] = []
  for (const ch of chains) {
    let from = ch.tap
    let xPrev = busX.get(ch.tap) ?? xC
    ch.items.forEach((item, k) => {
      const xi = chainX(ch.items.length - 1 - k)
      const rotation: Rotation = item.nodes[0] === from ? 270 : 90
      from = item.nodes[0] === from ? item.nodes[1] : item.nodes[0]
      const part = partFor(p, item)
      c.wire([[xPrev, ch.y], [xi - TERMINAL, ch.y]])
      c.part({ ...part, x: xi, y: ch.y, rotation, label: { x: xi, y: ch.y - 28, anchor: 'middle', valign: 'bottom' } }, lineCount(part))
      xPrev = xi + TERMINAL
    })
    c.wire([[xPrev, ch.y], [xS, ch.y]])
    if (Math.abs(ch.y - yOut) > 1) c.dot(xS, ch.y)
    if (busX.has(ch.tap)) { touch(ch.tap, ch.y); busJoins.push({ tap: ch.tap, y: ch.y }) }
  }
  for (const tap of innerTaps) {
    const xb = busX.get(tap)!
    const yt = yDc.get(tap)!
    c.dot(xC, yt)
    // A tap wire on a row that another tap's chain uses would run into it: step down half a row first.
    const clash = chains.some(ch => ch.tap !== tap && Math.abs(ch.y - yt) < 1)
    const yJoin = clash ? yt + ROW / 2 : yt
    c.wire(clash ? [[xC, yt], [xC + 20, yt], [xC + 20, yJoin], [xb, yJoin]] : [[xC, yt], [xb, yt]])
    touch(tap, yJoin)
    busJoins.push({ tap, y: yJoin })
  }
  for (const [tap, [y0, y1]] of busSpan) {
    const xb = busX.get(tap)!
    if (y1 > y0) c.wire([[xb, y0], [xb, y1]])
    for (const j of busJoins.filter(b => b.tap === tap)) if (j.y > y0 + 1 && j.y < y1 - 1) c.dot(xb, j.y)
  }
  return c.finish()
}

/**
 * Flying-capacitor leg drawn as a vertical ladder: the upper switches down the left path from DC+, the lower
 * switches down the right path from DC−, flying capacitors as rungs, the output where the paths meet.
 */
function drawLadder(layout: LegLayout, p: Parts, o: DrawOptions): LegDrawing {
  const c = new Canvas(o.labelWidth)
  const upperRow = Math.min(...p.switches.map(s => s.row))
  const left = p.switches.filter(s => s.row === upperRow).sort((a, b) => a.column - b.column)
  const right = p.switches.filter(s => s.row !== upperRow).sort((a, b) => a.column - b.column)
  const PITCH = 96
  const xP = 0
  const xQ = Math.max(210, widest(p, o, p.capacitors) + 70)
  const xMid = (xP + xQ) / 2
  const y0 = 0
  const cells = Math.max(left.length, right.length)
  const yDev = (k: number) => y0 + 48 + k * PITCH
  const yRung = (k: number) => y0 + k * PITCH

  const dcLink = p.capacitors.find(cap => layout.dcNodes.includes(cap.nodes[0]) && layout.dcNodes.includes(cap.nodes[1]))
  const flying = p.capacitors.filter(cap => cap !== dcLink).sort((a, b) => a.column - b.column)

  c.note({ x: xP, y: y0 - 14, text: 'DC+', anchor: 'middle', tone: 'rail' })
  c.note({ x: xQ, y: y0 - 14, text: 'DC−', anchor: 'middle', tone: 'rail' })
  const rung = (cap: LegLayoutItem | undefined, yy: number, nameAbove: boolean) => {
    if (!cap) { c.wire([[xP, yy], [xQ, yy]]); return }
    c.wire([[xP, yy], [xMid - TERMINAL, yy]])
    c.wire([[xMid + TERMINAL, yy], [xQ, yy]])
    c.part({ ...partFor(p, cap), x: xMid, y: yy, rotation: 90, label: { x: xMid, y: nameAbove ? yy - 20 : yy + 34, anchor: 'middle', valign: nameAbove ? 'bottom' : 'middle' } }, 1)
  }
  if (dcLink) rung(dcLink, y0, false)

  const path = (devices: LegLayoutItem[], x: number, startNode: string | undefined, side: 'left' | 'right') => {
    let from = startNode
    let yy = y0
    devices.forEach((d, k) => {
      const yc = yDev(k)
      const rotation: Rotation = from === undefined || d.nodes[0] === from ? 0 : 180
      from = rotation === 0 ? d.nodes[1] : d.nodes[0]
      c.wire([[x, yy], [x, yc - TERMINAL]])
      const part = partFor(p, d)
      c.part({ ...part, x, y: yc, rotation, label: { x: side === 'left' ? x - 30 : x + 30, y: yc, anchor: side === 'left' ? 'end' : 'start', valign: 'middle' } }, lineCount(part))
      yy = yc + TERMINAL
    })
    return yy
  }
  const topOf = (devices: LegLayoutItem[]) => devices[0]?.nodes.find(n => layout.dcNodes.includes(n))
  const endL = path(left, xP, topOf(left), 'left')
  const endR = path(right, xQ, topOf(right), 'right')

  flying.forEach((cap, k) => {
    const yy = yRung(k + 1)
    rung(cap, yy, true)
    c.dot(xP, yy)
    c.dot(xQ, yy)
  })
  const yEnd = yRung(cells) + 12
  c.wire([[xP, endL], [xP, yEnd], [xQ, yEnd], [xQ, endR]])
  c.wire([[xMid, yEnd], [xMid, yEnd + 26]])
  c.dot(xMid, yEnd)
  c.terminal({ x: xMid, y: yEnd + 26, text: 'out', anchor: 'start', dx: 10, dy: 4 })
  return c.finish()
}

/**
 * Cascaded H-bridge phase: cells stacked, the first cell's terminal A is the phase output, each cell's B
 * feeds the next cell's A, the last B is the star point. More than three cells: the middle ones are elided.
 */
function drawCells(layout: LegLayout, p: Parts, o: DrawOptions): LegDrawing {
  const c = new Canvas(o.labelWidth)
  const cellsPerPhase = Math.max(1, ...p.switches.map(s => s.countPerPhase))
  const legA = p.switches.filter(s => s.nodes.includes(layout.outputNode)).sort((a, b) => a.row - b.row)
  const legB = p.switches.filter(s => !s.nodes.includes(layout.outputNode)).sort((a, b) => a.row - b.row)
  const cap = p.capacitors[0]
  const drawn = cellsPerPhase <= 3 ? Array.from({ length: cellsPerPhase }, (_, k) => k + 1) : [1, 2, cellsPerPhase]

  const GAP = 150
  const xB = 0
  const xCap = xB + GAP
  const xA = xCap + GAP
  const xL = xB - 40 - widest(p, o, legB)
  const xR = xA + 40 + widest(p, o, legA)
  const CELL_H = 150
  const CELL_PITCH = 210
  const ELISION = 80

  let yc = 0
  let prevGap: number | undefined
  drawn.forEach((cell, idx) => {
    const elided = idx > 0 && cell - drawn[idx - 1]! > 1
    if (elided) {
      const from = drawn[idx - 1]! + 1
      c.note({ x: xCap, y: yc + 10, text: from === cell - 1 ? `⋮  cell ${from} is identical` : `⋮  cells ${from}…${cell - 1} are identical`, anchor: 'middle', tone: 'caption' })
      yc += ELISION
    }
    const namesOnly = cell !== 1
    const yP = yc
    const yN = yc + CELL_H
    const yMid = (yP + yN) / 2
    c.frame({ x: xL + 8, y: yP - 24, w: xR - xL - 16, h: CELL_H + 40, label: `Cell ${cell} of ${cellsPerPhase}` })

    const leg = (devices: LegLayoutItem[], x: number, side: 'left' | 'right') => {
      let yy = yP
      devices.forEach((d, k) => {
        const yd = yP + 40 + k * 70
        c.wire([[x, yy], [x, yd - TERMINAL]])
        const part = partFor(p, d)
        c.part({ ...part, x, y: yd, rotation: 0, namesOnly, label: { x: side === 'left' ? x - 30 : x + 30, y: yd, anchor: side === 'left' ? 'end' : 'start', valign: 'middle' } }, lineCount(part))
        yy = yd + TERMINAL
      })
      c.wire([[x, yy], [x, yN]])
    }
    leg(legB, xB, 'left')
    leg(legA, xA, 'right')
    c.wire([[xB, yP], [xA, yP]])
    c.wire([[xB, yN], [xA, yN]])
    if (cap) {
      c.wire([[xCap, yP], [xCap, yMid - TERMINAL]])
      c.wire([[xCap, yMid + TERMINAL], [xCap, yN]])
      c.part({ ...partFor(p, cap), x: xCap, y: yMid, rotation: 0, namesOnly, label: { x: xCap + 20, y: yMid, anchor: 'start', valign: 'middle' } }, 1)
    }
    c.dot(xCap, yP)
    c.dot(xCap, yN)

    // Terminal A to the right, terminal B to the left.
    c.dot(xA, yMid)
    c.dot(xB, yMid)
    if (idx === 0) {
      c.wire([[xA, yMid], [xR, yMid]])
      c.terminal({ x: xR, y: yMid, text: 'out', anchor: 'start', dx: 10, dy: 4 })
    }
    else {
      c.wire([[xA, yMid], [xR, yMid], [xR, prevGap!]])
    }
    const yGap = yN + 30
    if (idx < drawn.length - 1) {
      c.wire([[xB, yMid], [xL, yMid], [xL, yGap], [xR, yGap]])
      prevGap = yGap
      const nextElided = drawn[idx + 1]! - cell > 1
      if (nextElided) {
        // The elided cells sit on a dashed stretch of the chain.
        c.wire([[xR, yGap], [xR, yGap + CELL_PITCH - CELL_H + ELISION - 30]], true)
        prevGap = yGap + CELL_PITCH - CELL_H + ELISION - 30
      }
    }
    else {
      c.wire([[xB, yMid], [xL, yMid], [xL, yMid + 44]])
      c.terminal({ x: xL, y: yMid + 44, text: 'star point', anchor: 'start', dx: 10, dy: 4 })
    }
    yc += CELL_PITCH
  })
  if (cellsPerPhase > 1) c.note({ x: xL + 8, y: yc - CELL_PITCH + CELL_H + 58, text: 'Every cell carries the same stresses; they are written on cell 1.', anchor: 'start', tone: 'caption' })
  return c.finish()
}

/**
 * One output phase of the 3×3 matrix converter in detail: a bidirectional switch (two switches in
 * common-emitter connection) from each input phase to the output; a small 3×3 overview beside it.
 */
function drawMatrix(layout: LegLayout, p: Parts, o: DrawOptions): LegDrawing {
  const c = new Canvas(o.labelWidth)
  const columns = Array.from(new Set(p.switches.map(s => s.column))).sort((a, b) => a - b)
  const PITCH = Math.max(160, widest(p, o, p.switches) + 64)
  const x0 = 0
  const yIn = (k: number) => k * 22
  const top = yIn(columns.length - 1)
  const y1 = top + 70
  const y2 = y1 + 84
  const yOut = y2 + 56
  const xEnd = x0 + (columns.length - 1) * PITCH + 40 + widest(p, o, p.switches)
  const inputs: string[] = []

  columns.forEach((col, k) => {
    const pair = p.switches.filter(s => s.column === col).sort((a, b) => a.row - b.row)
    const x = x0 + k * PITCH
    const inputNode = pair[0]?.nodes[0] ?? `in${k}`
    const input = inputNode.replace(/^in/, '') || String(k + 1)
    inputs.push(input)
    c.wire([[x0 - 40, yIn(k)], [xEnd, yIn(k)]])
    c.note({ x: x0 - 46, y: yIn(k) + 4, text: `input ${input}`, anchor: 'end', tone: 'rail' })
    c.dot(x, yIn(k))
    let from = inputNode
    let yy = yIn(k)
    pair.forEach((d, j) => {
      const yc = j === 0 ? y1 : y2
      const rotation: Rotation = d.nodes[0] === from ? 0 : 180
      from = rotation === 0 ? d.nodes[1] : d.nodes[0]
      c.wire([[x, yy], [x, yc - TERMINAL]])
      const part = partFor(p, d)
      c.part({ ...part, x, y: yc, rotation, label: { x: x + 32, y: yc, anchor: 'start', valign: 'middle' } }, lineCount(part))
      yy = yc + TERMINAL
    })
    c.wire([[x, yy], [x, yOut]])
    c.dot(x, yOut)
  })
  const xLast = x0 + (columns.length - 1) * PITCH
  c.wire([[x0, yOut], [xLast + 60, yOut]])
  c.terminal({ x: xLast + 60, y: yOut, text: 'out (output phase a)', anchor: 'start', dx: 10, dy: 4 })

  // 3×3 overview under the detail, with the explanation beside it.
  const ix = x0 + 10
  const iy = yOut + 52
  c.inset = { x: ix, y: iy, inputs, outputs: ['a', 'b', 'c'], detailed: 0 }
  c.grow(ix - 30, iy - 14)
  c.grow(ix + 3 * INSET_PITCH + 20, iy + 3 * INSET_PITCH + 34)
  c.note({ x: ix + 160, y: iy + 44, text: 'Above: output phase a, one bidirectional switch per input phase.', anchor: 'start', tone: 'caption' })
  c.note({ x: ix + 160, y: iy + 62, text: 'Output phases b and c repeat it: 9 bidirectional switches in all.', anchor: 'start', tone: 'caption' })
  return c.finish()
}

/** Anything without a known shape: parts on their layout slots, no wiring. */
function drawGrid(layout: LegLayout, p: Parts, o: DrawOptions): LegDrawing {
  const c = new Canvas(o.labelWidth)
  const DX = widest(p, o, [...p.switches, ...p.loneDiodes, ...p.capacitors]) + 90
  const all = [...p.switches, ...p.loneDiodes, ...p.capacitors]
  for (const item of all) {
    const part = partFor(p, item)
    const x = item.column * DX
    const y = item.row * 90
    c.part({ ...part, x, y, rotation: 0, label: { x: x + 30, y, anchor: 'start', valign: 'middle' } }, lineCount(part))
  }
  c.note({ x: 0, y: Math.max(0, ...all.map(i => i.row)) * 90 + 60, text: `Parts of one ${layout.topology} leg on their layout slots (wiring not drawn).`, anchor: 'start', tone: 'caption' })
  return c.finish()
}

/** The per-shape rules, chosen by the topology's declared drawing kind (its definition's `presentation.drawing`). */
const DRAWING_RULES: Record<LegDrawingKind, (layout: LegLayout, parts: Parts, options: DrawOptions) => LegDrawing> = {
  stack: drawStack,
  ladder: drawLadder,
  cells: drawCells,
  matrix: drawMatrix,
}
