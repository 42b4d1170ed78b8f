// npm run reconcile: proves, read-only, that every vessel's firing counters equal the firings recorded
// (shared/reconcile.ts says how). Exit 0: "all N vessels reconcile"; exit 1: a table of every counter that disagrees.
//   --json   the full report as JSON (every vessel, every check) instead of the table
// Reads NUXT_DATABASE_URL (scripts/reconcile.sh sets it up like npm start does).
import pg from 'pg'
import { formatReconciliation, reconcile, type VesselCounts } from '../shared/reconcile'

const url = process.env.NUXT_DATABASE_URL
if (!url) throw new Error('NUXT_DATABASE_URL is not set')
const json = process.argv.includes('--json')

// A reset is a routine service that passed its checks or a passing requalification, not a correction
// (shared/domain/vessel-lifecycle.ts: serviceEffect, correctionEffect), recorded through the app: its audit row carries the
// vessel's counters after it. Records loaded as history without that row did not reset anything.
const QUERY = `
with resets as (
  select s.id, s.vessel_id, s.kind, s.performed_at, s.created_at,
         exists (
           select 1 from audit_log a
           where a.entity = 'vessel' and a.entity_id = s.vessel_id::text and a.action = 'service.' || s.kind
             and a.new_values -> 'service' ->> 'id' = s.id::text and a.new_values ? 'vessel'
         ) as applied
  from services s
  where s.corrects_id is null
    and ((s.kind = 'routine' and s.record -> 'effect' ->> 'checksPassed' = 'true')
      or (s.kind = 'requalification' and s.record ->> 'passed' = 'true'))
)
select v.id, v.name, v.firings_total, v.firings_total_at_registration, v.firings_since_service, v.firings_since_requalification,
       (select count(*) from firings f where f.vessel_id = v.id)::int as firings,
       reg.new_values as registered,
       ls.kind as ls_kind, ls.performed_at as ls_at,
       (select count(*) from firings f where f.vessel_id = v.id and f.fired_at > ls.performed_at)::int as ls_after,
       lr.performed_at as lr_at,
       (select count(*) from firings f where f.vessel_id = v.id and f.fired_at > lr.performed_at)::int as lr_after,
       (select count(*) from resets r where r.vessel_id = v.id and not r.applied)::int as history
from vessels v
left join lateral (
  select a.new_values from audit_log a
  where a.entity = 'vessel' and a.entity_id = v.id::text and a.action = 'vessel.register' order by a.at limit 1
) reg on true
left join lateral (
  select r.kind, r.performed_at from resets r where r.vessel_id = v.id and r.applied order by r.created_at desc limit 1
) ls on true
left join lateral (
  select r.performed_at from resets r where r.vessel_id = v.id and r.applied and r.kind = 'requalification' order by r.created_at desc limit 1
) lr on true
order by v.name`

interface Row {
  id: string, name: string, firings_total: number, firings_total_at_registration: number
  firings_since_service: number, firings_since_requalification: number, firings: number
  registered: Record<string, unknown> | null
  ls_kind: string | null, ls_at: Date | null, ls_after: number
  lr_at: Date | null, lr_after: number, history: number
}

const num = (x: unknown) => (typeof x === 'number' && Number.isInteger(x) && x >= 0 ? x : null)

function toCounts(r: Row): VesselCounts {
  const s = num(r.registered?.firingsSinceService)
  const q = num(r.registered?.firingsSinceRequalification)
  return {
    id: r.id,
    name: r.name,
    firingsTotal: r.firings_total,
    firingsTotalAtRegistration: r.firings_total_at_registration,
    firingsSinceService: r.firings_since_service,
    firingsSinceRequalification: r.firings_since_requalification,
    firings: r.firings,
    registered: s !== null && q !== null ? { firingsSinceService: s, firingsSinceRequalification: q } : null,
    lastServiceReset: r.ls_at ? { at: r.ls_at.toISOString(), kind: r.ls_kind === 'requalification' ? 'requalification' : 'routine service', firingsAfter: r.ls_after } : null,
    lastRequalificationReset: r.lr_at ? { at: r.lr_at.toISOString(), firingsAfter: r.lr_after } : null,
    historyRecords: r.history,
  }
}

const client = new pg.Client({ connectionString: url, application_name: 'emberline-reconcile' })
await client.connect()
let rows: Row[]
try {
  // One snapshot for every count, and nothing can be written through this connection.
  await client.query('begin isolation level repeatable read read only')
  rows = (await client.query<Row>(QUERY)).rows
  await client.query('commit')
}
finally {
  await client.end()
}

const report = reconcile(rows.map(toCounts))
console.log(json ? JSON.stringify(report, null, 2) : formatReconciliation(report))
process.exitCode = report.ok ? 0 : 1
