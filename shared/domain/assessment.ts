// Charge assessment: heat, oxygen, peak bound, screening and vessel state turned into findings and a verdict.
import { z } from 'zod'
import {
  type AtomCounts,
  type Composition,
  asFiredFractions,
  compositionFromFormula,
  CompositionError,
  compositionProblems,
} from './composition'
import { chooseHeatingValue, type CorrelationEstimate, type HeatingValueSource, type WireType } from './heating-value'
import { combustionPerGram, fillGaugeForOxygenMol, oxygenDemandFromHeatMol, vesselGas } from './oxygen'
import { type GasAmounts, GAS_SPECIES, peakPressureBound, type ProofCharge, proofChargeBound } from './peak-pressure'
import type { LabPolicy } from './policy'
import {
  type DeclaredHazard,
  type ExplosophoreGroup,
  EXPLOSOPHORE_GROUPS,
  oxidiserFractionPct,
  type ScreeningResult,
  screenComponent,
} from './screening'
import type { StructureAnalysis } from './structure'
import type { VesselState } from './vessel-state'

// ───────────────────────────── public contract (DESIGN §6, POST /api/assess) ─────────────────────────────

export type VesselClass = 'standard' | 'high-strength'
// The vessel's states are those of the one state function (DESIGN.md §5).
export type { VesselState }
export type ComponentRole = 'sample' | 'aid' | 'fuse'
export type RunRole = 'sample' | 'standardisation' | 'check'
export type Severity = 'block' | 'approval' | 'info'
export type Verdict = 'clear' | 'needs-approval' | 'blocked'

export interface VesselInput {
  ratedEnergyJ: number
  maxChargeMassG: number
  /** Gauge. */
  maxFillPressureMPa: number
  volumeMl: number
  class: VesselClass
  state?: VesselState
  name?: string
  proofCharge?: ProofCharge
}

export interface ChargeComponentInput {
  role: ComponentRole
  massG?: number
  lengthCm?: number
  wire?: WireType
  heatingValueJPerG?: number
  formula?: string
  smiles?: string
  composition?: Composition
  declaredHazard?: DeclaredHazard
  decompositionEnergyJPerG?: number
  name?: string
  /** Density for the free-volume estimate; the policy value (1 g/mL, common practice) when absent. */
  densityGPerMl?: number
  /** Set by the server when the heating value was filled in from a material record. */
  heatingValueFrom?: 'declared' | 'material'
}

/** Chemistry derived from a formula or a structure by resolveComponents. */
export interface ResolvedChemistry {
  source: 'formula' | 'structure'
  formula: string
  atoms: AtomCounts
  molarMassGPerMol: number
  composition: Composition
  /** Present only when a structure was searched. */
  explosophores?: ExplosophoreGroup[]
}

export interface ResolvedComponent extends ChargeComponentInput {
  resolved?: ResolvedChemistry
}

export interface ChargeInput {
  vessel: VesselInput
  /** Gauge, as read on the regulator. */
  fillPressureMPa: number
  temperatureC?: number
  waterMl?: number
  components: ResolvedComponent[]
  standardEnergyJ?: number
  runRole?: RunRole
}

export interface Finding {
  code: FindingCode
  severity: Severity
  message: string
  data?: Record<string, unknown>
}

export interface ComponentAssessment {
  /** Null for a fuse wire, whose energy goes by length. */
  heatingValueJPerG: number | null
  heatingValueSource: HeatingValueSource
  heatReleaseJ: number
  /** Negative when the component releases oxygen. */
  oxygenDemandMol: number
  oxygenBalancePct?: number
  screening?: ScreeningResult
}

export interface Suggestions {
  /** Largest total sample mass that raises no block; null without a sample. */
  maxSampleMassG: number | null
  /** Mass releasing the target energy within the approval limits; null when none can. */
  targetSampleMassG: number | null
  /** Gauge fill giving the approval oxygen excess; null when the charge needs no oxygen. */
  fillPressureForExcessMPa: number | null
  /** Benzoic acid to add to a weak sample. */
  aidMassG?: number
}

export interface MethodNote {
  figure: string
  formula: string
  source: string
  inputs: Record<string, number | string>
}

export interface Assessment {
  verdict: Verdict
  heatReleaseJ: number
  oxygenDemandMol: number
  oxygenAvailableMol: number
  /** available / demand; null when the charge needs no oxygen. */
  oxygenExcess: number | null
  /** Absolute. */
  peakPressureBoundMPa: number
  /** Absolute. */
  proofPeakPressureBoundMPa: number
  components: ComponentAssessment[]
  findings: Finding[]
  suggestions: Suggestions
  notes: MethodNote[]
}

/** Stable finding codes with their severity, for the docs and the interface (DESIGN §3 findings table). */
export const FINDING_CODES = {
  'vessel-overdue': { severity: 'block', description: 'The vessel is overdue for routine service.' },
  'vessel-requalification-due': { severity: 'block', description: 'The vessel is due for requalification.' },
  'vessel-locked-out': { severity: 'block', description: 'The vessel is locked out after an incident or damage.' },
  'vessel-away': { severity: 'block', description: 'The vessel is away for requalification.' },
  'vessel-retired': { severity: 'block', description: 'The vessel is retired.' },
  'vessel-awaiting-verification': { severity: 'block', description: 'After service only a benzoic-acid standardisation or check run may be fired until a check run passes.' },
  'energy-over-rating': { severity: 'block', description: 'Heat release above the vessel rating.' },
  'mass-over-maximum': { severity: 'block', description: 'Charge mass (sample + aid) above the vessel maximum.' },
  'fill-over-maximum': { severity: 'block', description: 'Oxygen fill above the vessel maximum.' },
  'oxygen-insufficient': { severity: 'block', description: 'Oxygen excess below the policy minimum: combustion cannot complete.' },
  'energetic-in-standard-vessel': { severity: 'block', description: 'Energetic material in a standard vessel.' },
  'peak-over-proof': { severity: 'block', description: 'Peak-pressure bound above the bound of the vessel proof charge.' },
  'energy-near-rating': { severity: 'approval', description: 'Heat release above the approval fraction of the vessel rating.' },
  'oxygen-low': { severity: 'approval', description: 'Oxygen excess below the approval level.' },
  'fill-outside-window': { severity: 'approval', description: 'Oxygen fill outside the method window.' },
  'heating-value-unknown': { severity: 'approval', description: 'No heating value or composition: the conservative policy value was used.' },
  'composition-outside-correlation': { severity: 'approval', description: 'Composition outside the validity range of the heating-value correlation.' },
  'composition-unresolved': { severity: 'approval', description: 'A formula or structure was given but not yet resolved.' },
  'energetic-in-high-strength-vessel': { severity: 'approval', description: 'Energetic material in a high-strength vessel.' },
  'energetic-unclearable-formula': { severity: 'approval', description: 'A formula with N and O and oxygen balance above the limit that the screen cannot clear without a structure.' },
  'service-due-soon': { severity: 'info', description: 'The vessel is due for service within the policy margin of its interval.' },
  'energy-far-from-standard': { severity: 'info', description: 'Heat release far from the standardisation energy.' },
  'suggested-mass': { severity: 'info', description: 'No sample mass given: the charge was assessed at the suggested mass.' },
  'weak-sample-aid': { severity: 'info', description: 'The sample releases little heat: a benzoic-acid combustion aid is suggested.' },
  'oxidiser-mixture': { severity: 'info', description: 'A declared oxidiser and its share of the charge against the screening limit.' },
  'screen-cleared': { severity: 'info', description: 'An explosophore or N+O formula was found but the screen clears it.' },
} as const satisfies Record<string, { severity: Severity; description: string }>

