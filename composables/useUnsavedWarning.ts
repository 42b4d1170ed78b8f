/** The question asked before unsaved work is left behind. */
export const UNSAVED_QUESTION = 'You have changes that are not saved. Leave this page and lose them?'

/**
 * Warns before unsaved work is lost: on leaving the page inside the app (a confirm dialog) and on reload, closing
 * the tab or following an outside link (the browser's own beforeunload prompt).
 */
export function useUnsavedWarning(dirty: () => boolean, question = UNSAVED_QUESTION) {
  onBeforeRouteLeave(() => {
    if (dirty() && !window.confirm(question)) return false
  })
  const onUnload = (e: BeforeUnloadEvent) => {
    if (!dirty()) return
    e.preventDefault()
    // Older browsers show the prompt only when returnValue is set.
    e.returnValue = ''
  }
  onMounted(() => window.addEventListener('beforeunload', onUnload))
  onBeforeUnmount(() => window.removeEventListener('beforeunload', onUnload))
}
