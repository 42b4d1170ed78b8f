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
  electrodeResistanceMaxOhm: number
  uploadMaxBytes: number
  sessionIdleMinutes: number
  sessionAbsoluteHours: number
  displayUnit: SpecificEnergyUnit
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
  fallbackHeatingValueJPerG: 46000,
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
  electrodeResistanceMaxOhm: 5,
  uploadMaxBytes: 10485760,
  sessionIdleMinutes: 60,
  sessionAbsoluteHours: 12,
  displayUnit: 'J/g',
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
    electrodeResistanceMaxOhm: positive().max(1000),
    uploadMaxBytes: count().max(1073741824),
    sessionIdleMinutes: count().max(1440),
    sessionAbsoluteHours: count().max(168),
    displayUnit: z.enum(SPECIFIC_ENERGY_UNITS),
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
  source: string
}

/** Label, unit and source of every policy field, for the admin page. */
export const POLICY_DESCRIPTIONS: Readonly<Record<keyof LabPolicy, PolicyDescription>> = {
  serviceIntervalFirings: { label: 'Routine service every', unit: 'firings', source: 'common practice (vessel service guidance)' },
  serviceIntervalDays: { label: 'Routine service at the latest every', unit: 'days', source: 'common practice (six months)' },
  requalificationIntervalFirings: { label: 'Requalification every', unit: 'firings', source: 'common practice; ASTM E144 describes the tests' },
  serviceDueMarginPct: { label: 'Service shown as due within', unit: '% of the interval', source: 'common practice' },
  approvalEnergyFraction: { label: 'Approval above this fraction of the vessel rating', unit: '—', source: 'common practice' },
  minOxygenExcess: { label: 'Block below this oxygen excess', unit: 'available / demand', source: 'stoichiometry (complete combustion needs at least 1)' },
  approvalOxygenExcess: { label: 'Approval below this oxygen excess', unit: 'available / demand', source: 'common practice' },
  fallbackHeatingValueJPerG: { label: 'Heating value assumed when nothing is known', unit: 'J/g', source: 'common practice (above most hydrocarbons)' },
  waterMl: { label: 'Water placed in the vessel', unit: 'mL', source: 'ISO 1928 / ASTM D5865 (from memory)' },
  labTemperatureC: { label: 'Laboratory temperature', unit: '°C', source: 'common practice' },
  fillPressureWindowMinMPa: { label: 'Method fill window, lower end', unit: 'MPa gauge', source: 'ISO 1928: 3.0 ± 0.2 MPa (from memory)' },
  fillPressureWindowMaxMPa: { label: 'Method fill window, upper end', unit: 'MPa gauge', source: 'ISO 1928: 3.0 ± 0.2 MPa (from memory)' },
  defaultFillPressureMPa: { label: 'Default oxygen fill', unit: 'MPa gauge', source: 'ISO 1928 (from memory)' },
  targetEnergyJ: { label: 'Target heat release when no standardisation energy is known', unit: 'J', source: 'common practice (about 1 g benzoic acid)' },
  energyFarFromTargetFraction: { label: 'Note when the heat release differs from the target by more than', unit: 'fraction', source: 'common practice' },
  fuseWireJPerCm: { label: 'Fuse wire energy (nickel-chromium / iron / platinum)', unit: 'J/cm', source: 'secondary sources (from memory); platinum does not burn' },
  cottonJPerG: { label: 'Cotton thread energy', unit: 'J/g', source: 'secondary sources (from memory)' },
  oxidiserFractionLimitPct: { label: 'Inorganic oxidiser in a mixture with organics counts as energetic above', unit: '% of the charge mass', source: 'UN Manual of Tests and Criteria, Appendix 6 (packing groups I/II)' },
  energeticObThresholdPct: { label: 'Screen clears explosophores below this oxygen balance', unit: '%', source: 'UN Manual of Tests and Criteria, Appendix 6' },
  decompositionEnergyThresholdJPerG: { label: 'Screen clears explosophores below this decomposition energy', unit: 'J/g', source: 'UN Manual of Tests and Criteria, Appendix 6' },
  weakSampleMinHeatReleaseJ: { label: 'Suggest a combustion aid below this heat release', unit: 'J', source: 'common practice' },
  aidHeatingValueJPerG: { label: 'Combustion aid (benzoic acid) heating value', unit: 'J/g', source: 'NIST SRM 39j certificate (weighed in air)' },
  sampleDensityGPerMl: { label: 'Sample density assumed for the free volume', unit: 'g/mL', source: 'common practice' },
  proofChargeMassG: { label: 'Proof charge, benzoic acid mass', unit: 'g', source: 'secondary summaries of ASTM E144 and vessel safety guidance' },
  proofChargeHeatingValueJPerG: { label: 'Proof charge heating value', unit: 'J/g', source: 'NIST SRM 39j certificate (weighed in air)' },
  proofChargeFillPressureMPa: { label: 'Proof charge oxygen fill (40 atm)', unit: 'MPa gauge', source: 'secondary summaries of ASTM E144 and vessel safety guidance' },
  repeatabilityJPerG: { label: 'Duplicate repeatability limit', unit: 'J/g', source: 'ISO 1928 r = 120 J/g (from memory)' },
  standardisationRuns: { label: 'Standardisation runs per series', unit: 'runs', source: 'ISO 1928: five runs (from memory); ASTM D240: at least six' },
  standardisationMaxRsdPct: { label: 'Standardisation series relative standard deviation limit', unit: '%', source: 'ISO 1928 (from memory)' },
  checkRunTolerancePct: { label: 'Check run agreement with the certified value', unit: '%', source: 'common practice' },
  electrodeResistanceMaxOhm: { label: 'Electrode resistance limit after service', unit: 'Ω', source: 'common practice' },
  uploadMaxBytes: { label: 'Largest data file accepted', unit: 'bytes', source: 'common practice' },
  sessionIdleMinutes: { label: 'Sign out after idle', unit: 'minutes', source: 'common practice' },
  sessionAbsoluteHours: { label: 'Sign out at the latest after', unit: 'hours', source: 'common practice' },
  displayUnit: { label: 'Unit for calorific values', unit: '—', source: 'NIST SP 811 factors' },
  acidConvention: { label: 'Acid correction convention when a result names no acid measurement', unit: '—', source: 'the lab\'s own decision (ISO 1928: nitric acid alone; ASTM D5865: total acid)' },
  totalAcidSulfurJPerPctG: { label: 'Sulfur correction after a total-acid titration', unit: 'J per (% S × g)', source: 'ASTM D5865 / ASTM D240' },
  chlorineJPerPctG: { label: 'Chlorine correction (hydrochloric acid formed)', unit: 'J per (% Cl × g)', source: 'the lab\'s own decision: HCl(g) → HCl(aq), 74.85 kJ/mol' },
  reproducibilityJPerG: { label: 'Reproducibility limit R between laboratories', unit: 'J/g', source: 'ISO 1928 R = 300 J/g' },
  ownRepeatabilityMinDof: { label: 'Use the lab\'s own duplicate scatter from', unit: 'degrees of freedom', source: 'the lab\'s own decision' },
  standardCertifiedValueJPerG: { label: 'Certified value of the reference benzoic acid (mass in vacuum)', unit: 'J/g', source: 'NIST SRM 39j certificate' },
  standardCertifiedUncertaintyJPerG: { label: 'Uncertainty stated on its certificate', unit: 'J/g', source: 'NIST SRM 39j certificate' },
  standardCertifiedCoverageFactor: { label: 'Coverage factor of that uncertainty', unit: 'k', source: 'the certificate of the lot in use' },
  buoyancyCorrection: { label: 'Correct the certified value for air buoyancy (masses weighed in air)', unit: 'yes / no', source: 'the lab\'s own decision' },
  buoyancyAirGPerMl: { label: 'Density of air at the balance', unit: 'g/mL', source: 'OIML R 111 conventional value' },
  buoyancyStandardGPerMl: { label: 'Density of benzoic acid', unit: 'g/mL', source: 'handbook value' },
  buoyancyWeightsGPerMl: { label: 'Density of the balance weights', unit: 'g/mL', source: 'OIML R 111 conventional value' },
  singleDeterminationCertificates: { label: 'Certificates from a single determination', unit: 'yes / no', source: 'the lab\'s own decision (ISO 1928 asks for duplicates)' },
}
