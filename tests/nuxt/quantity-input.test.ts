// The quantity field: what a person types, what the page receives (a number in the API's unit), what the field says.
import { mountSuspended } from '@nuxt/test-utils/runtime'
import { describe, expect, it } from 'vitest'
import { defineComponent, h, ref } from 'vue'
import QuantityInput from '~/components/quantity/QuantityInput.vue'

function host(kind: 'mass' | 'pressure' | 'specificEnergy' | 'energy', unit: string, start: number | null = null) {
  const value = ref<number | null>(start)
  const Host = defineComponent({ setup: () => () => h(QuantityInput, { 'kind': kind, unit, 'modelValue': value.value, 'onUpdate:modelValue': (v: number | null) => { value.value = v }, 'data-testid': 'q' }) })
  return { value, mount: () => mountSuspended(Host) }
}

async function type(wrapper: Awaited<ReturnType<typeof mountSuspended>>, text: string) {
  await wrapper.find('[data-testid="q"]').setValue(text)
  // mathjs loads on first use; the field answers when it has read the text.
  await expect.poll(() => wrapper.find('[data-testid="quantity-reading"]').exists() || text.trim() === '' || /^[\d.,]+$/.test(text.trim()), { timeout: 15_000 }).toBe(true)
}

describe('QuantityInput', () => {
  it('hands the page grams for "950 mg" and says what it read (SI prefixes, NIST SP 811)', async () => {
    const h = host('mass', 'g')
    const w = await h.mount()
    await type(w, '950 mg')
    await expect.poll(() => h.value.value).toBeCloseTo(0.95, 12)
    expect(w.find('[data-testid="quantity-reading"]').text()).toBe('= 0.95 g')
  })

  it('reads "3,05 MPa" and "30 bar" as gauge MPa and states gauge (NIST SP 811 App. B: 1 bar = 0.1 MPa)', async () => {
    const h = host('pressure', 'MPa')
    const w = await h.mount()
    await type(w, '3,05 MPa')
    await expect.poll(() => h.value.value).toBeCloseTo(3.05, 12)
    await type(w, '30 bar')
    await expect.poll(() => h.value.value).toBeCloseTo(3, 12)
    expect(w.find('[data-testid="quantity-reading"]').text()).toBe('= 3 MPa gauge')
  })

  it('says so for a wrong dimension and gives the page no number', async () => {
    const h = host('pressure', 'MPa', 3)
    const w = await h.mount()
    await type(w, '30 g')
    await expect.poll(() => w.find('[data-testid="quantity-reading"]').text()).toMatch(/not a pressure/)
    expect(h.value.value).toBeNull()
    expect(w.find('[data-testid="q"]').attributes('aria-invalid')).toBe('true')
  })

  it('reads "6318 cal/g" as the international-table calorie, 4.1868 J (NIST SP 811 App. B)', async () => {
    const h = host('specificEnergy', 'J/g')
    const w = await h.mount()
    await type(w, '6318 cal/g')
    await expect.poll(() => h.value.value).toBeCloseTo(6318 * 4.1868, 6)
  })

  it('takes a plain number in the field unit without loading mathjs, and shows a value the page sets', async () => {
    const h = host('mass', 'g', 1.2)
    const w = await h.mount()
    expect((w.find('[data-testid="q"]').element as HTMLInputElement).value).toBe('1.2')
    await type(w, '0,5')
    await expect.poll(() => h.value.value).toBe(0.5)
    h.value.value = 0.75
    await expect.poll(() => (w.find('[data-testid="q"]').element as HTMLInputElement).value).toBe('0.75')
  })

  it('keeps a field in its own unit: "6318 cal/g" in an MJ/kg field, "33 kJ" in a kJ field (NIST SP 811, App. B: cal_IT = 4.1868 J)', async () => {
    const he = host('specificEnergy', 'MJ/kg')
    const w = await he.mount()
    await type(w, '6318 cal/g')
    // 6318 × 4.1868 J/g = 26 452.2 J/g = 26.4522 MJ/kg.
    await expect.poll(() => he.value.value).toBeCloseTo(26.4522, 4)
    expect(w.find('[data-testid="quantity-reading"]').text()).toBe('= 26.4522 MJ/kg')
    await type(w, '30 g')
    await expect.poll(() => w.find('[data-testid="quantity-reading"]').text()).toMatch(/not an energy per mass/)
    expect(he.value.value).toBeNull()

    const hk = host('energy', 'kJ')
    const k = await hk.mount()
    await type(k, '33000 J')
    await expect.poll(() => hk.value.value).toBeCloseTo(33, 9)
    expect(k.find('[data-testid="quantity-reading"]').text()).toBe('= 33 kJ')
  })

  it('labels the international-table calorie "cal_IT/g" in what it read, so it cannot be taken for cal_th/g', async () => {
    const h = host('specificEnergy', 'cal/g')
    const w = await h.mount()
    await type(w, '26.454 MJ/kg')
    // 26 454 J/g ÷ 4.1868 J/cal_IT = 6318.43 cal_IT/g (NIST SP 811, App. B).
    await expect.poll(() => h.value.value).toBeCloseTo(6318.43, 2)
    expect(w.find('[data-testid="quantity-reading"]').text()).toBe('= 6318.43 cal_IT/g')
  })
})
