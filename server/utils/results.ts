// Results of fired runs (issue 5): inputs → gross and net calorific values, bases, uncertainty, ε of a
// standardisation run, agreement of a check run; revisions, sign-off and duplicate agreement.
import { createHash } from 'node:crypto'
import { and, asc, desc, eq, inArray } from 'drizzle-orm'
import type { SQL } from 'drizzle-orm'
import { z } from 'zod'
import { resolveComponents } from '../../shared/domain/assessment'
import type { ChargeComponentInput, ResolvedChemistry } from '../../shared/domain/assessment'
import { toDryBasis } from '../../shared/domain/composition'
import type { Composition } from '../../shared/domain/composition'
import type { LabPolicy } from '../../shared/domain/policy'
import {
  acidCorrectionFromTitrationJ, analyseThermogram, assessDuplicates, calorificValueUncertainty, convertBasis, energyEquivalent,
  fuseCorrectionJ, grossCalorificValue, median, mean, netCalorificValueConstantPressure, netCalorificValueConstantVolume,
  nitricAcidCorrectionJ, parseThermogramCsv, rectangularStandardUncertainty, standardUncertaintyOfMean, sulfurCorrectionJ,
} from '../../shared/domain/results'
import type { Basis, BasisConditions, CorrectionEstimate, DuplicateAssessment, UncertaintyBudget } from '../../shared/domain/results'
import type { RunComponent } from '../../shared/schemas/plans'
import { checkRunEffect } from '../../shared/domain/vessel-lifecycle'
import type { CertificateContent, CertificateRow } from './certificate'

export type ResultRow = typeof schema.results.$inferSelect
export type EnergyEquivalentRow = typeof schema.energyEquivalents.$inferSelect
export type ResultKind = 'sample' | 'standardisation' | 'check'

/** Standard uncertainty of a weighing on a four-place analytical balance, g (readability 0.1 mg; common practice). */
export const DEFAULT_U_MASS_G = 0.0001
/** Standard uncertainty of an entered corrected temperature rise, K (about 0.04 % of a 2.5 K rise; common practice). */
export const DEFAULT_U_THETA_K = 0.001
/** Relative standard uncertainty of the fuse, acid and sulfur corrections (10 %; common practice). */
export const DEFAULT_U_CORRECTION_REL = 0.1

const pct = (what: string) => z.number({ error: `${what} in mass-%` }).min(0, 'not negative').lt(100, 'below 100 %')

export const thermogramInputSchema = z.object({
  csv: z.string({ error: 'the thermogram as CSV text' }).min(1, 'the thermogram is empty').max(5_000_000, 'at most 5 MB of text'),
  fileName: z.string().trim().max(200).optional(),
  ignitionTimeS: z.number().min(0, 'not negative').optional(),
  mainPeriodEndTimeS: z.number().min(0, 'not negative').optional(),
  method: z.enum(['regnault-pfaundler', 'dickinson']).default('regnault-pfaundler'),
}).strict()

const resultFields = {
  temperatureRiseK: z.number({ error: 'the corrected temperature rise in K' }).positive('above 0 K').max(20, 'at most 20 K').optional(),
  thermogram: thermogramInputSchema.optional(),
  sampleMassG: z.number().positive('above 0 g').max(100, 'at most 100 g').optional(),
  fuse: z.object({
    wire: z.enum(['nichrome', 'iron', 'platinum', 'cotton']),
    burntLengthCm: z.number().min(0, 'not negative').max(100, 'at most 100 cm').optional(),
    cottonMassG: z.number().min(0, 'not negative').max(1, 'at most 1 g').optional(),
  }).strict().optional(),
  acid: z.object({
    titrantMl: z.number().min(0, 'not negative').max(500, 'at most 500 mL').optional(),
    titrantJPerMl: z.number().positive('above 0').max(100, 'at most 100 J/mL').optional(),
    nitricAcidMol: z.number().min(0, 'not negative').max(1, 'at most 1 mol').optional(),
  }).strict().optional(),
  sulfurPct: pct('sulfur of the analysis sample').optional(),
  aidMassG: z.number().min(0, 'not negative').max(20, 'at most 20 g').optional(),
  aidHeatingValueJPerG: z.number().positive('above 0').max(150_000).optional(),
  moistureAdPct: pct('moisture of the analysis sample').optional(),
  moistureArPct: pct('total moisture as received').optional(),
  hydrogenDryPct: pct('hydrogen, dry basis').optional(),
  oxygenDryPct: pct('oxygen, dry basis').optional(),
  nitrogenDryPct: pct('nitrogen, dry basis').optional(),
  ashDryPct: pct('ash, dry basis').optional(),
  certifiedValueJPerG: z.number().positive('above 0').max(100_000).optional(),
  uncertainty: z.object({
    temperatureRiseK: z.number().min(0).max(1).optional(),
    sampleMassG: z.number().min(0).max(1).optional(),
    fuseJ: z.number().min(0).max(10_000).optional(),
    acidJ: z.number().min(0).max(10_000).optional(),
    sulfurJ: z.number().min(0).max(10_000).optional(),
    aidJ: z.number().min(0).max(100_000).optional(),
  }).strict().optional(),
  note: z.string().trim().max(2000).default(''),
}

type RawInputs = z.output<z.ZodObject<typeof resultFields>>

function checkInputs(v: RawInputs, ctx: z.RefinementCtx) {
  if (v.temperatureRiseK === undefined && !v.thermogram) ctx.addIssue({ code: 'custom', path: ['temperatureRiseK'], message: 'give the corrected temperature rise or a thermogram' })
  if (v.temperatureRiseK !== undefined && v.thermogram) ctx.addIssue({ code: 'custom', path: ['temperatureRiseK'], message: 'give either the temperature rise or a thermogram, not both' })
  if (v.fuse?.wire === 'cotton' && v.fuse.cottonMassG === undefined) ctx.addIssue({ code: 'custom', path: ['fuse', 'cottonMassG'], message: 'the mass of cotton thread burnt' })
  if (v.fuse && v.fuse.wire !== 'cotton' && v.fuse.burntLengthCm === undefined) ctx.addIssue({ code: 'custom', path: ['fuse', 'burntLengthCm'], message: 'the length of wire burnt' })
  if (v.acid) {
    const titration = v.acid.titrantMl !== undefined || v.acid.titrantJPerMl !== undefined
    if (titration && v.acid.nitricAcidMol !== undefined) ctx.addIssue({ code: 'custom', path: ['acid'], message: 'give the titration or the nitric acid formed, not both' })
    if (titration && (v.acid.titrantMl === undefined || v.acid.titrantJPerMl === undefined)) {
      ctx.addIssue({ code: 'custom', path: ['acid', v.acid.titrantMl === undefined ? 'titrantMl' : 'titrantJPerMl'], message: 'the titration needs both the volume and the energy per mL' })
    }
  }
}

