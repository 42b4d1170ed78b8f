// Display preferences: this person's unit wins over the lab's, and is kept in the browser across visits.
import { mountSuspended } from '@nuxt/test-utils/runtime'
import { createPinia, setActivePinia } from 'pinia'
import { beforeEach, describe, expect, it } from 'vitest'
import { defineComponent, h } from 'vue'
import UiUnitSwitch from '~/components/ui/UiUnitSwitch.vue'
import { useEnergyUnit, usePreferencesStore } from '~/stores/preferences'

beforeEach(() => {
  localStorage.clear()
  setActivePinia(createPinia())
})

describe('preferences store', () => {
  it('shows the lab\'s unit until the person chooses, then the choice, and stores it', async () => {
    const Page = defineComponent({
      setup() {
        const unit = useEnergyUnit(() => 'MJ/kg')
        return () => h('div', [h(UiUnitSwitch, { 'modelValue': unit.value, 'onUpdate:modelValue': (u: typeof unit.value) => { unit.value = u } }), h('p', { 'data-testid': 'unit' }, unit.value)])
      },
    })
    const prefs = usePreferencesStore()
    prefs.restore()
    const w = await mountSuspended(Page)
    expect(w.find('[data-testid="unit"]').text()).toBe('MJ/kg')
    await w.findAll('button[role="radio"]').find(b => b.text().startsWith('Btu/lb'))!.trigger('click')
    expect(w.find('[data-testid="unit"]').text()).toBe('Btu/lb')
    await expect.poll(() => JSON.parse(localStorage.getItem('emberline:preferences') ?? '{}').energyUnit).toBe('Btu/lb')
  })

  it('restores a stored choice and ignores one it does not know', () => {
    localStorage.setItem('emberline:preferences', JSON.stringify({ energyUnit: 'cal/g', basis: 'dry', decimalSeparator: ',' }))
    const prefs = usePreferencesStore()
    prefs.restore()
    expect(prefs.unitOr('J/g')).toBe('cal/g')
    expect(prefs.basis).toBe('dry')
    expect(prefs.decimalSeparator).toBe(',')
    setActivePinia(createPinia())
    localStorage.setItem('emberline:preferences', JSON.stringify({ energyUnit: 'furlongs' }))
    const fresh = usePreferencesStore()
    fresh.restore()
    expect(fresh.unitOr('J/g')).toBe('J/g')
  })
})
