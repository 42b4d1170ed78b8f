import { eq } from 'drizzle-orm'
import { z } from 'zod'
import { assessCharge, resolveComponents, ChargeInputError } from '#shared/domain/assessment'
import { heatingValueFromComposition } from '#shared/domain/heating-value'
import { componentFromMaterial } from '#shared/material-component'
import type { LabPolicy } from '#shared/domain/policy'
import type { materials } from '../database/schema'

export type MaterialRow = typeof materials.$inferSelect

export const materialIdParam = z.object({ id: z.string().uuid('a material id (UUID)') })

export async function findMaterialOr404(db: Db | Tx, id: string): Promise<MaterialRow> {
  const [row] = await db.select().from(schema.materials).where(eq(schema.materials.id, id))
  if (!row) throw createError({ statusCode: 404, message: 'No such material.' })
  return row
}

// A notional 1 g charge in a generous vessel: only the per-gram figures of the material are read from it.
const PROBE_VESSEL = { ratedEnergyJ: 1e6, maxChargeMassG: 100, maxFillPressureMPa: 10, volumeMl: 5000, class: 'high-strength' as const }

/** Derived figures of a material: estimated heating value, oxygen demand per gram, oxygen balance, screening. */
export function materialDerived(m: MaterialRow, policy: LabPolicy): ReturnType<typeof deriveMaterial> {
  // A pure function of the row and the policy, kept per policy object: a policy copy lives while it is in force
  // (server/utils/policy.ts; a change or a read without the change listener brings a new object, and with it an empty
  // cache). The key is the whole row, so any change to the material is a new entry.
  let known = derivedByPolicy.get(policy)
  if (!known) derivedByPolicy.set(policy, known = new Map())
  const key = JSON.stringify(m)
  const hit = known.get(key)
  if (hit) return hit
  if (known.size >= DERIVED_CACHE_MAX) known.clear()
  const derived = deriveMaterial(m, policy)
  known.set(key, derived)
  derived.catch(() => known.delete(key))
  return derived
}
const DERIVED_CACHE_MAX = 5_000
const derivedByPolicy = new WeakMap<LabPolicy, Map<string, ReturnType<typeof deriveMaterial>>>()

async function deriveMaterial(m: MaterialRow, policy: LabPolicy) {
  try {
    const [resolved] = await resolveComponents([componentFromMaterial(m, { massG: 1 })])
    const a = assessCharge({ vessel: PROBE_VESSEL, fillPressureMPa: 3, components: [resolved!] }, policy)
    const comp = resolved!.resolved?.composition ?? resolved!.composition
    const estimate = comp && (comp.C ?? 0) > 0 ? heatingValueFromComposition(comp) : null
    const c = a.components[0]!
    return {
      ok: true as const,
      heatingValueJPerG: c.heatingValueJPerG,
      heatingValueSource: c.heatingValueSource,
      estimatedHeatingValueJPerG: estimate?.hhvAsFiredJPerG ?? null,
      correlationOutOfRange: estimate?.violations.map(v => `${v.field} ${v.value.toFixed(1)} % outside ${v.min}–${v.max} %`) ?? [],
      oxygenDemandMolPerG: c.oxygenDemandMol,
      oxygenBalancePct: c.oxygenBalancePct ?? c.screening?.oxygenBalancePct ?? null,
      screening: c.screening ?? null,
      formula: resolved!.resolved?.formula ?? null,
    }
  }
  catch (err) {
    if (err instanceof ChargeInputError) return { ok: false as const, problem: err.message }
    throw err
  }
}

export function materialView(m: MaterialRow) {
  return {
    id: m.id,
    name: m.name,
    category: m.category,
    heatingValueJPerG: m.heatingValueJPerG,
    heatingValueUncertaintyJPerG: m.heatingValueUncertaintyJPerG,
    heatingValueSource: m.heatingValueSource,
    typicalRange: m.typicalRange,
    composition: m.composition,
    compositionBasis: m.compositionBasis,
    formula: m.formula,
    smiles: m.smiles,
    declaredHazard: m.declaredHazard,
    decompositionEnergyJPerG: m.decompositionEnergyJPerG,
    decompositionOnsetC: m.decompositionOnsetC,
    decompositionMethod: m.decompositionMethod,
    decompositionEvidence: m.decompositionEvidence,
    decompositionRecordedBy: m.decompositionRecordedBy,
    decompositionRecordedAt: m.decompositionRecordedAt,
    identityRecordedBy: m.identityRecordedBy,
    identityRecordedAt: m.identityRecordedAt,
    boilingPointC: m.boilingPointC,
    vapourPressureKPa: m.vapourPressureKPa,
    chlorinePct: m.chlorinePct,
    notes: m.notes,
    reference: m.reference,
    active: m.active,
    updatedAt: m.updatedAt,
  }
}

const IDENTITY_FIELDS = ['category', 'formula', 'smiles', 'composition', 'declaredHazard'] as const
const DECOMPOSITION_FIELDS = ['decompositionEnergyJPerG', 'decompositionOnsetC', 'decompositionMethod', 'decompositionEvidence'] as const

/**
 * The supervisor who writes a material's identity (category, formula, structure, composition, declared hazard) or
 * its decomposition evidence is recorded with the time: only such records let the screen lean on the library.
 */
export function materialRecordedBy(input: Record<string, unknown>, userId: string) {
  const now = new Date()
  const out: { identityRecordedBy?: string, identityRecordedAt?: Date, decompositionRecordedBy?: string | null, decompositionRecordedAt?: Date | null } = {}
  if (IDENTITY_FIELDS.some(f => input[f] !== undefined)) Object.assign(out, { identityRecordedBy: userId, identityRecordedAt: now })
  if (DECOMPOSITION_FIELDS.some(f => input[f] !== undefined)) {
    const cleared = input.decompositionEnergyJPerG === null
    Object.assign(out, { decompositionRecordedBy: cleared ? null : userId, decompositionRecordedAt: cleared ? null : now })
  }
  return out
}

/** Formula and structure must be readable before a material is saved (422 naming the field otherwise). */
export async function checkMaterialChemistry(input: { formula?: string | null, smiles?: string | null }) {
  if (!input.formula && !input.smiles) return
  try {
    await resolveComponents([{ role: 'sample', massG: 1, ...(input.formula ? { formula: input.formula } : {}), ...(input.smiles ? { smiles: input.smiles } : {}) }])
  }
  catch (err) {
    if (err instanceof ChargeInputError) invalidInput(err.issues.map(i => ({ path: String(i.path[i.path.length - 1] ?? 'formula'), message: i.message })))
    throw err
  }
}
