// The bench day: which vessel fires which run, in which order, and why — a plain, explained greedy heuristic.
//
// The problem is a small bin-packing with side rules; labs plan tens of vessels and hundreds of runs, so a greedy pass
// that a person can follow beats an optimal solver nobody can explain. The rules, in the order they are applied:
//  1. A vessel takes nothing when its state blocks every firing (locked out, away, overdue, requalification due).
//  2. Each vessel has a number of firings for the day: the least of the firings left before routine service, the firings
//     left before requalification, and the firing cycles that fit between the start of the bench day and its end (or the
//     calendar service due date, when that falls inside the day). A vessel never crosses a service limit mid-day.
//  3. Where the vessel needs a check first (serviced and awaiting verification, or its energy equivalent is older than the
//     lab allows) the day starts with that check; a vessel with no energy equivalent starts with a standardisation series.
//     A vessel awaiting verification fires nothing else that day: the check has to pass first.
//  4. Samples are taken oldest first. All determinations of one sample go to one vessel when one vessel may fire them
//     all and has room for them all — the one free earliest (fewest firings so far), then the one with more firings left
//     before service, then by name. Otherwise the determinations are spread one by one on the same rule.
//  5. A run never goes to a vessel on which its charge assessment is "blocked", and a sample run never goes to a vessel
//     that may fire only standardisation or check runs. "Needs approval" is allowed and says a signature is needed.
//  6. What finds no place stays in the queue, with the reason.
// The same layout function re-checks any edited assignment (a run moved by the analyst), so a move is judged by the
// same rules as the proposal.
import type { Verdict } from './assessment'

export type PlanRunKind = 'sample' | 'standardisation' | 'check'

export interface PlanVessel {
  id: string
  name: string
  blocksAllFirings: boolean
  blocksSampleRuns: boolean
  /** The state's main sentence, shown when the vessel takes nothing. */
  stateReason: string
  firingsUntilService: number
  firingsUntilRequalification: number
  /** Calendar date of the next routine service. */
  serviceDueAt: Date
  /** Firings already placed on this vessel that day by an accepted day plan: this plan starts after them. */
  alreadyPlannedToday?: number
  /** What the day must start with, and why; null when nothing is needed. */
  firstNeeds: { kind: 'check' | 'standardisation', firings: number, reason: string } | null
}

export interface PlanRun {
  id: string
  sampleId: string | null
  /** What the bench reads: the lab code, with the determination. */
  label: string
  kind: PlanRunKind
  /** Smaller goes first (the sample's time of receipt, in ms). */
  priority: number
}

export interface RunOnVessel { verdict: Verdict, reason?: string }
/** The charge assessment of a run on a vessel (the app passes the real assessment; tests may pass any rule). */
export type AssessOn = (run: PlanRun, vessel: PlanVessel) => RunOnVessel

export interface DaySettings {
  dayStart: Date
  workdayMinutes: number
  cycleMinutes: number
}

export interface PlannedFiring {
  /** null for the check or standardisation firings the day starts with (the analyst plans them with the reference standard). */
  runId: string | null
  kind: PlanRunKind
  label: string
  order: number
  startsAt: Date
  endsAt: Date
  why: string
  needsSignature: boolean
}

export interface VesselDay {
  vesselId: string
  name: string
  /** Firings this vessel may do that day (rule 2); 0 when it takes nothing. */
  capacity: number
  firings: PlannedFiring[]
  endsAt: Date | null
  /** Firings left before routine service once this day is fired. */
  firingsLeftAfter: number
  note: string
}

export interface Leftover { runId: string, label: string, reason: string }
export interface Problem { runId: string, vesselId: string, message: string }

export interface DayPlanProposal {
  vessels: VesselDay[]
  leftovers: Leftover[]
  /** Empty for a proposal; for an edited assignment, every rule it breaks. */
  problems: Problem[]
}

/** Vessel id → run ids in firing order (after any check the vessel needs first). */
export type Assignment = Record<string, string[]>

