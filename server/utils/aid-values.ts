// The lab's accepted aid values (capsule, tape, oil, cotton) and what a result takes from them or from the library.
import { and, desc, eq, isNull } from 'drizzle-orm'
import { AID_KIND_LABELS, typicalRangeValue } from '../../shared/domain/results'
import type { AidKind, AidValue } from '../../shared/domain/results'

export type AidValueRow = typeof schema.aidValues.$inferSelect

export function aidValueView(r: AidValueRow, extra: { acceptedByName?: string | null, materialName?: string | null } = {}) {
  return {
    id: r.id, kind: r.kind as AidKind, materialId: r.materialId, materialName: extra.materialName ?? null, lot: r.lot,
    determinationsJPerG: r.determinationsJPerG, runs: r.runs, meanJPerG: r.meanJPerG, standardDeviationJPerG: r.standardDeviationJPerG,
    standardUncertaintyJPerG: r.standardUncertaintyJPerG, note: r.note, acceptedBy: r.acceptedBy, acceptedByName: extra.acceptedByName ?? null,
    acceptedAt: r.acceptedAt, active: r.active,
  }
}
export type AidValueView = ReturnType<typeof aidValueView>

const asAidValue = (r: AidValueRow): AidValue => ({
  valueJPerG: r.meanJPerG, standardUncertaintyJPerG: r.standardUncertaintyJPerG, source: 'lab-determined',
  label: `${AID_KIND_LABELS[r.kind as AidKind] ?? r.kind}${r.lot ? ` lot ${r.lot}` : ''}, ${r.runs} determinations accepted ${r.acceptedAt.toISOString().slice(0, 10)}`,
})

/**
 * The aid's value for a result: the lab's accepted determination of that material; else a certified library value
 * (with its uncertainty, no typical range); else the library's typical range as a rectangular distribution (provisional).
 */
export async function aidValueFor(db: Db | Tx, materialId: string | null): Promise<AidValue | null> {
  if (!materialId) return null
  const [own] = await db.select().from(schema.aidValues).where(and(eq(schema.aidValues.materialId, materialId), eq(schema.aidValues.active, true))).orderBy(desc(schema.aidValues.acceptedAt)).limit(1)
  if (own) return asAidValue(own)
  const [m] = await db.select().from(schema.materials).where(eq(schema.materials.id, materialId))
  if (!m || m.heatingValueJPerG === null) return null
  const range = m.typicalRange
  if (range?.minJPerG !== undefined && range.maxJPerG !== undefined) {
    return { ...typicalRangeValue(range.minJPerG, range.maxJPerG), source: 'typical', label: `${m.name}, typical range ${range.minJPerG}–${range.maxJPerG} J/g` }
  }
  // A library value with a stated uncertainty is a certificate's; without one it is no better than typical.
  if (m.heatingValueUncertaintyJPerG !== null) return { valueJPerG: m.heatingValueJPerG, standardUncertaintyJPerG: m.heatingValueUncertaintyJPerG, source: 'certified', label: m.name }
  return null
}

/** The lab's accepted cotton-thread value, or null (then the policy's typical value is used and flagged). */
export async function cottonValue(db: Db | Tx): Promise<AidValue | null> {
  const [own] = await db.select().from(schema.aidValues).where(and(eq(schema.aidValues.kind, 'cotton'), isNull(schema.aidValues.materialId), eq(schema.aidValues.active, true))).orderBy(desc(schema.aidValues.acceptedAt)).limit(1)
  return own ? asAidValue(own) : null
}
