// The one computation of a combustion vessel's service state for the whole app.
// Intervals are common practice (manufacturers' service guidance), not a published standard: routine seal service every
// 500 firings or six months, whichever comes first; requalification after 5,000 firings (ASTM E144 describes the tests).

/** What people record about a vessel; the state is computed from it and the counters. */
export const VESSEL_CONDITIONS = ['normal', 'locked-out', 'away', 'awaiting-verification', 'retired'] as const
export type VesselCondition = typeof VESSEL_CONDITIONS[number]

export const VESSEL_STATES = [
  'in-service', 'service-due', 'overdue', 'requalification-due', 'locked-out', 'away', 'awaiting-verification', 'retired',
] as const
export type VesselState = typeof VESSEL_STATES[number]

/** Routine service interval in firings — common practice (manufacturers' service guidance). */
export const DEFAULT_SERVICE_INTERVAL_FIRINGS = 500
/** Routine service interval in days, six months — common practice (manufacturers' service guidance). */
export const DEFAULT_SERVICE_INTERVAL_DAYS = 182
/** Requalification interval in firings — common practice (manufacturers' service guidance). */
export const DEFAULT_REQUALIFICATION_INTERVAL_FIRINGS = 5000
/** "Service due" notice within this % of either interval — lab policy default (info finding). */
export const DEFAULT_DUE_MARGIN_PCT = 10

const DAY_MS = 86_400_000

export interface VesselStateInput {
  firingsSinceService: number
  firingsSinceRequalification: number
  firingsTotal: number
  /** Last routine service; null when never serviced, in which case the registration date counts. */
  lastServicedAt: Date | null
  registeredAt: Date
  serviceIntervalFirings: number
  serviceIntervalDays: number
  requalificationIntervalFirings: number
  condition: VesselCondition
  now: Date
  /** Service is "due" within this % of either interval; default 10. */
  dueMarginPct?: number
}

export interface VesselServiceState {
  state: VesselState
  /** Calendar due date of the next routine service: last service (or registration) + serviceIntervalDays. */
  serviceDueAt: Date
  /** Firings left before the service interval; zero or negative once reached. */
  firingsUntilService: number
  /** Whole days left before serviceDueAt (a part day counts as a day); zero or negative once reached. */
  daysUntilService: number
  /** Firings left before the requalification interval; zero or negative once reached. */
  firingsUntilRequalification: number
  /** Plain sentences, with the numbers, explaining the state; the first one is the main reason. */
  reasons: string[]
  /** True when only standardisation/check runs, or nothing, may be fired. */
  blocksSampleRuns: boolean
  /** True when no firing at all may take place. */
  blocksAllFirings: boolean
  /** The `now` the state was computed for. */
  evaluatedAt: Date
}

// One formatter for every count: building one per call was a large share of the fleet route's time (docs/benchmarks.md).
const counts = new Intl.NumberFormat('en-GB')
const count = (n: number) => counts.format(n)
const isoDate = (d: Date) => d.toISOString().slice(0, 10)
const plural = (n: number, word: string) => `${count(n)} ${word}${n === 1 ? '' : 's'}`

function checkCounter(value: number, name: string): void {
  if (!Number.isInteger(value) || value < 0) throw new RangeError(`${name} must be a whole number of at least 0 (got ${value})`)
}

function checkInterval(value: number, name: string): void {
  if (!Number.isFinite(value) || value <= 0) throw new RangeError(`${name} must be greater than 0 (got ${value})`)
}

function checkDate(value: Date, name: string): void {
  if (!(value instanceof Date) || Number.isNaN(value.getTime())) throw new RangeError(`${name} must be a valid date`)
}

