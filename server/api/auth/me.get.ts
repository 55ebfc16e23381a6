// The signed-in person as the database knows them now (role changes and disabling apply at once).
export default defineEventHandler(async (event) => {
  const user = await currentUser(event)
  if (!user) throw createError({ statusCode: 401, message: 'Please sign in.' })
  return { user }
})
