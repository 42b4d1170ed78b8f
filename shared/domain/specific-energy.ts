// Mathjs-free specific-energy conversion for the pages; units.ts holds the general (mathjs) version.

/** Display units a lab may choose; 'cal/g' is the international-table calorie per gram, 'cal_th/g' the thermochemical one. */
export const SPECIFIC_ENERGY_UNITS = ['J/g', 'MJ/kg', 'cal/g', 'cal_th/g', 'Btu/lb'] as const
export type SpecificEnergyUnit = (typeof SPECIFIC_ENERGY_UNITS)[number]

// J/g per one unit: cal_IT = 4.1868 J, cal_th = 4.184 J, 1 Btu_IT/lb = 2.326 J/g exactly (NIST SP 811, App. B).
const J_PER_G: Readonly<Record<SpecificEnergyUnit, number>> = {
  'J/g': 1,
  'MJ/kg': 1000,
  'cal/g': 4.1868,
  'cal_th/g': 4.184,
  'Btu/lb': 2.326,
}

// Decimals that keep about five significant figures for calorific values of fuels.
const DECIMALS: Readonly<Record<SpecificEnergyUnit, number>> = {
  'J/g': 0,
  'MJ/kg': 3,
  'cal/g': 1,
  'cal_th/g': 1,
  'Btu/lb': 0,
}

/** True when the text names one of the display units. */
export function isSpecificEnergyUnit(unit: string): unit is SpecificEnergyUnit {
  return (SPECIFIC_ENERGY_UNITS as readonly string[]).includes(unit)
}

/** Converts J/g to a display unit (factors: NIST SP 811, Appendix B). */
export function fromJPerG(value: number, unit: SpecificEnergyUnit): number {
  return value / J_PER_G[unit]
}

/** Converts a value in a display unit to J/g (factors: NIST SP 811, Appendix B). */
export function toJPerG(value: number, unit: SpecificEnergyUnit): number {
  return value * J_PER_G[unit]
}

/** Formats J/g in a display unit with its unit beside it, e.g. "26,454 J/g" (NIST SP 811 factors). */
export function formatSpecificEnergy(jPerG: number, unit: SpecificEnergyUnit): string {
  const decimals = DECIMALS[unit]
  const text = fromJPerG(jPerG, unit).toLocaleString('en-US', {
    minimumFractionDigits: decimals,
    maximumFractionDigits: decimals,
  })
  return `${text} ${unit}`
}
