// The one renderer of the leg schematic: the drawing of ./leg (layout) with the symbols of ./leg (SYMBOL) turned into
// an SVG element tree, one rule per shape, styled by a theme. The design page renders the tree with Vue
// (app/components/design/results/LegSchematic.vue: hover, highlight); the report serialises it (./leg-svg.ts).
import type { LegLayout } from '../engine'
import { drawLeg, FRAME, insetGeometry, LABEL_GAP, labelBaselines, labelLines, labelWidthOf, SYMBOL, WIRE, type LabelLine, type LegDrawing, type PlacedPart } from './leg'

export type SvgAttrs = Record<string, string | number | undefined>
export interface SvgNode { tag: string, attrs: SvgAttrs, children: SvgChild[] }
export type SvgChild = SvgNode | string

/** Kinds of text in the drawing; the theme gives each its attributes (classes on the page, sizes in print). */
export type TextRole = 'frame' | 'name' | 'stress' | 'terminal' | 'rail' | 'caption' | 'inset-title' | 'inset-input' | 'inset-output' | 'inset-output-detailed'

/** Colours and text styles: the page's (on screen, with highlight) or the report's (black and greys). */
export interface LegTheme {
  /** symbol strokes, per highlighted or not */
  ink: (hot: boolean) => string
  /** fill of a diode's triangle, per highlighted or not */
  triangle: (hot: boolean) => string
  /** joints of an anti-parallel diode and wire dots */
  dot: string
  wire: string
  paper: string
  frame: SvgAttrs
  terminal: SvgAttrs
  inset: { input: string, output: (detailed: boolean) => SvgAttrs, crosspoint: (detailed: boolean) => SvgAttrs }
  text: (role: TextRole, hot: boolean) => SvgAttrs
  /** text as it can be set in the theme's font (print drops glyphs its font lacks) */
  printable?: (text: string) => string
  /** on the page: a transparent hit box under every part (filled when highlighted) and a tooltip */
  interactive?: { hotFill: string, title: (name: string) => string }
}

export interface LegRenderInput {
  layout: LegLayout
  /** a position's label name, e.g. "Dc1+ ×2" for a series stack */
  nameText: (name: string) => string
  /** a position's stress, e.g. "600 V · 212 A" */
  stressText: (name: string) => string
  theme: LegTheme
  /** the position to highlight (page only) */
  highlight?: string | null
}

const node = (tag: string, attrs: SvgAttrs, children: SvgChild[] = []): SvgNode => ({ tag, attrs, children })

