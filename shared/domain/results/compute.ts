// One function from a fired run's inputs to its values and uncertainty budget: the server stores what it returns, the
// result page previews with it, the demo seed and the tests call it. Pure: no database, no HTTP.
import type { ResultInputs } from '../../schemas/results'
import { toDryBasis } from '../composition'
import type { Composition } from '../composition'
import { ACID_CONVENTION_TEXT, acidConventionOf, chlorineCorrectionJ, sulfurCoefficientFor } from './acid'
import { convertBasis } from './bases'
import { buoyancyFactor } from './buoyancy'
import { acidCorrectionFromTitrationJ, fuseCorrectionJ, grossCalorificValue, nitricAcidCorrectionJ, sulfurCorrectionJ } from './calorific-value'
import { basesAndNet } from './compute-bases'
import { energyEquivalent } from './energy-equivalent'
import { repeatabilityTerm } from './repeatability'
import type { AidValue, Corrections, ResultContext, ResultNote, ResultValues, ThermogramSummary } from './result-types'
import { ResultInputError } from './result-types'
import { analyseThermogram, parseThermogramCsv } from './thermogram'
import { calorificValueUncertainty, rectangularStandardUncertainty, standardUncertaintyOfMean } from './uncertainty'
import type { CorrectionEstimate, ExtraTerm } from './uncertainty'

/** Standard uncertainty of a weighing on a four-place analytical balance, g (readability 0.1 mg; common practice). */
export const DEFAULT_U_MASS_G = 0.0001
/** Standard uncertainty of an entered corrected temperature rise, K (about 0.04 % of a 2.5 K rise; common practice). */
export const DEFAULT_U_THETA_K = 0.001
/** Relative standard uncertainty of the fuse, acid, sulfur and chlorine corrections (10 %; common practice). */
export const DEFAULT_U_CORRECTION_REL = 0.1
/** Half-width of a typical heating value with no range given, relative (± 5 %, rectangular; common practice). */
export const TYPICAL_VALUE_HALF_WIDTH_REL = 0.05

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

/** The aid's heating value in force: typed with its uncertainty, the lab's own determination, else the library's (typical). */
function aidValue(inputs: ResultInputs, ctx: ResultContext, massG: number): AidValue | null {
  if (massG <= 0) return null
  if (inputs.aidHeatingValueJPerG !== undefined) {
    const v = inputs.aidHeatingValueJPerG
    if (inputs.aidUncertaintyJPerG !== undefined) return { valueJPerG: v, standardUncertaintyJPerG: inputs.aidUncertaintyJPerG, source: 'entered', label: 'entered with its uncertainty' }
    return { valueJPerG: v, standardUncertaintyJPerG: rectangularStandardUncertainty(TYPICAL_VALUE_HALF_WIDTH_REL * v), source: 'typical', label: 'entered without an uncertainty' }
  }
  if (ctx.aid) return ctx.aid
  const component = ctx.components.find(c => c.role === 'aid')
  if (component?.heatingValueJPerG !== undefined) {
    const v = component.heatingValueJPerG
    return { valueJPerG: v, standardUncertaintyJPerG: rectangularStandardUncertainty(TYPICAL_VALUE_HALF_WIDTH_REL * v), source: 'typical', label: component.name ?? 'the aid\'s library value' }
  }
  const p = ctx.policy
  return { valueJPerG: p.aidHeatingValueJPerG, standardUncertaintyJPerG: p.standardCertifiedUncertaintyJPerG / p.standardCertifiedCoverageFactor, source: 'certified', label: 'benzoic acid, the lab policy\'s certified value' }
}

