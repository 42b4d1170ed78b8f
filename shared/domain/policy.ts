// The lab's adjustable rules: every threshold the assessment uses comes from here, never from a literal in a rule.
import { z } from 'zod'
import { SPECIFIC_ENERGY_UNITS, type SpecificEnergyUnit } from './specific-energy'
import { ACID_CONVENTIONS, type AcidConvention } from './results/acid'

export interface FuseWireEnergies {
  nichrome: number
  iron: number
  platinum: number
}

export interface LabPolicy {
  serviceIntervalFirings: number
  serviceIntervalDays: number
  requalificationIntervalFirings: number
  serviceDueMarginPct: number
  approvalEnergyFraction: number
  minOxygenExcess: number
  approvalOxygenExcess: number
  fallbackHeatingValueJPerG: number
  waterMl: number
  labTemperatureC: number
  fillPressureWindowMinMPa: number
  fillPressureWindowMaxMPa: number
  defaultFillPressureMPa: number
  targetEnergyJ: number
  energyFarFromTargetFraction: number
  fuseWireJPerCm: FuseWireEnergies
  cottonJPerG: number
  oxidiserFractionLimitPct: number
  energeticObThresholdPct: number
  decompositionEnergyThresholdJPerG: number
  decompositionOnsetLimitC: number
  volatileBoilingPointC: number
  halogenSharePct: number
  weakSampleMinHeatReleaseJ: number
  aidHeatingValueJPerG: number
  sampleDensityGPerMl: number
  proofChargeMassG: number
  proofChargeHeatingValueJPerG: number
  proofChargeFillPressureMPa: number
  repeatabilityJPerG: number
  standardisationRuns: number
  standardisationMaxRsdPct: number
  checkRunTolerancePct: number
  signedMassTolerancePct: number
  minSampleMassG: number
  electrodeResistanceMaxOhm: number
  uploadMaxBytes: number
  maxRunsPerPlan: number
  sessionIdleMinutes: number
  sessionAbsoluteHours: number
  displayUnit: SpecificEnergyUnit
  determinationsPerSample: number
  firingCycleMinutes: number
  workdayStartHour: number
  workdayHours: number
  energyEquivalentMaxAgeDays: number
  /** Results: the acid convention in force when a result names no acid measurement. */
  acidConvention: AcidConvention
  totalAcidSulfurJPerPctG: number
  chlorineJPerPctG: number
  reproducibilityJPerG: number
  /** Degrees of freedom of the lab's own duplicates before their pooled s_r replaces r/2.8. */
  ownRepeatabilityMinDof: number
  standardCertifiedValueJPerG: number
  standardCertifiedUncertaintyJPerG: number
  standardCertifiedCoverageFactor: number
  buoyancyCorrection: boolean
  buoyancyAirGPerMl: number
  buoyancyStandardGPerMl: number
  buoyancyWeightsGPerMl: number
  singleDeterminationCertificates: boolean
}