export type FindingCode = keyof typeof FINDING_CODES

export interface InputIssue {
  path: (string | number)[]
  message: string
}

/** Thrown for input that cannot be assessed at all (negative masses, impossible compositions, bad formulas). */
export class ChargeInputError extends Error {
  readonly issues: InputIssue[]
  constructor(issues: InputIssue[]) {
    super(issues.map(i => `${i.path.join('.')}: ${i.message}`).join('; '))
    this.name = 'ChargeInputError'
    this.issues = issues
  }
}

// ───────────────────────────── zod schema of the request body ─────────────────────────────

const compositionSchema = z
  .object({
    C: z.number().min(0).max(100).optional(),
    H: z.number().min(0).max(100).optional(),
    N: z.number().min(0).max(100).optional(),
    S: z.number().min(0).max(100).optional(),
    O: z.number().min(0).max(100).optional(),
    Cl: z.number().min(0).max(100).optional(),
    ash: z.number().min(0).max(100).optional(),
    moisture: z.number().min(0).max(100).optional(),
    basis: z.enum(['dry', 'as-received', 'air-dried']).optional(),
  })
  .refine(c => compositionProblems(c).length === 0, { message: 'The composition parts add up to more than 100 %' })

const componentSchema = z.object({
  role: z.enum(['sample', 'aid', 'fuse']),
  massG: z.number().min(0).max(1000).optional(),
  lengthCm: z.number().min(0).max(1000).optional(),
  wire: z.enum(['nichrome', 'iron', 'platinum', 'cotton']).optional(),
  heatingValueJPerG: z.number().min(0).max(200000).optional(),
  formula: z.string().trim().min(1).max(200).optional(),
  smiles: z.string().trim().min(1).max(2000).optional(),
  composition: compositionSchema.optional(),
  declaredHazard: z.enum(['none', 'energetic', 'oxidiser']).optional(),
  decompositionEnergyJPerG: z.number().min(0).max(100000).optional(),
  name: z.string().max(200).optional(),
  densityGPerMl: z.number().min(0.05).max(25).optional(),
  heatingValueFrom: z.enum(['declared', 'material']).optional(),
})

const proofChargeSchema = z.object({
  massG: z.number().positive().max(100),
  heatingValueJPerG: z.number().positive().max(200000),
  fillPressureMPa: z.number().positive().max(50),
})

export const vesselInputSchema = z.object({
  ratedEnergyJ: z.number().positive().max(1e7),
  maxChargeMassG: z.number().positive().max(1000),
  maxFillPressureMPa: z.number().positive().max(50),
  volumeMl: z.number().positive().max(100000),
  class: z.enum(['standard', 'high-strength']),
  state: z
    .enum(['in-service', 'service-due', 'overdue', 'requalification-due', 'locked-out', 'away', 'awaiting-verification', 'retired'])
    .optional(),
  name: z.string().max(200).optional(),
  proofCharge: proofChargeSchema.optional(),
})

/**
 * Request body of POST /api/assess (DESIGN §6) without vesselId, which the route resolves. Unknown keys such as
 * `resolved` are stripped, so a caller cannot supply its own screening result: run resolveComponents after parsing.
 */
export const chargeInputSchema = z.object({
  vessel: vesselInputSchema,
  fillPressureMPa: z.number().min(0).max(50),
  temperatureC: z.number().min(-20).max(60).optional(),
  waterMl: z.number().min(0).max(100).optional(),
  components: z.array(componentSchema).min(1).max(20),
  standardEnergyJ: z.number().positive().max(1e7).optional(),
  runRole: z.enum(['sample', 'standardisation', 'check']).optional(),
})

// ───────────────────────────── resolution (async; lazy chemistry libraries) ─────────────────────────────

const RESOLVE_CACHE_LIMIT = 500
const resolveCache = new Map<string, Promise<ResolvedChemistry>>()

function cached(key: string, make: () => Promise<ResolvedChemistry>): Promise<ResolvedChemistry> {
  const hit = resolveCache.get(key)
  if (hit) return hit
  if (resolveCache.size >= RESOLVE_CACHE_LIMIT) resolveCache.clear()
  const promise = make()
  resolveCache.set(key, promise)
  promise.catch(() => resolveCache.delete(key))
  return promise
}

function fromStructure(analysis: StructureAnalysis): ResolvedChemistry {
  return {
    source: 'structure',
    formula: analysis.formula,
    atoms: analysis.atoms,
    molarMassGPerMol: analysis.molarMassGPerMol,
    composition: analysis.composition,
    explosophores: analysis.explosophores,
  }
}

function sameAtoms(a: AtomCounts, b: AtomCounts): boolean {
  const keys = new Set([...Object.keys(a), ...Object.keys(b)])
  for (const k of keys) if (Math.abs((a[k] ?? 0) - (b[k] ?? 0)) > 1e-9) return false
  return true
}

/**
 * Turns each formula (mf-parser) or SMILES (openchemlib) into atoms, composition and explosophores; both
 * libraries load on first need. Any `resolved` already on a component is replaced. Throws ChargeInputError.
 */
export async function resolveComponents<T extends ChargeComponentInput>(components: readonly T[]): Promise<(T & { resolved?: ResolvedChemistry })[]> {
  const issues: InputIssue[] = []
  const attempt = async (path: (string | number)[], work: () => Promise<ResolvedChemistry>): Promise<ResolvedChemistry | undefined> => {
    try {
      return await work()
    }
    catch (error) {
      if (!(error instanceof CompositionError)) throw error
      issues.push({ path, message: error.message })
      return undefined
    }
  }
  const out = await Promise.all(
    components.map(async (component, index) => {
      // A caller's own `resolved` is never trusted: it is replaced or dropped.
      const base: T & { resolved?: ResolvedChemistry } = { ...component }
      delete base.resolved
      const smiles = component.smiles?.trim() || undefined
      const formula = component.formula?.trim() || undefined
      const fromStructureText = smiles
        ? await attempt(['components', index, 'smiles'], () => cached(`s:${smiles}`, async () => {
            const { analyseStructure } = await import('./structure')
            return fromStructure(analyseStructure(smiles))
          }))
        : undefined
      const fromFormulaText = formula
        ? await attempt(['components', index, 'formula'], () => cached(`f:${formula}`, async () => ({ source: 'formula', ...(await compositionFromFormula(formula)) })))
        : undefined
      if (fromStructureText && fromFormulaText && !sameAtoms(fromFormulaText.atoms, fromStructureText.atoms)) {
        issues.push({ path: ['components', index, 'formula'], message: `Formula ${formula} does not match the structure, which is ${fromStructureText.formula}` })
      }
      const resolved = fromStructureText ?? fromFormulaText
      if (resolved) base.resolved = resolved
      return base
    }),
  )
  if (issues.length > 0) throw new ChargeInputError(issues)
  return out
}

