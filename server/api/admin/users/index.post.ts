import { eq } from 'drizzle-orm'
import { userCreateSchema } from '#shared/schemas/users'

export default defineEventHandler(async (event) => {
  await requireRole(event)
  const input = await parseBody(event, userCreateSchema)
  await assertStrongPassword(input.password, 'password', [input.email, input.name])
  const passwordHash = await inHashSlot(() => hashPassword(input.password))
  const created = await useDb().transaction(async (tx) => {
    const [clash] = await tx.select({ id: schema.users.id }).from(schema.users).where(eq(schema.users.email, input.email))
    if (clash) throw createError({ statusCode: 409, message: `A user with the e-mail ${input.email} already exists.`, data: { fields: [{ path: 'email', message: 'already in use' }] } })
    const [row] = await tx.insert(schema.users).values({ email: input.email, name: input.name, roles: input.roles, passwordHash }).returning()
    await audit(tx, event, { action: 'user.create', entity: 'user', entityId: row!.id, newValues: publicUser(row!) })
    return row!
  })
  setResponseStatus(event, 201)
  return publicUser(created)
})
