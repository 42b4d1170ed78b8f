// Display preferences come from localStorage after the first render, so it matches the server's.
import { usePreferencesStore } from '~/stores/preferences'

export default defineNuxtPlugin((nuxtApp) => {
  nuxtApp.hook('app:mounted', () => usePreferencesStore().restore())
})
