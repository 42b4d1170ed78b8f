// The shapes of one computed result: what the computation needs besides the analyst's inputs, and what it returns.
import type { ChargeComponentInput, ResolvedChemistry } from '../assessment'
import type { LabPolicy } from '../policy'
import type { AcidConvention } from './acid'
import type { Basis } from './bases'
import type { RepeatabilityTerm } from './repeatability'
import type { UncertaintyBudget } from './uncertainty'

export type ResultKind = 'sample' | 'standardisation' | 'check'
export type ByBasis = Partial<Record<Basis, number>>

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

/** Where an aid's (or the cotton fuse's) heating value comes from; 'typical' makes a result provisional. */
export type AidValueSource = 'lab-determined' | 'certified' | 'entered' | 'typical'

export interface AidValue {
  valueJPerG: number
  standardUncertaintyJPerG: number
  source: AidValueSource
  /** e.g. "Gelatin capsule lot 7, 6 determinations accepted 2026-11-20 by A. Supervisor". */
  label: string
}

/** The energy equivalent in force, as the computation needs it. */
export interface EnergyEquivalentInput {
  id: string | null
  valueJPerK: number
  standardDeviationJPerK: number
  runs: number
  acceptedAt: Date | string
}

/** What the computation needs besides the analyst's inputs. */
export interface ResultContext {
  kind: ResultKind
  weighedMassG: number
  /** The charge as weighed at firing, materials filled in and formulas resolved. */
  components: (ChargeComponentInput & { resolved?: ResolvedChemistry })[]
  energyEquivalent: EnergyEquivalentInput | null
  /** The aid's heating value and where it comes from; null = from the component or the policy (then typical unless certified). */
  aid?: AidValue | null
  /** The lab's determined cotton-thread value; null = the policy's typical value. */
  cotton?: AidValue | null
  /** The run-to-run scatter of a determination; default r/2.8 of the policy. */
  repeatability?: RepeatabilityTerm | null
  policy: LabPolicy
}

export interface Corrections {
  fuseJ: number
  acidJ: number
  sulfurJ: number
  chlorineJ: number
  aidJ: number
  sulfurPct: number
  sulfurSource: string
  sulfurJPerPctG: number
  chlorinePct: number
  chlorineSource: string | null
  aidMassG: number
  aidHeatingValueJPerG: number | null
  aidValueSource: AidValueSource | null
  acidConvention: AcidConvention
  acidMeasured: 'total-acid titration' | 'nitric acid determined' | 'nitric acid, fixed value' | 'not measured'
}

export interface MineralMatterFree {
  /** Mineral matter (ASTM D388 formula), dry basis, mass-%. */
  mineralMatterDryPct: number
  dryJPerG: number
  dryExpandedUncertaintyJPerG: number | null
  /** On the as-received basis with the total moisture taken as the inherent moisture; null without it. */
  moistJPerG: number | null
  /** Its expanded uncertainty (k = 2); absent on results stored before it was computed. */
  moistExpandedUncertaintyJPerG?: number | null
}

export interface ResultValues {
  kind: ResultKind
  sampleMassG: number
  temperatureRiseK: number
  temperatureRiseSource: 'entered' | 'regnault-pfaundler' | 'dickinson'
  thermogram: ThermogramSummary | null
  corrections: Corrections
  energyEquivalent: { id: string | null, valueJPerK: number, standardUncertaintyJPerK: number, acceptedAt: string | null } | null
  /** Standardisation runs: ε of this run and the energy released. */
  energyEquivalentJPerK: number | null
  energyReleasedJ: number | null
  certifiedValueJPerG: number | null
  /** Air-buoyancy factor applied to the certified value (m_vacuum/m_air) and the densities used; null when not applied. */
  buoyancy: { factor: number, airGPerMl: number, standardGPerMl: number, weightsGPerMl: number } | null
  /** Gross calorific value at constant volume by basis ('air-dried' = as determined), J/g. */
  grossJPerG: ByBasis
  netConstantPressureJPerG: ByBasis
  netConstantVolumeJPerG: ByBasis
  uncertainty: UncertaintyBudget | null
  /** Expanded uncertainty (k = 2) of every value on every basis, J/g. */
  expandedUncertaintyByBasis: { gross: ByBasis, netConstantPressure: ByBasis, netConstantVolume: ByBasis } | null
  /** The repeatability term in the budget (standard deviation of one determination), J/g. */
  repeatabilityJPerG: number | null
  mineralMatterFree: MineralMatterFree | null
  check: { certifiedJPerG: number, deviationPct: number, tolerancePct: number, passed: boolean } | null
  analysis: { moistureAdPct: number | null, moistureArPct: number | null, hydrogenDryPct: number | null, oxygenDryPct: number | null, nitrogenDryPct: number | null, ashDryPct: number | null }
  /** Why the result is provisional (a typical value in use); empty when it is not. */
  provisional: string[]
  missing: string[]
  notes: ResultNote[]
}

export class ResultInputError extends Error {
  constructor(readonly path: string, message: string) { super(message) }
}
