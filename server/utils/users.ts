import { and, arrayContains, eq, ne } from 'drizzle-orm'
import { z } from 'zod'
import type { users } from '../database/schema'
import type { Role } from '../../shared/types/roles'

type UserRow = typeof users.$inferSelect

/** What the API shows of a user: never the hash. */
export function publicUser(u: UserRow) {
  return {
    id: u.id,
    email: u.email,
    name: u.name,
    // The users_roles_check constraint keeps only known role names in the column.
    roles: u.roles as Role[],
    active: u.active,
    lastSignInAt: u.lastSignInAt,
    createdAt: u.createdAt,
    updatedAt: u.updatedAt,
  }
}

export const uuidParam = z.object({ id: z.string().uuid('a user id (UUID)') })

export async function findUserOr404(tx: Tx, id: string): Promise<UserRow> {
  const [row] = await tx.select().from(schema.users).where(eq(schema.users.id, id)).for('update')
  if (!row) throw createError({ statusCode: 404, message: 'No such user.' })
  return row
}

/** True when another active admin remains besides `exceptId` (the lab must never lose its last admin). */
export async function anotherActiveAdmin(tx: Tx, exceptId: string) {
  const rows = await tx.select({ id: schema.users.id }).from(schema.users)
    .where(and(ne(schema.users.id, exceptId), eq(schema.users.active, true), arrayContains(schema.users.roles, ['admin'])))
    .limit(1)
  return rows.length > 0
}
