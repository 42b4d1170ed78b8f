// Loads the demo lab's bench history into NUXT_DATABASE_URL (after scripts/seed.ts): a benzoic-acid standardisation
// series and an accepted energy equivalent for KR-1 Aster and KR-2 Birch, and fired sample runs with results —
// one duplicate pair in agreement (signed off), one out of limit. Every firing is inserted together with the
// increment of its vessel's counters, so firings_total = firings_total_at_registration + count(firings) still holds.
// Idempotent: a second run finds its plans and adds nothing. All figures are invented for the demo.
import { createHash, randomUUID } from 'node:crypto'
import { readFileSync } from 'node:fs'
import { and, eq, inArray, sql } from 'drizzle-orm'
import { drizzle } from 'drizzle-orm/node-postgres'
import pg from 'pg'
import * as schema from '../server/database/schema'
import { resultHash } from '../server/utils/results'
import { assess, resolveComponents, type ChargeComponentInput } from '../shared/domain/assessment'
import { DEFAULT_POLICY, labPolicySchema } from '../shared/domain/policy'
import { computeResultValues, mean, seriesStatistics } from '../shared/domain/results'
import type { ResultInputs } from '../shared/schemas/results'
import { computeVesselState } from '../shared/domain/vessel-state'
import { componentFromMaterial } from '../shared/material-component'
import type { RunComponent } from '../shared/schemas/plans'

const url = process.env.NUXT_DATABASE_URL
if (!url) throw new Error('NUXT_DATABASE_URL is not set')
const pool = new pg.Pool({ connectionString: url, max: 2 })
const db = drizzle(pool, { schema })
type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0]

const MARK = '(bench demo)'
const HOUR = 3_600_000
const BA_MATERIAL = 'Benzoic acid, calorimetric standard'
const FUSE: RunComponent = { role: 'fuse', wire: 'nichrome', lengthCm: 10 }

interface DemoRun {
  sampleCode: string
  kind: 'sample' | 'standardisation'
  material: string
  massG: number
  /** Target: ε of a standardisation run (J/K), or gross as determined of a sample (J/g); θ is worked back from it. */
  target: number
  inputs?: Partial<ResultInputs>
  hoursAgo: number
  thermogramFile?: string
  /** Cleared and waiting on the bench: not fired yet. */
  ready?: true
}

// Invented series around ε ≈ 10 000 J/K (RSD about 0.04 %), and invented sample figures.
const PLAN: Record<string, { vessel: string, runs: DemoRun[], signSamples: string[] }> = {
  [`Standardisation and coal KR-1 ${MARK}`]: {
    vessel: 'KR-1 Aster',
    signSamples: ['KRC-2611-A'],
    runs: [
      ...[10_012.4, 10_006.9, 10_015.8, 10_009.3, 10_011.0].map((eps, i) => ({ sampleCode: `STD-A-26${11 + i}`, kind: 'standardisation' as const, material: BA_MATERIAL, massG: [1.0012, 0.9987, 1.0034, 0.9969, 1.0008][i]!, target: eps, hoursAgo: 120 - i * 3 })),
      { sampleCode: 'KRC-2611-A', kind: 'sample', material: 'Client coal KRC-2611 (bituminous blend)', massG: 0.9512, target: 27_884, hoursAgo: 50, inputs: { moistureAdPct: 1.8, moistureArPct: 6.4, sulfurPct: 0.88 } },
      { sampleCode: 'KRC-2611-A', kind: 'sample', material: 'Client coal KRC-2611 (bituminous blend)', massG: 0.9487, target: 27_935, hoursAgo: 49, inputs: { moistureAdPct: 1.8, moistureArPct: 6.4, sulfurPct: 0.88 } },
    ],
  },
  [`Standardisation and pellets KR-2 ${MARK}`]: {
    vessel: 'KR-2 Birch',
    signSamples: [],
    runs: [
      ...[9_987.2, 9_991.5, 9_983.9, 9_989.8, 9_986.1].map((eps, i) => ({ sampleCode: `STD-B-26${11 + i}`, kind: 'standardisation' as const, material: BA_MATERIAL, massG: [0.9959, 1.0021, 1.0006, 0.9978, 1.0015][i]!, target: eps, hoursAgo: 110 - i * 3, thermogramFile: i === 0 ? 'data/thermogram-template.csv' : undefined })),
      { sampleCode: 'P-44-B', kind: 'sample', material: 'Pine pellets lot P-44', massG: 1.0104, target: 19_852, hoursAgo: 30, inputs: { moistureAdPct: 6.9, moistureArPct: 7.5 } },
      { sampleCode: 'P-44-B', kind: 'sample', material: 'Pine pellets lot P-44', massG: 1.0066, target: 20_013, hoursAgo: 29, inputs: { moistureAdPct: 6.9, moistureArPct: 7.5 } },
    ],
  },
  [`Coal batch KR-1 ${MARK}`]: {
    vessel: 'KR-1 Aster',
    signSamples: [],
    runs: ['KRC-2612-A', 'KRC-2612-A', 'KRC-2612-B'].map((code, i) => ({ sampleCode: code, kind: 'sample' as const, material: 'Client coal KRC-2611 (bituminous blend)', massG: 0.95, target: 0, hoursAgo: 3 - i, ready: true as const })),
  },
  [`Standardisation after service KR-3 ${MARK}`]: {
    vessel: 'KR-3 Cedar',
    signSamples: [],
    runs: [0, 1, 2, 3, 4].map(i => ({ sampleCode: `STD-C-26${21 + i}`, kind: 'standardisation' as const, material: BA_MATERIAL, massG: 1.0, target: 0, hoursAgo: 2, ready: true as const })),
  },
}

