// The plan's entry row: typed quantities reach the draft in the API's units, the live check answers, Enter saves.
import { mountSuspended, registerEndpoint } from '@nuxt/test-utils/runtime'
import { beforeEach, describe, expect, it } from 'vitest'
import { defineComponent, h, ref } from 'vue'
import PlanEntryRow from '~/components/plan/PlanEntryRow.vue'
import type { MaterialOption, VesselSummary } from '~/composables/usePlanData'
import { DEFAULT_POLICY } from '#shared/domain/policy'
import { usePlanEditorStore } from '~/stores/plan-editor'
import { useSettingsStore } from '~/stores/settings'
import { freshStores } from '../support/nuxt-stores'

// Benzoic acid, 26 454 J/g weighed in air (NIST SRM 39j certificate), as in the unit tests' factories.
const benzoic: MaterialOption = { id: 'm-ba', name: 'Benzoic acid', category: 'standard', heatingValueJPerG: 26454, composition: null, compositionBasis: null, formula: 'C7H6O2', smiles: null, declaredHazard: 'none', decompositionEnergyJPerG: null, typicalRange: null }
const vessel: VesselSummary = {
  id: 'v-1', name: 'Vessel A', class: 'standard', state: 'in-service', stateReasons: [],
  ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4.05, volumeMl: 300,
  proofCharge: { massG: 1, heatingValueJPerG: 26454, fillPressureMPa: 3 },
}
registerEndpoint('/api/materials', () => ({ rows: [], total: 0, page: 1, pageSize: 200 }))
beforeEach(() => {
  freshStores()
  useSettingsStore().settings = { labName: 'Test lab', policy: DEFAULT_POLICY, updatedAt: null }
})

function mountRow() {
  const editor = usePlanEditorStore()
  editor.begin('plan-1', vessel.id, 3)
  editor.vessels = [vessel]
  editor.remember(benzoic)
  editor.draft.materialName = benzoic.name
  const saves = ref(0)
  const Host = defineComponent({
    setup: () => () => h(PlanEntryRow, { busy: false, fieldErrors: {}, planFill: 3, onSave: () => { saves.value++ } }),
  })
  return { draft: computed(() => editor.draft), saves, mount: () => mountSuspended(Host) }
}

describe('PlanEntryRow', () => {
  it('takes "950 mg" and "30 bar" into the draft as 0.95 g and 3 MPa gauge (NIST SP 811: 1 bar = 0.1 MPa)', async () => {
    const row = mountRow()
    const w = await row.mount()
    await w.find('[data-testid="entry-mass"]').setValue('950 mg')
    await w.find('[data-testid="entry-fill"]').setValue('30 bar')
    await expect.poll(() => row.draft.value.massG, { timeout: 15_000 }).toBeCloseTo(0.95, 12)
    await expect.poll(() => row.draft.value.fillPressureMPa, { timeout: 15_000 }).toBeCloseTo(3, 12)
    expect(w.text()).toContain('= 0.95 g')
    expect(w.text()).toContain('= 3 MPa gauge')
  })

  it('shows the live check for a known material and saves on Enter', async () => {
    const row = mountRow()
    const w = await row.mount()
    await w.find('[data-testid="entry-mass"]').setValue('1.0')
    await expect.poll(() => w.find('[data-testid="entry-verdict"]').text(), { timeout: 15_000 }).toMatch(/Clear|Needs approval|Blocked/)
    await w.find('[data-testid="entry-mass"]').trigger('keydown', { key: 'Enter' })
    expect(row.saves.value).toBe(1)
  })

  it('names a wrong dimension beside the field and leaves the draft without a fill pressure', async () => {
    const row = mountRow()
    const w = await row.mount()
    await w.find('[data-testid="entry-fill"]').setValue('30 g')
    await expect.poll(() => w.text(), { timeout: 15_000 }).toMatch(/not a pressure/)
    expect(row.draft.value.fillPressureMPa).toBeNull()
  })
})
