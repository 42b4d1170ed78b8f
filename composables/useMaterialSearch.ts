import type { MaterialOption } from './usePlanData'

/** Searches the whole library on the server: name, formula or category, names that start with `q` first. */
export async function searchMaterials(q: string, limit = 20, category?: string) {
  const res = await $fetch('/api/materials', { query: { q, limit, derived: '0', ...(category ? { category } : {}) } })
  return { rows: res.rows as MaterialOption[], total: res.total }
}

/** The library material with exactly this name (any case), or null: a name typed faster than the search still counts. */
export async function materialNamed(name: string): Promise<MaterialOption | null> {
  const wanted = name.trim().toLowerCase()
  if (!wanted) return null
  const found = await searchMaterials(name.trim(), 5).catch(() => null)
  return found?.rows.find(m => m.name.toLowerCase() === wanted) ?? null
}