/** Same binding as server/utils/runs.ts chargeHash: the charge and its assessment. */
function chargeHash(vesselId: string, fill: number, components: RunComponent[], a: Awaited<ReturnType<typeof assess>>) {
  return createHash('sha256').update(JSON.stringify({ vesselId, fillPressureMPa: fill, components, verdict: a.verdict, findings: a.findings.map(f => [f.code, f.severity, f.message]) })).digest('hex')
}

async function seedPlan(tx: Tx, name: string, spec: typeof PLAN[string], policy: typeof DEFAULT_POLICY, users: Record<string, { id: string, name: string }>) {
  const [vessel] = await tx.select().from(schema.vessels).where(eq(schema.vessels.name, spec.vessel)).for('update')
  if (!vessel) throw new Error(`vessel ${spec.vessel} is missing: run scripts/seed.ts first`)
  const materials = await tx.select().from(schema.materials).where(inArray(schema.materials.name, [...new Set(spec.runs.map(r => r.material))]))
  const byName = new Map(materials.map(m => [m.name, m]))
  const analyst = users.analyst!
  const supervisor = users.supervisor!
  const fill = policy.defaultFillPressureMPa
  const [plan] = await tx.insert(schema.plans).values({ name, vesselId: vessel.id, fillPressureMPa: fill, createdBy: analyst.id, submittedAt: new Date(Date.now() - (Math.max(...spec.runs.map(r => r.hoursAgo)) + 3) * HOUR) }).returning()
  await tx.insert(schema.auditLog).values({ action: 'plan.create', entity: 'plan', entityId: plan!.id, actorId: analyst.id, actorName: analyst.name, newValues: plan!, reason: 'demo bench loaded' })

  const standardisationIds: string[] = []
  const energies: number[] = []
  const sampleResults: { id: string, code: string }[] = []
  let energyEquivalent: typeof schema.energyEquivalents.$inferSelect | null = null
  for (const [i, r] of spec.runs.entries()) {
    const material = byName.get(r.material)
    if (!material) throw new Error(`material ${r.material} is missing: run scripts/seed.ts first`)
    const components: RunComponent[] = [{ role: 'sample', materialId: material.id, massG: r.massG }, FUSE]
    const charge: ChargeComponentInput[] = [componentFromMaterial(material, { massG: r.massG }, 'sample'), { role: 'fuse', wire: 'nichrome', lengthCm: 10 }]
    const state = computeVesselState({ ...vessel, now: new Date(), dueMarginPct: policy.serviceDueMarginPct })
    const vesselInput = { name: vessel.name, class: vessel.class, ratedEnergyJ: vessel.ratedEnergyJ, maxChargeMassG: vessel.maxChargeMassG, maxFillPressureMPa: vessel.maxFillPressureMPa, volumeMl: vessel.volumeMl, proofCharge: { massG: vessel.proofChargeMassG, heatingValueJPerG: vessel.proofChargeHeatingValueJPerG, fillPressureMPa: vessel.proofChargeFillPressureMPa }, state: state.state }
    const assessment = await assess({ vessel: vesselInput, fillPressureMPa: fill, components: charge, runRole: r.kind }, policy)
    if (assessment.verdict !== 'clear') throw new Error(`demo run ${r.sampleCode} is ${assessment.verdict}: ${assessment.findings.map(f => f.message).join(' ')}`)
    const firedAt = new Date(Date.now() - r.hoursAgo * HOUR)
    const [run] = await tx.insert(schema.runs).values({
      planId: plan!.id, seq: i + 1, sampleCode: r.sampleCode, kind: r.kind, vesselId: vessel.id, fillPressureMPa: fill, components, assessment,
      verdict: assessment.verdict, chargeHash: chargeHash(vessel.id, fill, components, assessment), status: r.ready ? 'ready' : 'fired', plannedBy: analyst.id, createdAt: new Date(firedAt.getTime() - 2 * HOUR), updatedAt: firedAt,
    }).returning()
    await tx.insert(schema.auditLog).values({ action: 'run.submit', entity: 'run', entityId: run!.id, actorId: analyst.id, actorName: analyst.name, newValues: { status: 'ready', verdict: assessment.verdict }, reason: 'demo bench loaded' })
    if (r.ready) continue

    // The firing and its count, together: the database adds one to each counter.
    const firingId = randomUUID()
    const [counted] = await tx.update(schema.vessels).set({
      firingsSinceService: sql`${schema.vessels.firingsSinceService} + 1`,
      firingsSinceRequalification: sql`${schema.vessels.firingsSinceRequalification} + 1`,
      firingsTotal: sql`${schema.vessels.firingsTotal} + 1`,
      updatedAt: new Date(),
    }).where(eq(schema.vessels.id, vessel.id)).returning()
    const answer = { id: firingId, runId: run!.id, vesselId: vessel.id, sampleCode: r.sampleCode, kind: r.kind, outcome: 'complete' as const, weighedMassG: r.massG, aidMassG: null, observations: '', firedAt: firedAt.toISOString(), firedBy: analyst, run: { id: run!.id, status: 'fired' as const }, lockedOut: false, message: 'Firing recorded (demo data).', vessel: { id: vessel.id, name: vessel.name, state: state.state, condition: vessel.condition, conditionReason: vessel.conditionReason, stateReasons: state.reasons, blocksAllFirings: state.blocksAllFirings, blocksSampleRuns: state.blocksSampleRuns, firingsSinceService: counted!.firingsSinceService, firingsSinceRequalification: counted!.firingsSinceRequalification, firingsTotal: counted!.firingsTotal } }
    await tx.insert(schema.firings).values({
      id: firingId, runId: run!.id, vesselId: vessel.id, idempotencyKey: `seed-bench:${r.sampleCode}:${i}:${plan!.id}`, outcome: 'complete', weighedMassG: r.massG,
      data: { requestHash: 'seed-bench', aidMassG: null, observations: '', components, plannedComponents: components, verdictAtFiring: assessment.verdict, findingsAtFiring: assessment.findings.map(f => f.code) },
      answer, firedBy: analyst.id, firedAt,
    })
    await tx.insert(schema.auditLog).values({ action: 'run.fire', entity: 'run', entityId: run!.id, actorId: analyst.id, actorName: analyst.name, at: firedAt, oldValues: { status: 'ready' }, newValues: { status: 'fired', firingId, outcome: 'complete', vesselId: vessel.id, vessel: { firingsTotal: counted!.firingsTotal } }, reason: 'demo bench loaded' })

    // θ worked back from the target: ε·θ = m·q + corrections (ASTM D240 §8 / D5865, rearranged).
    const resolved = await resolveComponents(charge)
    const fuseJ = 10 * policy.fuseWireJPerCm.nichrome
    const acid = { titrantMl: r.kind === 'standardisation' ? 6.8 : 9.4, titrantJPerMl: 4.33 }
    const acidJ = acid.titrantMl * acid.titrantJPerMl
    const bias = r.kind === 'sample' ? 57.5 * (r.inputs?.sulfurPct ?? 0) * r.massG : 0
    const baseInputs: ResultInputs = { fuse: { wire: 'nichrome', burntLengthCm: 10 }, acid, note: '', ...r.inputs }
    let inputs: ResultInputs
    if (r.kind === 'standardisation') {
      const theta = (r.massG * material.heatingValueJPerG! + fuseJ + acidJ) / r.target
      inputs = r.thermogramFile ? { ...baseInputs, thermogram: { csv: readFileSync(r.thermogramFile, 'utf8'), fileName: 'thermogram-template.csv', method: 'regnault-pfaundler' } } : { ...baseInputs, temperatureRiseK: Number(theta.toFixed(5)) }
    }
    else {
      const theta = (r.massG * r.target + fuseJ + acidJ + bias) / energyEquivalent!.valueJPerK
      inputs = { ...baseInputs, temperatureRiseK: Number(theta.toFixed(5)) }
    }
    const values = computeResultValues(inputs, { kind: r.kind, weighedMassG: r.massG, components: resolved, energyEquivalent: r.kind === 'sample' ? energyEquivalent : null, aid: null, cotton: null, policy })
    const [result] = await tx.insert(schema.results).values({
      runId: run!.id, firingId, vesselId: vessel.id, sampleCode: r.sampleCode, kind: r.kind, revision: 1, current: true, inputs, values,
      energyEquivalentId: r.kind === 'sample' ? energyEquivalent!.id : null, status: 'unsigned', createdBy: analyst.id, createdAt: new Date(firedAt.getTime() + HOUR),
    }).returning()
    await tx.insert(schema.auditLog).values({ action: 'result.create', entity: 'result', entityId: result!.id, actorId: analyst.id, actorName: analyst.name, newValues: { runId: run!.id, sampleCode: r.sampleCode, kind: r.kind, grossJPerG: values.grossJPerG, energyEquivalentJPerK: values.energyEquivalentJPerK }, reason: 'demo bench loaded' })

    if (r.kind === 'standardisation') {
      standardisationIds.push(result!.id)
      energies.push(values.energyEquivalentJPerK!)
      // The series is accepted once complete, before the samples are worked out with it.
      if (standardisationIds.length === policy.standardisationRuns) {
        const stats = seriesStatistics(energies, { minRuns: policy.standardisationRuns, maxRsdPct: policy.standardisationMaxRsdPct })
        if (!stats.accepted) throw new Error(`demo series for ${vessel.name} not acceptable: ${stats.reason}`)
        await tx.update(schema.energyEquivalents).set({ active: false }).where(and(eq(schema.energyEquivalents.vesselId, vessel.id), eq(schema.energyEquivalents.active, true)))
        const [ee] = await tx.insert(schema.energyEquivalents).values({
          vesselId: vessel.id, valueJPerK: stats.mean!, standardDeviationJPerK: stats.standardDeviation!, relativeStandardDeviationPct: stats.relativeStandardDeviationPct!, runs: stats.n,
          resultIds: standardisationIds, meanEnergyJ: mean(spec.runs.slice(0, stats.n).map(x => x.massG * 26_454)), acceptedBy: supervisor.id, acceptedAt: new Date(firedAt.getTime() + 2 * HOUR), active: true,
        }).returning()
        energyEquivalent = ee!
        await tx.insert(schema.signatures).values({ entity: 'energy-equivalent', entityId: ee!.id, signerId: supervisor.id, signerName: supervisor.name, meaning: 'standardisation series accepted', reason: 'Demo series: five runs within the RSD limit.', boundHash: 'seed-bench', signedAt: ee!.acceptedAt })
        await tx.insert(schema.auditLog).values({ action: 'energy-equivalent.accept', entity: 'vessel', entityId: vessel.id, actorId: supervisor.id, actorName: supervisor.name, newValues: { energyEquivalentId: ee!.id, valueJPerK: stats.mean, runs: stats.n }, reason: 'demo bench loaded' })
      }
    }
    else if (spec.signSamples.includes(r.sampleCode)) sampleResults.push({ id: result!.id, code: r.sampleCode })
  }
  for (const s of sampleResults) {
    const [row] = await tx.select().from(schema.results).where(eq(schema.results.id, s.id))
    const [sig] = await tx.insert(schema.signatures).values({ entity: 'result', entityId: s.id, signerId: supervisor.id, signerName: supervisor.name, meaning: 'result signed off', reason: 'Duplicates agree; corrections checked.', boundHash: resultHash(row!) }).returning()
    await tx.update(schema.results).set({ status: 'signed', signatureId: sig!.id }).where(eq(schema.results.id, s.id))
    await tx.insert(schema.auditLog).values({ action: 'result.sign', entity: 'result', entityId: s.id, actorId: supervisor.id, actorName: supervisor.name, newValues: { status: 'signed', signatureId: sig!.id }, reason: 'demo bench loaded' })
  }
}

await db.transaction(async (tx) => {
  const existing = await tx.select({ name: schema.plans.name }).from(schema.plans).where(inArray(schema.plans.name, Object.keys(PLAN)))
  if (existing.length) {
    console.log('bench demo already loaded')
    return
  }
  const [settings] = await tx.select().from(schema.labSettings).where(eq(schema.labSettings.id, 1))
  const policy = labPolicySchema.parse({ ...DEFAULT_POLICY, ...(settings?.policy as object | null) })
  const people = await tx.select({ id: schema.users.id, name: schema.users.name, email: schema.users.email }).from(schema.users)
    .where(inArray(schema.users.email, ['analyst@emberline.test', 'supervisor@emberline.test']))
  const users = Object.fromEntries(people.map(p => [p.email.split('@')[0]!, { id: p.id, name: p.name }]))
  if (!users.analyst || !users.supervisor) throw new Error('the demo users are missing: run scripts/seed.ts first')
  for (const [name, spec] of Object.entries(PLAN)) await seedPlan(tx, name, spec, policy, users)
  console.log('bench demo loaded')
})
await pool.end()
