import type { Assessment, AssessmentSummary } from '#shared/domain/assessment'
import type { RunComponent, RunStatus } from '#shared/schemas/plans'
import type { VesselState } from '#shared/domain/vessel-state'

// Shapes of the plan pages' server data (see server/utils/runs.ts and vessels.ts).
export interface VesselSummary {
  id: string, name: string, class: 'standard' | 'high-strength', state: VesselState, stateReasons: string[]
  ratedEnergyJ: number, maxChargeMassG: number, maxFillPressureMPa: number, volumeMl: number
  proofCharge: { massG: number, heatingValueJPerG: number, fillPressureMPa: number }
}
export interface Signature { id: string, signerName: string, meaning: string, reason: string, signedAt: string, current: boolean }
export interface Run {
  id: string, planId: string, seq: number, sampleCode: string, kind: 'sample' | 'standardisation' | 'check', vesselId: string, fillPressureMPa: number
  components: RunComponent[], status: RunStatus, verdict: Assessment['verdict'], assessment: AssessmentSummary, chargeHash: string, note: string
  plannedBy: string, editedBy: string[], submittedBy: string[], statusReason: string | null, signatures: Signature[]
}
export interface PlanDetail {
  id: string, name: string, vesselId: string, fillPressureMPa: number, note: string, createdBy: string, createdByName: string, submittedAt: string | null, createdAt: string
  runs: Run[], vessels: VesselSummary[]
  /** All runs of the plan; `runs` holds the page from `runsOffset`. */
  runsTotal: number, runsOffset: number, draftCount: number
}
export interface MaterialOption {
  id: string, name: string, category: string, heatingValueJPerG: number | null, composition: unknown, compositionBasis: string | null
  formula: string | null, smiles: string | null, declaredHazard: string, decompositionEnergyJPerG: number | null, typicalRange: { minJPerG: number, maxJPerG: number } | null
}

/** The library materials named by these runs' components. */
export const materialIdsOf = (runs: readonly Pick<Run, 'components'>[]) => [...new Set(runs.flatMap(r => r.components.map(c => c.materialId).filter((m): m is string => !!m)))]

/**
 * The library materials a page names by id (the materials of a plan's runs), with the values a charge needs.
 * Pickers search the library on the server instead (MaterialPicker), so no page loads the whole library.
 */
export function useMaterialsNamed(ids: MaybeRefOrGetter<string[]>) {
  const joined = computed(() => [...toValue(ids)].sort().slice(0, 200).join(','))
  return useFetch('/api/materials', {
    key: () => `materials:named:${joined.value}`,
    query: { ids: joined, derived: '0', pageSize: 200 },
    default: () => ({ rows: [] }),
  })
}
