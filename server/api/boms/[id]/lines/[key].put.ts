import { and, eq } from 'drizzle-orm'
import { z } from 'zod'
import { purchaseLineSchema } from '#shared/schemas/bom'
import { dbIdValue } from '#shared/schemas/bounds'
import { quoteNeedsConfirmation, QUOTE_CONFIRM_FACTOR } from '#shared/bom/number'
import type { BomSnapshot } from '#shared/bom/types'
import { loadBom } from '~~/server/services/bom'

const params = z.object({ id: dbIdValue, key: z.string().min(1).max(300) })

// Purchasing records one line: status (with its date), supplier, quoted unit price and currency, order
// reference, promised delivery. Engineering content stays as released. A quote more than 3× off the
// catalogue price break answers 409 with needsConfirmation until sent again with confirmUnusualQuote.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'bom:purchase')
  const { id, key } = paramsValid(event, params)
  const { confirmUnusualQuote, statusDate, ...body } = await readValid(event, purchaseLineSchema)
  const bom = await loadBom(id)
  const lineKey = decodeURIComponent(key)
  const line = (bom.snapshot as BomSnapshot).lines.find(l => l.key === lineKey)
  if (!line) throw createError({ statusCode: 404, message: 'This BOM has no such line.' })
  const t = tables.bomPurchaseLines
  const db = useDb()
  const [existing] = await db.select().from(t).where(and(eq(t.bomId, id), eq(t.lineKey, lineKey)))
  const currency = body.quoteCurrency ?? existing?.quoteCurrency ?? line.currency
  if (body.quotedUnitPrice != null && !confirmUnusualQuote && currency === line.currency && quoteNeedsConfirmation(body.quotedUnitPrice, line.unitPrice)) {
    throw createError({
      statusCode: 409,
      message: `quotedUnitPrice: ${body.quotedUnitPrice} ${currency} is more than ${QUOTE_CONFIRM_FACTOR}× away from the catalogue price of ${line.unitPrice} ${line.currency} at ${line.priceBreakQuantity} pcs. Check the entry (decimal separator?) and confirm it.`,
      data: { needsConfirmation: true, field: 'quotedUnitPrice', catalogueUnitPrice: line.unitPrice, currency: line.currency },
    })
  }
  const values: Record<string, unknown> = Object.fromEntries(Object.entries(body).filter(([, v]) => v !== undefined))
  if (body.status) values.statusDates = { ...(existing?.statusDates ?? {}), [body.status]: statusDate ?? new Date().toISOString().slice(0, 10) }
  await db.insert(t).values({ bomId: id, lineKey, ...values, updatedBy: user.id })
    .onConflictDoUpdate({ target: [t.bomId, t.lineKey], set: { ...values, updatedBy: user.id, updatedAt: new Date() } })
  await audit(event, 'BOM line purchase data', { subject: `BOM ${id} ${lineKey}`, details: { ...values, ...(confirmUnusualQuote ? { confirmUnusualQuote } : {}) } })
  return { ok: true }
})
