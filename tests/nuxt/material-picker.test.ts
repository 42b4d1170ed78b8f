// The material picker searches the library on the server as the person types (debounced) and hands over the choice.
import { mountSuspended, registerEndpoint } from '@nuxt/test-utils/runtime'
import { describe, expect, it } from 'vitest'
import { getQuery } from 'h3'
import { defineComponent, h, ref } from 'vue'
import MaterialPicker from '~/components/material/MaterialPicker.vue'
import type { MaterialOption } from '~/composables/usePlanData'

// A library larger than any page: 250 lots, searched by the server, never sent whole.
const library: MaterialOption[] = Array.from({ length: 250 }, (_, i) => ({
  id: `m-${i}`, name: `Coal lot ${String(i).padStart(3, '0')}`, category: 'coal', heatingValueJPerG: 25000, composition: null, compositionBasis: null,
  formula: null, smiles: null, declaredHazard: 'none', decompositionEnergyJPerG: null, typicalRange: null,
}))
const asked: Record<string, unknown>[] = []
registerEndpoint('/api/materials', (event) => {
  const q = getQuery(event)
  asked.push(q)
  const hits = library.filter(m => m.name.toLowerCase().includes(String(q.q ?? '').toLowerCase()))
  return { rows: hits.slice(0, Number(q.limit ?? 20)), total: hits.length, page: 1, pageSize: Number(q.limit ?? 20) }
})

function mountPicker() {
  const text = ref('')
  const picked = ref<MaterialOption | null | undefined>(undefined)
  const Host = defineComponent({
    setup: () => () => h(MaterialPicker, { 'modelValue': text.value, 'onUpdate:modelValue': (t: string) => { text.value = t }, 'onPick': (m: MaterialOption | null) => { picked.value = m }, 'freeText': true }),
  })
  return { text, picked, mount: () => mountSuspended(Host) }
}

describe('MaterialPicker', () => {
  it('finds a material past the 200th with a search, once typing pauses, and picks it with the keyboard', async () => {
    asked.length = 0
    const p = mountPicker()
    const w = await p.mount()
    const input = w.find('input[role="combobox"]')
    for (const t of ['2', '24', '247']) await input.setValue(t)
    await expect.poll(() => w.findAll('[role="option"]').length, { timeout: 5000 }).toBe(1)
    // Three keystrokes, one request (the search waits for a pause).
    expect(asked).toHaveLength(1)
    expect(asked[0]).toMatchObject({ q: '247', limit: '20', derived: '0' })
    expect(w.find('[role="option"]').text()).toContain('Coal lot 247')
    await input.trigger('keydown', { key: 'ArrowDown' })
    await input.trigger('keydown', { key: 'Enter' })
    expect(p.picked.value?.id).toBe('m-247')
    expect(p.text.value).toBe('Coal lot 247')
  })

  it('says how many more match than it shows, and that free text is kept as the sample\'s name', async () => {
    const p = mountPicker()
    const w = await p.mount()
    const input = w.find('input[role="combobox"]')
    await input.setValue('coal')
    await expect.poll(() => w.text(), { timeout: 5000 }).toContain('20 of 250 matches — type more to narrow.')
    await input.setValue('peat from the north bog')
    await expect.poll(() => w.text(), { timeout: 5000 }).toContain('No library material matches — the text is kept as the sample\'s own name.')
  })

  it('takes a library name typed in full as chosen, and lets go of it when the text changes', async () => {
    const p = mountPicker()
    const w = await p.mount()
    const input = w.find('input[role="combobox"]')
    await input.setValue('coal lot 012')
    await expect.poll(() => p.picked.value?.id, { timeout: 5000 }).toBe('m-12')
    await input.setValue('coal lot 01')
    expect(p.picked.value).toBeNull()
  })
})
