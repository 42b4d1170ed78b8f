import { and, asc, count, eq, ilike, or } from 'drizzle-orm'
import type { SQL } from 'drizzle-orm'
import { z } from 'zod'
import { MATERIAL_CATEGORIES } from '#shared/schemas/materials'

const query = z.object({
  q: z.string().trim().max(100).optional(),
  category: z.enum(MATERIAL_CATEGORIES).optional(),
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
  derived: z.enum(['0', '1']).default('1'),
})

// Everyone reads the library; derived figures are computed for the page shown only.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { q, category, page, pageSize, derived } = parseQuery(event, query)
  const where: SQL[] = [eq(schema.materials.active, true)]
  if (q) {
    const like = `%${q.replace(/[%_\\]/g, m => `\\${m}`)}%`
    where.push(or(ilike(schema.materials.name, like), ilike(schema.materials.formula, like))!)
  }
  if (category) where.push(eq(schema.materials.category, category))
  const db = useDb()
  const [rows, [total], policy] = await Promise.all([
    db.select().from(schema.materials).where(and(...where)).orderBy(asc(schema.materials.reference), asc(schema.materials.name)).limit(pageSize).offset((page - 1) * pageSize),
    db.select({ n: count() }).from(schema.materials).where(and(...where)),
    getPolicy(),
  ])
  return {
    rows: await Promise.all(rows.map(async m => ({ ...materialView(m), ...(derived === '1' ? { derived: await materialDerived(m, policy) } : {}) }))),
    total: total?.n ?? 0,
    page,
    pageSize,
  }
})
