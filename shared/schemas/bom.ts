import { z } from 'zod'

export const bomStatuses = ['released', 'quoted', 'ordered', 'received', 'cancelled'] as const
export const bomStatusSchema = z.object({ status: z.enum(bomStatuses, { message: `Choose one of: ${bomStatuses.join(', ')}` }) })

export const purchaseLineSchema = z.object({
  supplier: z.string().trim().max(120).nullable().optional(),
  quotedUnitPrice: z.number({ error: 'Enter a price per piece' }).min(0, 'Must not be negative').max(1e7).nullable().optional(),
  orderReference: z.string().trim().max(80).nullable().optional(),
}).refine(v => Object.values(v).some(x => x !== undefined), { message: 'Give supplier, quotedUnitPrice or orderReference' })

export const exportFormat = z.object({ format: z.enum(['xlsx', 'pdf'], { message: 'Use \'xlsx\' or \'pdf\'' }) })