export const DEFAULT_POLICY: LabPolicy = {
  serviceIntervalFirings: 500,
  serviceIntervalDays: 182,
  requalificationIntervalFirings: 5000,
  serviceDueMarginPct: 10,
  approvalEnergyFraction: 0.9,
  minOxygenExcess: 1,
  approvalOxygenExcess: 3,
  fallbackHeatingValueJPerG: 50000,
  waterMl: 1,
  labTemperatureC: 25,
  fillPressureWindowMinMPa: 2.8,
  fillPressureWindowMaxMPa: 3.2,
  defaultFillPressureMPa: 3.0,
  targetEnergyJ: 26000,
  energyFarFromTargetFraction: 0.25,
  fuseWireJPerCm: { nichrome: 9.6, iron: 11.3, platinum: 0 },
  cottonJPerG: 17500,
  oxidiserFractionLimitPct: 15,
  energeticObThresholdPct: -200,
  decompositionEnergyThresholdJPerG: 500,
  decompositionOnsetLimitC: 500,
  volatileBoilingPointC: 100,
  halogenSharePct: 2,
  weakSampleMinHeatReleaseJ: 10000,
  aidHeatingValueJPerG: 26454,
  sampleDensityGPerMl: 1,
  proofChargeMassG: 2,
  proofChargeHeatingValueJPerG: 26454,
  proofChargeFillPressureMPa: 4.053,
  repeatabilityJPerG: 120,
  standardisationRuns: 5,
  standardisationMaxRsdPct: 0.2,
  checkRunTolerancePct: 0.3,
  signedMassTolerancePct: 2,
  minSampleMassG: 0.010,
  electrodeResistanceMaxOhm: 5,
  uploadMaxBytes: 10485760,
  maxRunsPerPlan: 300,
  sessionIdleMinutes: 60,
  sessionAbsoluteHours: 12,
  displayUnit: 'J/g',
  determinationsPerSample: 2,
  firingCycleMinutes: 20,
  workdayStartHour: 8,
  workdayHours: 8,
  energyEquivalentMaxAgeDays: 30,
  acidConvention: 'nitric-acid',
  totalAcidSulfurJPerPctG: 57.5,
  chlorineJPerPctG: 21.1,
  reproducibilityJPerG: 300,
  ownRepeatabilityMinDof: 10,
  standardCertifiedValueJPerG: 26434,
  standardCertifiedUncertaintyJPerG: 3,
  standardCertifiedCoverageFactor: 2,
  buoyancyCorrection: false,
  buoyancyAirGPerMl: 0.0012,
  buoyancyStandardGPerMl: 1.32,
  buoyancyWeightsGPerMl: 8.0,
  singleDeterminationCertificates: false,
}

const positive = () => z.number().positive()
const nonNegative = () => z.number().nonnegative()
const count = () => z.number().int().positive()

/** Validates a whole policy as an admin saves it (bounds: common practice unless a field's source says more). */
export const labPolicySchema = z
  .object({
    serviceIntervalFirings: count().max(100000),
    serviceIntervalDays: count().max(3650),
    requalificationIntervalFirings: count().max(1000000),
    serviceDueMarginPct: z.number().min(0).max(50),
    approvalEnergyFraction: z.number().gt(0).max(1),
    minOxygenExcess: z.number().min(1).max(10),
    approvalOxygenExcess: z.number().min(1).max(20),
    fallbackHeatingValueJPerG: z.number().min(1000).max(150000),
    waterMl: z.number().min(0).max(20),
    labTemperatureC: z.number().min(0).max(50),
    fillPressureWindowMinMPa: positive().max(10),
    fillPressureWindowMaxMPa: positive().max(10),
    defaultFillPressureMPa: positive().max(10),
    targetEnergyJ: positive().max(200000),
    energyFarFromTargetFraction: z.number().gt(0).max(1),
    fuseWireJPerCm: z
      .object({ nichrome: nonNegative().max(100), iron: nonNegative().max(100), platinum: nonNegative().max(100) })
      .strict(),
    cottonJPerG: nonNegative().max(50000),
    oxidiserFractionLimitPct: z.number().min(0).max(100),
    energeticObThresholdPct: z.number().min(-1000).max(0),
    decompositionEnergyThresholdJPerG: nonNegative().max(10000),
    decompositionOnsetLimitC: z.number().min(0).max(1000),
    volatileBoilingPointC: z.number().min(-50).max(400),
    halogenSharePct: z.number().min(0).max(100),
    weakSampleMinHeatReleaseJ: nonNegative().max(200000),
    aidHeatingValueJPerG: positive().max(150000),
    sampleDensityGPerMl: z.number().min(0.1).max(25),
    proofChargeMassG: positive().max(100),
    proofChargeHeatingValueJPerG: positive().max(150000),
    proofChargeFillPressureMPa: positive().max(20),
    repeatabilityJPerG: positive().max(5000),
    standardisationRuns: count().max(50),
    standardisationMaxRsdPct: positive().max(10),
    checkRunTolerancePct: positive().max(10),
    signedMassTolerancePct: nonNegative().max(20),
    minSampleMassG: positive().max(10),
    electrodeResistanceMaxOhm: positive().max(1000),
    uploadMaxBytes: count().max(1073741824),
    maxRunsPerPlan: count().max(1000),
    sessionIdleMinutes: count().max(1440),
    sessionAbsoluteHours: count().max(168),
    displayUnit: z.enum(SPECIFIC_ENERGY_UNITS),
    determinationsPerSample: count().max(10),
    firingCycleMinutes: count().max(240),
    workdayStartHour: z.number().int().min(0).max(23),
    workdayHours: z.number().gt(0).max(24),
    energyEquivalentMaxAgeDays: count().max(3650),
    acidConvention: z.enum(ACID_CONVENTIONS as [AcidConvention, ...AcidConvention[]]),
    totalAcidSulfurJPerPctG: nonNegative().max(500),
    chlorineJPerPctG: nonNegative().max(500),
    reproducibilityJPerG: positive().max(10000),
    ownRepeatabilityMinDof: count().max(1000),
    standardCertifiedValueJPerG: positive().max(100000),
    standardCertifiedUncertaintyJPerG: nonNegative().max(1000),
    standardCertifiedCoverageFactor: positive().max(10),
    buoyancyCorrection: z.boolean(),
    buoyancyAirGPerMl: positive().max(0.01),
    buoyancyStandardGPerMl: z.number().min(0.1).max(25),
    buoyancyWeightsGPerMl: z.number().min(1).max(25),
    singleDeterminationCertificates: z.boolean(),
  })
  .strict()
  .refine(p => p.fillPressureWindowMinMPa <= p.fillPressureWindowMaxMPa, {
    message: 'The window minimum must not exceed its maximum',
    path: ['fillPressureWindowMinMPa'],
  })
  .refine(p => p.defaultFillPressureMPa >= p.fillPressureWindowMinMPa && p.defaultFillPressureMPa <= p.fillPressureWindowMaxMPa, {
    message: 'The default fill must lie inside the fill window',
    path: ['defaultFillPressureMPa'],
  })
  .refine(p => p.minOxygenExcess <= p.approvalOxygenExcess, {
    message: 'The blocking oxygen excess must not exceed the approval one',
    path: ['minOxygenExcess'],
  })
  .refine(p => p.sessionIdleMinutes <= p.sessionAbsoluteHours * 60, {
    message: 'The idle timeout must not exceed the absolute session length',
    path: ['sessionIdleMinutes'],
  })

