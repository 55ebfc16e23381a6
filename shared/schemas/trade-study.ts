import { z } from 'zod'
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
  candidates: z.array(z.object({ topology: z.enum(topologyIds), levels: z.number().int().min(2).max(15).optional() })).min(1).max(40).optional(),
})
export type TradeStudyInput = z.infer<typeof tradeStudySchema>
