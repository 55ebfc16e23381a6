// One schematic renderer for the page and the report: the same element tree and geometry in either theme, the
// page's hover marks on every part, the highlight on the one pointed at, and the report's SVG built from that tree.
import { describe, expect, it } from 'vitest'
import { renderLeg, type LegTheme, type SvgChild, type SvgNode } from '../../../shared/drawing/leg-render'
import { legSchematicSvg, serialiseSvg } from '../../../shared/drawing/leg-svg'
import { legLayout, topologies, type TopologyId } from '../../../shared/engine'

const plain: LegTheme = {
  ink: hot => (hot ? 'HOT' : 'INK'),
  triangle: hot => (hot ? 'HOT' : 'PAPER'),
  dot: 'INK',
  wire: 'WIRE',
  paper: 'PAPER',
  frame: { fill: 'none' },
  terminal: { stroke: 'INK' },
  inset: { input: 'SOFT', output: d => ({ stroke: d ? 'INK' : 'SOFT' }), crosspoint: d => ({ fill: d ? 'GREY' : 'PAPER' }) },
  text: role => ({ 'data-role': role }),
}
const interactive: LegTheme = { ...plain, interactive: { hotFill: 'HOTFILL', title: name => `about ${name}` } }

const walk = (nodes: readonly SvgChild[], visit: (n: SvgNode, parents: SvgNode[]) => void, parents: SvgNode[] = []) => {
  for (const n of nodes) {
    if (typeof n === 'string') continue
    visit(n, parents)
    walk(n.children, visit, [...parents, n])
  }
}
/** The drawing without what only the page adds (tooltips, hit boxes, hover marks). */
function geometry(nodes: readonly SvgChild[]): string[] {
  const out: string[] = []
  walk(nodes, (n, parents) => {
    if (n.tag === 'title' || parents.some(p => p.tag === 'title')) return
    if (n.tag === 'rect' && n.attrs.fill === 'transparent') return
    const { 'data-hover': _h, 'class': _c, ...rest } = n.attrs
    out.push(`${n.tag} ${JSON.stringify(rest)}`)
  })
  return out
}

const cases = topologies.flatMap(t => (t.allowedLevels === 'ignored' ? [{ id: t.id, levels: undefined }] : [{ id: t.id, levels: t.allowedLevels.includes(3) ? 3 : t.allowedLevels[0] }]))
const names = (id: TopologyId, levels?: number) => legLayout(id, levels).items.map(i => i.name)

describe('one leg renderer (shared/drawing/leg-render.ts)', () => {
  it.each(cases)('$id: the page and the report draw the same elements at the same places', ({ id, levels }) => {
    const input = { layout: legLayout(id, levels), nameText: (n: string) => n, stressText: () => '1 kV · 2 A' }
    const page = renderLeg({ ...input, theme: interactive })
    const print = renderLeg({ ...input, theme: plain })
    expect(geometry(page.nodes)).toEqual(geometry(print.nodes))
    expect(page.drawing).toEqual(print.drawing)
  })

  it.each(cases)('$id: on the page every position can be pointed at (symbol and label) and has a tooltip', ({ id, levels }) => {
    const { nodes } = renderLeg({ layout: legLayout(id, levels), nameText: n => n, stressText: () => '', theme: interactive })
    const hover = new Set<string>()
    const titles = new Set<string>()
    walk(nodes, (n, parents) => {
      if (typeof n.attrs['data-hover'] === 'string') hover.add(n.attrs['data-hover'])
      if (n.tag === 'title') titles.add(String(n.children[0]))
      if (n.tag === 'title') expect(parents.at(-1)!.attrs['data-hover']).toBeDefined()
    })
    for (const name of names(id, levels)) {
      expect(hover.has(name), name).toBe(true)
      expect(titles.has(`about ${name}`), name).toBe(true)
    }
    // the report theme adds none of it
    const plainTree = renderLeg({ layout: legLayout(id, levels), nameText: n => n, stressText: () => '', theme: plain }).nodes
    walk(plainTree, (n) => {
      expect(n.attrs['data-hover']).toBeUndefined()
      expect(n.tag).not.toBe('title')
    })
  })

  it('highlights only the position pointed at: its strokes, its hit box and its label', () => {
    const layout = legLayout('diode-clamped', 3)
    const { nodes } = renderLeg({ layout, nameText: n => n, stressText: () => '', theme: interactive, highlight: 'Dc1+' })
    const hot: string[] = []
    walk(nodes, (n, parents) => {
      const owner = [...parents, n].reverse().find(p => typeof p.attrs['data-hover'] === 'string')?.attrs['data-hover']
      if (n.attrs.stroke === 'HOT' || n.attrs.fill === 'HOT' || n.attrs.fill === 'HOTFILL') hot.push(String(owner))
    })
    expect(hot.length).toBeGreaterThan(0)
    expect(new Set(hot)).toEqual(new Set(['Dc1+']))
  })

  it('the report\'s SVG document is the serialised tree in the report theme', () => {
    const layout = legLayout('flying-capacitor', 5)
    const svg = legSchematicSvg(layout, { devices: [], capacitors: [] })
    const paths = (s: string) => (s.match(/<path /g) ?? []).length
    const { nodes } = renderLeg({ layout, nameText: n => n, stressText: () => '', theme: plain })
    expect(paths(svg)).toBe(paths(serialiseSvg(nodes)))
    expect(svg).not.toContain('data-hover')
    expect(svg).not.toContain('<title>about')
  })
})
