// Reconciliation of the vessels' firing counters with the firings recorded: the pure comparison behind
// `npm run reconcile`. Every recorded firing adds one to each counter in the transaction that records
// it; a routine service resets the service counter, a requalification resets both. So, for every vessel:
//   lifetime              = lifetime carried at registration + all firings recorded
//   since service         = firings recorded after the last record that reset it (routine or requalification),
//                           or, with no such record, the baseline carried at registration + all firings recorded
//   since requalification = the same with requalification records only.
// A reset sets the counter to the firings recorded after the record's performed-at time (server/utils/services.ts),
// so "after" means fired after that time.

/** What the database holds about one vessel, counted in one snapshot (scripts/reconcile.ts). */
export interface VesselCounts {
  id: string
  name: string
  firingsTotal: number
  firingsTotalAtRegistration: number
  firingsSinceService: number
  firingsSinceRequalification: number
  /** All firings recorded for the vessel. */
  firings: number
  /** The counters entered when the vessel was registered (its registration audit row), or null if unknown. */
  registered: { firingsSinceService: number, firingsSinceRequalification: number } | null
  /** The last record that reset the service counter (routine or requalification), with the firings after it. */
  lastServiceReset: { at: string, kind: string, firingsAfter: number } | null
  /** The last requalification that reset both counters, with the firings after it. */
  lastRequalificationReset: { at: string, firingsAfter: number } | null
  /** Passing service or requalification records loaded as history, which reset nothing (shown as a note). */
  historyRecords?: number
}

export type Counter = 'lifetime' | 'since-service' | 'since-requalification'

export interface CounterCheck {
  counter: Counter
  /** The counter on the vessel row. */
  recorded: number
  /** What the firings say it must be; null when it cannot be derived (then it is not compared). */
  expected: number | null
  basis: string
}

export interface VesselReconciliation {
  id: string
  name: string
  checks: CounterCheck[]
  mismatches: CounterCheck[]
  notes: string[]
}

export interface Reconciliation {
  vessels: VesselReconciliation[]
  mismatched: VesselReconciliation[]
  ok: boolean
}

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`

/** The three counter checks of one vessel and, where a counter cannot be derived, a note that says why. */
export function reconcileVessel(v: VesselCounts): VesselReconciliation {
  const notes: string[] = []
  const checks: CounterCheck[] = [{
    counter: 'lifetime',
    recorded: v.firingsTotal,
    expected: v.firingsTotalAtRegistration + v.firings,
    basis: `${v.firingsTotalAtRegistration} at registration + ${plural(v.firings, 'firing')} recorded`,
  }]

  if (v.lastServiceReset) {
    checks.push({ counter: 'since-service', recorded: v.firingsSinceService, expected: v.lastServiceReset.firingsAfter, basis: `${plural(v.lastServiceReset.firingsAfter, 'firing')} after the ${v.lastServiceReset.kind} of ${v.lastServiceReset.at}` })
  }
  else if (v.registered) {
    checks.push({ counter: 'since-service', recorded: v.firingsSinceService, expected: v.registered.firingsSinceService + v.firings, basis: `${v.registered.firingsSinceService} at registration + ${plural(v.firings, 'firing')} recorded` })
  }
  else {
    checks.push({ counter: 'since-service', recorded: v.firingsSinceService, expected: null, basis: 'no service record and no registration record' })
    notes.push('no service record and no registration record: the since-service counter carries an unknown baseline, so only the lifetime counter is compared')
  }

  if (v.lastRequalificationReset) {
    checks.push({ counter: 'since-requalification', recorded: v.firingsSinceRequalification, expected: v.lastRequalificationReset.firingsAfter, basis: `${plural(v.lastRequalificationReset.firingsAfter, 'firing')} after the requalification of ${v.lastRequalificationReset.at}` })
  }
  else if (v.registered) {
    checks.push({ counter: 'since-requalification', recorded: v.firingsSinceRequalification, expected: v.registered.firingsSinceRequalification + v.firings, basis: `${v.registered.firingsSinceRequalification} at registration + ${plural(v.firings, 'firing')} recorded` })
  }
  else {
    checks.push({ counter: 'since-requalification', recorded: v.firingsSinceRequalification, expected: null, basis: 'no requalification record and no registration record' })
    notes.push('no requalification record and no registration record: the since-requalification counter carries an unknown baseline, so only the lifetime counter is compared')
  }

  if (v.historyRecords) {
    notes.push(`${plural(v.historyRecords, 'service record')} loaded as history without resetting the counters (no counters in ${v.historyRecords === 1 ? 'its' : 'their'} audit row), so not counted as a reset`)
  }
  const mismatches = checks.filter(c => c.expected !== null && c.expected !== c.recorded)
  return { id: v.id, name: v.name, checks, mismatches, notes }
}

export function reconcile(vessels: VesselCounts[]): Reconciliation {
  const rows = vessels.map(reconcileVessel)
  const mismatched = rows.filter(r => r.mismatches.length > 0)
  return { vessels: rows, mismatched, ok: mismatched.length === 0 }
}

/** The report as the lab reads it: one line when all is well, else a table of every counter that disagrees. */
export function formatReconciliation(r: Reconciliation): string {
  const lines: string[] = []
  const noted = r.vessels.filter(v => v.notes.length)
  if (r.ok) {
    lines.push(`all ${plural(r.vessels.length, 'vessel')} reconcile: every counter equals the firings recorded`)
  }
  else {
    lines.push(`${plural(r.mismatched.length, 'vessel')} of ${r.vessels.length} ${r.mismatched.length === 1 ? 'does' : 'do'} not reconcile:`, '')
    const table = [['vessel', 'counter', 'recorded', 'expected', 'difference', 'expected from']]
    for (const v of r.mismatched) {
      for (const c of v.mismatches) table.push([v.name, c.counter, String(c.recorded), String(c.expected), `${c.recorded - c.expected! > 0 ? '+' : ''}${c.recorded - c.expected!}`, c.basis])
    }
    const widths = table[0]!.map((_, i) => Math.max(...table.map(row => row[i]!.length)))
    const numeric = new Set([2, 3, 4])
    for (const [i, row] of table.entries()) {
      lines.push(row.map((cell, j) => (numeric.has(j) && i > 0 ? cell.padStart(widths[j]!) : cell.padEnd(widths[j]!))).join('  ').trimEnd())
      if (i === 0) lines.push(widths.map(w => '─'.repeat(w)).join('  '))
    }
  }
  if (noted.length) {
    lines.push('', 'notes:')
    for (const v of noted) for (const n of v.notes) lines.push(`  ${v.name}: ${n}`)
  }
  return lines.join('\n')
}
