import { z } from 'zod'
import { converterInputSchema, deratingSchema, topologyIds } from './stress'

/** One duty run through several topologies: the DC link and operating points of a converter, without its topology. */
export const tradeStudySchema = z.object({
  dcVoltage: z.number({ error: 'dcVoltage must be a number (V)' }).positive('dcVoltage must be above 0 V'),
  dcVoltageMax: z.number().positive('dcVoltageMax must be above 0 V').optional(),
  inputLineVoltageRms: z.number().positive('inputLineVoltageRms must be above 0 V').optional(),
  switchingHz: z.number({ error: 'switchingHz must be a number (Hz)' }).positive('switchingHz must be above 0 Hz'),
  overshootVoltage: z.number().min(0).optional(),
  operatingPoints: converterInputSchema.shape.operatingPoints,
  derating: deratingSchema.optional(),
  candidates: z.array(z.object({ topology: z.enum(topologyIds), levels: z.number().int().min(2).max(15).optional() })).min(1).max(40).optional(),
})
export type TradeStudyInput = z.infer<typeof tradeStudySchema>
