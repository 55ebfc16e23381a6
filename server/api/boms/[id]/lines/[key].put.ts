import { z } from 'zod'
import { purchaseLineSchema } from '#shared/schemas/bom'
import { dbIdValue } from '#shared/schemas/bounds'
import type { BomSnapshot } from '#shared/bom/types'
import { loadBom } from '~~/server/services/bom'

const params = z.object({ id: dbIdValue, key: z.string().min(1).max(300) })

// Purchasing records supplier, quoted price and order reference on one line; engineering content stays as released.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'bom:purchase')
  const { id, key } = paramsValid(event, params)
  const body = await readValid(event, purchaseLineSchema)
  const bom = await loadBom(id)
  const lineKey = decodeURIComponent(key)
  if (!(bom.snapshot as BomSnapshot).lines.some(l => l.key === lineKey)) throw createError({ statusCode: 404, message: 'This BOM has no such line.' })
  const values = Object.fromEntries(Object.entries(body).filter(([, v]) => v !== undefined))
  await useDb().insert(tables.bomPurchaseLines).values({ bomId: id, lineKey, ...values, updatedBy: user.id })
    .onConflictDoUpdate({ target: [tables.bomPurchaseLines.bomId, tables.bomPurchaseLines.lineKey], set: { ...values, updatedBy: user.id, updatedAt: new Date() } })
  await audit(event, 'BOM line purchase data', { subject: `BOM ${id} ${lineKey}`, details: values })
  return { ok: true }
})
