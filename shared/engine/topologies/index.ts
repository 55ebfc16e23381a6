// The topology registry: adding a topology = one file in this folder + one line here. Everything outside
// this folder (form, results, drawing, report, BOM) reads these definitions and never switches on an id.
import type { TopologyDefinition } from '../model'
import type { TopologyId } from '../types'
import { twoLevel } from './two-level'
import { diodeClamped } from './diode-clamped'
import { tType } from './t-type'
import { anpc } from './anpc'
import { flyingCapacitor } from './flying-capacitor'
import { cascadedHBridge } from './cascaded-h-bridge'
import { matrix } from './matrix'

export const topologies: TopologyDefinition[] = [
  twoLevel,
  diodeClamped,
  tType,
  anpc,
  flyingCapacitor,
  cascadedHBridge,
  matrix,
]

export const topologyById: Record<TopologyId, TopologyDefinition> = Object.fromEntries(
  topologies.map(t => [t.id, t]),
) as Record<TopologyId, TopologyDefinition>

/**
 * Adds a definition to the registry and returns the function that takes it out again. For tests: a throw-away
 * topology declared in one file must reach the form choices, the engine, the drawing, the report and the BOM.
 */
export function registerTopology(definition: TopologyDefinition): () => void {
  if (topologyById[definition.id]) throw new Error(`topology ${definition.id} is already registered`)
  topologies.push(definition)
  topologyById[definition.id] = definition
  return () => {
    topologies.splice(topologies.indexOf(definition), 1)
    Reflect.deleteProperty(topologyById, definition.id)
  }
}

/** The form's topology choices in registry order, read when a form is built (so a registered topology is offered). */
export function topologyOptions(): { id: TopologyId, label: string, description: string }[] {
  return topologies.map(t => ({ id: t.id, label: t.label, description: t.description }))
}

/** The level count a design of this topology has: its only one, its default where levels are ignored, else the given one. */
export function effectiveLevels(topology: TopologyId, levels?: number): number {
  const t = topologyById[topology]
  if (!t) return levels ?? 3
  if (t.allowedLevels === 'ignored') return t.defaultLevels ?? 3
  if (t.allowedLevels.length === 1) return t.allowedLevels[0]!
  return levels ?? t.defaultLevels ?? t.allowedLevels[0]!
}

/** Short name of a converter, e.g. "Diode-clamped multilevel (N = 5)"; the level count only where the topology has several. */
export function topologyName(topology: TopologyId, levels?: number, style: 'paren' | 'comma' = 'paren'): string {
  const t = topologyById[topology]
  const label = t?.label ?? topology
  if (!t?.presentation.levelsInName || !levels) return label
  return style === 'paren' ? `${label} (N = ${levels})` : `${label}, ${levels} levels`
}

/** What one leg drawing shows, for headings and screen-reader summaries. */
export function drawnUnitText(topology: TopologyId, levels: number): string {
  return topologyById[topology]?.presentation.drawnUnit === 'output-phase' ? 'one output phase' : `one phase leg, ${levels} levels`
}
