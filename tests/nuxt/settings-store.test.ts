// The lab settings store: one read of /api/settings however many pages and components ask, and a fresh read after
// the policy page saves.
import { mountSuspended, registerEndpoint } from '@nuxt/test-utils/runtime'
import { beforeEach, describe, expect, it } from 'vitest'
import { defineComponent, h } from 'vue'
import { DEFAULT_POLICY } from '#shared/domain/policy'
import { useLabSettings, useSettingsStore } from '~/stores/settings'
import { freshStores } from '../support/nuxt-stores'

let reads = 0
let labName = 'Harbour Fuels Laboratory'
registerEndpoint('/api/settings', () => {
  reads++
  return { labName, updatedAt: null, policy: { ...DEFAULT_POLICY, defaultFillPressureMPa: reads === 1 ? 3 : 3.2 } }
})

// Two views of one page, each asking for the settings as every page does.
const View = (testid: string) => defineComponent({
  async setup() {
    const { settings, policy } = await useLabSettings()
    return () => h('p', { 'data-testid': testid }, `${settings.value?.labName} · ${policy.value?.defaultFillPressureMPa} MPa gauge`)
  },
})

beforeEach(() => {
  reads = 0
  labName = 'Harbour Fuels Laboratory'
  freshStores()
  useState('nuxt-session').value = { user: { id: 'u-1', name: 'Ana Lyst', roles: ['analyst'] } }
})

describe('settings store', () => {
  it('reads the settings once for every page and component that asks', async () => {
    const a = await mountSuspended(View('a'))
    const b = await mountSuspended(View('b'))
    expect(a.find('[data-testid="a"]').text()).toBe('Harbour Fuels Laboratory · 3 MPa gauge')
    expect(b.find('[data-testid="b"]').text()).toBe('Harbour Fuels Laboratory · 3 MPa gauge')
    expect(reads).toBe(1)
  })

  it('shows the new values everywhere after a refresh (what the policy page does after saving)', async () => {
    const a = await mountSuspended(View('a'))
    labName = 'Harbour Fuels Laboratory, north site'
    await useSettingsStore().refresh()
    await nextTick()
    expect(a.find('[data-testid="a"]').text()).toBe('Harbour Fuels Laboratory, north site · 3.2 MPa gauge')
    expect(reads).toBe(2)
  })

  it('reads nothing for a visitor who is not signed in', async () => {
    useState('nuxt-session').value = null
    await useSettingsStore().load()
    expect(reads).toBe(0)
    expect(useSettingsStore().settings).toBeNull()
  })
})
