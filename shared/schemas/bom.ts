import { z } from 'zod'
import { PURCHASE_STATUSES } from '../bom/types'

export const bomStatuses = ['released', 'quoted', 'ordered', 'received', 'cancelled'] as const
export const bomStatusSchema = z.object({ status: z.enum(bomStatuses, { message: `Choose one of: ${bomStatuses.join(', ')}` }) })

const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date as yyyy-mm-dd').refine(v => !Number.isNaN(Date.parse(v)), 'Not a real date')

export const purchaseLineSchema = z.object({
  supplier: z.string().trim().max(120).nullable().optional(),
  // A number, never text: the page's quantity field reads what the user typed in their locale (shared/utils/quantity.ts).
  quotedUnitPrice: z.number({ error: 'Enter a price per piece' }).min(0, 'Must not be negative').max(1e7).nullable().optional(),
  quoteCurrency: z.string().trim().regex(/^[A-Z]{3}$/, 'Use a three-letter currency code such as EUR').nullable().optional(),
  orderReference: z.string().trim().max(80).nullable().optional(),
  status: z.enum(PURCHASE_STATUSES, { message: `Choose one of: ${PURCHASE_STATUSES.join(', ')}` }).optional(),
  /** date the new status was reached (default today) */
  statusDate: isoDate.optional(),
  promisedDelivery: isoDate.nullable().optional(),
  /** true once the user confirmed a quote more than 3× off the catalogue price */
  confirmUnusualQuote: z.boolean().optional(),
}).refine(v => Object.entries(v).some(([k, x]) => x !== undefined && k !== 'confirmUnusualQuote' && k !== 'statusDate'), { message: 'Give at least one of supplier, quotedUnitPrice, quoteCurrency, orderReference, status, promisedDelivery' })

export const exportFormat = z.object({ format: z.enum(['xlsx', 'pdf'], { message: 'Use \'xlsx\' or \'pdf\'' }) })

export const exportQuery = z.object({
  open: z.enum(['0', '1'], { message: 'Use open=1 for open lines only' }).optional(),
  /** PDF only: 1 renders on the job queue (202 with the job to poll) */
  async: z.enum(['0', '1'], { message: 'Use async=1 to queue the rendering' }).optional(),
})

export const releaseSchema = z.object({
  /** the BOM revision the page showed as the draft; another release meanwhile answers 409 */
  expectedRevision: z.number().int().positive().optional(),
}).default({})

export const acknowledgementSchema = z.object({
  lineKey: z.string().trim().min(1, 'Name the line').max(300),
  reason: z.string().trim().min(5, 'Give a reason of at least 5 characters').max(500),
})
