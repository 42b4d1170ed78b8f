import { eq, sql } from 'drizzle-orm'
import { userUpdateSchema } from '#shared/schemas/users'

export default defineEventHandler(async (event) => {
  const admin = await requireRole(event, 'admin')
  const { id } = parseParams(event, uuidParam)
  const input = await parseBody(event, userUpdateSchema)
  const updated = await useDb().transaction(async (tx) => {
    const before = await findUserOr404(tx, id)
    const losesAdmin = before.roles.includes('admin') && ((input.roles && !input.roles.includes('admin')) || input.active === false)
    if (losesAdmin && !await anotherActiveAdmin(tx, id)) {
      throw createError({ statusCode: 409, message: 'The lab must keep at least one active admin: give another user the admin role first.' })
    }
    if (id === admin.id && input.active === false) {
      throw createError({ statusCode: 409, message: 'You cannot disable your own account.' })
    }
    if (input.email && input.email !== before.email) {
      const [clash] = await tx.select({ id: schema.users.id }).from(schema.users).where(eq(schema.users.email, input.email))
      if (clash) throw createError({ statusCode: 409, message: `A user with the e-mail ${input.email} already exists.`, data: { fields: [{ path: 'email', message: 'already in use' }] } })
    }
    // Disabling, or changing roles, ends the user's sessions at once (epoch raised).
    const endSessions = input.active === false || (input.roles !== undefined && input.roles.join() !== before.roles.join())
    const [row] = await tx.update(schema.users).set({
      ...input,
      updatedAt: new Date(),
      ...(endSessions ? { sessionEpoch: sql`${schema.users.sessionEpoch} + 1` } : {}),
    }).where(eq(schema.users.id, id)).returning()
    const action = input.active === false ? 'user.disable' : input.active === true && !before.active ? 'user.enable' : 'user.update'
    await audit(tx, event, { action, entity: 'user', entityId: id, oldValues: publicUser(before), newValues: publicUser(row!) })
    return row!
  })
  return publicUser(updated)
})
