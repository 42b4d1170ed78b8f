import { defineStore } from 'pinia'
import { isSpecificEnergyUnit, type SpecificEnergyUnit } from '#shared/domain/specific-energy'

export type DecimalSeparator = '.' | ','
export type DisplayBasis = 'as-received' | 'air-dried' | 'dry' | 'dry-ash-free'
const BASES: readonly DisplayBasis[] = ['as-received', 'air-dried', 'dry', 'dry-ash-free']
const KEY = 'emberline:preferences'

/**
 * What this person likes to see: the energy unit, the basis of calorific values and the decimal separator.
 * Kept in the browser (localStorage), never on the server; null means "the lab's choice" (its policy).
 * The server renders the lab's choice; restore() runs once the app is mounted (plugins/preferences.client.ts),
 * so the first render matches the server's and the stored choice follows.
 */
export const usePreferencesStore = defineStore('preferences', () => {
  const energyUnit = ref<SpecificEnergyUnit | null>(null)
  const basis = ref<DisplayBasis | null>(null)
  const decimalSeparator = ref<DecimalSeparator>('.')
  let restored = false

  function restore() {
    if (restored || typeof localStorage === 'undefined') return
    restored = true
    try {
      const saved = JSON.parse(localStorage.getItem(KEY) ?? '{}') as Record<string, unknown>
      if (typeof saved.energyUnit === 'string' && isSpecificEnergyUnit(saved.energyUnit)) energyUnit.value = saved.energyUnit
      if (BASES.includes(saved.basis as DisplayBasis)) basis.value = saved.basis as DisplayBasis
      if (saved.decimalSeparator === ',' || saved.decimalSeparator === '.') decimalSeparator.value = saved.decimalSeparator
    }
    catch { /* an unreadable entry is replaced on the next change */ }
    watch([energyUnit, basis, decimalSeparator], () => {
      localStorage.setItem(KEY, JSON.stringify({ energyUnit: energyUnit.value, basis: basis.value, decimalSeparator: decimalSeparator.value }))
    })
  }

  /** The unit to show: this person's choice, else the lab's. */
  const unitOr = (labUnit: SpecificEnergyUnit | undefined): SpecificEnergyUnit => energyUnit.value ?? labUnit ?? 'J/g'

  return { energyUnit, basis, decimalSeparator, restore, unitOr }
})

/** A writable energy unit for a page: reads this person's choice (else the lab's), writes the choice. */
export function useEnergyUnit(labUnit: () => SpecificEnergyUnit | undefined) {
  const prefs = usePreferencesStore()
  return computed<SpecificEnergyUnit>({ get: () => prefs.unitOr(labUnit()), set: (u) => { prefs.energyUnit = u } })
}
