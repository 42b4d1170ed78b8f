import { defineStore, storeToRefs } from 'pinia'

/**
 * The lab's name and the policy in force, read once per visit: the server renders it into the payload, the browser
 * takes it from there, and every page and component reads this store instead of fetching `/api/settings` itself.
 * The policy page calls refresh() after a save so every open view shows the new values.
 */
export const useSettingsStore = defineStore('settings', () => {
  // Forwards the visitor's cookie while the server renders (a bare $fetch would not).
  const request = useRequestFetch()
  const { loggedIn } = useUserSession()
  const read = () => request('/api/settings')
  const settings = ref<Awaited<ReturnType<typeof read>> | null>(null)
  const problem = ref<string | null>(null)
  let pending: Promise<void> | null = null

  async function refresh() {
    pending ??= read()
      .then((s) => { settings.value = s; problem.value = null })
      .catch((e: { statusMessage?: string, message?: string }) => { problem.value = e.statusMessage ?? e.message ?? 'The lab settings could not be read.' })
      .finally(() => { pending = null })
    await pending
  }
  /** Reads the settings unless this visit already has them (a signed-out visitor has none to read). */
  async function load() {
    if (settings.value || !loggedIn.value) return
    await refresh()
  }

  const policy = computed(() => settings.value?.policy)
  const labName = computed(() => settings.value?.labName ?? '')
  return { settings, problem, policy, labName, load, refresh }
})

/** For a page's setup: waits for the settings (rendered on the server) and hands them back as refs. */
export async function useLabSettings() {
  const store = useSettingsStore()
  await store.load()
  return storeToRefs(store)
}
