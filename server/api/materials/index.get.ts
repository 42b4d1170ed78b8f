import { and, asc, count, desc, eq, ilike, inArray, or, sql } from 'drizzle-orm'
import type { SQL } from 'drizzle-orm'
import { z } from 'zod'
import { MATERIAL_CATEGORIES } from '#shared/schemas/materials'

const query = z.object({
  q: z.string().trim().max(100).optional(),
  category: z.enum(MATERIAL_CATEGORIES).optional(),
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
  // A picker's search: the best `limit` matches (prefix matches first), one page only.
  limit: z.coerce.number().int().min(1).max(50).optional(),
  // The materials a page already names (a plan's runs), comma-separated ids.
  ids: z.string().max(200 * 37).transform(s => s.split(',').filter(Boolean)).pipe(z.array(z.uuid()).max(200)).optional(),
  derived: z.enum(['0', '1']).default('1'),
})

// Everyone reads the library; derived figures are computed for the page shown only.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { q, category, page: asked, pageSize: size, limit, ids, derived } = parseQuery(event, query)
  const page = limit ? 1 : asked
  const pageSize = limit ?? size
  const where: SQL[] = [eq(schema.materials.active, true)]
  let like: string | undefined
  if (q) {
    like = `%${q.replace(/[%_\\]/g, m => `\\${m}`)}%`
    where.push(or(ilike(schema.materials.name, like), ilike(schema.materials.formula, like), ilike(schema.materials.category, like))!)
  }
  if (category) where.push(eq(schema.materials.category, category))
  if (ids) where.push(ids.length ? inArray(schema.materials.id, ids) : sql`false`)
  // A name that starts with what was typed comes before one that merely contains it.
  const order = like && limit ? [desc(ilike(schema.materials.name, like.slice(1))), asc(schema.materials.name)] : [asc(schema.materials.reference), asc(schema.materials.name)]
  const db = useDb()
  const [rows, [total], policy] = await Promise.all([
    db.select().from(schema.materials).where(and(...where)).orderBy(...order).limit(pageSize).offset((page - 1) * pageSize),
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