/** Resolves formulas and structures, then assesses the charge (DESIGN §3). */
export async function assess(input: ChargeInput, policy: LabPolicy): Promise<Assessment> {
  return assessCharge({ ...input, components: await resolveComponents(input.components) }, policy)
}

// ───────────────────────────── charge model ─────────────────────────────

interface ComponentModel {
  index: number
  role: ComponentRole
  label: string
  /** Counts to the charge mass and volume (sample and aid; never the fuse). */
  inCharge: boolean
  massG: number
  massGiven: boolean
  heatPerG: number
  demandPerG: number
  productsPerG: GasAmounts
  volumePerG: number
  fixedHeatJ: number
  fixedDemandMol: number
  heatingValueJPerG: number | null
  source: HeatingValueSource
  estimate: CorrelationEstimate | undefined
  compositionFrom: 'given' | 'derived' | undefined
  demandFrom: 'composition' | 'heat'
  screening: ScreeningResult | undefined
  unresolved: boolean
  declaredHazard: DeclaredHazard | undefined
}

// Products of an unknown fuel taken as those of (CH2)n: 1.5 O2 → 1 CO2 + 1 H2O (common practice assumption).
function productsFromDemand(demandMol: number): GasAmounts {
  return { CO2: (2 / 3) * demandMol, H2O: (2 / 3) * demandMol }
}

function labelOf(c: ChargeComponentInput, index: number): string {
  return c.name ? `'${c.name}'` : `${c.role} ${index + 1}`
}

function validate(input: ChargeInput): void {
  const issues: InputIssue[] = []
  const positive = (v: number | undefined, path: (string | number)[]) => {
    if (v === undefined || !Number.isFinite(v) || v <= 0) issues.push({ path, message: 'must be a positive number' })
  }
  const nonNegative = (v: number | undefined, path: (string | number)[]) => {
    if (v !== undefined && (!Number.isFinite(v) || v < 0)) issues.push({ path, message: 'must be zero or more' })
  }
  positive(input.vessel.ratedEnergyJ, ['vessel', 'ratedEnergyJ'])
  positive(input.vessel.maxChargeMassG, ['vessel', 'maxChargeMassG'])
  positive(input.vessel.maxFillPressureMPa, ['vessel', 'maxFillPressureMPa'])
  positive(input.vessel.volumeMl, ['vessel', 'volumeMl'])
  if (input.vessel.proofCharge) {
    positive(input.vessel.proofCharge.massG, ['vessel', 'proofCharge', 'massG'])
    positive(input.vessel.proofCharge.heatingValueJPerG, ['vessel', 'proofCharge', 'heatingValueJPerG'])
    positive(input.vessel.proofCharge.fillPressureMPa, ['vessel', 'proofCharge', 'fillPressureMPa'])
  }
  if (!Number.isFinite(input.fillPressureMPa) || input.fillPressureMPa < 0) {
    issues.push({ path: ['fillPressureMPa'], message: 'must be zero or more (MPa gauge)' })
  }
  nonNegative(input.waterMl, ['waterMl'])
  if (input.temperatureC !== undefined && !(input.temperatureC > -50 && input.temperatureC < 100)) {
    issues.push({ path: ['temperatureC'], message: 'must be a laboratory temperature in °C' })
  }
  if (input.standardEnergyJ !== undefined) positive(input.standardEnergyJ, ['standardEnergyJ'])
  if (input.components.length === 0) issues.push({ path: ['components'], message: 'a charge needs at least one component' })
  input.components.forEach((c, i) => {
    nonNegative(c.massG, ['components', i, 'massG'])
    nonNegative(c.lengthCm, ['components', i, 'lengthCm'])
    nonNegative(c.heatingValueJPerG, ['components', i, 'heatingValueJPerG'])
    nonNegative(c.decompositionEnergyJPerG, ['components', i, 'decompositionEnergyJPerG'])
    if (c.densityGPerMl !== undefined) positive(c.densityGPerMl, ['components', i, 'densityGPerMl'])
    // Without its length a metal wire would be priced by mass at the cotton value: refuse rather than guess.
    if (c.role === 'fuse' && c.wire !== undefined && c.wire !== 'cotton' && c.lengthCm === undefined && c.heatingValueJPerG === undefined) {
      issues.push({ path: ['components', i, 'lengthCm'], message: `a ${c.wire} fuse wire needs its burnt length in cm` })
    }
    if (c.composition) {
      for (const problem of compositionProblems(c.composition)) issues.push({ path: ['components', i, 'composition'], message: problem })
    }
  })
  if (issues.length > 0) throw new ChargeInputError(issues)
}

function buildComponent(c: ResolvedComponent, index: number, policy: LabPolicy): ComponentModel {
  // Built as one flat object of fixed shape: this runs on every keystroke in the browser.
  const model: ComponentModel = {
    index,
    role: c.role,
    label: labelOf(c, index),
    inCharge: c.role !== 'fuse',
    massG: c.massG ?? 0,
    massGiven: c.massG !== undefined,
    heatPerG: 0,
    demandPerG: 0,
    productsPerG: {},
    volumePerG: 1 / (c.densityGPerMl ?? policy.sampleDensityGPerMl),
    fixedHeatJ: 0,
    fixedDemandMol: 0,
    heatingValueJPerG: null,
    source: 'declared',
    estimate: undefined,
    compositionFrom: undefined,
    demandFrom: 'heat',
    screening: undefined,
    unresolved: (c.formula !== undefined || c.smiles !== undefined) && c.resolved === undefined,
    declaredHazard: c.declaredHazard,
  }

  if (c.role === 'fuse' && c.wire !== 'cotton' && c.lengthCm !== undefined && c.heatingValueJPerG === undefined) {
    // A wire of unknown type is priced at the highest J/cm of the burnable wires (conservative).
    const jPerCm = c.wire ? policy.fuseWireJPerCm[c.wire] : Math.max(policy.fuseWireJPerCm.nichrome, policy.fuseWireJPerCm.iron)
    model.massG = 0
    model.fixedHeatJ = c.lengthCm * jPerCm
    // The metal oxide is solid: the wire takes oxygen (Huggett estimate, negligible) and adds no gas.
    model.fixedDemandMol = oxygenDemandFromHeatMol(model.fixedHeatJ)
    model.source = 'fuse-wire'
    return model
  }

  const derived = c.resolved?.composition
  if (c.role === 'fuse' && c.heatingValueJPerG === undefined) {
    model.heatPerG = policy.cottonJPerG
    model.source = 'cotton'
  }
  else {
    const choice = chooseHeatingValue(
      { heatingValueJPerG: c.heatingValueJPerG, heatingValueFrom: c.heatingValueFrom, composition: c.composition, derivedComposition: derived },
      policy,
    )
    model.heatPerG = choice.jPerG
    model.source = choice.source
    model.estimate = choice.estimate
    model.compositionFrom = choice.compositionFrom
  }
  model.heatingValueJPerG = model.heatPerG

  const demandComposition = c.role === 'fuse' ? undefined : (c.composition ?? derived)
  if (demandComposition) {
    const per = combustionPerGram(asFiredFractions(demandComposition))
    model.demandPerG = per.oxygenDemandMol
    model.productsPerG = { CO2: per.co2Mol, H2O: per.h2oMol, SO2: per.so2Mol, HCl: per.hclMol, N2: per.n2Mol }
    model.demandFrom = 'composition'
  }
  else {
    model.demandPerG = oxygenDemandFromHeatMol(model.heatPerG)
    model.productsPerG = productsFromDemand(model.demandPerG)
  }

  if (c.role !== 'fuse') {
    const r = c.resolved
    model.screening = screenComponent(
      {
        declaredHazard: c.declaredHazard,
        groups: r?.explosophores,
        atoms: r?.atoms,
        molarMassGPerMol: r?.molarMassGPerMol,
        decompositionEnergyJPerG: c.decompositionEnergyJPerG,
      },
      policy,
    )
  }
  return model
}