/** One rendered drawing: its geometry (for the view box) and the element tree inside the `<svg>`. */
export function renderLeg(input: LegRenderInput): { drawing: LegDrawing, nodes: SvgNode[] } {
  const { theme, highlight } = input
  const text = (s: string) => (theme.printable ? theme.printable(s) : s)
  const linesOf = (p: Pick<PlacedPart, 'name' | 'diodeName' | 'namesOnly'>): LabelLine[] => labelLines(p, input.nameText, input.stressText)
  const drawing = drawLeg(input.layout, { labelWidth: (name, diodeName) => labelWidthOf(linesOf({ name, diodeName })) })
  const isHot = (name: string | undefined) => !!name && !!highlight && highlight === name
  const strokeWidth = (hot: boolean) => (hot ? 2.6 : SYMBOL.stroke)

  /** A hoverable group: `data-hover` names the part; on the page a hit box and a tooltip come first. */
  const hoverable = (name: string, box: { x: number, y: number, w: number, h: number }, body: SvgNode[]): SvgNode => {
    const i = theme.interactive
    if (!i) return node('g', {}, body)
    return node('g', { 'data-hover': name, 'class': 'cursor-pointer' }, [
      node('title', {}, [i.title(name)]),
      node('rect', { x: box.x, y: box.y, width: box.w, height: box.h, fill: isHot(name) ? i.hotFill : 'transparent', rx: 3 }),
      ...body,
    ])
  }

  const shapes: Record<PlacedPart['shape'], (p: PlacedPart) => SvgNode[]> = {
    switch: (p) => {
      const s = SYMBOL.switch
      const hot = isHot(p.name)
      const out = [hoverable(p.name, s.hitBox, [
        node('g', { 'fill': 'none', 'stroke': theme.ink(hot), 'stroke-width': strokeWidth(hot), 'stroke-linecap': 'round', 'stroke-linejoin': 'round' }, [
          node('path', { d: s.collector }),
          node('path', { 'd': s.channel, 'stroke-width': strokeWidth(hot) + 1 }),
          node('path', { d: s.emitter }),
          node('path', { d: s.gate }),
        ]),
        node('path', { d: s.arrow, fill: theme.ink(hot) }),
      ])]
      if (p.diodeName) {
        const d = SYMBOL.antiParallelDiode
        const dh = isHot(p.diodeName)
        out.push(hoverable(p.diodeName, d.hitBox, [
          node('g', { 'fill': 'none', 'stroke': theme.ink(dh), 'stroke-width': strokeWidth(dh), 'stroke-linejoin': 'round' }, [node('path', { d: d.leads }), node('path', { d: d.bar })]),
          node('path', { 'd': d.triangle, 'fill': theme.triangle(dh), 'stroke': theme.ink(dh), 'stroke-width': strokeWidth(dh), 'stroke-linejoin': 'round' }),
          ...d.joints.map(j => node('circle', { cx: j.x, cy: j.y, r: d.jointRadius, fill: theme.dot })),
        ]))
      }
      return out
    },
    // a lone (clamp) diode, cathode at the top
    diode: (p) => {
      const s = SYMBOL.diode
      const hot = isHot(p.name)
      return [hoverable(p.name, s.hitBox, [
        node('path', { 'd': s.leads, 'fill': 'none', 'stroke': theme.ink(hot), 'stroke-width': strokeWidth(hot) }),
        node('path', { 'd': s.triangle, 'fill': theme.triangle(hot), 'stroke': theme.ink(hot), 'stroke-width': strokeWidth(hot), 'stroke-linejoin': 'round' }),
      ])]
    },
    capacitor: (p) => {
      const s = SYMBOL.capacitor
      const hot = isHot(p.name)
      return [hoverable(p.name, s.hitBox, [
        node('path', { 'd': s.leads, 'fill': 'none', 'stroke': theme.ink(hot), 'stroke-width': strokeWidth(hot) }),
        node('path', { 'd': s.plates, 'fill': 'none', 'stroke': theme.ink(hot), 'stroke-width': strokeWidth(hot) + 1.2 }),
      ])]
    },
  }

  const nodes: SvgNode[] = []
  for (const f of drawing.frames) {
    nodes.push(node('g', {}, [
      node('rect', { 'x': f.x, 'y': f.y, 'width': f.w, 'height': f.h, 'rx': FRAME.radius, ...theme.frame, 'stroke-dasharray': FRAME.dash }),
      node('text', { x: f.x + FRAME.labelDx, y: f.y + FRAME.labelDy, ...theme.text('frame', false) }, [text(f.label)]),
    ]))
  }
  for (const w of drawing.wires) {
    nodes.push(node('path', { 'd': w.d, 'fill': 'none', 'stroke': theme.wire, 'stroke-width': WIRE.stroke, 'stroke-dasharray': w.dashed ? WIRE.dash : undefined, 'stroke-linecap': 'square' }))
  }
  for (const d of drawing.dots) nodes.push(node('circle', { cx: d.x, cy: d.y, r: WIRE.dotRadius, fill: theme.dot }))
  for (const p of drawing.parts) {
    nodes.push(node('g', { 'transform': `translate(${p.x} ${p.y})`, 'data-part': p.name }, [node('g', { transform: `rotate(${p.rotation})` }, shapes[p.shape](p))]))
  }
  // Labels after every symbol (so no part is drawn over a label), kept upright outside the rotated groups.
  for (const p of drawing.parts) {
    const lines = linesOf(p)
    labelBaselines(p.label, lines.length).forEach((y, k) => {
      const line = lines[k]!
      const name = k === 0 ? p.name : p.diodeName
      const hot = isHot(name)
      const spans: SvgNode[] = [node('tspan', theme.text('name', hot), [line.name])]
      if (line.stress) spans.push(node('tspan', { dx: LABEL_GAP, ...theme.text('stress', hot) }, [line.stress]))
      nodes.push(node('text', { 'x': p.label.x, y, 'text-anchor': p.label.anchor, ...(theme.interactive && name ? { 'data-hover': name, 'class': 'part-label cursor-default' } : {}) }, spans))
    })
  }
  for (const t of drawing.terminals) {
    nodes.push(node('g', {}, [
      node('circle', { cx: t.x, cy: t.y, r: WIRE.terminalRadius, fill: theme.paper, ...theme.terminal }),
      node('text', { 'x': t.x + t.dx, 'y': t.y + t.dy, 'text-anchor': t.anchor, ...theme.text('terminal', false) }, [text(t.text)]),
    ]))
  }
  for (const n of drawing.notes) {
    nodes.push(node('text', { 'x': n.x, 'y': n.y, 'text-anchor': n.anchor, ...theme.text(n.tone === 'rail' ? 'rail' : 'caption', false) }, [text(n.text)]))
  }
  if (drawing.inset) {
    const g = insetGeometry(drawing.inset)
    const body: SvgNode[] = [node('text', { x: g.title.x, y: g.title.y, ...theme.text('inset-title', false) }, [text(g.title.text)])]
    for (const i of g.inputs) {
      body.push(node('path', { 'd': i.d, 'stroke': theme.inset.input, 'stroke-width': 1.2 }))
      body.push(node('text', { 'x': i.label.x, 'y': i.label.y, 'text-anchor': 'end', ...theme.text('inset-input', false) }, [text(i.label.text)]))
    }
    for (const o of g.outputs) {
      body.push(node('path', { d: o.d, ...theme.inset.output(o.detailed) }))
      body.push(node('text', { 'x': o.label.x, 'y': o.label.y, 'text-anchor': 'middle', ...theme.text(o.detailed ? 'inset-output-detailed' : 'inset-output', false) }, [text(o.label.text)]))
      for (const b of o.crosspoints) body.push(node('rect', { x: b.x, y: b.y, width: b.size, height: b.size, rx: b.radius, ...theme.inset.crosspoint(o.detailed) }))
    }
    nodes.push(node('g', { 'transform': `translate(${drawing.inset.x} ${drawing.inset.y})`, 'aria-hidden': 'true' }, body))
  }
  return { drawing, nodes }
}