export const resultInputSchema = z.object(resultFields).strict().superRefine(checkInputs)
export type ResultInputs = z.output<typeof resultInputSchema>

export const resultReviseSchema = z.object({ ...resultFields, reason: z.string().trim().min(3, 'say why the result is revised').max(2000) }).strict().superRefine(checkInputs)

const blankToUndefined = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v)
/** Filters of the results list and its CSV export. */
export const resultListQuery = z.object({
  sampleCode: z.preprocess(blankToUndefined, z.string().trim().max(80).optional()),
  vesselId: z.preprocess(blankToUndefined, z.string().uuid('a vessel id (UUID)').optional()),
  kind: z.preprocess(blankToUndefined, z.enum(['sample', 'standardisation', 'check']).optional()),
  status: z.preprocess(blankToUndefined, z.enum(['unsigned', 'signed']).optional()),
  includeSuperseded: z.preprocess(blankToUndefined, z.enum(['0', '1']).default('0')),
  limit: z.coerce.number().int('a whole number').min(1).max(1000, 'at most 1000').default(200),
})

export function resultListWhere(q: z.output<typeof resultListQuery>) {
  const r = schema.results
  const where: SQL[] = []
  if (q.sampleCode) where.push(eq(r.sampleCode, q.sampleCode))
  if (q.vesselId) where.push(eq(r.vesselId, q.vesselId))
  if (q.kind) where.push(eq(r.kind, q.kind))
  if (q.status) where.push(eq(r.status, q.status))
  if (q.includeSuperseded === '0') where.push(eq(r.current, true))
  return and(...where)
}

export const resultIdParam = z.object({ id: z.string().uuid('a result id (UUID)') })

export interface NoteInput { label: string, value: number | string, unit: string }
export interface ResultNote { figure: string, formula: string, source: string, inputs: NoteInput[] }

export interface ThermogramSummary {
  method: 'regnault-pfaundler' | 'dickinson'
  fileName: string | null
  readings: number
  ignitionTimeS: number
  mainPeriodEndTimeS: number
  detected: { ignition: boolean, mainPeriodEnd: boolean }
  regnaultPfaundlerRiseK: number
  dickinsonRiseK: number
  coolingCorrectionK: number
  foreDriftKPerS: number
  afterDriftKPerS: number
}

type ByBasis = Partial<Record<Basis, number>>

export interface ResultValues {
  kind: ResultKind
  sampleMassG: number
  temperatureRiseK: number
  temperatureRiseSource: 'entered' | 'regnault-pfaundler' | 'dickinson'
  thermogram: ThermogramSummary | null
  corrections: { fuseJ: number, acidJ: number, sulfurJ: number, aidJ: number, sulfurPct: number, sulfurSource: string, aidMassG: number, aidHeatingValueJPerG: number | null }
  energyEquivalent: { id: string | null, valueJPerK: number, standardUncertaintyJPerK: number, acceptedAt: string | null } | null
  /** Standardisation runs: ε of this run and the energy released. */
  energyEquivalentJPerK: number | null
  energyReleasedJ: number | null
  certifiedValueJPerG: number | null
  /** Gross calorific value at constant volume by basis ('air-dried' = as determined), J/g. */
  grossJPerG: ByBasis
  netConstantPressureJPerG: ByBasis
  netConstantVolumeJPerG: ByBasis
  uncertainty: UncertaintyBudget | null
  check: { certifiedJPerG: number, deviationPct: number, tolerancePct: number, passed: boolean } | null
  analysis: { moistureAdPct: number | null, moistureArPct: number | null, hydrogenDryPct: number | null, oxygenDryPct: number | null, nitrogenDryPct: number | null, ashDryPct: number | null }
  missing: string[]
  notes: ResultNote[]
}

/** What the computation needs besides the analyst's inputs. */
export interface ResultContext {
  kind: ResultKind
  weighedMassG: number
  /** The charge as weighed at firing, materials filled in and formulas resolved. */
  components: (ChargeComponentInput & { resolved?: ResolvedChemistry })[]
  energyEquivalent: EnergyEquivalentRow | null
  aidUncertaintyJPerG: number | null
  policy: LabPolicy
}

export class ResultInputError extends Error {
  constructor(readonly path: string, message: string) { super(message) }
}

/** Analytical figures of the sample on the dry basis from its composition, where the inputs leave them out. */
function compositionDry(components: ResultContext['components']): Composition | null {
  const sample = components.find(c => c.role === 'sample')
  // A composition from a formula is complete: an element it does not hold is 0 %, not unknown.
  const comp = sample?.composition ?? (sample?.resolved ? { N: 0, S: 0, O: 0, H: 0, ash: 0, ...sample.resolved.composition } : undefined)
  if (!comp) return null
  try {
    return toDryBasis(comp)
  }
  catch {
    return null
  }
}

const round = (v: number, d: number) => Math.round(v * 10 ** d) / 10 ** d

