// Leg schematic hints for the UI: ordered positions with slots and the nodes they join. Data only.
import { EngineInputError } from './errors'
import type { CapacitorDef } from './model'
import { topologyById } from './topologies'
import type { DeviceKind, TopologyId } from './types'
import { legFor } from './validate'

export interface LegLayoutItem {
  name: string
  kind: DeviceKind | 'capacitor'
  /** slot: row from the positive rail down, column from the DC link rightwards (may be fractional: junction rows) */
  row: number
  column: number
  /** [collector / cathode / + node, emitter / anode / − node] */
  nodes: [string, string]
  /** the switch a diode is anti-parallel to: draw it beside that switch */
  antiParallelTo?: string
  /** devices per phase at the position; capacitors: how many the drawn one stands for (cells per phase, or the whole shared DC-link string) */
  countPerPhase: number
  /**
   * capacitors drawn once across several level steps of the DC link: how many units (each rated as the capacitor
   * table's row, one level step) the symbol stands for in series, e.g. the flying-capacitor leg's Cdc, N − 1
   */
  seriesUnits?: number
}

export interface LegLayout {
  topology: TopologyId
  levels: number
  /** the node that is the phase output (for a cascaded H-bridge: terminal A of one cell) */
  outputNode: string
  /** DC nodes from the negative rail up (empty for the matrix converter) */
  dcNodes: string[]
  rows: number
  columns: number
  items: LegLayoutItem[]
}

/** How many capacitors one drawn capacitor stands for: a cell's per phase, the shared DC-link string whole, a flying capacitor one. */
function capacitorsDrawn(supply: string, c: CapacitorDef, cells = 1): number {
  if (supply === 'cell') return cells
  return c.kind === 'flying' ? 1 : c.countInConverter
}

/** DC node dcK sits K level steps above dc0. */
const dcStep = (node: string) => (/^dc\d+$/.test(node) ? Number(node.slice(2)) : undefined)

/** Units in series one drawn DC-link capacitor stands for: the level steps it spans over the steps one unit holds. */
function seriesUnitsDrawn(c: CapacitorDef): number | undefined {
  const [a, b] = c.nodes.map(dcStep)
  if (a === undefined || b === undefined || c.voltageUnits <= 0) return undefined
  const units = Math.abs(a - b) / c.voltageUnits
  return units > 1 ? units : undefined
}

/** Ordered device (and capacitor) positions of one phase leg for a level count. */
export function legLayout(topology: TopologyId, levels?: number): LegLayout {
  const t = topologyById[topology]
  if (!t) throw new EngineInputError('topology', `unknown topology ${String(topology)}`)
  const n = t.allowedLevels === 'ignored' ? (t.defaultLevels ?? 3) : (levels ?? t.defaultLevels)
  if (n === undefined || (t.allowedLevels !== 'ignored' && !t.allowedLevels.includes(n))) {
    throw new EngineInputError('levels', `levels must be one of ${t.allowedLevels === 'ignored' ? 'any' : t.allowedLevels.join(', ')} for ${topology}`)
  }
  const leg = legFor(t, n)
  const items: LegLayoutItem[] = [
    ...leg.positions.map(p => ({ name: p.name, kind: p.kind, row: p.row, column: p.column, nodes: p.nodes, ...(p.antiParallelTo ? { antiParallelTo: p.antiParallelTo } : {}), countPerPhase: p.countPerPhase })),
    ...leg.def.capacitors.map(c => ({ name: c.name, kind: 'capacitor' as const, row: c.row, column: c.column, nodes: c.nodes, countPerPhase: capacitorsDrawn(t.supply, c, leg.def.cellsPerPhase), ...(seriesUnitsDrawn(c) ? { seriesUnits: seriesUnitsDrawn(c) } : {}) })),
  ]
  const dcNodes = t.supply === 'dc-link'
    ? Array.from(new Set(leg.def.capacitors.flatMap(c => c.nodes))).filter(x => x.startsWith('dc')).sort((a, b) => Number(a.slice(2)) - Number(b.slice(2)))
    : t.supply === 'cell' ? ['n', 'p'] : []
  return {
    topology,
    levels: n,
    outputNode: leg.def.outputNode,
    dcNodes,
    rows: Math.ceil(Math.max(...items.map(i => i.row))) + 1,
    columns: Math.ceil(Math.max(...items.map(i => i.column))) + 1,
    items,
  }
}