/** Everything about the charge that is linear in the total sample mass m. */
interface ChargeModel {
  components: ComponentModel[]
  hasSample: boolean
  sampleMassMissing: boolean
  /** Share of each sample component in the sample mass (index → share). */
  shares: Map<number, number>
  fixed: { heatJ: number; demandMol: number; products: GasAmounts; massG: number; volumeMl: number; sampleAidHeatJ: number }
  perSampleGram: { heatJ: number; demandMol: number; products: GasAmounts; volumeMl: number }
  baseSampleMassG: number
  geometry: { volumeMl: number; waterMl: number; temperatureC: number }
  o2PerMl: number
  n2PerMl: number
  temperatureK: number
}

function addScaled(into: GasAmounts, from: GasAmounts, k: number): void {
  for (const species of GAS_SPECIES) {
    const v = from[species]
    if (v !== undefined && v !== 0) into[species] = (into[species] ?? 0) + v * k
  }
}

function buildModel(input: ChargeInput, policy: LabPolicy): ChargeModel {
  const components = input.components.map((c, i) => buildComponent(c, i, policy))
  const samples = components.filter(c => c.role === 'sample')
  const sampleMassMissing = samples.length > 0 && samples.every(c => !c.massGiven)
  const baseSampleMassG = samples.reduce((s, c) => s + c.massG, 0)
  const shares = new Map<number, number>()
  for (const c of samples) shares.set(c.index, baseSampleMassG > 0 ? c.massG / baseSampleMassG : 1 / samples.length)

  const fixed = { heatJ: 0, demandMol: 0, products: {} as GasAmounts, massG: 0, volumeMl: 0, sampleAidHeatJ: 0 }
  const perSampleGram = { heatJ: 0, demandMol: 0, products: {} as GasAmounts, volumeMl: 0 }
  for (const c of components) {
    if (c.role === 'sample') {
      const share = shares.get(c.index) ?? 0
      perSampleGram.heatJ += share * c.heatPerG
      perSampleGram.demandMol += share * c.demandPerG
      perSampleGram.volumeMl += share * c.volumePerG
      addScaled(perSampleGram.products, c.productsPerG, share)
    }
    else {
      fixed.heatJ += c.fixedHeatJ + c.massG * c.heatPerG
      fixed.demandMol += c.fixedDemandMol + c.massG * c.demandPerG
      addScaled(fixed.products, c.productsPerG, c.massG)
      if (c.inCharge) {
        fixed.massG += c.massG
        fixed.volumeMl += c.massG * c.volumePerG
        fixed.sampleAidHeatJ += c.massG * c.heatPerG
      }
    }
  }
  const geometry = {
    volumeMl: input.vessel.volumeMl,
    waterMl: input.waterMl ?? policy.waterMl,
    temperatureC: input.temperatureC ?? policy.labTemperatureC,
  }
  // O2 and N2 scale with the free volume at a given fill and temperature, so one evaluation gives both per mL.
  const empty = vesselGas({ ...geometry, chargeVolumeMl: 0, fillGaugeMPa: input.fillPressureMPa })
  return {
    components,
    hasSample: samples.length > 0,
    sampleMassMissing,
    shares,
    fixed,
    perSampleGram,
    baseSampleMassG,
    geometry,
    o2PerMl: empty.oxygenMol / empty.freeVolumeMl,
    n2PerMl: empty.nitrogenMol / empty.freeVolumeMl,
    temperatureK: empty.temperatureK,
  }
}

interface ChargeState {
  heatJ: number
  demandMol: number
  chargeMassG: number
  freeVolumeMl: number
  oxygenMol: number
  nitrogenMol: number
  products: GasAmounts
}

function stateAt(model: ChargeModel, m: number): ChargeState {
  const products: GasAmounts = {}
  addScaled(products, model.fixed.products, 1)
  addScaled(products, model.perSampleGram.products, m)
  const freeVolumeMl = model.geometry.volumeMl - model.geometry.waterMl - model.fixed.volumeMl - m * model.perSampleGram.volumeMl
  return {
    heatJ: model.fixed.heatJ + m * model.perSampleGram.heatJ,
    demandMol: model.fixed.demandMol + m * model.perSampleGram.demandMol,
    chargeMassG: model.fixed.massG + m,
    freeVolumeMl,
    oxygenMol: model.o2PerMl * freeVolumeMl,
    nitrogenMol: model.n2PerMl * freeVolumeMl,
    products,
  }
}

function peakAt(model: ChargeModel, m: number) {
  const s = stateAt(model, m)
  return peakPressureBound({
    initialGas: { O2: s.oxygenMol, N2: s.nitrogenMol },
    oxygenConsumedMol: s.demandMol,
    products: s.products,
    heatJ: s.heatJ,
    freeVolumeMl: s.freeVolumeMl,
    initialTemperatureK: model.temperatureK,
  })
}

// ───────────────────────────── mass limits ─────────────────────────────

/** Largest sample mass with Q ≤ energy (Q linear in m: Q = Q_fixed + m·q). */
function energyLimit(model: ChargeModel, energyJ: number): number {
  const q = model.perSampleGram.heatJ
  const room = energyJ - model.fixed.heatJ
  if (q <= 0) return room >= 0 ? Infinity : 0
  return room / q
}

function massLimit(model: ChargeModel, maxChargeMassG: number): number {
  return maxChargeMassG - model.fixed.massG
}

