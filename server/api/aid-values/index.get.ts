import { desc, eq } from 'drizzle-orm'

// The lab's accepted aid values, newest first (active ones are in force).
export default defineEventHandler(async (event) => {
  await requireRole(event)
  const db = useDb()
  const rows = await db.select({ a: schema.aidValues, userName: schema.users.name, materialName: schema.materials.name })
    .from(schema.aidValues).innerJoin(schema.users, eq(schema.users.id, schema.aidValues.acceptedBy)).leftJoin(schema.materials, eq(schema.materials.id, schema.aidValues.materialId))
    .orderBy(desc(schema.aidValues.acceptedAt)).limit(200)
  return { aidValues: rows.map(r => aidValueView(r.a, { acceptedByName: r.userName, materialName: r.materialName })) }
})
