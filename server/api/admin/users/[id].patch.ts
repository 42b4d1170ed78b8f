import { eq } from 'drizzle-orm'
import { userUpdateSchema } from '#shared/schemas/users'

export default defineEventHandler(async (event) => {
  const admin = await requireRole(event)
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
    // Disabling, or changing roles, ends the user's sessions at once: they sign in again with what they now may do.
    const rolesChanged = input.roles !== undefined && [...input.roles].sort().join() !== [...before.roles].sort().join()
    const [row] = await tx.update(schema.users).set({ ...input, updatedAt: new Date() }).where(eq(schema.users.id, id)).returning()
    const sessionsEnded = input.active === false ? await endUserSessions(tx, id, 'disabled') : rolesChanged ? await endUserSessions(tx, id, 'role-change') : 0
    const action = input.active === false ? 'user.disable' : input.active === true && !before.active ? 'user.enable' : 'user.update'
    await audit(tx, event, { action, entity: 'user', entityId: id, oldValues: publicUser(before), newValues: { ...publicUser(row!), sessionsEnded } })
    return row!
  })
  return publicUser(updated)
})