/** State by precedence retired > locked-out > away > requalification-due > overdue (≥ 500 firings or ≥ 182 days) > awaiting-verification > service-due (≥ 90 % of either interval) > in-service; intervals common practice (manufacturers' service guidance). */
export function computeVesselState(input: VesselStateInput): VesselServiceState {
  checkCounter(input.firingsSinceService, 'firingsSinceService')
  checkCounter(input.firingsSinceRequalification, 'firingsSinceRequalification')
  checkCounter(input.firingsTotal, 'firingsTotal')
  checkInterval(input.serviceIntervalFirings, 'serviceIntervalFirings')
  checkInterval(input.serviceIntervalDays, 'serviceIntervalDays')
  checkInterval(input.requalificationIntervalFirings, 'requalificationIntervalFirings')
  checkDate(input.registeredAt, 'registeredAt')
  checkDate(input.now, 'now')
  if (input.lastServicedAt !== null) checkDate(input.lastServicedAt, 'lastServicedAt')
  const margin = input.dueMarginPct ?? DEFAULT_DUE_MARGIN_PCT
  if (!Number.isFinite(margin) || margin < 0 || margin >= 100) throw new RangeError(`dueMarginPct must be at least 0 and below 100 (got ${margin})`)

  const since = input.lastServicedAt ?? input.registeredAt
  const sinceWhat = input.lastServicedAt ? 'the last routine service' : 'registration (no service recorded)'
  const serviceDueAt = new Date(since.getTime() + input.serviceIntervalDays * DAY_MS)
  const elapsedDays = (input.now.getTime() - since.getTime()) / DAY_MS
  const wholeDays = Math.floor(elapsedDays)
  const firingsUntilService = input.serviceIntervalFirings - input.firingsSinceService
  // A part day left still counts as a day; `|| 0` turns Math.ceil's −0 into 0.
  const daysUntilService = Math.ceil((serviceDueAt.getTime() - input.now.getTime()) / DAY_MS) || 0
  const firingsUntilRequalification = input.requalificationIntervalFirings - input.firingsSinceRequalification

  const dueFraction = 1 - margin / 100
  const requalificationReached = input.firingsSinceRequalification >= input.requalificationIntervalFirings
  const requalificationNear = !requalificationReached && input.firingsSinceRequalification >= input.requalificationIntervalFirings * dueFraction
  const overdueByFirings = input.firingsSinceService >= input.serviceIntervalFirings
  const overdueByDays = elapsedDays >= input.serviceIntervalDays
  const dueByFirings = !overdueByFirings && input.firingsSinceService >= input.serviceIntervalFirings * dueFraction
  const dueByDays = !overdueByDays && elapsedDays >= input.serviceIntervalDays * dueFraction

  const findings: string[] = []
  if (requalificationReached) {
    findings.push(`${plural(input.firingsSinceRequalification, 'firing')} since the last requalification reach the requalification interval of ${count(input.requalificationIntervalFirings)}; requalify the vessel before any further firing.`)
  }
  if (overdueByFirings) {
    findings.push(`Routine service is overdue: ${plural(input.firingsSinceService, 'firing')} since ${sinceWhat}, the interval is ${count(input.serviceIntervalFirings)}.`)
  }
  if (overdueByDays) {
    findings.push(`Routine service is overdue: ${plural(wholeDays, 'day')} since ${sinceWhat} (due ${isoDate(serviceDueAt)}), the interval is ${count(input.serviceIntervalDays)} days.`)
  }
  if (dueByFirings) {
    findings.push(`Routine service is due soon: ${plural(input.firingsSinceService, 'firing')} since ${sinceWhat}, ${count(firingsUntilService)} left before the interval of ${count(input.serviceIntervalFirings)}.`)
  }
  if (dueByDays) {
    findings.push(`Routine service is due soon: ${plural(wholeDays, 'day')} since ${sinceWhat}, due by ${isoDate(serviceDueAt)} (${plural(daysUntilService, 'day')} left).`)
  }
  if (requalificationNear) {
    findings.push(`Requalification is due in ${plural(firingsUntilRequalification, 'firing')} (${count(input.firingsSinceRequalification)} of ${count(input.requalificationIntervalFirings)}).`)
  }

  const conditionSentence: Record<Exclude<VesselCondition, 'normal'>, string> = {
    'retired': 'The vessel is retired and can no longer be fired.',
    'locked-out': 'The vessel is locked out; it cannot be fired until it has been requalified.',
    'away': 'The vessel is away for requalification; it cannot be fired until it returns.',
    'awaiting-verification': 'The vessel has been serviced and awaits verification: only standardisation or check runs until a check run passes.',
  }

  let state: VesselState
  if (input.condition === 'retired' || input.condition === 'locked-out' || input.condition === 'away') state = input.condition
  else if (requalificationReached) state = 'requalification-due'
  else if (overdueByFirings || overdueByDays) state = 'overdue'
  else if (input.condition === 'awaiting-verification') state = 'awaiting-verification'
  else if (dueByFirings || dueByDays) state = 'service-due'
  else state = 'in-service'

  const reasons: string[] = []
  // The condition sentence leads when the condition decides the state; awaiting verification still shows when outranked.
  if (input.condition !== 'normal' && state === input.condition) reasons.push(conditionSentence[input.condition])
  reasons.push(...findings)
  if (input.condition === 'awaiting-verification' && state !== 'awaiting-verification') reasons.push(conditionSentence['awaiting-verification'])
  if (state === 'in-service') {
    reasons.unshift(`In service: ${plural(firingsUntilService, 'firing')} and ${plural(daysUntilService, 'day')} until the next routine service (due by ${isoDate(serviceDueAt)}).`)
  }

  const blocksAllFirings = state === 'retired' || state === 'locked-out' || state === 'away' || state === 'requalification-due' || state === 'overdue'
  return {
    state,
    serviceDueAt,
    firingsUntilService,
    daysUntilService,
    firingsUntilRequalification,
    reasons,
    blocksSampleRuns: blocksAllFirings || state === 'awaiting-verification',
    blocksAllFirings,
    evaluatedAt: new Date(input.now.getTime()),
  }
}

/** Date the service-firing count reaches its interval at the recent firing rate (now + firings left / rate), or the calendar due date if that comes first — common practice (manufacturers' service guidance: whichever comes first). */
export function forecastServiceDate(state: VesselServiceState, recentFiringsPerDay: number): Date {
  if (!Number.isFinite(recentFiringsPerDay) || recentFiringsPerDay < 0) throw new RangeError(`recentFiringsPerDay must be at least 0 (got ${recentFiringsPerDay})`)
  if (recentFiringsPerDay === 0) return new Date(state.serviceDueAt.getTime())
  const firingsLeft = Math.max(0, state.firingsUntilService)
  const byFirings = state.evaluatedAt.getTime() + (firingsLeft / recentFiringsPerDay) * DAY_MS
  return new Date(Math.min(byFirings, state.serviceDueAt.getTime()))
}
