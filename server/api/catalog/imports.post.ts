import { eq } from 'drizzle-orm'
import { readUpload, storeUpload, rememberTable, describeImport, initialChoice, settingsOf } from '~~/server/services/catalog-import'

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
  const choice = await initialChoice(user.id, table, decimalSeparator)
  const storageKey = await storeUpload(file.data, filename)
  await rememberTable(storageKey, table)
  const [row] = await useDb().insert(tables.catalogImports).values({
    filename, storageKey, sizeBytes: file.data.length, status: 'preview', sheetName: table.sheetName,
    headers: table.headers, mapping: choice.mapping, decimalSeparator, settings: settingsOf(choice), rowCount: table.rows.length, uploadedBy: user.id,
  }).returning()
  const described = await describeImport(row!, table, choice)
  // The imports list shows the real count from this first check on.
  await useDb().update(tables.catalogImports).set({ issueCount: described.preview.issueCount }).where(eq(tables.catalogImports.id, row!.id))
  await audit(event, 'catalogue file uploaded', { subject: filename, details: { importId: row!.id, rows: table.rows.length } })
  setResponseStatus(event, 201)
  return described
})