/** The thermogram's corrected rise by the chosen method, with the period boundaries used. */
export function thermogramRise(t: NonNullable<ResultInputs['thermogram']>): { riseK: number, summary: ThermogramSummary } {
  const parsed = parseThermogramCsv(t.csv)
  if (!parsed.ok) {
    const shown = parsed.errors.slice(0, 8).map(e => (e.row === null ? e.message : `line ${e.row}: ${e.message}`))
    const more = parsed.errors.length > 8 ? ` (and ${parsed.errors.length - 8} more)` : ''
    throw new ResultInputError('thermogram.csv', `${shown.join('; ')}${more}`)
  }
  let analysis
  try {
    analysis = analyseThermogram(parsed.points, { ignitionTimeS: t.ignitionTimeS, mainPeriodEndTimeS: t.mainPeriodEndTimeS })
  }
  catch (err) {
    if (err instanceof RangeError) throw new ResultInputError('thermogram', err.message)
    throw err
  }
  if (!analysis.ok) throw new ResultInputError('thermogram', analysis.reason)
  const summary: ThermogramSummary = {
    method: t.method,
    fileName: t.fileName ?? null,
    readings: parsed.points.length,
    ignitionTimeS: analysis.periods.ignitionTimeS,
    mainPeriodEndTimeS: analysis.periods.mainPeriodEndTimeS,
    detected: analysis.periods.detected,
    regnaultPfaundlerRiseK: analysis.regnaultPfaundler.riseK,
    dickinsonRiseK: analysis.dickinson.riseK,
    coolingCorrectionK: analysis.regnaultPfaundler.coolingCorrectionK,
    foreDriftKPerS: analysis.regnaultPfaundler.foreDriftKPerS,
    afterDriftKPerS: analysis.regnaultPfaundler.afterDriftKPerS,
  }
  return { riseK: t.method === 'dickinson' ? summary.dickinsonRiseK : summary.regnaultPfaundlerRiseK, summary }
}

/** The whole computation of one result; throws a 422 naming the input when a figure is impossible. */
export function computeResult(inputs: ResultInputs, ctx: ResultContext): ResultValues {
  try {
    return computeResultValues(inputs, ctx)
  }
  catch (err) {
    if (err instanceof ResultInputError) invalidInput([{ path: err.path, message: err.message }])
    if (err instanceof RangeError) invalidInput([{ path: '(inputs)', message: err.message }])
    throw err
  }
}

