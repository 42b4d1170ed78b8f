// The public contract of the charge assessment: inputs, answer, finding codes and the input error.
import type { AtomCounts, Composition } from '../composition'
import type { HeatingValueSource, WireType } from '../heating-value'
import type { ProofCharge } from '../peak-pressure'
import type { DeclaredHazard, DecompositionRecord, ExplosophoreGroup, ScreeningResult } from '../screening'
import type { VesselState } from '../vessel-state'

export type VesselClass = 'standard' | 'high-strength'
export type { VesselState }
export type { DeclaredHazard, ExplosophoreGroup }
export type ComponentRole = 'sample' | 'aid' | 'fuse'
export type RunRole = 'sample' | 'standardisation' | 'check'
export type Severity = 'block' | 'approval' | 'info'
export const VERDICTS = ['clear', 'needs-approval', 'blocked'] as const
export type Verdict = typeof VERDICTS[number]

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
  /** Marked in the vessel register as resistant to halogen acids (chlorine-rich samples). */
  halogenResistant?: boolean
}

/**
 * What the materials library vouches for, set by the server from the material record only (never from a request):
 * who recorded its classification and its decomposition-energy evidence.
 */
export interface LibraryIdentity {
  materialId?: string
  name: string
  /** Classification recorded by a supervisor, or a shipped reference material. */
  classification?: string
  /** The hazard the library declares for the material. */
  declaredHazard?: DeclaredHazard
  decomposition?: DecompositionRecord
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
  /** Typed on a run or a quick check: shown, never used to clear. */
  decompositionEnergyJPerG?: number
  /** Material category (coal, coke, biomass, liquid fuel, waste fuel, food, feed, polymer, …). */
  category?: string
  /** Boiling point, °C: below the policy value the sample is volatile. */
  boilingPointC?: number
  /** Vapour pressure at the lab temperature, kPa: a known vapour pressure marks the sample volatile. */
  vapourPressureKPa?: number
  /** Chlorine share of the sample, mass-% (when no composition or formula gives it). */
  chlorinePct?: number
  /** An aid that encloses the sample: a sealed capsule or a combustible tape. */
  containment?: 'capsule' | 'tape'
  name?: string
  /** Density for the free-volume estimate; the policy value (1 g/mL, common practice) when absent. */
  densityGPerMl?: number
  /** Set by the server when the heating value was filled in from a material record. */
  heatingValueFrom?: 'declared' | 'material'
  /** Set by the server from the materials library; dropped from any request. */
  library?: LibraryIdentity
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

/** What a list of runs shows of each stored assessment: the verdict, the findings and the headline figures. */
export type AssessmentSummary = Omit<Assessment, 'components' | 'suggestions' | 'notes'>
/** The keys left out of a summary (PostgreSQL's jsonb `-` takes them off before the row leaves the database). */
export const ASSESSMENT_DETAIL_KEYS = ['components', 'suggestions', 'notes'] as const satisfies readonly (keyof Assessment)[]

/** Stable finding codes with their severity, for the docs and the interface. */
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
  'sample-below-minimum': { severity: 'block', description: 'Sample mass below the policy minimum.' },
  'energy-near-rating': { severity: 'approval', description: 'Heat release above the approval fraction of the vessel rating.' },
  'oxygen-low': { severity: 'approval', description: 'Oxygen excess below the approval level.' },
  'fill-outside-window': { severity: 'approval', description: 'Oxygen fill outside the method window.' },
  'heating-value-unknown': { severity: 'approval', description: 'No usable heating value or composition: the conservative policy value was used.' },
  'composition-outside-correlation': { severity: 'approval', description: 'Composition outside the validity range of the heating-value correlation.' },
  'composition-unresolved': { severity: 'approval', description: 'A formula or structure was given but not yet resolved.' },
  'energetic-in-high-strength-vessel': { severity: 'approval', description: 'Energetic material in a high-strength vessel.' },
  'structure-needed': { severity: 'approval', description: 'A formula alone that could hold a group associated with explosive properties: the structure (SMILES) is needed to clear it.' },
  'identity-unknown': { severity: 'approval', description: 'Nothing says what the sample is (no structure, formula, composition with category, or library record).' },
  'metal-powder': { severity: 'approval', description: 'A metal or other element that burns to a solid oxide: approval in any vessel.' },
  'oxidiser-without-fuel': { severity: 'approval', description: 'An inorganic oxidiser fired without organic matter beside it.' },
  'volatile-unsealed': { severity: 'approval', description: 'A volatile sample without a sealed capsule or tape in the charge.' },
  'halogen-vessel': { severity: 'approval', description: 'A chlorine-rich sample in a vessel not marked halogen-resistant.' },
  'service-due-soon': { severity: 'info', description: 'The vessel is due for service within the policy margin of its interval.' },
  'energy-far-from-standard': { severity: 'info', description: 'Heat release far from the standardisation energy.' },
  'suggested-mass': { severity: 'info', description: 'No sample mass given: the charge was assessed at the suggested mass.' },
  'weak-sample-aid': { severity: 'info', description: 'The sample releases little heat: a benzoic-acid combustion aid is suggested.' },
  'oxidiser-mixture': { severity: 'info', description: 'An inorganic oxidiser and its share of the charge against the screening limit.' },
  'screen-cleared': { severity: 'info', description: 'A group was found but an Appendix 6 exemption clears it.' },
  'halogen-acid': { severity: 'info', description: 'A chlorine-rich sample in a halogen-resistant vessel: hydrochloric acid forms.' },
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
