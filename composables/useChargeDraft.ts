import { adviseCharge, type ChargeAdvice } from '#shared/domain/advice'
import { assessCharge, resolveComponents } from '#shared/domain/assessment'
import type { Assessment, ChargeComponentInput } from '#shared/domain/assessment'
import type { LabPolicy } from '#shared/domain/policy'
import { componentFromMaterial } from '#shared/material-component'
import type { RunComponent } from '#shared/schemas/plans'
import type { MaterialOption, VesselSummary } from './usePlanData'

/** The entry row of the plan table: what the analyst types, as run components and a live assessment. */
export interface ChargeDraft {
  sampleCode: string
  kind: 'sample' | 'standardisation' | 'check'
  materialName: string
  massG: number | null
  heatingValueJPerG: number | null
  aidMaterialId: string
  aidMassG: number | null
  wire: 'nichrome' | 'iron' | 'platinum' | 'cotton'
  fuseLengthCm: number | null
  vesselId: string
  fillPressureMPa: number | null
  note: string
}

export function blankDraft(vesselId: string, fill: number): ChargeDraft {
  return { sampleCode: '', kind: 'sample', materialName: '', massG: null, heatingValueJPerG: null, aidMaterialId: '', aidMassG: null, wire: 'nichrome', fuseLengthCm: 10, vesselId, fillPressureMPa: fill, note: '' }
}

// v-model.number leaves '' in an emptied field.
const isNum = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v)

/** Draft → the components the API stores (a material is named by id; the server fills in its values). */
export function draftComponents(d: ChargeDraft, materials: MaterialOption[]): RunComponent[] {
  const material = materials.find(m => m.name.toLowerCase() === d.materialName.trim().toLowerCase())
  const sample: RunComponent = { role: 'sample' }
  if (material) sample.materialId = material.id
  else if (d.materialName.trim()) sample.name = d.materialName.trim()
  if (isNum(d.massG)) sample.massG = d.massG
  if (isNum(d.heatingValueJPerG) && d.heatingValueJPerG > 0) sample.heatingValueJPerG = d.heatingValueJPerG
  const out: RunComponent[] = [sample]
  if (d.aidMaterialId && isNum(d.aidMassG) && d.aidMassG > 0) out.push({ role: 'aid', materialId: d.aidMaterialId, massG: d.aidMassG })
  if (d.wire === 'cotton') out.push({ role: 'fuse', wire: 'cotton', massG: 0.003 })
  else if (isNum(d.fuseLengthCm) && d.fuseLengthCm > 0) out.push({ role: 'fuse', wire: d.wire, lengthCm: d.fuseLengthCm })
  return out
}

/** Run components back into a draft, for editing an existing run. */
export function draftFromRun(r: { sampleCode: string, kind: ChargeDraft['kind'], components: RunComponent[], vesselId: string, fillPressureMPa: number, note: string }, materials: MaterialOption[]): ChargeDraft {
  const sample = r.components.find(c => c.role === 'sample')
  const aid = r.components.find(c => c.role === 'aid')
  const fuse = r.components.find(c => c.role === 'fuse')
  return {
    sampleCode: r.sampleCode,
    kind: r.kind,
    materialName: materials.find(m => m.id === sample?.materialId)?.name ?? sample?.name ?? '',
    massG: sample?.massG ?? null,
    heatingValueJPerG: sample?.heatingValueJPerG ?? null,
    aidMaterialId: aid?.materialId ?? '',
    aidMassG: aid?.massG ?? null,
    wire: fuse?.wire ?? 'nichrome',
    fuseLengthCm: fuse?.lengthCm ?? null,
    vesselId: r.vesselId,
    fillPressureMPa: r.fillPressureMPa,
    note: r.note,
  }
}

/** Components with their material's values filled in, as the assessment needs them (same rule as the server). */
export function resolveWithMaterials(components: RunComponent[], materials: MaterialOption[]): ChargeComponentInput[] {
  return components.map(({ materialId, ...rest }) => {
    const m = materialId ? materials.find(x => x.id === materialId) : undefined
    return m ? componentFromMaterial(m, rest, rest.role) : rest as ChargeComponentInput
  })
}

/** Live assessment of a draft in the browser, with the same shared code the server runs. */
export function useLiveAssessment(source: () => { draft: ChargeDraft, vessel: VesselSummary | undefined, materials: MaterialOption[], policy: LabPolicy | undefined }) {
  const result = ref<Assessment | null>(null)
  const advice = ref<ChargeAdvice | null>(null)
  const problem = ref<string | null>(null)
  let ticket = 0
  watchDebounced(source, async ({ draft, vessel, materials, policy }) => {
    const mine = ++ticket
    if (!vessel || !policy || !isNum(draft.fillPressureMPa)) { result.value = null; advice.value = null; return }
    const components = resolveWithMaterials(draftComponents(draft, materials), materials)
    const sample = components.find(c => c.role === 'sample')
    if (!sample || (sample.heatingValueJPerG === undefined && !sample.composition && !sample.formula && !sample.smiles && !draft.materialName.trim())) {
      result.value = null
      advice.value = null
      problem.value = null
      return
    }
    try {
      const input = { vessel: { ...vessel }, fillPressureMPa: draft.fillPressureMPa, components: await resolveComponents(components), runRole: draft.kind }
      const a = assessCharge(input, policy)
      if (mine === ticket) { result.value = a; advice.value = adviseCharge(input, policy, a); problem.value = null }
    }
    catch (err) {
      if (mine === ticket) { result.value = null; advice.value = null; problem.value = (err as Error).message }
    }
  }, { debounce: 120, deep: true, immediate: true })
  return { result, advice, problem }
}
