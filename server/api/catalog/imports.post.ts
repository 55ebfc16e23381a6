import { readUpload, storeUpload, rememberedMapping, rememberTable, describeImport } from '~~/server/services/catalog-import'
import { suggestMapping } from '#shared/catalog/mapping'

// Upload a catalogue spreadsheet (.xlsx / .csv, multipart field "file"): read, suggest a mapping, preview.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'catalog:write')
  const form = await readMultipartFormData(event).catch(() => null)
  const file = form?.find(p => p.name === 'file' && p.filename)
  if (!file) throw createError({ statusCode: 400, message: 'file: attach the spreadsheet as multipart field "file".', data: { issues: [{ path: 'file', message: 'No file attached' }] } })
  // the name travels into the database, the audit log and the page: control characters and NUL go
  const filename = cleanFileName(file.filename!)
  const decimalField = form?.find(p => p.name === 'decimalSeparator')?.data.toString()
  const table = await readUpload(file.data, filename)
  const decimalSeparator = decimalField === ',' || decimalField === '.' ? decimalField : (table.suggestedDecimalSeparator ?? '.')
  const mapping = (await rememberedMapping(user.id, table.headers)) ?? suggestMapping(table.headers).mapping
  const storageKey = await storeUpload(file.data, filename)
  await rememberTable(storageKey, table)
  const [row] = await useDb().insert(tables.catalogImports).values({
    filename, storageKey, sizeBytes: file.data.length, status: 'preview', sheetName: table.sheetName,
    headers: table.headers, mapping, decimalSeparator, rowCount: table.rows.length, uploadedBy: user.id,
  }).returning()
  await audit(event, 'catalogue file uploaded', { subject: filename, details: { importId: row!.id, rows: table.rows.length } })
  setResponseStatus(event, 201)
  return describeImport(row!, table, mapping, decimalSeparator)
})