/** Largest sample mass with available/demand ≥ ratio; both are linear in m (free volume shrinks by m/density). */
function oxygenLimit(model: ChargeModel, ratio: number): number {
  const v0 = model.geometry.volumeMl - model.geometry.waterMl - model.fixed.volumeMl
  const numerator = model.o2PerMl * v0 - ratio * model.fixed.demandMol
  const denominator = model.o2PerMl * model.perSampleGram.volumeMl + ratio * model.perSampleGram.demandMol
  if (denominator <= 0) return numerator >= 0 ? Infinity : 0
  return numerator / denominator
}

/** Largest sample mass in [0, upper] whose peak bound stays at or below the proof bound (bisection). */
function peakLimit(model: ChargeModel, proofMPa: number, upper: number): number {
  const ceiling = Number.isFinite(upper) ? upper : 1000
  const free = (m: number) => stateAt(model, m).freeVolumeMl > 0
  if (free(ceiling) && peakAt(model, ceiling).pressureMPa <= proofMPa) return ceiling
  if (peakAt(model, 0).pressureMPa > proofMPa) return 0
  let lo = 0
  let hi = ceiling
  for (let i = 0; i < 40 && hi - lo > 1e-6; i++) {
    const mid = (lo + hi) / 2
    if (free(mid) && peakAt(model, mid).pressureMPa <= proofMPa) lo = mid
    else hi = mid
  }
  return lo
}

const floor2 = (x: number) => Math.floor(x * 100 + 1e-7) / 100
const ceil2 = (x: number) => Math.ceil(x * 100 - 1e-7) / 100

export interface SampleMassSuggestion {
  maxSampleMassG: number | null
  targetSampleMassG: number | null
  targetEnergyJ: number
  limitedBy: 'target' | 'energy' | 'mass' | 'oxygen' | 'peak' | 'none'
}

function suggestFromModel(model: ChargeModel, input: ChargeInput, policy: LabPolicy, proofMPa: number): SampleMassSuggestion {
  const targetEnergyJ = input.standardEnergyJ ?? policy.targetEnergyJ
  if (!model.hasSample) return { maxSampleMassG: null, targetSampleMassG: null, targetEnergyJ, limitedBy: 'none' }
  const v = input.vessel
  const hardCap = Math.min(energyLimit(model, v.ratedEnergyJ), massLimit(model, v.maxChargeMassG), oxygenLimit(model, policy.minOxygenExcess))
  const maxRaw = peakLimit(model, proofMPa, Math.max(0, hardCap))
  const caps: [SampleMassSuggestion['limitedBy'], number][] = [
    ['energy', energyLimit(model, policy.approvalEnergyFraction * v.ratedEnergyJ)],
    ['mass', massLimit(model, v.maxChargeMassG)],
    ['oxygen', oxygenLimit(model, policy.approvalOxygenExcess)],
  ]
  let limitedBy: SampleMassSuggestion['limitedBy'] = 'target'
  let target = model.perSampleGram.heatJ > 0 ? (targetEnergyJ - model.fixed.heatJ) / model.perSampleGram.heatJ : Infinity
  for (const [name, cap] of caps) {
    if (cap < target) {
      target = cap
      limitedBy = name
    }
  }
  if (target > maxRaw) {
    target = maxRaw
    limitedBy = 'peak'
  }
  const maxSampleMassG = Number.isFinite(maxRaw) ? Math.max(0, floor2(maxRaw)) : null
  const targetSampleMassG = Number.isFinite(target) && target > 0 ? floor2(target) : null
  return { maxSampleMassG, targetSampleMassG: targetSampleMassG === 0 ? null : targetSampleMassG, targetEnergyJ, limitedBy }
}

/**
 * Sample mass releasing the target energy (standardEnergyJ, else policy.targetEnergyJ) within the approval limits —
 * energy ≤ approvalEnergyFraction × rating, mass ≤ maximum, oxygen excess ≥ approvalOxygenExcess — and the hard
 * maximum; linear heat and oxygen balances (DESIGN §3), peak bound by bisection.
 */
export function suggestSampleMass(input: ChargeInput, policy: LabPolicy): SampleMassSuggestion {
  validate(input)
  const model = buildModel(input, policy)
  return suggestFromModel(model, input, policy, proofChargeBound(input.vessel, policy).pressureMPa)
}

/** Benzoic acid to add so that sample + aid release the weak-sample threshold, g = (threshold − Q)/q_BA (NIST SRM 39j q_BA); null when not weak. */
export function suggestAidMass(sampleAndAidHeatJ: number, policy: LabPolicy): number | null {
  if (sampleAndAidHeatJ >= policy.weakSampleMinHeatReleaseJ) return null
  return ceil2((policy.weakSampleMinHeatReleaseJ - sampleAndAidHeatJ) / policy.aidHeatingValueJPerG)
}

// ───────────────────────────── findings ─────────────────────────────

const kJ = (j: number) => `${(j / 1000).toFixed(1)} kJ`
const grams = (g: number) => `${g.toFixed(2)} g`
const mpa = (p: number) => `${p.toFixed(2)} MPa`
const pct = (x: number) => `${Math.round(x)} %`
const jPerG = (x: number) => `${Math.round(x).toLocaleString('en-US')} J/g`
// Comparisons allow for floating-point noise so a limit printed to 0.01 g passes when used.
const over = (value: number, limit: number) => value > limit * (1 + 1e-9) + 1e-12
const under = (value: number, limit: number) => value < limit * (1 - 1e-9) - 1e-12

function finding(code: FindingCode, message: string, data?: Record<string, unknown>): Finding {
  return data ? { code, severity: FINDING_CODES[code].severity, message, data } : { code, severity: FINDING_CODES[code].severity, message }
}

function reduceSampleTo(model: ChargeModel, limit: number): string {
  if (!model.hasSample) return 'reduce the combustion aid or the fuse'
  if (!(limit > 0.005)) return 'no sample mass passes with this aid and fuse: reduce the combustion aid'
  return `reduce the sample to ≤ ${grams(floor2(limit))}`
}

/** A fill advice inside the method window (never the arithmetic edge below it): the window's lower end, or the fill needed when higher. */
function fillInWindow(need: number, vesselMaxMPa: number, policy: LabPolicy): string {
  const low = policy.fillPressureWindowMinMPa
  const high = Math.min(policy.fillPressureWindowMaxMPa, vesselMaxMPa)
  if (need > high) return `raise the fill to ≥ ${mpa(need)} gauge (above the method window ${low.toFixed(2)}–${mpa(policy.fillPressureWindowMaxMPa)} gauge: a supervisor must approve)`
  return `fill to ${mpa(Math.max(need, low))} gauge or more, within the method window ${low.toFixed(2)}–${mpa(high)} gauge,`
}

const STATE_BLOCKS: Partial<Record<VesselState, { code: FindingCode; what: string }>> = {
  'overdue': { code: 'vessel-overdue', what: 'is overdue for routine service: record the service (all seals renewed, leak test, electrode check) before firing' },
  'requalification-due': { code: 'vessel-requalification-due', what: 'is due for requalification: send it away and record the requalification before firing' },
  'locked-out': { code: 'vessel-locked-out', what: 'is locked out: it may be fired again only after requalification and a return-to-service record' },
  'away': { code: 'vessel-away', what: 'is away for requalification: record its return to service before firing' },
  'retired': { code: 'vessel-retired', what: 'is retired: choose another vessel' },
}