export interface PolicyDescription {
  label: string
  unit: string
  /** What the page says: the standard and clause the value follows, or that it is the lab's own decision. */
  source: string
}

const LAB = 'The lab\'s own decision'

/**
 * Label, unit and page-facing source of every policy field, for the admin page. Provenance of the defaults (kept
 * here, never on a page): fill window 3.0 ± 0.2 MPa, water 1 mL, repeatability r = 120 J/g, five-run series and
 * 0.20 % precision as ISO 1928 states them (from memory); fuse wire 9.6 / 11.3 J/cm and cotton 17.5 kJ/g from
 * secondary sources (from memory); proof charge 2 g benzoic acid at 40 atm from secondary summaries of ASTM E144;
 * service intervals, approval levels and margins common practice.
 */
export const POLICY_DESCRIPTIONS: Readonly<Record<keyof LabPolicy, PolicyDescription>> = {
  serviceIntervalFirings: { label: 'Routine service every', unit: 'firings', source: `${LAB}, within the vessel maker's service instructions` },
  serviceIntervalDays: { label: 'Routine service at the latest every', unit: 'days', source: `${LAB}, within the vessel maker's service instructions` },
  requalificationIntervalFirings: { label: 'Requalification every', unit: 'firings', source: `${LAB}; ASTM E144 describes the tests` },
  serviceDueMarginPct: { label: 'Service shown as due within', unit: '% of the interval', source: LAB },
  approvalEnergyFraction: { label: 'Approval above this fraction of the vessel rating', unit: '—', source: LAB },
  minOxygenExcess: { label: 'Block below this oxygen excess', unit: 'available / demand', source: 'Stoichiometry: complete combustion needs at least 1' },
  approvalOxygenExcess: { label: 'Approval below this oxygen excess', unit: 'available / demand', source: LAB },
  fallbackHeatingValueJPerG: { label: 'Heating value assumed when nothing is known', unit: 'J/g', source: `${LAB} (set above most hydrocarbons)` },
  waterMl: { label: 'Water placed in the vessel', unit: 'mL', source: `${LAB}, as its test method prescribes` },
  labTemperatureC: { label: 'Laboratory temperature', unit: '°C', source: LAB },
  fillPressureWindowMinMPa: { label: 'Method fill window, lower end', unit: 'MPa gauge', source: `${LAB}, as its test method prescribes` },
  fillPressureWindowMaxMPa: { label: 'Method fill window, upper end', unit: 'MPa gauge', source: `${LAB}, as its test method prescribes` },
  defaultFillPressureMPa: { label: 'Default oxygen fill', unit: 'MPa gauge', source: `${LAB}, as its test method prescribes` },
  targetEnergyJ: { label: 'Target heat release when no standardisation energy is known', unit: 'J', source: `${LAB} (about 1 g benzoic acid)` },
  energyFarFromTargetFraction: { label: 'Note when the heat release differs from the target by more than', unit: 'fraction', source: LAB },
  fuseWireJPerCm: { label: 'Fuse wire energy (nickel-chromium / iron / platinum)', unit: 'J/cm', source: `${LAB}, from the wire supplier's value; platinum does not burn` },
  cottonJPerG: { label: 'Cotton thread energy', unit: 'J/g', source: `${LAB}, from the thread supplier's value` },
  oxidiserFractionLimitPct: { label: 'Inorganic oxidiser in a mixture with organics counts as energetic above', unit: '% of the charge mass', source: 'UN Manual of Tests and Criteria, Appendix 6, section 5 (packing groups I/II)' },
  energeticObThresholdPct: { label: 'Screen clears explosophores below this oxygen balance', unit: '%', source: 'UN Manual of Tests and Criteria, Appendix 6, clause 3.3(b)' },
  decompositionEnergyThresholdJPerG: { label: 'Screen clears explosophores below this decomposition energy', unit: 'J/g', source: 'UN Manual of Tests and Criteria, Appendix 6, clause 3.3(c)' },
  weakSampleMinHeatReleaseJ: { label: 'Suggest a combustion aid below this heat release', unit: 'J', source: LAB },
  decompositionOnsetLimitC: { label: 'Decomposition onset must be below', unit: '°C', source: 'UN Manual of Tests and Criteria, Appendix 6, clause 3.3(c)' },
  volatileBoilingPointC: { label: 'Volatile sample: boiling point below', unit: '°C', source: `${LAB} (a sealed capsule or tape is needed)` },
  halogenSharePct: { label: 'Halogen-resistant vessel needed above this chlorine share', unit: '% of the sample mass', source: `${LAB} (hydrochloric acid attacks the vessel)` },
  aidHeatingValueJPerG: { label: 'Combustion aid (benzoic acid) heating value', unit: 'J/g', source: 'NIST SRM 39j certificate (weighed in air)' },
  sampleDensityGPerMl: { label: 'Sample density assumed for the free volume', unit: 'g/mL', source: LAB },
  proofChargeMassG: { label: 'Proof charge, benzoic acid mass', unit: 'g', source: `${LAB}, from the vessel maker's proof rating; ASTM E144 describes the proof test` },
  proofChargeHeatingValueJPerG: { label: 'Proof charge heating value', unit: 'J/g', source: 'NIST SRM 39j certificate (weighed in air)' },
  proofChargeFillPressureMPa: { label: 'Proof charge oxygen fill (40 atm)', unit: 'MPa gauge', source: `${LAB}, from the vessel maker's proof rating; ASTM E144 describes the proof test` },
  repeatabilityJPerG: { label: 'Duplicate repeatability limit', unit: 'J/g', source: `${LAB}, as its test method states the repeatability limit` },
  standardisationRuns: { label: 'Standardisation runs per series', unit: 'runs', source: `${LAB}; ASTM D240 asks for at least six` },
  standardisationMaxRsdPct: { label: 'Standardisation series relative standard deviation limit', unit: '%', source: `${LAB}, as its test method states the precision of the series` },
  checkRunTolerancePct: { label: 'Check run agreement with the certified value', unit: '%', source: LAB },
  electrodeResistanceMaxOhm: { label: 'Electrode resistance limit after service', unit: 'Ω', source: `${LAB}, within the vessel maker's service instructions` },
  uploadMaxBytes: { label: 'Largest data file accepted', unit: 'bytes', source: LAB },
  sessionIdleMinutes: { label: 'Sign out after idle', unit: 'minutes', source: LAB },
  sessionAbsoluteHours: { label: 'Sign out at the latest after', unit: 'hours', source: LAB },
  displayUnit: { label: 'Unit for calorific values', unit: '—', source: 'Conversion factors: NIST SP 811, Appendix B' },
  signedMassTolerancePct: { label: 'A signature covers a weighed sample mass up to this much above the signed mass', unit: '%', source: LAB },
  minSampleMassG: { label: 'Smallest sample mass accepted', unit: 'g', source: LAB },
  maxRunsPerPlan: { label: 'Most runs in one plan', unit: 'runs', source: LAB },
  determinationsPerSample: { label: 'Determinations per received sample', unit: 'runs', source: `${LAB}, as its test method asks for duplicates` },
  firingCycleMinutes: { label: 'Bench time per firing cycle (charge, fire, read, clean)', unit: 'minutes', source: LAB },
  workdayStartHour: { label: 'Bench day starts at', unit: 'hour (0–23)', source: LAB },
  workdayHours: { label: 'Bench day length', unit: 'hours', source: LAB },
  energyEquivalentMaxAgeDays: { label: 'Check run first when the energy equivalent is older than', unit: 'days', source: LAB },
  acidConvention: { label: 'Acid correction convention when a result names no acid measurement', unit: '—', source: `${LAB} (ISO 1928 corrects nitric acid alone; ASTM D5865 titrates total acid)` },
  totalAcidSulfurJPerPctG: { label: 'Sulfur correction after a total-acid titration', unit: 'J per (% S × g)', source: 'ASTM D5865, acid correction after a total-acid titration' },
  chlorineJPerPctG: { label: 'Chlorine correction (hydrochloric acid formed)', unit: 'J per (% Cl × g)', source: `${LAB}: HCl(g) → HCl(aq), 74.85 kJ/mol` },
  reproducibilityJPerG: { label: 'Reproducibility limit R between laboratories', unit: 'J/g', source: 'ISO 1928, precision: R = 300 J/g' },
  ownRepeatabilityMinDof: { label: 'Use the lab\'s own duplicate scatter from', unit: 'degrees of freedom', source: LAB },
  standardCertifiedValueJPerG: { label: 'Certified value of the reference benzoic acid (mass in vacuum)', unit: 'J/g', source: 'NIST SRM 39j certificate' },
  standardCertifiedUncertaintyJPerG: { label: 'Uncertainty stated on its certificate', unit: 'J/g', source: 'NIST SRM 39j certificate' },
  standardCertifiedCoverageFactor: { label: 'Coverage factor of that uncertainty', unit: 'k', source: `${LAB}, from the certificate of the lot in use` },
  buoyancyCorrection: { label: 'Correct the certified value for air buoyancy (masses weighed in air)', unit: 'yes / no', source: LAB },
  buoyancyAirGPerMl: { label: 'Density of air at the balance', unit: 'g/mL', source: 'OIML R 111-1, conventional density of air' },
  buoyancyStandardGPerMl: { label: 'Density of benzoic acid', unit: 'g/mL', source: `${LAB} (handbook density)` },
  buoyancyWeightsGPerMl: { label: 'Density of the balance weights', unit: 'g/mL', source: 'OIML R 111-1, conventional density of weights' },
  singleDeterminationCertificates: { label: 'Certificates from a single determination', unit: 'yes / no', source: `${LAB} (ISO 1928 asks for duplicates)` },
}
