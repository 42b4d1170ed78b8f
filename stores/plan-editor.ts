import { defineStore } from 'pinia'
import { blankDraft, draftFromRun, useLiveAssessment, type ChargeDraft } from '~/composables/useChargeDraft'
import { materialNamed } from '~/composables/useMaterialSearch'
import type { MaterialOption, Run, VesselSummary } from '~/composables/usePlanData'
import { useSettingsStore } from './settings'

const UNDO_DEPTH = 50
// Keystrokes in one field within this window are one change to undo, not one per character.
const GROUP_MS = 1500

const copy = (d: ChargeDraft): ChargeDraft => ({ ...d })
const changedKeys = (a: ChargeDraft, b: ChargeDraft) => (Object.keys(b) as (keyof ChargeDraft)[]).filter(k => a[k] !== b[k]).sort().join(',')

/**
 * The plan being edited: its entry row (the draft run), the run being edited, the live check of the draft and an
 * undo of the last changes to the draft. The plan's runs stay server data (useFetch on the page); the store keeps
 * only what the analyst has typed and not saved, plus the library materials the draft names.
 */
export const usePlanEditorStore = defineStore('plan-editor', () => {
  const planId = ref<string | null>(null)
  const draft = ref<ChargeDraft>(blankDraft('', 3))
  const editing = ref<Run | null>(null)
  const history = ref<ChargeDraft[]>([])
  const vessels = ref<VesselSummary[]>([])
  // Library materials the draft may name: those of the plan's runs and those picked in the entry row.
  const picked = ref<MaterialOption[]>([])
  const named = ref<MaterialOption[]>([])
  const materials = computed(() => [...new Map([...named.value, ...picked.value].map(m => [m.id, m])).values()])
  const settings = useSettingsStore()

  let last = copy(draft.value)
  let lastKeys = ''
  let lastAt = 0
  let restoring = false
  // Nothing is remembered before a page opens the plan: the server's draft arriving in the browser is not a change.
  let tracking = false
  // Every change of the draft is remembered; a burst of typing in one field counts once.
  watch(draft, (now) => {
    const keys = changedKeys(last, now)
    if (!keys) return
    if (!tracking) { last = copy(now); return }
    if (!restoring) {
      const sameBurst = keys === lastKeys && Date.now() - lastAt < GROUP_MS
      if (!sameBurst) history.value = [...history.value, last].slice(-UNDO_DEPTH)
      lastKeys = keys
      lastAt = Date.now()
    }
    restoring = false
    last = copy(now)
  }, { deep: true, flush: 'sync' })

  function replace(next: ChargeDraft, forget: boolean) {
    lastKeys = '' // a new row is a step of its own, never part of the typing before it
    draft.value = next
    if (forget) { history.value = []; last = copy(next); lastKeys = '' }
  }

  /** Opens a plan: a different plan starts from a blank row, the same plan keeps what was typed. */
  function begin(id: string, vesselId: string, fill: number) {
    tracking = true
    if (planId.value === id) return
    planId.value = id
    editing.value = null
    picked.value = []
    replace(blankDraft(vesselId, fill), true)
  }

  /** The next row: keeps kind, fuse, aid and vessel from a saved row; the fill goes back to the plan's. */
  function startNext(vesselId: string, fill: number, keep?: ChargeDraft) {
    const base = blankDraft(vesselId, fill)
    const wasEditing = editing.value !== null
    editing.value = null
    // Clearing a half-typed row can be undone; a saved row or a closed edit cannot come back as a draft.
    replace(keep ? { ...base, aidMaterialId: keep.aidMaterialId, aidMassG: keep.aidMassG, wire: keep.wire, fuseLengthCm: keep.fuseLengthCm, vesselId: keep.vesselId, kind: keep.kind } : base, !!keep || wasEditing)
  }

  function edit(run: Run) {
    editing.value = run
    replace(draftFromRun(run, materials.value), true)
  }

  const canUndo = computed(() => history.value.length > 0)
  /** Puts the draft back as it was before the last change. */
  function undo() {
    const previous = history.value.at(-1)
    if (!previous) return
    history.value = history.value.slice(0, -1)
    restoring = true
    lastKeys = ''
    draft.value = copy(previous)
    restoring = false
  }

  function remember(m: MaterialOption) {
    if (!picked.value.some(x => x.id === m.id)) picked.value = [...picked.value, m]
  }

  /** Before a save: a library name typed in full (faster than the search) still names the library material. */
  async function resolveTypedName() {
    const name = draft.value.materialName.trim()
    if (!name || materials.value.some(m => m.name.toLowerCase() === name.toLowerCase())) return
    const exact = await materialNamed(name)
    if (exact) remember(exact)
  }

  const vessel = computed(() => vessels.value.find(v => v.id === draft.value.vesselId))
  const live = useLiveAssessment(() => ({ draft: draft.value, vessel: vessel.value, materials: materials.value, policy: settings.policy }))

  return {
    planId, draft, editing, history, vessels, named, picked, materials, vessel, canUndo,
    assessment: live.result, advice: live.advice, problem: live.problem,
    begin, startNext, edit, undo, remember, resolveTypedName,
  }
})