function vesselFindings(input: ChargeInput, policy: LabPolicy): Finding[] {
  const v = input.vessel
  const name = v.name ? `Vessel ${v.name}` : 'The vessel'
  const state = v.state ?? 'in-service'
  const block = STATE_BLOCKS[state]
  if (block) return [finding(block.code, `${name} ${block.what}.`, { state })]
  if (state === 'awaiting-verification' && (input.runRole ?? 'sample') === 'sample') {
    return [finding('vessel-awaiting-verification', `${name} is awaiting verification after service: only a benzoic-acid check run may be fired until a check run passes.`, { state })]
  }
  if (state === 'service-due') {
    return [finding('service-due-soon', `${name} is due for service within ${policy.serviceDueMarginPct} % of its interval: plan a routine service.`, { state })]
  }
  return []
}

function screeningFindings(model: ChargeModel, input: ChargeInput, policy: LabPolicy, chargeMassG: number, massOf: (c: ComponentModel) => number): Finding[] {
  const out: Finding[] = []
  const standard = input.vessel.class === 'standard'
  const inCharge = model.components.filter(c => c.inCharge)
  const oxidiserPct = oxidiserFractionPct(inCharge.map(c => ({ massG: massOf(c), declaredHazard: c.declaredHazard })))
  const limit = policy.oxidiserFractionLimitPct
  const oxidiserEnergetic = oxidiserPct > limit
  const energeticReasons: { index: number; label: string; reasons: string[]; groups: ExplosophoreGroup[] }[] = []

  for (const c of inCharge) {
    const s = c.screening
    if (c.unresolved) {
      out.push(finding('composition-unresolved', `The formula or structure of ${c.label} has not been resolved yet: it cannot be screened; wait for the check to finish or have a supervisor approve.`, { component: c.index }))
    }
    if (!s) continue
    if (s.status === 'energetic') energeticReasons.push({ index: c.index, label: c.label, reasons: s.reasons, groups: s.groups })
    if (s.status === 'oxidiser') {
      const text = `Oxidiser ${c.label} is ${oxidiserPct.toFixed(1)} % of the charge mass (${grams(chargeMassG)})`
      out.push(finding(
        'oxidiser-mixture',
        oxidiserEnergetic
          ? `${text}, above the ${limit} % screening limit: the charge counts as energetic (UN Manual of Tests and Criteria, App. 6).`
          : `${text}, at or below the ${limit} % screening limit: the screen clears the mixture (UN Manual of Tests and Criteria, App. 6).`,
        { component: c.index, oxidiserPct, limitPct: limit },
      ))
      if (oxidiserEnergetic) energeticReasons.push({ index: c.index, label: c.label, reasons: [`inorganic oxidiser ${oxidiserPct.toFixed(1)} % of the charge, above ${limit} %`], groups: [] })
    }
    if (s.status === 'unclearable') {
      out.push(finding(
        'energetic-unclearable-formula',
        `${c.label}: ${s.reasons.join('; ')}. The screen cannot clear it: give its structure (SMILES) or a decomposition energy below ${policy.decompositionEnergyThresholdJPerG} J/g, or have a supervisor approve.`,
        { component: c.index, oxygenBalancePct: s.oxygenBalancePct },
      ))
    }
    if (s.status === 'cleared' && (s.clearedBy === 'oxygen-balance' || s.clearedBy === 'decomposition-energy')) {
      out.push(finding('screen-cleared', `${c.label}: ${s.reasons.join('; ')}; the screen clears it (UN Manual of Tests and Criteria, App. 6).`, { component: c.index, groups: s.groups }))
    }
  }

  for (const e of energeticReasons) {
    const groups = e.groups.map(g => EXPLOSOPHORE_GROUPS[g])
    const why = e.reasons.join('; ')
    if (standard) {
      out.push(finding('energetic-in-standard-vessel', `${e.label} screens as energetic (${why}): never in a standard vessel; use a high-strength vessel rated for energetic material.`, { component: e.index, groups }))
    }
    else {
      out.push(finding('energetic-in-high-strength-vessel', `${e.label} screens as energetic (${why}): firing it in this high-strength vessel needs a supervisor's approval.`, { component: e.index, groups }))
    }
  }
  return out
}

// ───────────────────────────── the assessment ─────────────────────────────

const VERDICT_OF: Record<Severity, Verdict> = { block: 'blocked', approval: 'needs-approval', info: 'clear' }

/**
 * Assesses one charge whose formulas and structures are already resolved (DESIGN §3): heat release, oxygen
 * demand and availability, the peak-pressure bound against the proof-charge bound, energetic screening and the
 * vessel's state, as findings from the policy; the verdict is the worst severity. Throws ChargeInputError.
 */
