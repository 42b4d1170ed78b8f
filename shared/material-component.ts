// A library material as a charge component: the material's identity travels unchanged; a run may only add to it.
import type { ChargeComponentInput, ComponentRole, LibraryIdentity } from './domain/assessment'
import type { Composition } from './domain/composition'
import { type DeclaredHazard, stricterHazard } from './domain/screening'

export interface MaterialLike {
  id?: string
  name: string
  category?: string | null
  heatingValueJPerG: number | null
  composition: unknown
  compositionBasis: string | null
  formula: string | null
  smiles: string | null
  declaredHazard: string
  decompositionEnergyJPerG: number | null
  reference?: boolean | null
  identityRecordedBy?: string | null
  decompositionOnsetC?: number | null
  decompositionMethod?: string | null
  decompositionEvidence?: string | null
  decompositionRecordedBy?: string | null
  boilingPointC?: number | null
  vapourPressureKPa?: number | null
  chlorinePct?: number | null
}

/** The library's own word on the material: its classification (recorded or shipped) and decomposition evidence. */
export function libraryIdentity(m: MaterialLike): LibraryIdentity {
  const out: LibraryIdentity = { name: m.name }
  if (m.id) out.materialId = m.id
  if (m.declaredHazard && m.declaredHazard !== 'none') out.declaredHazard = m.declaredHazard as DeclaredHazard
  if (m.identityRecordedBy || m.reference) out.classification = `${m.category ?? 'material'}${m.reference ? ', shipped reference material' : ', recorded by a supervisor'}`
  if (m.decompositionEnergyJPerG !== null && m.decompositionRecordedBy) {
    out.decomposition = {
      energyJPerG: m.decompositionEnergyJPerG,
      onsetC: m.decompositionOnsetC ?? undefined,
      method: m.decompositionMethod ?? undefined,
      evidence: m.decompositionEvidence ?? undefined,
      recordedBy: m.decompositionRecordedBy,
    }
  }
  return out
}

const CONTAINMENT = /capsule/i
// Fields only the materials library speaks for: a run's values for them are dropped.
const LIBRARY_OWNED: ReadonlySet<string> = new Set(['library', 'heatingValueFrom', 'formula', 'smiles', 'composition', 'category', 'decompositionEnergyJPerG'])

/**
 * The material's identity (formula, structure, composition, category, declared hazard, decomposition energy)
 * travels into the run as the library holds it: the run's own values for these are dropped, except a stricter
 * declared hazard. What the library leaves empty stays empty: a supervisor records it there, not a planner on a
 * run. Volatility and chlorine share take the more cautious of the two; a run's heating value counts only when it
 * is not below the material's (the larger heat release is the safe side); mass, fuse and the like come from the run.
 */
export function componentFromMaterial(m: MaterialLike, over: Partial<ChargeComponentInput>, role: ComponentRole = 'sample'): ChargeComponentInput {
  const run = Object.fromEntries(Object.entries(over).filter(([k, v]) => v !== undefined && !LIBRARY_OWNED.has(k))) as Partial<ChargeComponentInput>
  const c: ChargeComponentInput = { ...run, role, name: run.name ?? m.name }
  const hazard = stricterHazard(m.declaredHazard as DeclaredHazard, over.declaredHazard)
  if (hazard) c.declaredHazard = hazard
  if (m.formula) c.formula = m.formula
  if (m.smiles) c.smiles = m.smiles
  if (m.composition) c.composition = { ...(m.composition as Composition), basis: (m.compositionBasis ?? 'dry') as Composition['basis'] }
  if (m.category) c.category = m.category
  if (m.decompositionEnergyJPerG !== null) c.decompositionEnergyJPerG = m.decompositionEnergyJPerG
  if (m.boilingPointC != null) c.boilingPointC = run.boilingPointC !== undefined ? Math.min(run.boilingPointC, m.boilingPointC) : m.boilingPointC
  if (m.vapourPressureKPa != null) c.vapourPressureKPa = Math.max(run.vapourPressureKPa ?? 0, m.vapourPressureKPa)
  if (m.chlorinePct != null) c.chlorinePct = Math.max(run.chlorinePct ?? 0, m.chlorinePct)
  if (m.heatingValueJPerG !== null) {
    if (run.heatingValueJPerG !== undefined && run.heatingValueJPerG > m.heatingValueJPerG) c.heatingValueFrom = 'declared'
    else {
      c.heatingValueJPerG = m.heatingValueJPerG
      c.heatingValueFrom = 'material'
    }
  }
  if (role === 'aid' && c.containment === undefined) {
    if (CONTAINMENT.test(m.name)) c.containment = 'capsule'
    else if (/tape/i.test(m.name)) c.containment = 'tape'
  }
  c.library = libraryIdentity(m)
  return c
}
