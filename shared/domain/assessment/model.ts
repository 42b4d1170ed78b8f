// The charge model: every component's heat, oxygen and gas per gram, and the charge as a linear function of the sample mass.
import { asFiredFractions, compositionProblems } from '../composition'
import { type ElementFuel, elementFuel, elementsOutsideCorrelation, soleElement } from '../elements'
import { chooseHeatingValue, type CorrelationEstimate, type HeatingValueSource } from '../heating-value'
import { combustionPerGram, oxygenDemandFromHeatMol, vesselGas } from '../oxygen'
import { type GasAmounts, GAS_SPECIES, peakPressureBound } from '../peak-pressure'
import type { LabPolicy } from '../policy'
import { type DeclaredHazard, type ScreeningResult, screenComponent } from '../screening'
import { type ChargeComponentInput, type ChargeInput, ChargeInputError, type ComponentRole, type InputIssue, type ResolvedComponent } from './contract'

export interface ComponentModel {
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
  demandFrom: 'composition' | 'element' | 'heat'
  screening: ScreeningResult | undefined
  unresolved: boolean
  declaredHazard: DeclaredHazard | undefined
  /** A pure element burnt to its oxide (metal powder, boron, silicon, phosphorus). */
  elementFuel: ElementFuel | undefined
  /** Elements outside C, H, N, O, S, Cl that sent the heating value to the policy value. */
  otherElements: string[]
  fallbackReason: string | undefined
  /** Chlorine mass fraction as fired (0–1), from the composition, formula or the given share. */
  chlorineFraction: number
  /** Volatile by its boiling point or a known vapour pressure. */
  volatile: string | undefined
  containment: 'capsule' | 'tape' | undefined
}

// Products of an unknown fuel taken as those of (CH2)n: 1.5 O2 → 1 CO2 + 1 H2O (common practice assumption).
function productsFromDemand(demandMol: number): GasAmounts {
  return { CO2: (2 / 3) * demandMol, H2O: (2 / 3) * demandMol }
}

function labelOf(c: ChargeComponentInput, index: number): string {
  return c.name ? `'${c.name}'` : `${c.role} ${index + 1}`
}

