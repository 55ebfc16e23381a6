import { sendTemplate } from '~~/server/services/catalog-template'

export default defineEventHandler(async (event) => {
  await requireRole(event, 'catalog:read')
  return sendTemplate(event, 'csv')
})
