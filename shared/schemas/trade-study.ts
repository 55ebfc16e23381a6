import { z } from 'zod'
import { topologyById } from '../engine/topologies'
import type { TopologyId } from '../engine/types'
import { converterInputSchema, deratingSchema, topologyIds } from './stress'

/** One duty run through several topologies: the DC link and operating points of a converter, without its topology. */
export const tradeStudySchema = z.object({
  // The converter's own field checks, with the physical bounds of shared/engine/limits.ts.
  dcVoltage: converterInputSchema.shape.dcVoltage.unwrap(),
  dcVoltageMax: converterInputSchema.shape.dcVoltageMax,
  inputLineVoltageRms: converterInputSchema.shape.inputLineVoltageRms,
  switchingHz: converterInputSchema.shape.switchingHz,
  overshootVoltage: converterInputSchema.shape.overshootVoltage,
  operatingPoints: converterInputSchema.shape.operatingPoints,
  derating: deratingSchema.optional(),
  // Level counts the user picks: N = 3 … 9 for the diode-clamped and flying-capacitor legs, odd N up to 15 for the cascaded H-bridge.
  candidates: z.array(z.object({ topology: z.enum(topologyIds), levels: z.number().int().min(2).max(15).optional() })).min(1).max(40).optional(),
}).superRefine((v, ctx) => {
  v.candidates?.forEach((c, i) => {
    const allowed = topologyById[c.topology]?.allowedLevels
    if (!allowed || c.levels === undefined || allowed === 'ignored' || allowed.includes(c.levels)) return
    ctx.addIssue({ code: 'custom', path: ['candidates', i, 'levels'], message: `candidates.${i}.levels: ${topologyById[c.topology].label} takes N = ${allowed.join(', ')}, not ${c.levels}` })
  })
})
export type TradeStudyInput = z.infer<typeof tradeStudySchema>

/** Candidates when the study names none (the page starts from these). */
export const defaultCandidates: { topology: TopologyId, levels?: number }[] = [
  { topology: 'two-level', levels: 2 },
  { topology: 'diode-clamped', levels: 3 },
  { topology: 't-type', levels: 3 },
  { topology: 'anpc', levels: 3 },
  { topology: 'flying-capacitor', levels: 3 },
  { topology: 'diode-clamped', levels: 5 },
  { topology: 'flying-capacitor', levels: 5 },
  { topology: 'cascaded-h-bridge', levels: 5 },
  { topology: 'cascaded-h-bridge', levels: 7 },
  { topology: 'matrix' },
]