/** The computation itself, free of the server: scripts/seed-bench.ts uses it too. Throws RangeError or ResultInputError. */
export function computeResultValues(inputs: ResultInputs, ctx: ResultContext): ResultValues {
  const { policy, kind } = ctx
  const notes: ResultNote[] = []
  const missing: string[] = []
  const mass = inputs.sampleMassG ?? ctx.weighedMassG

  // θ: entered, or from the thermogram (ISO 1928 / ASTM D5865 extrapolations).
  let theta: number
  let thermogram: ThermogramSummary | null = null
  let uTheta = inputs.uncertainty?.temperatureRiseK ?? DEFAULT_U_THETA_K
  if (inputs.thermogram) {
    const bytes = new TextEncoder().encode(inputs.thermogram.csv).length
    if (bytes > policy.uploadMaxBytes) throw new ResultInputError('thermogram.csv', `the thermogram is ${bytes} bytes; the lab accepts at most ${policy.uploadMaxBytes} bytes`)
    const t = thermogramRise(inputs.thermogram)
    theta = t.riseK
    thermogram = t.summary
    // The two extrapolations bound the method's own doubt: half their difference as a rectangular half-width (JCGM 100:2008 §4.3.7).
    if (inputs.uncertainty?.temperatureRiseK === undefined) {
      uTheta = Math.max(DEFAULT_U_THETA_K, rectangularStandardUncertainty(Math.abs(t.summary.regnaultPfaundlerRiseK - t.summary.dickinsonRiseK) / 2))
    }
    notes.push({
      figure: 'Corrected temperature rise θ',
      formula: t.summary.method === 'dickinson'
        ? 'θ = T_c − T_a − g_i(t_x − t_a) − g_f(t_c − t_x), t_x at 60 % of the observed rise'
        : 'θ = T_f − T_i − ∫ [g_i + (g_f − g_i)(T − T̄_i)/(T̄_f − T̄_i)] dt over the main period',
      source: t.summary.method === 'dickinson' ? 'Dickinson extrapolation, ASTM D5865 / ASTM D240' : 'Regnault–Pfaundler, ISO 1928; ASTM D5865',
      inputs: [
        { label: 'readings', value: t.summary.readings, unit: '' },
        { label: 'ignition (end of fore-period)', value: t.summary.ignitionTimeS, unit: 's' },
        { label: 'end of main period', value: t.summary.mainPeriodEndTimeS, unit: 's' },
        { label: 'fore-period drift', value: round(t.summary.foreDriftKPerS * 60, 6), unit: 'K/min' },
        { label: 'after-period drift', value: round(t.summary.afterDriftKPerS * 60, 6), unit: 'K/min' },
        { label: 'θ by Regnault–Pfaundler', value: round(t.summary.regnaultPfaundlerRiseK, 5), unit: 'K' },
        { label: 'θ by Dickinson', value: round(t.summary.dickinsonRiseK, 5), unit: 'K' },
      ],
    })
  }
  else {
    theta = inputs.temperatureRiseK!
  }

  // Fuse: the wire burnt × its J/cm, or the cotton thread's mass × J/g (policy values).
  const fuseInput = inputs.fuse ?? plannedFuse(ctx.components)
  let fuseJ = 0
  if (fuseInput) {
    if (fuseInput.wire === 'cotton') fuseJ = (fuseInput.cottonMassG ?? 0) * policy.cottonJPerG
    else fuseJ = fuseCorrectionJ(fuseInput.burntLengthCm ?? 0, policy.fuseWireJPerCm[fuseInput.wire])
    if (!inputs.fuse) missing.push('Burnt fuse length not entered: the planned length was used.')
  }
  else {
    missing.push('No fuse in the charge or the inputs: no fuse correction.')
  }

  // Acid: the washings titration (ASTM) or the nitric acid formed (ISO).
  let acidJ = 0
  if (inputs.acid?.nitricAcidMol !== undefined) acidJ = nitricAcidCorrectionJ(inputs.acid.nitricAcidMol)
  else if (inputs.acid?.titrantMl !== undefined && inputs.acid.titrantJPerMl !== undefined) acidJ = acidCorrectionFromTitrationJ(inputs.acid.titrantMl, inputs.acid.titrantJPerMl)
  else missing.push('No acid titration entered: the acid correction is 0 J.')

  // Analytical figures: entered, else the sample's composition (dry basis).
  const dry = compositionDry(ctx.components)
  const analysis = {
    moistureAdPct: inputs.moistureAdPct ?? null,
    moistureArPct: inputs.moistureArPct ?? null,
    hydrogenDryPct: inputs.hydrogenDryPct ?? dry?.H ?? null,
    oxygenDryPct: inputs.oxygenDryPct ?? dry?.O ?? null,
    nitrogenDryPct: inputs.nitrogenDryPct ?? dry?.N ?? null,
    ashDryPct: inputs.ashDryPct ?? dry?.ash ?? null,
  }

  // Sulfur (samples only; benzoic acid has none): measured on the analysis sample, else from the composition.
  let sulfurPct = 0
  let sulfurSource = 'none'
  if (kind === 'sample') {
    if (inputs.sulfurPct !== undefined) { sulfurPct = inputs.sulfurPct; sulfurSource = 'measured' }
    else if (dry?.S !== undefined) {
      sulfurPct = analysis.moistureAdPct !== null ? convertBasis(dry.S, 'dry', 'air-dried', { moistureAd: analysis.moistureAdPct }) : dry.S
      sulfurSource = analysis.moistureAdPct !== null ? 'sample composition (dry → analysis basis)' : 'sample composition (dry basis; no moisture given)'
    }
  }
  const sulfurJ = sulfurPct > 0 ? sulfurCorrectionJ(sulfurPct, mass) : 0

  // Aid: its weighed mass × its heating value (material, else the policy's benzoic acid value).
  const aid = ctx.components.find(c => c.role === 'aid')
  const aidMassG = inputs.aidMassG ?? ctx.components.filter(c => c.role === 'aid').reduce((a, c) => a + (c.massG ?? 0), 0)
  const aidHv = inputs.aidHeatingValueJPerG ?? aid?.heatingValueJPerG ?? (aidMassG > 0 ? policy.aidHeatingValueJPerG : null)
  const aidJ = aidMassG > 0 && aidHv ? aidMassG * aidHv : 0

  const u = inputs.uncertainty ?? {}
  const uMass = u.sampleMassG ?? DEFAULT_U_MASS_G
  const corrections: CorrectionEstimate[] = [
    { name: 'fuse', value: fuseJ, standardUncertainty: u.fuseJ ?? DEFAULT_U_CORRECTION_REL * fuseJ },
    { name: 'acid', value: acidJ, standardUncertainty: u.acidJ ?? DEFAULT_U_CORRECTION_REL * acidJ },
    { name: 'sulfur', value: sulfurJ, standardUncertainty: u.sulfurJ ?? DEFAULT_U_CORRECTION_REL * sulfurJ },
    // u(e_aid)² = (m·u(q))² + (q·u(m))², the aid's certificate and its weighing (JCGM 100:2008 eq. 10).
    { name: 'aid', value: aidJ, standardUncertainty: u.aidJ ?? (aidJ > 0 ? Math.hypot(aidMassG * (ctx.aidUncertaintyJPerG ?? 0), (aidHv ?? 0) * DEFAULT_U_MASS_G) : 0) },
  ]
  notes.push({
    figure: 'Corrections',
    formula: 'e_fuse = burnt length × J/cm (cotton: mass × J/g); e_acid = titrant mL × J/mL or n(HNO₃) × 59.7 kJ/mol; e_S = 57.5 × S % × m; e_aid = m_aid × q_aid',
    source: 'ASTM D240 / D5865 (fuse, titration, sulfur); ISO 1928 (nitric acid)',
    inputs: [
      { label: 'fuse', value: round(fuseJ, 2), unit: 'J' },
      { label: 'acid', value: round(acidJ, 2), unit: 'J' },
      { label: `sulfur (${sulfurPct ? `${round(sulfurPct, 3)} %, ${sulfurSource}` : 'none'})`, value: round(sulfurJ, 2), unit: 'J' },
      { label: 'aid', value: round(aidJ, 2), unit: 'J' },
    ],
  })

  const base: Omit<ResultValues, 'grossJPerG' | 'netConstantPressureJPerG' | 'netConstantVolumeJPerG' | 'uncertainty' | 'check' | 'energyEquivalent' | 'energyEquivalentJPerK' | 'energyReleasedJ' | 'certifiedValueJPerG'> = {
    kind, sampleMassG: mass, temperatureRiseK: theta, temperatureRiseSource: thermogram ? thermogram.method : 'entered', thermogram,
    corrections: { fuseJ, acidJ, sulfurJ, aidJ, sulfurPct, sulfurSource, aidMassG, aidHeatingValueJPerG: aidHv }, analysis, missing, notes,
  }

  const certified = kind === 'sample' ? null : certifiedValue(inputs, ctx)
  if (kind === 'standardisation') {
    const eps = energyEquivalent({ benzoicAcidMassG: mass, benzoicAcidJPerG: certified!, temperatureRiseK: theta, fuseJ, acidJ, aidJ })
    notes.unshift({
      figure: 'Energy equivalent ε of this run',
      formula: 'ε = (m_BA·q_BA + e_fuse + e_acid + e_aid) / θ',
      source: 'ASTM D240 §8; ISO 1928',
      inputs: [
        { label: 'benzoic acid mass', value: mass, unit: 'g' },
        { label: 'certified specific energy', value: certified!, unit: 'J/g' },
        { label: 'θ', value: round(theta, 5), unit: 'K' },
        { label: 'ε', value: round(eps, 2), unit: 'J/K' },
      ],
    })
    return {
      ...base, energyEquivalent: null, energyEquivalentJPerK: eps, energyReleasedJ: mass * certified! + fuseJ + acidJ + aidJ, certifiedValueJPerG: certified,
      grossJPerG: {}, netConstantPressureJPerG: {}, netConstantVolumeJPerG: {}, uncertainty: null, check: null,
    }
  }

  const ee = ctx.energyEquivalent
  if (!ee) throw new Error('energy equivalent required')
  const uEps = standardUncertaintyOfMean(ee.standardDeviationJPerK, ee.runs)
  const gross = grossCalorificValue({ energyEquivalentJPerK: ee.valueJPerK, temperatureRiseK: theta, sampleMassG: mass, fuseJ, acidJ, sulfurJ, aidJ })
  const budget = calorificValueUncertainty({
    energyEquivalentJPerK: { value: ee.valueJPerK, standardUncertainty: uEps },
    temperatureRiseK: { value: theta, standardUncertainty: uTheta },
    sampleMassG: { value: mass, standardUncertainty: uMass },
    corrections,
  })
  notes.unshift({
    figure: 'Gross calorific value at constant volume, as determined',
    formula: 'q_v,gr = (ε·θ − e_fuse − e_acid − e_S − e_aid) / m',
    source: 'ASTM D5865; ISO 1928',
    inputs: [
      { label: 'ε (accepted)', value: round(ee.valueJPerK, 2), unit: 'J/K' },
      { label: 'θ', value: round(theta, 5), unit: 'K' },
      { label: 'm', value: mass, unit: 'g' },
      { label: 'Σ corrections', value: round(fuseJ + acidJ + sulfurJ + aidJ, 2), unit: 'J' },
    ],
  }, {
    figure: 'Uncertainty',
    formula: 'u_c² = (θ/m·u(ε))² + (ε/m·u(θ))² + (q/m·u(m))² + Σ(u(e)/m)²; U = k·u_c, k = 2; u(ε) = s/√n of the accepted series',
    source: 'JCGM 100:2008 §5.1.2 eq. (10), §6.2, §4.2.3',
    inputs: budget.contributions.map(c => ({ label: c.quantity, value: round(c.contributionJPerG, 2), unit: 'J/g' })),
  })

  const { grossJPerG, netP, netV } = basesAndNet(gross, analysis, missing, notes)
  let check: ResultValues['check'] = null
  if (kind === 'check') {
    const deviationPct = (100 * (gross - certified!)) / certified!
    check = { certifiedJPerG: certified!, deviationPct, tolerancePct: policy.checkRunTolerancePct, passed: Math.abs(deviationPct) <= policy.checkRunTolerancePct }
  }
  return {
    ...base,
    energyEquivalent: { id: ee.id, valueJPerK: ee.valueJPerK, standardUncertaintyJPerK: uEps, acceptedAt: ee.acceptedAt.toISOString() },
    energyEquivalentJPerK: null, energyReleasedJ: null, certifiedValueJPerG: certified,
    grossJPerG, netConstantPressureJPerG: netP, netConstantVolumeJPerG: netV, uncertainty: budget, check,
  }
}

