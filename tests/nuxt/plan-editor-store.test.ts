// The plan editor: the entry row lives in a store that remembers each change, and Undo puts the row back as it was.
import { mountSuspended, registerEndpoint } from '@nuxt/test-utils/runtime'
import { beforeEach, describe, expect, it } from 'vitest'
import PlanEntryRow from '~/components/plan/PlanEntryRow.vue'
import type { Run, VesselSummary } from '~/composables/usePlanData'
import { DEFAULT_POLICY } from '#shared/domain/policy'
import { usePlanEditorStore } from '~/stores/plan-editor'
import { useSettingsStore } from '~/stores/settings'
import { freshStores } from '../support/nuxt-stores'

const vessel: VesselSummary = {
  id: 'v-1', name: 'Vessel A', class: 'standard', state: 'in-service', stateReasons: [],
  ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4.05, volumeMl: 300,
  proofCharge: { massG: 1, heatingValueJPerG: 26454, fillPressureMPa: 3 },
}
registerEndpoint('/api/materials', () => ({ rows: [], total: 0, page: 1, pageSize: 200 }))

function editor() {
  const store = usePlanEditorStore()
  store.begin('plan-1', vessel.id, 3)
  store.vessels = [vessel]
  return store
}

beforeEach(() => {
  freshStores()
  useSettingsStore().settings = { labName: 'Test lab', policy: DEFAULT_POLICY, updatedAt: null }
})

describe('plan editor store', () => {
  it('undoes the last change, then the one before, back to the blank row', () => {
    const store = editor()
    expect(store.canUndo).toBe(false)
    store.draft.sampleCode = 'C-14'
    store.draft.massG = 0.95
    store.draft.note = 'pellet pressed'
    store.undo()
    expect(store.draft.note).toBe('')
    expect(store.draft.massG).toBe(0.95)
    store.undo()
    expect(store.draft.massG).toBeNull()
    expect(store.draft.sampleCode).toBe('C-14')
    store.undo()
    expect(store.draft.sampleCode).toBe('')
    expect(store.canUndo).toBe(false)
  })

  it('counts a burst of typing in one field as one change', () => {
    const store = editor()
    for (const text of ['C', 'C-', 'C-1', 'C-14']) store.draft.sampleCode = text
    store.undo()
    expect(store.draft.sampleCode).toBe('')
  })

  it('brings back a row cleared by mistake, but not a saved one', () => {
    const store = editor()
    store.draft.sampleCode = 'C-15'
    store.startNext(vessel.id, 3)
    expect(store.draft.sampleCode).toBe('')
    store.undo()
    expect(store.draft.sampleCode).toBe('C-15')
    // After a save the row starts afresh: the saved run is in the plan, not a draft to bring back.
    store.startNext(vessel.id, 3, store.draft)
    expect(store.canUndo).toBe(false)
  })

  it('does not count the row that arrives from the server-rendered page as a change', () => {
    const store = usePlanEditorStore()
    // What Pinia does when the browser takes over the server's state, before the page opens the plan.
    store.planId = 'plan-1'
    store.draft = { ...store.draft, sampleCode: 'C-30', vesselId: vessel.id }
    store.begin('plan-1', vessel.id, 3)
    expect(store.canUndo).toBe(false)
    store.draft.note = 'typed in the browser'
    store.undo()
    expect(store.draft).toMatchObject({ sampleCode: 'C-30', vesselId: vessel.id, note: '' })
  })

  it('keeps the typed row when the same plan is opened again, and starts blank for another plan', () => {
    const store = editor()
    store.draft.sampleCode = 'C-16'
    store.begin('plan-1', vessel.id, 3)
    expect(store.draft.sampleCode).toBe('C-16')
    store.begin('plan-2', vessel.id, 3.2)
    expect(store.draft.sampleCode).toBe('')
    expect(store.draft.fillPressureMPa).toBe(3.2)
  })

  it('opens a run for editing without an undo back into the previous row', () => {
    const store = editor()
    store.draft.sampleCode = 'C-17'
    const run = { sampleCode: 'C-3', kind: 'sample', components: [{ role: 'sample', name: 'coal lot 3', massG: 1 }], vesselId: vessel.id, fillPressureMPa: 3, note: '', seq: 3 } as unknown as Run
    store.edit(run)
    expect(store.draft.sampleCode).toBe('C-3')
    expect(store.canUndo).toBe(false)
  })
})

describe('the Undo control of the entry row', () => {
  it('is a visible button that restores the previous draft, and Ctrl+Z does the same outside a field', async () => {
    const store = editor()
    const w = await mountSuspended(PlanEntryRow, { props: { busy: false, fieldErrors: {}, planFill: 3 } })
    const undo = w.find('[data-testid="entry-undo"]')
    expect(undo.text()).toContain('Undo')
    expect(undo.attributes('disabled')).toBeDefined()

    await w.find('[data-testid="entry-code"]').setValue('C-20')
    await w.find('[data-testid="entry-note"]').setValue('weighed twice')
    expect(undo.attributes('disabled')).toBeUndefined()
    await undo.trigger('click')
    expect(store.draft.note).toBe('')
    expect((w.find('[data-testid="entry-note"]').element as HTMLInputElement).value).toBe('')

    // Typing in a field keeps the browser's own undo; outside a field Ctrl+Z is the row's.
    window.dispatchEvent(new KeyboardEvent('keydown', { key: 'z', ctrlKey: true }))
    await nextTick()
    expect(store.draft.sampleCode).toBe('')
    store.draft.sampleCode = 'C-21'
    w.find('[data-testid="entry-code"]').element.dispatchEvent(new KeyboardEvent('keydown', { key: 'z', ctrlKey: true, bubbles: true }))
    expect(store.draft.sampleCode).toBe('C-21')
  })
})
