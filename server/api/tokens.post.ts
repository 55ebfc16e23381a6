import { apiTokenCreateSchema } from '#shared/schemas/auth'

// A personal API token for /api/v1: shown once here, stored only as a hash.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'tokens:own')
  const { name } = await readValid(event, apiTokenCreateSchema)
  const token = `sv_${newSecretToken(24)}`
  const [row] = await useDb().insert(tables.apiTokens)
    .values({ userId: user.id, name, prefix: token.slice(0, 8), tokenHash: sha256(token) }).returning()
  await audit(event, 'API token created', { subject: name })
  setResponseStatus(event, 201)
  return { id: row!.id, name, prefix: row!.prefix, token }
})