function plannedFuse(components: ResultContext['components']): ResultInputs['fuse'] | null {
  const f = components.find(c => c.role === 'fuse')
  if (!f) return null
  if (f.wire === 'cotton') return { wire: 'cotton', cottonMassG: f.massG ?? 0 }
  return { wire: f.wire ?? 'nichrome', burntLengthCm: f.lengthCm ?? 0 }
}

function certifiedValue(inputs: ResultInputs, ctx: ResultContext): number {
  if (inputs.certifiedValueJPerG !== undefined) return inputs.certifiedValueJPerG
  const sample = ctx.components.find(c => c.role === 'sample')
  if (sample?.heatingValueJPerG !== undefined) return sample.heatingValueJPerG
  throw new ResultInputError('certifiedValueJPerG', 'the certified specific energy of the benzoic acid (J/g, from its certificate): the run\'s sample names none')
}

/** Gross on every basis the analysis allows (ASTM D3180 / ISO 1170) and the net values (ISO 1928 / ISO 18125). */
function basesAndNet(grossAd: number, a: ResultValues['analysis'], missing: string[], notes: ResultNote[]) {
  const grossJPerG: ByBasis = { 'air-dried': grossAd }
  const netP: ByBasis = {}
  const netV: ByBasis = {}
  if (a.moistureAdPct === null) {
    missing.push('Moisture of the analysis sample not given: only the value as determined is reported (no dry, as-received, dry ash-free or net values).')
    return { grossJPerG, netP, netV }
  }
  const c: BasisConditions = { moistureAd: a.moistureAdPct }
  if (a.moistureArPct !== null) c.moistureAr = a.moistureArPct
  if (a.ashDryPct !== null) c.ashDry = a.ashDryPct
  const dry = convertBasis(grossAd, 'air-dried', 'dry', c)
  grossJPerG.dry = dry
  if (c.moistureAr !== undefined) grossJPerG['as-received'] = convertBasis(grossAd, 'air-dried', 'as-received', c)
  else missing.push('Total moisture as received not given: no as-received values.')
  if (c.ashDry !== undefined) grossJPerG['dry-ash-free'] = convertBasis(grossAd, 'air-dried', 'dry-ash-free', c)
  else missing.push('Ash not given: no dry ash-free value.')
  notes.push({
    figure: 'Bases',
    formula: 'dry = ad·100/(100 − M_ad); ar = dry·(100 − M_ar)/100; daf = dry·100/(100 − A_d)',
    source: 'ASTM D3180; ISO 1170',
    inputs: [
      { label: 'M_ad', value: a.moistureAdPct, unit: '%' },
      { label: 'M_ar', value: a.moistureArPct ?? 'not given', unit: a.moistureArPct === null ? '' : '%' },
      { label: 'A_d', value: a.ashDryPct ?? 'not given', unit: a.ashDryPct === null ? '' : '%' },
    ],
  })
  if (a.hydrogenDryPct === null) {
    missing.push('Hydrogen not given: no net calorific values.')
    return { grossJPerG, netP, netV }
  }
  const moistures: [Basis, number][] = [['dry', 0], ['air-dried', a.moistureAdPct]]
  if (a.moistureArPct !== null) moistures.push(['as-received', a.moistureArPct])
  for (const [basis, m] of moistures) {
    netV[basis] = netCalorificValueConstantVolume({ grossDryJPerG: dry, hydrogenDryPct: a.hydrogenDryPct, moisturePct: m })
    if (a.oxygenDryPct !== null && a.nitrogenDryPct !== null) {
      netP[basis] = netCalorificValueConstantPressure({ grossDryJPerG: dry, hydrogenDryPct: a.hydrogenDryPct, oxygenDryPct: a.oxygenDryPct, nitrogenDryPct: a.nitrogenDryPct, moisturePct: m })
    }
  }
  if (a.oxygenDryPct === null || a.nitrogenDryPct === null) missing.push('Oxygen or nitrogen not given: no net value at constant pressure.')
  notes.push({
    figure: 'Net calorific values',
    formula: 'q_p,net = [q_v,gr,d − 212.2·H_d − 0.8(O_d + N_d)](1 − 0.01M) − 24.43M;  q_v,net = [q_v,gr,d − 206.0·H_d](1 − 0.01M) − 23.05M',
    source: 'ISO 1928 / ISO 18125',
    inputs: [
      { label: 'q_v,gr,d', value: round(dry, 1), unit: 'J/g' },
      { label: 'H_d', value: a.hydrogenDryPct, unit: '%' },
      { label: 'O_d', value: a.oxygenDryPct ?? 'not given', unit: a.oxygenDryPct === null ? '' : '%' },
      { label: 'N_d', value: a.nitrogenDryPct ?? 'not given', unit: a.nitrogenDryPct === null ? '' : '%' },
    ],
  })
  return { grossJPerG, netP, netV }
}

