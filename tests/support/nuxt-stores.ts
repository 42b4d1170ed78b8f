// Component tests share the Nuxt app's Pinia: each test starts from stores that have not been used yet.
import type { Pinia } from 'pinia'
import { setActivePinia } from 'pinia'
import { useNuxtApp } from '#imports'

export function freshStores() {
  const pinia = useNuxtApp().$pinia as Pinia & { _s: Map<string, { $dispose: () => void }> }
  setActivePinia(pinia)
  for (const id of Object.keys(pinia.state.value)) {
    pinia._s.get(id)?.$dispose()
    Reflect.deleteProperty(pinia.state.value, id)
  }
}
