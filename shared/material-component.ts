// A library material as a charge component: its values fill in whatever the component leaves out.
import type { ChargeComponentInput, ComponentRole } from './domain/assessment'
import type { Composition } from './domain/composition'

export interface MaterialLike {
  name: string
  heatingValueJPerG: number | null
  composition: unknown
  compositionBasis: string | null
  formula: string | null
  smiles: string | null
  declaredHazard: string
  decompositionEnergyJPerG: number | null
}

export function componentFromMaterial(m: MaterialLike, over: Partial<ChargeComponentInput>, role: ComponentRole = 'sample'): ChargeComponentInput {
  const c: ChargeComponentInput = { role, name: m.name, declaredHazard: m.declaredHazard as ChargeComponentInput['declaredHazard'] }
  if (m.heatingValueJPerG !== null) {
    c.heatingValueJPerG = m.heatingValueJPerG
    c.heatingValueFrom = 'material'
  }
  if (m.composition) c.composition = { ...(m.composition as Composition), basis: (m.compositionBasis ?? 'dry') as Composition['basis'] }
  if (m.formula) c.formula = m.formula
  if (m.smiles) c.smiles = m.smiles
  if (m.decompositionEnergyJPerG !== null) c.decompositionEnergyJPerG = m.decompositionEnergyJPerG
  const merged = { ...c, ...Object.fromEntries(Object.entries(over).filter(([, v]) => v !== undefined)) } as ChargeComponentInput
  if (over.heatingValueJPerG !== undefined) merged.heatingValueFrom = 'declared'
  return merged
}