/** Loads what a result of this run needs: the firing, the weighed charge resolved, the active ε and the aid's uncertainty. */
export async function resultContext(db: Db | Tx, run: RunRow, policy: LabPolicy, energyEquivalentId?: string | null) {
  const [firing] = await db.select().from(schema.firings).where(eq(schema.firings.runId, run.id))
  if (!firing) throw createError({ statusCode: 409, message: `Run ${run.sampleCode} has not been fired yet: record the firing first.` })
  if (firing.outcome !== 'complete') {
    throw createError({ statusCode: 409, message: `The firing of ${run.sampleCode} was recorded as "${firing.outcome}": it gives no valid result. Fire a duplicate of the run.` })
  }
  const weighed = ((firing.data as { components?: RunComponent[] }).components ?? run.components) as RunComponent[]
  const charge = await buildCharge(db, weighed)
  let components: ResultContext['components']
  try {
    components = await resolveComponents(charge)
  }
  catch {
    components = charge
  }
  const aid = weighed.find(c => c.role === 'aid')
  let aidUncertaintyJPerG: number | null = null
  if (aid?.materialId) {
    const [m] = await db.select({ u: schema.materials.heatingValueUncertaintyJPerG }).from(schema.materials).where(eq(schema.materials.id, aid.materialId))
    aidUncertaintyJPerG = m?.u ?? null
  }
  const kind = run.kind as ResultKind
  // A revision keeps the ε that was in force for its firing; a first result takes the vessel's active ε.
  const energy = kind === 'standardisation' ? null : energyEquivalentId ? await energyEquivalentById(db, energyEquivalentId) : await activeEnergyEquivalent(db, run.vesselId)
  if (kind !== 'standardisation' && !energy) {
    const [v] = await db.select({ name: schema.vessels.name }).from(schema.vessels).where(eq(schema.vessels.id, run.vesselId))
    throw createError({
      statusCode: 409,
      message: `${v?.name ?? 'This vessel'} has no accepted energy equivalent: standardise the vessel first (a series of benzoic-acid standardisation runs accepted by a supervisor on the Standardisation page).`,
      data: { reason: 'no-energy-equivalent' },
    })
  }
  const ctx: ResultContext = { kind, weighedMassG: firing.weighedMassG, components, energyEquivalent: energy, aidUncertaintyJPerG, policy }
  return { firing, ctx }
}

export async function activeEnergyEquivalent(db: Db | Tx, vesselId: string): Promise<EnergyEquivalentRow | null> {
  const [row] = await db.select().from(schema.energyEquivalents)
    .where(and(eq(schema.energyEquivalents.vesselId, vesselId), eq(schema.energyEquivalents.active, true)))
    .orderBy(desc(schema.energyEquivalents.acceptedAt)).limit(1)
  return row ?? null
}

async function energyEquivalentById(db: Db | Tx, id: string): Promise<EnergyEquivalentRow | null> {
  const [row] = await db.select().from(schema.energyEquivalents).where(eq(schema.energyEquivalents.id, id))
  return row ?? null
}

/** Binds a sign-off to the inputs and values of one revision. */
export function resultHash(r: Pick<ResultRow, 'id' | 'inputs' | 'values' | 'revision'>): string {
  return createHash('sha256').update(JSON.stringify({ id: r.id, revision: r.revision, inputs: r.inputs, values: r.values })).digest('hex')
}

/** A check run that passes returns a vessel awaiting verification to service (rule: checkRunEffect), in the caller's transaction. */
export async function applyCheckOutcome(tx: Tx, event: Parameters<typeof audit>[1], run: RunRow, values: ResultValues, resultId: string) {
  if (run.kind !== 'check' || !values.check) return null
  const vessel = await findVesselOr404(tx, run.vesselId, true)
  const effect = checkRunEffect(vessel, run.sampleCode, values.check)
  if (!effect.returnedToService) return { returnedToService: false, message: effect.message }
  const now = new Date()
  await tx.update(schema.vessels).set({ condition: 'normal', conditionReason: effect.reason, conditionSince: now, updatedAt: now }).where(eq(schema.vessels.id, vessel.id))
  await audit(tx, event, {
    action: 'vessel.return-to-service', entity: 'vessel', entityId: vessel.id,
    oldValues: { condition: vessel.condition }, newValues: { condition: 'normal', checkResultId: resultId, deviationPct: values.check.deviationPct },
    reason: effect.reason,
  })
  return { returnedToService: true, message: effect.message }
}

type SignatureRow = typeof schema.signatures.$inferSelect

export function resultView(r: ResultRow, extra: { vesselName?: string, createdByName?: string, firedAt?: Date | null, firedBy?: string | null, firedByName?: string | null, signature?: SignatureRow | null } = {}) {
  const values = r.values as ResultValues
  return {
    id: r.id,
    runId: r.runId,
    firingId: r.firingId,
    vesselId: r.vesselId,
    vesselName: extra.vesselName ?? null,
    sampleCode: r.sampleCode,
    kind: r.kind as ResultKind,
    revision: r.revision,
    supersedesId: r.supersedesId,
    current: r.current,
    inputs: r.inputs as ResultInputs,
    values,
    energyEquivalentId: r.energyEquivalentId,
    status: r.status as 'unsigned' | 'signed',
    reason: r.reason,
    createdBy: r.createdBy,
    createdByName: extra.createdByName ?? null,
    createdAt: r.createdAt,
    firedAt: extra.firedAt ?? null,
    firedBy: extra.firedBy ?? null,
    firedByName: extra.firedByName ?? null,
    signature: extra.signature
      ? { id: extra.signature.id, signerName: extra.signature.signerName, meaning: extra.signature.meaning, reason: extra.signature.reason, signedAt: extra.signature.signedAt, valid: extra.signature.boundHash === resultHash(r) }
      : null,
  }
}
export type ResultView = ReturnType<typeof resultView>