/** Refuses input that cannot be assessed at all (ChargeInputError naming each field). */
export function validate(input: ChargeInput): void {
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
    elementFuel: undefined,
    otherElements: [],
    fallbackReason: undefined,
    chlorineFraction: 0,
    volatile: undefined,
    containment: undefined,
  }

  if (c.role === 'fuse' && c.wire !== 'cotton' && c.lengthCm !== undefined && c.heatingValueJPerG === undefined) {
    // A wire of unknown type is priced at the highest J/cm of the burnable wires (conservative).
    const jPerCm = c.wire ? policy.fuseWireJPerCm[c.wire] : Math.max(policy.fuseWireJPerCm.nichrome, policy.fuseWireJPerCm.iron)
    model.massG = 0
    model.fixedHeatJ = c.lengthCm * jPerCm
    // The metal oxide is solid: the wire takes oxygen (Huggett estimate, negligible) and adds no gas.
    model.fixedDemandMol = oxygenDemandFromHeatMol(model.fixedHeatJ, true)
    model.source = 'fuse-wire'
    return model
  }

  const derived = c.resolved?.composition
  const atoms = c.resolved?.atoms
  const element = atoms && c.role !== 'fuse' ? soleElement(atoms) : undefined
  const fuel = element ? elementFuel(element) : undefined
  const other = atoms && !fuel ? elementsOutsideCorrelation(atoms) : []
  model.otherElements = other
  if (c.role === 'fuse' && c.heatingValueJPerG === undefined) {
    model.heatPerG = policy.cottonJPerG
    model.source = 'cotton'
  }
  else if (fuel && c.heatingValueJPerG === undefined) {
    // A pure element burns to its oxide (NIST-JANAF formation enthalpy), never at the "ash" value of a composition.
    model.elementFuel = fuel
    model.heatPerG = fuel.heatingValueJPerG
    model.source = 'element-oxide'
  }
  else {
    // A formula with elements outside C, H, N, O, S, Cl is not priced by the correlation: the policy value instead.
    const usable = other.length > 0 ? undefined : derived
    const choice = chooseHeatingValue(
      { heatingValueJPerG: c.heatingValueJPerG, heatingValueFrom: c.heatingValueFrom, composition: c.composition, derivedComposition: usable },
      policy,
    )
    model.heatPerG = choice.jPerG
    model.source = choice.source
    model.estimate = choice.estimate
    model.compositionFrom = choice.compositionFrom
    model.fallbackReason = choice.fallbackReason ?? (other.length > 0 && choice.source === 'policy-fallback' ? `its formula holds ${other.join(', ')}, outside the C, H, N, O, S, Cl of the correlation` : undefined)
  }
  model.heatingValueJPerG = model.heatPerG

  const demandComposition = c.role === 'fuse' ? undefined : (c.composition ?? (other.length > 0 ? undefined : derived))
  if (fuel) {
    // The oxide is solid: the element takes oxygen and adds no gas.
    model.demandPerG = fuel.oxygenDemandMolPerG
    model.productsPerG = {}
    model.demandFrom = 'element'
  }
  else if (demandComposition) {
    const per = combustionPerGram(asFiredFractions(demandComposition))
    model.demandPerG = per.oxygenDemandMol
    model.productsPerG = { CO2: per.co2Mol, H2O: per.h2oMol, SO2: per.so2Mol, HCl: per.hclMol, N2: per.n2Mol }
    model.demandFrom = 'composition'
  }
  else {
    model.demandPerG = oxygenDemandFromHeatMol(model.heatPerG)
    model.productsPerG = productsFromDemand(model.demandPerG)
  }

  const clComposition = c.composition ?? derived
  model.chlorineFraction = clComposition ? asFiredFractions(clComposition).Cl : (c.chlorinePct ?? 0) / 100
  if (c.chlorinePct !== undefined) model.chlorineFraction = Math.max(model.chlorineFraction, c.chlorinePct / 100)
  if (c.role === 'sample') {
    if (c.boilingPointC !== undefined && c.boilingPointC < policy.volatileBoilingPointC) model.volatile = `boils at ${c.boilingPointC} °C, below ${policy.volatileBoilingPointC} °C`
    else if (c.vapourPressureKPa !== undefined) model.volatile = `has a vapour pressure of ${c.vapourPressureKPa} kPa`
  }
  model.containment = c.containment

  if (c.role !== 'fuse') {
    const r = c.resolved
    model.screening = screenComponent(
      {
        declaredHazard: c.declaredHazard,
        declaredBy: c.library?.declaredHazard !== undefined && c.library.declaredHazard === c.declaredHazard ? 'library' : 'planner',
        groups: r?.explosophores,
        atoms: r?.atoms,
        molarMassGPerMol: r?.molarMassGPerMol,
        composition: c.composition,
        category: c.category,
        libraryClassification: c.library?.classification,
        decompositionRecord: c.library?.decomposition,
        typedDecompositionEnergyJPerG: c.library?.decomposition ? undefined : c.decompositionEnergyJPerG,
      },
      policy,
    )
  }
  return model
}

/** Everything about the charge that is linear in the total sample mass m. */
export interface ChargeModel {
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

export function buildModel(input: ChargeInput, policy: LabPolicy): ChargeModel {
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

export interface ChargeState {
  heatJ: number
  demandMol: number
  chargeMassG: number
  freeVolumeMl: number
  oxygenMol: number
  nitrogenMol: number
  products: GasAmounts
}

export function stateAt(model: ChargeModel, m: number): ChargeState {
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

export function peakAt(model: ChargeModel, m: number) {
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