export function assessCharge(input: ChargeInput, policy: LabPolicy): Assessment {
  validate(input)
  const v = input.vessel
  const model = buildModel(input, policy)
  const proof = proofChargeBound(v, policy)
  const suggestion = suggestFromModel(model, input, policy, proof.pressureMPa)

  const findings: Finding[] = []
  // A missing sample mass is assessed at the suggested one, so planning shows the charge it would become.
  const m = model.sampleMassMissing ? (suggestion.targetSampleMassG ?? 0) : model.baseSampleMassG
  const massOf = (c: ComponentModel) => (c.role === 'sample' ? m * (model.shares.get(c.index) ?? 0) : c.massG)
  const s = stateAt(model, m)
  if (!(s.freeVolumeMl > 0)) {
    throw new ChargeInputError([{ path: ['components'], message: `the charge and ${model.geometry.waterMl} mL of water leave no gas volume in a ${v.volumeMl} mL vessel` }])
  }
  const peak = peakAt(model, m)
  const demand = s.demandMol
  const excess = demand > 0 ? s.oxygenMol / demand : null
  const geometry = { ...model.geometry, chargeVolumeMl: model.geometry.volumeMl - model.geometry.waterMl - s.freeVolumeMl }
  const fillFor = (ratio: number) => (demand > 0 ? ceil2(fillGaugeForOxygenMol(ratio * demand, geometry)) : null)

  findings.push(...vesselFindings(input, policy))
  findings.push(...screeningFindings(model, input, policy, s.chargeMassG, massOf))

  // Energy against the rating.
  if (over(s.heatJ, v.ratedEnergyJ)) {
    const limit = energyLimit(model, v.ratedEnergyJ)
    findings.push(finding('energy-over-rating', `Heat release ${kJ(s.heatJ)} exceeds the vessel rating of ${kJ(v.ratedEnergyJ)}: ${reduceSampleTo(model, limit)}.`, { heatReleaseJ: s.heatJ, ratedEnergyJ: v.ratedEnergyJ, maxSampleMassG: floor2(Math.max(0, limit)) }))
  }
  else if (over(s.heatJ, policy.approvalEnergyFraction * v.ratedEnergyJ)) {
    const threshold = policy.approvalEnergyFraction * v.ratedEnergyJ
    const limit = energyLimit(model, threshold)
    findings.push(finding('energy-near-rating', `Heat release ${kJ(s.heatJ)} is above ${pct(policy.approvalEnergyFraction * 100)} of the vessel rating (${kJ(threshold)} of ${kJ(v.ratedEnergyJ)}): a supervisor must approve, or ${reduceSampleTo(model, limit)}.`, { heatReleaseJ: s.heatJ, thresholdJ: threshold }))
  }

  // Charge mass (sample + aid, fuse excluded).
  if (over(s.chargeMassG, v.maxChargeMassG)) {
    findings.push(finding('mass-over-maximum', `Charge mass ${grams(s.chargeMassG)} (sample + aid) exceeds the vessel maximum of ${grams(v.maxChargeMassG)}: ${reduceSampleTo(model, massLimit(model, v.maxChargeMassG))}.`, { chargeMassG: s.chargeMassG, maxChargeMassG: v.maxChargeMassG }))
  }

  // Oxygen fill against the vessel and the method.
  if (over(input.fillPressureMPa, v.maxFillPressureMPa)) {
    findings.push(finding('fill-over-maximum', `Oxygen fill ${mpa(input.fillPressureMPa)} gauge exceeds the vessel maximum of ${mpa(v.maxFillPressureMPa)} gauge: fill to ≤ ${mpa(v.maxFillPressureMPa)} gauge.`, { fillPressureMPa: input.fillPressureMPa, maxFillPressureMPa: v.maxFillPressureMPa }))
  }
  if (under(input.fillPressureMPa, policy.fillPressureWindowMinMPa) || over(input.fillPressureMPa, policy.fillPressureWindowMaxMPa)) {
    findings.push(finding('fill-outside-window', `Oxygen fill ${mpa(input.fillPressureMPa)} gauge is outside the method window ${policy.fillPressureWindowMinMPa.toFixed(2)}–${mpa(policy.fillPressureWindowMaxMPa)} gauge: fill within the window, or a supervisor must approve.`, { fillPressureMPa: input.fillPressureMPa }))
  }

  // Oxygen excess.
  if (excess !== null && under(excess, policy.minOxygenExcess)) {
    const need = fillFor(policy.minOxygenExcess) ?? 0
    const limit = oxygenLimit(model, policy.minOxygenExcess)
    const raise = need <= v.maxFillPressureMPa
      ? `${fillInWindow(need, v.maxFillPressureMPa, policy)} or ${reduceSampleTo(model, limit)}`
      : `no fill up to the vessel maximum of ${mpa(v.maxFillPressureMPa)} gauge is enough (≥ ${mpa(need)} gauge needed): ${reduceSampleTo(model, limit)}`
    findings.push(finding('oxygen-insufficient', `Oxygen excess ${floor2(excess).toFixed(2)} is below ${policy.minOxygenExcess}: ${raise}.`, { oxygenExcess: excess, fillNeededMPa: need }))
  }
  else if (excess !== null && under(excess, policy.approvalOxygenExcess)) {
    const need = fillFor(policy.approvalOxygenExcess) ?? 0
    const limit = oxygenLimit(model, policy.approvalOxygenExcess)
    const raise = need <= Math.min(v.maxFillPressureMPa, policy.fillPressureWindowMaxMPa) ? `${fillInWindow(need, v.maxFillPressureMPa, policy)} or ${reduceSampleTo(model, limit)}` : reduceSampleTo(model, limit)
    findings.push(finding('oxygen-low', `Oxygen excess ${floor2(excess).toFixed(2)} is below ${policy.approvalOxygenExcess}: a supervisor must approve, or ${raise}.`, { oxygenExcess: excess, fillNeededMPa: need }))
  }

  // Peak bound against the proof charge's bound.
  if (over(peak.pressureMPa, proof.pressureMPa)) {
    const limit = peakLimit(model, proof.pressureMPa, m)
    findings.push(finding('peak-over-proof', `Peak-pressure bound ${mpa(peak.pressureMPa)} exceeds the bound of the vessel's proof charge (${mpa(proof.pressureMPa)}): ${reduceSampleTo(model, limit)}.`, { peakPressureBoundMPa: peak.pressureMPa, proofPeakPressureBoundMPa: proof.pressureMPa }))
  }

  // Heating values and their sources.
  for (const c of model.components) {
    if (!c.inCharge) continue
    if (c.source === 'policy-fallback') {
      findings.push(finding('heating-value-unknown', `No heating value or composition for ${c.label}: assessed with the conservative ${jPerG(policy.fallbackHeatingValueJPerG)}; give a measured value or a composition, or a supervisor must approve.`, { component: c.index }))
    }
    if (c.source === 'correlation' && c.estimate && c.estimate.violations.length > 0) {
      const out = c.estimate.violations.map(x => `${x.field} ${x.value.toFixed(2)} % outside ${x.min}–${x.max} %`).join(', ')
      findings.push(finding('composition-outside-correlation', `The composition of ${c.label} is outside the range of the Channiwala–Parikh correlation (${out}, dry basis): give a measured heating value, or a supervisor must approve.`, { component: c.index, violations: c.estimate.violations }))
    }
  }

  // Notes that need no action.
  if (model.sampleMassMissing && model.hasSample) {
    findings.push(finding('suggested-mass', suggestion.targetSampleMassG !== null
      ? `No sample mass given: assessed at the suggested ${grams(suggestion.targetSampleMassG)}, which releases about ${kJ(s.heatJ)} against a target of ${kJ(suggestion.targetEnergyJ)}.`
      : 'No sample mass given, and no sample mass passes with this aid, fuse and vessel.', { targetSampleMassG: suggestion.targetSampleMassG }))
  }
  const targetEnergyJ = suggestion.targetEnergyJ
  if (m > 0 && Math.abs(s.heatJ - targetEnergyJ) > policy.energyFarFromTargetFraction * targetEnergyJ) {
    const better = suggestion.targetSampleMassG !== null ? `; about ${grams(suggestion.targetSampleMassG)} of sample would come closer` : ''
    const offPct = ((s.heatJ - targetEnergyJ) / targetEnergyJ) * 100
    const what = input.standardEnergyJ !== undefined ? 'standardisation' : 'target'
    findings.push(finding('energy-far-from-standard', `Heat release ${kJ(s.heatJ)} is ${pct(Math.abs(offPct))} ${offPct < 0 ? 'below' : 'above'} the ${what} energy of ${kJ(targetEnergyJ)}${better}.`, { heatReleaseJ: s.heatJ, targetEnergyJ }))
  }
  const sampleAidHeatJ = model.fixed.sampleAidHeatJ + m * model.perSampleGram.heatJ
  const aidMassG = model.hasSample && m > 0 ? suggestAidMass(sampleAidHeatJ, policy) : null
  if (aidMassG !== null) {
    findings.push(finding('weak-sample-aid', `Sample and aid release only ${kJ(sampleAidHeatJ)} (below ${kJ(policy.weakSampleMinHeatReleaseJ)}): add about ${grams(aidMassG)} of benzoic acid as a combustion aid.`, { heatReleaseJ: sampleAidHeatJ, aidMassG }))
  }

  const worst = findings.some(f => f.severity === 'block') ? 'block' : findings.some(f => f.severity === 'approval') ? 'approval' : 'info'

  const components: ComponentAssessment[] = model.components.map((c) => {
    const mass = massOf(c)
    const out: ComponentAssessment = {
      heatingValueJPerG: c.heatingValueJPerG,
      heatingValueSource: c.source,
      heatReleaseJ: c.fixedHeatJ + mass * c.heatPerG,
      oxygenDemandMol: c.fixedDemandMol + mass * c.demandPerG,
    }
    if (c.screening?.oxygenBalancePct !== undefined) out.oxygenBalancePct = c.screening.oxygenBalancePct
    if (c.screening) out.screening = c.screening
    return out
  })

  const fillForExcess = fillFor(policy.approvalOxygenExcess)
  const suggestions: Suggestions = {
    maxSampleMassG: suggestion.maxSampleMassG,
    targetSampleMassG: suggestion.targetSampleMassG,
    fillPressureForExcessMPa: fillForExcess,
    ...(aidMassG !== null ? { aidMassG } : {}),
  }

  return {
    verdict: VERDICT_OF[worst],
    heatReleaseJ: s.heatJ,
    oxygenDemandMol: demand,
    oxygenAvailableMol: s.oxygenMol,
    oxygenExcess: excess,
    peakPressureBoundMPa: peak.pressureMPa,
    proofPeakPressureBoundMPa: proof.pressureMPa,
    components,
    findings,
    suggestions,
    notes: methodNotes(model, input, policy, { m, s, excess, peak, proof, massOf }),
  }
}