/** Result rows with their vessel, author, firing and signature, as the API shows them. */
export async function loadResultViews(db: Db | Tx, rows: ResultRow[]): Promise<ResultView[]> {
  if (!rows.length) return []
  const vesselIds = [...new Set(rows.map(r => r.vesselId))]
  const userIds = [...new Set(rows.map(r => r.createdBy))]
  const firingIds = [...new Set(rows.map(r => r.firingId))]
  const sigIds = rows.flatMap(r => (r.signatureId ? [r.signatureId] : []))
  const [vs, us, fs, ss] = await Promise.all([
    db.select({ id: schema.vessels.id, name: schema.vessels.name }).from(schema.vessels).where(inArray(schema.vessels.id, vesselIds)),
    db.select({ id: schema.users.id, name: schema.users.name }).from(schema.users).where(inArray(schema.users.id, userIds)),
    db.select({ id: schema.firings.id, firedAt: schema.firings.firedAt, firedBy: schema.firings.firedBy, name: schema.users.name })
      .from(schema.firings).innerJoin(schema.users, eq(schema.users.id, schema.firings.firedBy)).where(inArray(schema.firings.id, firingIds)),
    sigIds.length ? db.select().from(schema.signatures).where(inArray(schema.signatures.id, sigIds)) : Promise.resolve([] as SignatureRow[]),
  ])
  const vName = new Map(vs.map(v => [v.id, v.name]))
  const uName = new Map(us.map(u => [u.id, u.name]))
  const fById = new Map(fs.map(f => [f.id, f]))
  const sById = new Map(ss.map(s => [s.id, s]))
  return rows.map((r) => {
    const f = fById.get(r.firingId)
    return resultView(r, {
      vesselName: vName.get(r.vesselId), createdByName: uName.get(r.createdBy), firedAt: f?.firedAt ?? null, firedBy: f?.firedBy ?? null, firedByName: f?.name ?? null,
      signature: r.signatureId ? sById.get(r.signatureId) ?? null : null,
    })
  })
}

export async function findResultOr404(db: Db | Tx, id: string, lock = false): Promise<ResultRow> {
  const q = db.select().from(schema.results).where(eq(schema.results.id, id))
  const [row] = lock ? await q.for('update') : await q
  if (!row) throw createError({ statusCode: 404, message: 'No such result.' })
  return row
}

export interface DuplicateSummary extends DuplicateAssessment {
  sampleCode: string
  resultIds: string[]
  signed: boolean
  /** The reportable value on each basis (mean or median of the determinations), when one may be reported. */
  reported: { grossJPerG: ByBasis, netConstantPressureJPerG: ByBasis, netConstantVolumeJPerG: ByBasis, expandedUncertaintyJPerG: number | null }
}

function combine(values: ResultValues[], pick: (v: ResultValues) => ByBasis, how: 'mean' | 'median' | null): ByBasis {
  const out: ByBasis = {}
  if (!how) return out
  for (const basis of ['air-dried', 'dry', 'as-received', 'dry-ash-free'] as Basis[]) {
    const xs = values.map(v => pick(v)[basis])
    if (xs.every((x): x is number => typeof x === 'number')) out[basis] = how === 'mean' ? mean(xs) : median(xs)
  }
  return out
}

/** Agreement of the current sample determinations of one sample code (ISO 1928 r, via assessDuplicates); never averaged blindly. */
export function duplicateSummary(sampleCode: string, rows: ResultRow[], policy: LabPolicy): DuplicateSummary {
  const current = rows.filter(r => r.current && r.kind === 'sample' && r.sampleCode === sampleCode)
  const values = current.map(r => r.values as ResultValues)
  const a = assessDuplicates(values.map(v => v.grossJPerG['air-dried']!), { repeatabilityLimit: policy.repeatabilityJPerG })
  const how = a.status === 'accepted' ? 'mean' : a.status === 'median-flagged' ? 'median' : a.n === 1 ? 'mean' : null
  const us = values.map(v => v.uncertainty?.expandedUncertaintyJPerG).filter((x): x is number => typeof x === 'number')
  return {
    ...a,
    sampleCode,
    resultIds: current.map(r => r.id),
    signed: current.length > 0 && current.every(r => r.status === 'signed'),
    reported: {
      grossJPerG: combine(values, v => v.grossJPerG, how),
      netConstantPressureJPerG: combine(values, v => v.netConstantPressureJPerG, how),
      netConstantVolumeJPerG: combine(values, v => v.netConstantVolumeJPerG, how),
      // The largest single-determination U is quoted for the reported value: a conservative choice (common practice).
      expandedUncertaintyJPerG: how && us.length ? Math.max(...us) : null,
    },
  }
}

/** Duplicate summaries for the sample codes given, from every current sample result of those codes. */
export async function duplicateSummaries(db: Db | Tx, sampleCodes: string[], policy: LabPolicy): Promise<Record<string, DuplicateSummary>> {
  const codes = [...new Set(sampleCodes)]
  if (!codes.length) return {}
  const rows = await db.select().from(schema.results)
    .where(and(inArray(schema.results.sampleCode, codes), eq(schema.results.current, true), eq(schema.results.kind, 'sample')))
    .orderBy(asc(schema.results.createdAt))
  return Object.fromEntries(codes.map(c => [c, duplicateSummary(c, rows, policy)]))
}

const BASIS_LABEL: Record<Basis, string> = { 'as-received': 'as received', 'air-dried': 'as determined', 'dry': 'dry', 'dry-ash-free': 'dry, ash-free' }
const BASIS_ORDER: Basis[] = ['as-received', 'air-dried', 'dry', 'dry-ash-free']

/**
 * The content of a certificate for one sample: only when every current determination is signed off and the
 * determinations agree (or a single one, or a flagged median, said so on the certificate). 409 otherwise.
 */
