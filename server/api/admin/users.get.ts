import { asc } from 'drizzle-orm'

export default defineEventHandler(async (event) => {
  await requireRole(event, 'users:manage')
  const rows = await useDb().select({
    id: tables.users.id, email: tables.users.email, name: tables.users.name, role: tables.users.role,
    disabled: tables.users.disabled, lastSignInAt: tables.users.lastSignInAt, createdAt: tables.users.createdAt,
    hasPassword: tables.users.passwordHash,
  }).from(tables.users).orderBy(asc(tables.users.name))
  return rows.map(({ hasPassword, ...r }) => ({ ...r, status: r.disabled ? 'disabled' : hasPassword ? 'active' : 'invited' }))
})