/** Fuse, acid (by the convention of what was measured), sulfur, chlorine and aid corrections with their standard uncertainties. */
function corrections(inputs: ResultInputs, ctx: ResultContext, mass: number, analysisMoistureAd: number | null, dry: Composition | null, missing: string[], provisional: string[]) {
  const { policy, kind } = ctx
  const u = inputs.uncertainty ?? {}
  // Fuse: the wire burnt × its J/cm, or the cotton thread's mass × J/g (the lab's determination, else typical).
  const fuseInput = inputs.fuse ?? plannedFuse(ctx.components)
  let fuseJ = 0
  let uFuse = 0
  if (fuseInput) {
    if (fuseInput.wire === 'cotton') {
      const cotton = ctx.cotton ?? { valueJPerG: policy.cottonJPerG, standardUncertaintyJPerG: rectangularStandardUncertainty(TYPICAL_VALUE_HALF_WIDTH_REL * policy.cottonJPerG), source: 'typical' as const, label: 'lab policy' }
      const m = fuseInput.cottonMassG ?? 0
      fuseJ = m * cotton.valueJPerG
      uFuse = Math.hypot(m * cotton.standardUncertaintyJPerG, cotton.valueJPerG * DEFAULT_U_MASS_G)
      if (cotton.source === 'typical' && fuseJ > 0) provisional.push(`Cotton thread at the typical ${cotton.valueJPerG} J/g: replace it by the lab's own determination.`)
    }
    else {
      fuseJ = fuseCorrectionJ(fuseInput.burntLengthCm ?? 0, policy.fuseWireJPerCm[fuseInput.wire])
      uFuse = DEFAULT_U_CORRECTION_REL * fuseJ
    }
    if (!inputs.fuse) missing.push('Burnt fuse length not entered: the planned length was used.')
  }
  else missing.push('No fuse in the charge or the inputs: no fuse correction.')

  // Acid: what was measured decides the convention; nothing measured → the policy's convention.
  const a = inputs.acid
  const titration = a?.titrantMl !== undefined && a.titrantJPerMl !== undefined
  const nitric = a?.nitricAcidMol !== undefined || a?.nitricAcidFixedJ !== undefined
  const convention = acidConventionOf({ titration, nitricAcid: nitric, chlorine: inputs.chlorinePct !== undefined }, policy.acidConvention)
  let acidJ = 0
  let acidMeasured: Corrections['acidMeasured'] = 'not measured'
  if (titration) { acidJ = acidCorrectionFromTitrationJ(a!.titrantMl!, a!.titrantJPerMl!); acidMeasured = 'total-acid titration' }
  else if (a?.nitricAcidMol !== undefined) { acidJ = nitricAcidCorrectionJ(a.nitricAcidMol); acidMeasured = 'nitric acid determined' }
  else if (a?.nitricAcidFixedJ !== undefined) { acidJ = a.nitricAcidFixedJ; acidMeasured = 'nitric acid, fixed value' }
  else missing.push('No acid figure entered: the acid correction is 0 J.')

  // Sulfur (samples only; benzoic acid has none): measured on the analysis sample, else from the composition.
  let sulfurPct = 0
  let sulfurSource = 'none'
  if (kind === 'sample') {
    if (inputs.sulfurPct !== undefined) { sulfurPct = inputs.sulfurPct; sulfurSource = 'measured' }
    else if (dry?.S !== undefined) {
      sulfurPct = analysisMoistureAd !== null ? convertBasis(dry.S, 'dry', 'air-dried', { moistureAd: analysisMoistureAd }) : dry.S
      sulfurSource = analysisMoistureAd !== null ? 'sample composition (dry → analysis basis)' : 'sample composition (dry basis; no moisture given)'
    }
  }
  const sulfurJPerPctG = sulfurCoefficientFor(convention, policy.totalAcidSulfurJPerPctG)
  const sulfurJ = sulfurPct > 0 ? sulfurCorrectionJ(sulfurPct, mass, sulfurJPerPctG) : 0
  const chlorinePct = kind === 'sample' ? inputs.chlorinePct ?? 0 : 0
  const chlorineJ = chlorinePct > 0 ? chlorineCorrectionJ(chlorinePct, mass, policy.chlorineJPerPctG) : 0

  // Aid: its weighed mass × its heating value; a typical value makes the result provisional.
  const aidMassG = inputs.aidMassG ?? ctx.components.filter(c => c.role === 'aid').reduce((s, c) => s + (c.massG ?? 0), 0)
  const aid = aidValue(inputs, ctx, aidMassG)
  const aidJ = aid ? aidMassG * aid.valueJPerG : 0
  if (aid?.source === 'typical') provisional.push(`Aid heating value ${aid.valueJPerG} J/g is a typical value (${aid.label}): the result stays provisional until the lab's own determination replaces it.`)

  const estimates: CorrectionEstimate[] = [
    { name: 'fuse', value: fuseJ, standardUncertainty: u.fuseJ ?? uFuse },
    { name: 'acid', value: acidJ, standardUncertainty: u.acidJ ?? DEFAULT_U_CORRECTION_REL * acidJ },
    { name: 'sulfur', value: sulfurJ, standardUncertainty: u.sulfurJ ?? DEFAULT_U_CORRECTION_REL * sulfurJ },
    ...(chlorineJ > 0 ? [{ name: 'chlorine', value: chlorineJ, standardUncertainty: DEFAULT_U_CORRECTION_REL * chlorineJ }] : []),
    // u(e_aid)² = (m·u(q))² + (q·u(m))², the aid's value and its weighing (JCGM 100:2008 eq. 10).
    { name: 'aid', value: aidJ, standardUncertainty: u.aidJ ?? (aid ? Math.hypot(aidMassG * aid.standardUncertaintyJPerG, aid.valueJPerG * DEFAULT_U_MASS_G) : 0) },
  ]
  const values: Corrections = {
    fuseJ, acidJ, sulfurJ, chlorineJ, aidJ, sulfurPct, sulfurSource, sulfurJPerPctG, chlorinePct, chlorineSource: inputs.chlorineSource ?? null,
    aidMassG, aidHeatingValueJPerG: aid?.valueJPerG ?? null, aidValueSource: aid?.source ?? null, acidConvention: convention, acidMeasured,
  }
  return { values, estimates }
}

