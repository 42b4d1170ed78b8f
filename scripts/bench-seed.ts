// npm run bench, step 1 (after scripts/seed.ts): loads NUXT_DATABASE_URL with a large lab in a few set-based SQL
// statements — 50 vessels, 1,000 plans of 100 fired runs (100,000 firings, 2,000 per vessel, counters consistent:
// firings_total = firings_total_at_registration + firings recorded), 20,000 materials and 200,000 audit rows.
// All names and figures are invented load data. Run once per fresh bench database.
import pg from 'pg'
import { assessCharge, type ChargeInput } from '../shared/domain/assessment'
import { DEFAULT_POLICY } from '../shared/domain/policy'

const url = process.env.NUXT_DATABASE_URL
if (!url) throw new Error('NUXT_DATABASE_URL is not set')
const log = (text: string) => process.stderr.write(`› ${text}\n`)

// 0.8 g of a sample declared at 26 454 J/g on 10 cm Ni-Cr fuse at 3.0 MPa in a 33 kJ, 300 mL vessel: a clear charge.
const charge: ChargeInput = {
  vessel: { ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4.05, volumeMl: 300, class: 'standard', name: 'load' },
  fillPressureMPa: 3.0,
  components: [{ role: 'sample', massG: 0.8, heatingValueJPerG: 26454, name: 'load sample' }, { role: 'fuse', wire: 'nichrome', lengthCm: 10 }],
}
const components = [{ role: 'sample', name: 'load sample', massG: 0.8, heatingValueJPerG: 26454 }, { role: 'fuse', wire: 'nichrome', lengthCm: 10 }]
const assessment = assessCharge(charge, DEFAULT_POLICY)

async function main() {
  const client = new pg.Client({ connectionString: url })
  await client.connect()
  const step = async (what: string, sql: string, params: unknown[] = []) => {
    const t0 = Date.now()
    const res = await client.query(sql, params)
    log(`${what}: ${res.rowCount ?? 0} rows in ${((Date.now() - t0) / 1000).toFixed(1)} s`)
  }
  const { rows: [analyst] } = await client.query(`select id, name from users where email = 'analyst@emberline.test'`)
  if (!analyst) throw new Error('run scripts/seed.ts first (no analyst@emberline.test)')
  const { rows: [done] } = await client.query(`select count(*)::int as n from vessels where name like 'Load %'`)
  if (done.n > 0) {
    log('the large lab is already loaded')
    await client.end()
    return
  }
  await client.query('begin')
  await step('vessels', `insert into vessels (name, serial_number, class, rated_energy_j, max_charge_mass_g, max_fill_pressure_mpa, volume_ml,
      proof_charge_mass_g, proof_charge_heating_value_j_per_g, proof_charge_fill_pressure_mpa, service_interval_firings, service_interval_days,
      requalification_interval_firings, location, firings_total_at_registration, firings_total, firings_since_service, firings_since_requalification,
      last_serviced_at, last_requalified_at, registered_at)
    select 'Load ' || lpad(g::text, 2, '0'), 'LOAD-SN-' || g, 'standard', 33000, 1.5, 4.05, 300, 1.0, 26454, 3.0, 100000, 3650, 1000000,
      'Load bench ' || (g % 5 + 1), 500, 2500, 2000, 2000, now() - interval '400 days', now() - interval '400 days', now() - interval '400 days'
    from generate_series(1, 50) g`)
  await step('plans', `insert into plans (name, vessel_id, fill_pressure_mpa, created_by, submitted_at, created_at)
    select 'Load plan ' || g, v.id, 3.0, $1, now() - (g || ' hours')::interval, now() - (g || ' hours')::interval
    from generate_series(1, 1000) g
    join (select id, row_number() over (order by name) as n from vessels where name like 'Load %') v on v.n = (g - 1) % 50 + 1`, [analyst.id])
  await step('runs', `insert into runs (plan_id, seq, sample_code, kind, vessel_id, fill_pressure_mpa, components, assessment, verdict, charge_hash, status, planned_by, created_at)
    select p.id, s, 'L' || p.n || '-' || s, 'sample', p.vessel_id, 3.0, $1::jsonb, $2::jsonb, $3, md5(p.id::text || s), 'fired', $4, p.created_at
    from (select id, vessel_id, created_at, row_number() over (order by name) as n from plans where name like 'Load plan %') p
    cross join generate_series(1, 100) s`, [JSON.stringify(components), JSON.stringify(assessment), assessment.verdict, analyst.id])
  await step('firings', `insert into firings (run_id, vessel_id, idempotency_key, outcome, weighed_mass_g, data, answer, fired_by, fired_at)
    select r.id, r.vessel_id, 'load-' || r.id, 'complete', 0.8, '{"observations": ""}'::jsonb, '{}'::jsonb, $1, r.created_at + (r.seq || ' minutes')::interval
    from runs r join plans p on p.id = r.plan_id where p.name like 'Load plan %'`, [analyst.id])
  await step('materials', `insert into materials (name, category, heating_value_j_per_g, heating_value_source, declared_hazard, notes)
    select 'Load material ' || lpad(g::text, 5, '0'), (array['coal', 'biomass', 'liquid fuel', 'waste fuel', 'food'])[g % 5 + 1], 15000 + (g % 300) * 100,
      'declared by the client (load data)', 'none', ''
    from generate_series(1, 20000) g`)
  await step('audit rows', `insert into audit_log (at, actor_id, actor_name, action, entity, entity_id, new_values, request_id)
    select now() - (g || ' minutes')::interval, $1, $2, (array['run.fire', 'run.submit', 'run.create', 'material.update', 'vessel.update'])[g % 5 + 1],
      (array['run', 'run', 'run', 'material', 'vessel'])[g % 5 + 1], md5(g::text), jsonb_build_object('load', g), 'load-' || g
    from generate_series(1, 200000) g`, [analyst.id, analyst.name])
  await client.query('commit')
  await step('analyze', 'analyze')
  await client.end()
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message : error)
  process.exit(1)
})