const MINUTE = 60_000
const hhmm = (d: Date) => d.toISOString().slice(11, 16)
const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`

/** Rule 2: firings the vessel may do that day, and what limits it. */
export function dayCapacity(v: PlanVessel, s: DaySettings): { firings: number, limit: string } {
  if (v.blocksAllFirings) return { firings: 0, limit: v.stateReason }
  const dayEnd = s.dayStart.getTime() + s.workdayMinutes * MINUTE
  const until = Math.min(dayEnd, v.serviceDueAt.getTime())
  const busy = v.alreadyPlannedToday ?? 0
  const byTime = Math.max(0, Math.floor((until - s.dayStart.getTime()) / (s.cycleMinutes * MINUTE)) - busy)
  const options: [number, string][] = [
    [byTime, until < dayEnd ? `routine service falls due at ${hhmm(v.serviceDueAt)} UTC` : `${byTime} firing cycles of ${s.cycleMinutes} min fit the bench day${busy ? ` after the ${busy} already planned` : ''}`],
    [Math.max(0, v.firingsUntilService), `${plural(Math.max(0, v.firingsUntilService), 'firing')} left before routine service`],
    [Math.max(0, v.firingsUntilRequalification), `${plural(Math.max(0, v.firingsUntilRequalification), 'firing')} left before requalification`],
  ]
  const [firings, limit] = options.reduce((a, b) => (b[0] < a[0] ? b : a))
  return { firings, limit }
}

function startsFor(v: PlanVessel, cap: number): number {
  if (!v.firstNeeds || cap === 0) return 0
  return Math.min(cap, v.firstNeeds.firings)
}

/** Why a run may not go on a vessel (rules 1, 3 and 5), or null when it may. */
export function refusal(run: PlanRun, v: PlanVessel, assessOn: AssessOn): string | null {
  if (v.blocksAllFirings) return `${v.name} may not fire: ${v.stateReason}`
  if (run.kind === 'sample' && v.blocksSampleRuns) return `${v.name} may fire only standardisation or check runs until a check run passes`
  const a = assessOn(run, v)
  if (a.verdict === 'blocked') return `blocked on ${v.name}${a.reason ? `: ${a.reason}` : ''}`
  return null
}

/**
 * Lays out an assignment: times, the check first where needed, and every rule an edited assignment breaks
 * (the server refuses to accept an assignment with problems).
 */
export function layoutDay(vessels: PlanVessel[], runs: PlanRun[], assignment: Assignment, assessOn: AssessOn, s: DaySettings, why: Map<string, string> = new Map()): DayPlanProposal {
  const runById = new Map(runs.map(r => [r.id, r]))
  const problems: Problem[] = []
  const seen = new Set<string>()
  const out: VesselDay[] = vessels.map((v) => {
    const { firings: cap, limit } = dayCapacity(v, s)
    const firings: PlannedFiring[] = []
    const at = (i: number) => new Date(s.dayStart.getTime() + (i + (v.alreadyPlannedToday ?? 0)) * s.cycleMinutes * MINUTE)
    const first = startsFor(v, cap)
    for (let i = 0; i < first; i++) {
      firings.push({ runId: null, kind: v.firstNeeds!.kind, label: `${v.firstNeeds!.kind === 'check' ? 'Check run' : 'Standardisation run'} (reference standard)`, order: i + 1, startsAt: at(i), endsAt: at(i + 1), why: v.firstNeeds!.reason, needsSignature: false })
    }
    for (const runId of assignment[v.id] ?? []) {
      const run = runById.get(runId)
      if (!run) {
        problems.push({ runId, vesselId: v.id, message: 'this run is not open for planning' })
        continue
      }
      if (seen.has(runId)) problems.push({ runId, vesselId: v.id, message: `${run.label} is placed twice` })
      seen.add(runId)
      const i = firings.length
      const no = refusal(run, v, assessOn)
      if (no) problems.push({ runId, vesselId: v.id, message: `${run.label}: ${no}` })
      else if (i >= cap) problems.push({ runId, vesselId: v.id, message: `${run.label}: ${v.name} has ${cap} firing${cap === 1 ? '' : 's'} that day (${limit})` })
      const verdict = no ? 'blocked' : assessOn(run, v).verdict
      firings.push({ runId, kind: run.kind, label: run.label, order: i + 1, startsAt: at(i), endsAt: at(i + 1), why: why.get(runId) ?? `moved here by the analyst; checked against ${v.name}`, needsSignature: verdict === 'needs-approval' })
    }
    const note = cap === 0
      ? `${v.name} takes nothing that day: ${limit}.`
      : `${v.name}: up to ${cap} firing${cap === 1 ? '' : 's'} that day (${limit}).${v.blocksSampleRuns && !v.blocksAllFirings ? ' No sample until a check run passes.' : ''}`
    return {
      vesselId: v.id,
      name: v.name,
      capacity: cap,
      firings,
      endsAt: firings.length ? firings[firings.length - 1]!.endsAt : null,
      firingsLeftAfter: v.firingsUntilService - firings.length,
      note,
    }
  })
  const leftovers = runs.filter(r => !seen.has(r.id)).map(r => ({ runId: r.id, label: r.label, reason: 'left in the queue by the analyst' }))
  return { vessels: out, leftovers, problems }
}

/** Proposes the day by rules 1–6; every placed run and every leftover carries its explanation. */
export function proposeDay(vessels: PlanVessel[], runs: PlanRun[], assessOn: AssessOn, s: DaySettings): DayPlanProposal {
  const sorted = [...vessels].sort((a, b) => a.name.localeCompare(b.name))
  const cap = new Map(sorted.map(v => [v.id, dayCapacity(v, s)]))
  const used = new Map(sorted.map(v => [v.id, startsFor(v, cap.get(v.id)!.firings)]))
  const free = (v: PlanVessel) => cap.get(v.id)!.firings - used.get(v.id)!
  const assignment: Assignment = Object.fromEntries(sorted.map(v => [v.id, []]))
  const why = new Map<string, string>()
  const leftovers: Leftover[] = []

  // Groups: the determinations of one sample (a run without a sample is a group of its own), oldest sample first.
  const groups = new Map<string, PlanRun[]>()
  for (const r of runs) {
    const key = r.sampleId ?? `run:${r.id}`
    groups.set(key, [...(groups.get(key) ?? []), r])
  }
  const ordered = [...groups.values()].sort((a, b) => Math.min(...a.map(r => r.priority)) - Math.min(...b.map(r => r.priority)) || a[0]!.label.localeCompare(b[0]!.label))
  // Rule 4's preference: free earliest, then more firings left before service, then by name (sorted above, stable).
  const better = (a: PlanVessel, b: PlanVessel) => used.get(a.id)! - used.get(b.id)! || b.firingsUntilService - a.firingsUntilService
  const place = (r: PlanRun, v: PlanVessel, text: string) => {
    assignment[v.id]!.push(r.id)
    used.set(v.id, used.get(v.id)! + 1)
    const needs = assessOn(r, v).verdict === 'needs-approval' ? ' Needs a supervisor\'s signature before firing.' : ''
    why.set(r.id, `${text}${needs}`)
  }

  for (const group of ordered) {
    const allowed = (r: PlanRun) => sorted.filter(v => !refusal(r, v, assessOn))
    const whole = sorted.filter(v => free(v) >= group.length && group.every(r => !refusal(r, v, assessOn))).sort(better)
    if (whole.length) {
      const v = whole[0]!
      const text = group.length > 1
        ? `All ${group.length} determinations on ${v.name}: of the ${whole.length} vessel${whole.length === 1 ? '' : 's'} with room for all of them, the one free earliest (${used.get(v.id)} firing${used.get(v.id) === 1 ? '' : 's'} before).`
        : `${v.name}: of the ${whole.length} vessel${whole.length === 1 ? '' : 's'} that may fire it, the one free earliest (${used.get(v.id)} firing${used.get(v.id) === 1 ? '' : 's'} before).`
      for (const r of group) place(r, v, text)
      continue
    }
    for (const r of group) {
      const ok = allowed(r)
      const room = ok.filter(v => free(v) > 0).sort(better)
      if (room.length) {
        place(r, room[0]!, `${room[0]!.name}: no single vessel could take all ${group.length} determinations of this sample, so they are spread; this one free earliest.`)
        continue
      }
      let reason: string
      if (!ok.length) {
        const reasons = sorted.map(v => refusal(r, v, assessOn)!)
        reason = `No chosen vessel may fire it — ${reasons.slice(0, 3).join('; ')}${reasons.length > 3 ? `; and ${reasons.length - 3} more` : ''}.`
      }
      else {
        reason = `The vessels that may fire it are full that day — ${ok.slice(0, 3).map(v => `${v.name}: ${cap.get(v.id)!.limit}`).join('; ')}${ok.length > 3 ? `; and ${ok.length - 3} more` : ''}.`
      }
      leftovers.push({ runId: r.id, label: r.label, reason })
    }
  }
  const laid = layoutDay(sorted, runs, assignment, assessOn, s, why)
  const placed = new Set(Object.values(assignment).flat())
  return { vessels: laid.vessels, leftovers: [...leftovers, ...laid.leftovers.filter(l => !placed.has(l.runId) && !leftovers.some(x => x.runId === l.runId))], problems: laid.problems }
}

/**
 * Service forecast counting planned firings: the first day on which the planned firings reach the firings left
 * before service, else the calendar due date, whichever comes first (common practice: whichever comes first).
 */
export function forecastWithPlans(firingsUntilService: number, serviceDueAt: Date, planned: { day: Date, firings: number }[]): { dueAt: Date, by: 'firings' | 'calendar' } {
  let left = firingsUntilService
  for (const p of [...planned].sort((a, b) => a.day.getTime() - b.day.getTime())) {
    if (p.day.getTime() > serviceDueAt.getTime()) break
    left -= p.firings
    if (left <= 0) return { dueAt: p.day, by: 'firings' }
  }
  return { dueAt: serviceDueAt, by: 'calendar' }
}
