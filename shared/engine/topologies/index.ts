// The topology registry: adding a topology = one file in this folder + one line here.
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