/** The whole computation of one result. Throws ResultInputError (naming the input) or RangeError for impossible figures. */
export function computeResultValues(inputs: ResultInputs, ctx: ResultContext): ResultValues {
  const { policy, kind } = ctx
  const notes: ResultNote[] = []
  const missing: string[] = []
  const provisional: string[] = []
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
  else theta = inputs.temperatureRiseK!

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
  const { values: corr, estimates } = corrections(inputs, ctx, mass, analysis.moistureAdPct, dry, missing, provisional)
  notes.push({
    figure: 'Corrections',
    formula: `e_fuse = burnt length × J/cm (cotton: mass × J/g); e_acid = ${corr.acidConvention === 'total-acid' ? 'titrant mL × J/mL' : 'n(HNO₃) × 59.7 kJ/mol, or the method\'s fixed value'}; e_S = ${corr.sulfurJPerPctG} × S % × m${corr.chlorineJ > 0 ? `; e_Cl = ${policy.chlorineJPerPctG} × Cl % × m` : ''}; e_aid = m_aid × q_aid`,
    source: ACID_CONVENTION_TEXT[corr.acidConvention],
    inputs: [
      { label: 'fuse', value: round(corr.fuseJ, 2), unit: 'J' },
      { label: `acid (${corr.acidMeasured})`, value: round(corr.acidJ, 2), unit: 'J' },
      { label: `sulfur (${corr.sulfurPct ? `${round(corr.sulfurPct, 3)} %, ${corr.sulfurSource}` : 'none'})`, value: round(corr.sulfurJ, 2), unit: 'J' },
      ...(corr.chlorineJ > 0 ? [{ label: `chlorine (${round(corr.chlorinePct, 3)} %, ${corr.chlorineSource})`, value: round(corr.chlorineJ, 2), unit: 'J' }] : []),
      { label: `aid${corr.aidValueSource ? ` (${corr.aidValueSource.replace('-', ' ')} value)` : ''}`, value: round(corr.aidJ, 2), unit: 'J' },
    ],
  })
  const sumE = corr.fuseJ + corr.acidJ + corr.sulfurJ + corr.chlorineJ + corr.aidJ

  // The reference standard's value; with the buoyancy option the certificate's in-vacuum figure per gram weighed in air.
  let certified = kind === 'sample' ? null : certifiedValue(inputs, ctx)
  let buoyancy: ResultValues['buoyancy'] = null
  if (certified !== null && policy.buoyancyCorrection) {
    const d = { airGPerMl: policy.buoyancyAirGPerMl, substanceGPerMl: policy.buoyancyStandardGPerMl, weightsGPerMl: policy.buoyancyWeightsGPerMl }
    const factor = buoyancyFactor(d)
    buoyancy = { factor, airGPerMl: d.airGPerMl, standardGPerMl: d.substanceGPerMl, weightsGPerMl: d.weightsGPerMl }
    certified *= factor
    notes.push({ figure: 'Air buoyancy of the standard', formula: 'q_air = q_vacuum × (1 − ρ_air/ρ_weights)/(1 − ρ_air/ρ_BA)', source: 'buoyancy equation of weighing; densities by the lab policy (OIML R 111 for air and weights)', inputs: [{ label: 'factor', value: round(factor, 6), unit: '' }, { label: 'ρ_air', value: d.airGPerMl, unit: 'g/mL' }, { label: 'ρ_BA', value: d.substanceGPerMl, unit: 'g/mL' }, { label: 'ρ_weights', value: d.weightsGPerMl, unit: 'g/mL' }] })
  }
  const common = {
    kind, sampleMassG: mass, temperatureRiseK: theta, temperatureRiseSource: thermogram ? thermogram.method : 'entered' as const, thermogram,
    corrections: corr, analysis, missing, notes, provisional, buoyancy, certifiedValueJPerG: certified,
  }

  if (kind === 'standardisation') {
    const eps = energyEquivalent({ benzoicAcidMassG: mass, benzoicAcidJPerG: certified!, temperatureRiseK: theta, fuseJ: corr.fuseJ, acidJ: corr.acidJ, aidJ: corr.aidJ })
    notes.unshift({
      figure: 'Energy equivalent ε of this run',
      formula: 'ε = (m_BA·q_BA + e_fuse + e_acid + e_aid) / θ',
      source: 'ASTM D240; ISO 1928',
      inputs: [
        { label: 'benzoic acid mass', value: mass, unit: 'g' },
        { label: 'certified specific energy', value: round(certified!, 1), unit: 'J/g' },
        { label: 'θ', value: round(theta, 5), unit: 'K' },
        { label: 'ε', value: round(eps, 2), unit: 'J/K' },
      ],
    })
    return {
      ...common, energyEquivalent: null, energyEquivalentJPerK: eps, energyReleasedJ: mass * certified! + corr.fuseJ + corr.acidJ + corr.aidJ,
      grossJPerG: {}, netConstantPressureJPerG: {}, netConstantVolumeJPerG: {}, uncertainty: null, expandedUncertaintyByBasis: null, repeatabilityJPerG: null, mineralMatterFree: null, check: null,
    }
  }

  const ee = ctx.energyEquivalent
  if (!ee) throw new Error('energy equivalent required')
  const uEps = standardUncertaintyOfMean(ee.standardDeviationJPerK, ee.runs)
  const gross = grossCalorificValue({ energyEquivalentJPerK: ee.valueJPerK, temperatureRiseK: theta, sampleMassG: mass, fuseJ: corr.fuseJ, acidJ: corr.acidJ, sulfurJ: corr.sulfurJ + corr.chlorineJ, aidJ: corr.aidJ })
  const rep = ctx.repeatability ?? repeatabilityTerm(policy.repeatabilityJPerG, null, policy.ownRepeatabilityMinDof)
  const uStd = policy.standardCertifiedUncertaintyJPerG / policy.standardCertifiedCoverageFactor
  const extraTerms: ExtraTerm[] = [
    // ε is proportional to the standard's value: ∂q/∂q_std = (θ/m)·(ε/q_std).
    { quantity: 'certified value of the standard', unit: 'J/g', sensitivity: (theta / mass) * (ee.valueJPerK / policy.standardCertifiedValueJPerG), standardUncertainty: uStd },
    // The run-to-run scatter of a determination, added to q with c = 1 (JCGM 100:2008 §4.2; ISO 5725-6 s_r = r/2.8).
    { quantity: `repeatability (${rep.source === 'lab-duplicates' ? 'lab duplicates' : 'method r/2.8'})`, unit: 'J/g', sensitivity: 1, standardUncertainty: rep.standardDeviationJPerG },
  ]
  const budget = calorificValueUncertainty({
    energyEquivalentJPerK: { value: ee.valueJPerK, standardUncertainty: uEps },
    temperatureRiseK: { value: theta, standardUncertainty: uTheta },
    sampleMassG: { value: mass, standardUncertainty: inputs.uncertainty?.sampleMassG ?? DEFAULT_U_MASS_G },
    corrections: estimates,
    extraTerms,
  })
  notes.unshift({
    figure: 'Gross calorific value at constant volume, as determined',
    formula: `q_v,gr = (ε·θ − e_fuse − e_acid − e_S${corr.chlorineJ > 0 ? ' − e_Cl' : ''} − e_aid) / m`,
    source: 'ASTM D5865; ISO 1928',
    inputs: [
      { label: 'ε (accepted)', value: round(ee.valueJPerK, 2), unit: 'J/K' },
      { label: 'θ', value: round(theta, 5), unit: 'K' },
      { label: 'm', value: mass, unit: 'g' },
      { label: 'Σ corrections', value: round(sumE, 2), unit: 'J' },
    ],
  }, {
    figure: 'Uncertainty',
    formula: 'u_c² = Σ (c_i·u(x_i))² over ε, θ, m, the corrections, the standard\'s certified value and the repeatability s_r; U = k·u_c, k = 2; u(ε) = s/√n of the accepted series',
    source: `JCGM 100:2008 (GUM); s_r from ${rep.basis}`,
    inputs: budget.contributions.map(c => ({ label: c.quantity, value: round(c.contributionJPerG, 2), unit: 'J/g' })),
  })

  const bases = basesAndNet(gross, budget.combinedStandardUncertaintyJPerG, analysis, corr.sulfurPct, missing, notes)
  let check: ResultValues['check'] = null
  if (kind === 'check') {
    const deviationPct = (100 * (gross - certified!)) / certified!
    check = { certifiedJPerG: certified!, deviationPct, tolerancePct: policy.checkRunTolerancePct, passed: Math.abs(deviationPct) <= policy.checkRunTolerancePct }
  }
  return {
    ...common,
    energyEquivalent: { id: ee.id, valueJPerK: ee.valueJPerK, standardUncertaintyJPerK: uEps, acceptedAt: new Date(ee.acceptedAt).toISOString() },
    energyEquivalentJPerK: null, energyReleasedJ: null,
    grossJPerG: bases.grossJPerG, netConstantPressureJPerG: bases.netP, netConstantVolumeJPerG: bases.netV,
    uncertainty: budget, expandedUncertaintyByBasis: bases.expanded, repeatabilityJPerG: rep.standardDeviationJPerG, mineralMatterFree: bases.mmf, check,
  }
}
