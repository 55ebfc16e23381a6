import { z } from 'zod'

const params = z.object({ id: z.string().regex(/^[\w-]+$/, 'Not a message id') })
const query = z.object({ attachment: z.coerce.number().int().min(0).max(1000).optional() })

// One received message; with ?attachment=N the N-th attachment as a download.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'mail:read')
  const { id } = paramsValid(event, params)
  const { attachment } = queryValid(event, query)
  const mail = await readStoredMail(id)
  if (!mail) throw createError({ statusCode: 404, message: 'No such message.' })
  if (attachment === undefined) return { ...mail, attachments: mail.attachments.map(({ contentBase64: _, ...a }) => a) }
  const file = mail.attachments[attachment]
  if (!file) throw createError({ statusCode: 404, message: 'No such attachment.' })
  setResponseHeaders(event, {
    'Content-Type': file.contentType,
    'Content-Disposition': `attachment; filename="${file.filename.replace(/[^\w.-]/g, '_')}"`,
  })
  return Buffer.from(file.contentBase64, 'base64')
})
