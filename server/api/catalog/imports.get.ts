import { desc, eq } from 'drizzle-orm'

export default defineEventHandler(async (event) => {
  await requireRole(event, 'catalog:read')
  const i = tables.catalogImports
  return useDb().select({
    id: i.id, filename: i.filename, sizeBytes: i.sizeBytes, status: i.status, rowCount: i.rowCount, issueCount: i.issueCount,
    createdAt: i.createdAt, uploadedBy: tables.users.name, catalogVersion: tables.catalogVersions.number,
  }).from(i).leftJoin(tables.users, eq(tables.users.id, i.uploadedBy)).leftJoin(tables.catalogVersions, eq(tables.catalogVersions.id, i.catalogVersionId))
    .orderBy(desc(i.createdAt)).limit(200)
})