export async function certificateContent(db: Db | Tx, sampleCode: string, issuer: { name: string }): Promise<{ content: CertificateContent, resultIds: string[] }> {
  const { labName, policy } = await getLabSettings()
  const rows = await db.select().from(schema.results)
    .where(and(eq(schema.results.sampleCode, sampleCode), eq(schema.results.current, true), eq(schema.results.kind, 'sample')))
    .orderBy(asc(schema.results.createdAt))
  if (!rows.length) throw createError({ statusCode: 404, message: `There are no sample results for ${sampleCode}.` })
  const unsigned = rows.filter(r => r.status !== 'signed')
  if (unsigned.length) {
    throw createError({ statusCode: 409, message: `Only signed results can be certified: ${unsigned.length} of the ${rows.length} current results of ${sampleCode} are not signed off yet.`, data: { unsigned: unsigned.map(r => r.id) } })
  }
  const dup = duplicateSummary(sampleCode, rows, policy)
  if (dup.status === 'third-determination-needed' || dup.status === 'review-needed') {
    throw createError({ statusCode: 409, message: `${dup.message} A certificate is issued once the determinations agree.`, data: { duplicate: dup } })
  }
  const views = await loadResultViews(db, rows)
  const run = await findRunOr404(db, rows[0]!.runId)
  const sample = (run.components as RunComponent[]).find(c => c.role === 'sample')
  let description = sample?.name ?? null
  if (sample?.materialId) {
    const [m] = await db.select({ name: schema.materials.name }).from(schema.materials).where(eq(schema.materials.id, sample.materialId))
    description = m?.name ?? description
  }
  const first = views[0]!.values
  const uAd = dup.reported.expandedUncertaintyJPerG
  const grossAd = dup.reported.grossJPerG['air-dried']
  const certRows: CertificateRow[] = []
  for (const b of BASIS_ORDER) {
    const v = dup.reported.grossJPerG[b]
    // The relative uncertainty carries over to the other bases (the moisture and ash figures are taken as exact).
    if (v !== undefined) certRows.push({ quantity: 'Gross calorific value at constant volume', basis: BASIS_LABEL[b], valueJPerG: v, expandedUncertaintyJPerG: uAd !== null && grossAd ? (uAd * v) / grossAd : null })
  }
  for (const b of BASIS_ORDER) {
    const v = dup.reported.netConstantPressureJPerG[b]
    if (v !== undefined) certRows.push({ quantity: 'Net calorific value at constant pressure', basis: BASIS_LABEL[b], valueJPerG: v, expandedUncertaintyJPerG: null })
  }
  for (const b of BASIS_ORDER) {
    const v = dup.reported.netConstantVolumeJPerG[b]
    if (v !== undefined) certRows.push({ quantity: 'Net calorific value at constant volume', basis: BASIS_LABEL[b], valueJPerG: v, expandedUncertaintyJPerG: null })
  }
  const a = first.analysis
  const analysis = [
    a.moistureAdPct !== null && { label: 'moisture of the analysis sample', value: `${a.moistureAdPct} %` },
    a.moistureArPct !== null && { label: 'total moisture as received', value: `${a.moistureArPct} %` },
    a.ashDryPct !== null && { label: 'ash (dry)', value: `${round(a.ashDryPct, 2)} %` },
    a.hydrogenDryPct !== null && { label: 'hydrogen (dry)', value: `${round(a.hydrogenDryPct, 2)} %` },
    a.oxygenDryPct !== null && { label: 'oxygen (dry)', value: `${round(a.oxygenDryPct, 2)} %` },
    a.nitrogenDryPct !== null && { label: 'nitrogen (dry)', value: `${round(a.nitrogenDryPct, 2)} %` },
  ].filter((x): x is { label: string, value: string } => !!x)
  const fired = views.map(v => v.firedAt).filter((d): d is Date => !!d).map(d => new Date(d).toISOString()).sort()
  const [previous] = await db.select({ reportNumber: schema.reports.reportNumber }).from(schema.reports).where(eq(schema.reports.sampleCode, sampleCode)).orderBy(desc(schema.reports.issuedAt)).limit(1)
  const reportedAs = dup.method === 'median' ? 'the median of the determinations, flagged for review' : dup.n === 1 ? 'the single determination' : `the mean of ${dup.n} determinations`
  const ee = first.energyEquivalent
  return {
    resultIds: rows.map(r => r.id),
    content: {
      labName,
      sampleCode,
      sampleDescription: description,
      method: [
        'Gross calorific value at constant volume by combustion in an oxygen-pressurised vessel in a calorimeter calibrated with certified benzoic acid (ISO 1928; ASTM D5865).',
        'Net calorific values by ISO 1928 / ISO 18125; bases by ASTM D3180 / ISO 1170.',
        ee ? `Energy equivalent ${fmtFixed(ee.valueJPerK, 1)} J/K (accepted ${ee.acceptedAt?.slice(0, 10) ?? '—'}).` : '',
      ].filter(Boolean),
      unit: policy.displayUnit,
      rows: certRows,
      duplicate: { status: dup.status, message: dup.message, n: dup.n, rangeJPerG: dup.range, limitJPerG: dup.limit, reportedAs },
      determinations: views.map(v => ({
        resultId: v.id, revision: v.revision, firedAt: v.firedAt ? new Date(v.firedAt).toISOString() : null, vesselName: v.vesselName ?? '', sampleMassG: v.values.sampleMassG,
        temperatureRiseK: v.values.temperatureRiseK, grossAdJPerG: v.values.grossJPerG['air-dried']!, expandedUncertaintyJPerG: v.values.uncertainty?.expandedUncertaintyJPerG ?? null,
        signedBy: v.signature?.signerName ?? '', signedAt: v.signature ? new Date(v.signature.signedAt).toISOString() : '',
      })),
      analysis,
      testedFrom: fired[0] ?? null,
      testedTo: fired[fired.length - 1] ?? null,
      signers: [...new Map(views.filter(v => v.signature).map(v => [v.signature!.signerName, { name: v.signature!.signerName, signedAt: new Date(v.signature!.signedAt).toISOString() }])).values()],
      issuedBy: issuer.name,
      replaces: previous?.reportNumber ?? null,
      statements: [
        'The results relate only to the sample as tested. "As determined" is the analysis sample as weighed (air-dried basis).',
        `U is the expanded uncertainty with coverage factor k = 2 (about 95 % coverage), evaluated as in JCGM 100:2008 from the uncertainties of the energy equivalent, the temperature rise, the sample mass and the corrections; it is not stated for the net values, which also depend on the hydrogen and moisture determinations.`,
        `Duplicate determinations are accepted when they differ by no more than the repeatability limit of ${fmtFixed(policy.repeatabilityJPerG, 0)} J/g (ISO 1928).`,
        'This certificate shall not be reproduced except in full without the written approval of the laboratory.',
      ],
    },
  }
}

const fmtFixed = (v: number, d: number) => v.toLocaleString('en-GB', { minimumFractionDigits: d, maximumFractionDigits: d })