function methodNotes(
  model: ChargeModel,
  input: ChargeInput,
  policy: LabPolicy,
  r: { m: number; s: ChargeState; excess: number | null; peak: ReturnType<typeof peakAt>; proof: ReturnType<typeof proofChargeBound>; massOf: (c: ComponentModel) => number },
): MethodNote[] {
  const notes: MethodNote[] = []
  for (const c of model.components) {
    const inputs: Record<string, number | string> = { component: c.label, massG: r.massOf(c) }
    if (c.source === 'fuse-wire') {
      notes.push({ figure: `heat release of ${c.label}`, formula: 'Q = length × J/cm of the wire type', source: 'lab policy (the lab\'s own decision); platinum does not burn', inputs: { ...inputs, heatJ: c.fixedHeatJ } })
      continue
    }
    const formula = {
      'declared': 'Q = m × declared heating value',
      'material': 'Q = m × heating value of the material record',
      'correlation': 'HHV_d (MJ/kg) = 0.3491C + 1.1783H + 0.1005S − 0.1034O − 0.0151N − 0.0211A; HHV = HHV_d·(1 − M/100); Q = m × HHV',
      'policy-fallback': 'Q = m × conservative policy heating value',
      'cotton': 'Q = m × policy J/g of cotton',
      'fuse-wire': '',
    }[c.source]
    const source = {
      'declared': 'value given by the planner',
      'material': 'materials library',
      'correlation': `Channiwala & Parikh 2002, Fuel 81:1051 (composition ${c.compositionFrom === 'derived' ? 'from the formula or structure' : 'as given'})`,
      'policy-fallback': 'lab policy',
      'cotton': 'lab policy (the lab\'s own decision)',
      'fuse-wire': '',
    }[c.source]
    notes.push({ figure: `heating value of ${c.label}`, formula, source, inputs: { ...inputs, heatingValueJPerG: c.heatPerG } })
    notes.push(c.demandFrom === 'composition'
      ? { figure: `oxygen demand of ${c.label}`, formula: 'n(O2)/g = C/12.011 + H/4.032 + S/32.06 − O/31.998 (mass fractions; N → N2; Cl → HCl takes H)', source: 'stoichiometry, IUPAC atomic weights', inputs: { ...inputs, demandMolPerG: c.demandPerG } }
      : { figure: `oxygen demand of ${c.label}`, formula: 'n(O2) = Q / 13,100 J per g O2 / 31.998 g/mol (estimated from heat: no composition)', source: 'Huggett 1980, Fire and Materials 4:61', inputs: { ...inputs, demandMolPerG: c.demandPerG } })
  }
  notes.push({ figure: 'heat release', formula: 'Q = Σ mass × heating value (+ fuse wire length × J/cm)', source: 'sum over the charge: sample, aid, fuse (common practice)', inputs: { heatReleaseJ: r.s.heatJ, sampleMassG: r.m } })
  notes.push({
    figure: 'oxygen available',
    formula: 'n = P_abs·V/(Z·R·T) − 0.7905·n_air; V = vessel − water − charge/density; P_abs = gauge + 0.101325 MPa; n_air = 0.101325 MPa·V/(R·T)',
    source: 'virial equation of O2 (Tsonopoulos 1974; Orbey & Vera 1983; critical constants Schmidt & Wagner 1985); air composition ISO 2533',
    inputs: {
      fillPressureMPaGauge: input.fillPressureMPa,
      freeVolumeMl: r.s.freeVolumeMl,
      temperatureC: model.geometry.temperatureC,
      waterMl: model.geometry.waterMl,
      oxygenAvailableMol: r.s.oxygenMol,
      nitrogenFromAirMol: r.s.nitrogenMol,
    },
  })
  notes.push({ figure: 'oxygen excess', formula: 'excess = oxygen available / oxygen demand', source: 'ratio of the oxygen filled to the stoichiometric demand (common practice)', inputs: { oxygenDemandMol: r.s.demandMol, oxygenExcess: r.excess ?? 'no demand' } })
  notes.push({
    figure: 'peak-pressure bound',
    formula: 'Σ nᵢ[Uᵢ(T) − Uᵢ(T₀)] = Q − n(H2O)·ΔvapU; P = n·R·T/V (constant volume, adiabatic, complete combustion, ideal gas at the peak)',
    source: 'NASA Glenn polynomials, McBride, Zehe & Gordon 2002, NASA/TP-2002-211556; ΔvapU from CODATA key values',
    inputs: { peakTemperatureK: r.peak.temperatureK, peakPressureMPaAbsolute: r.peak.pressureMPa, gasMol: r.peak.totalMol },
  })
  const proofCharge = input.vessel.proofCharge
  notes.push({
    figure: 'proof-charge bound',
    formula: 'the same bound for the vessel proof charge of benzoic acid',
    source: proofCharge ? 'vessel record' : 'lab policy: 2 g benzoic acid at 40 atm gauge (ASTM E144 summaries)',
    inputs: {
      massG: proofCharge?.massG ?? policy.proofChargeMassG,
      fillPressureMPaGauge: proofCharge?.fillPressureMPa ?? policy.proofChargeFillPressureMPa,
      peakPressureMPaAbsolute: r.proof.pressureMPa,
      peakTemperatureK: r.proof.temperatureK,
    },
  })
  return notes
}
