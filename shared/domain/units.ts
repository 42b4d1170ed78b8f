// General unit conversion on the server side; pages use specific-energy.ts so mathjs stays off them.
import { all, create, type MathJsInstance } from 'mathjs'
import { absoluteToGaugeMPa, gaugeToAbsoluteMPa, STANDARD_ATMOSPHERE_MPA } from './oxygen'

export { absoluteToGaugeMPa, gaugeToAbsoluteMPa, STANDARD_ATMOSPHERE_MPA }

export const ENERGY_UNITS = ['J', 'kJ', 'cal_th', 'cal_IT', 'Btu_IT'] as const
export const SPECIFIC_ENERGY_UNIT_NAMES = ['J/g', 'MJ/kg', 'cal_IT/g', 'cal_th/g', 'Btu/lb'] as const
export const PRESSURE_UNITS = ['MPa', 'bar', 'atm', 'psi'] as const
export const MASS_UNITS = ['g', 'mg'] as const
export const VOLUME_UNITS = ['mL', 'L'] as const

export type EnergyUnit = (typeof ENERGY_UNITS)[number]
export type SpecificEnergyUnitName = (typeof SPECIFIC_ENERGY_UNIT_NAMES)[number]
export type PressureUnit = (typeof PRESSURE_UNITS)[number]
export type MassUnit = (typeof MASS_UNITS)[number]
export type VolumeUnit = (typeof VOLUME_UNITS)[number]

// mathjs unit names must be alphanumeric, so the public names map onto these expressions.
const MATHJS_NAME: Readonly<Record<string, string>> = {
  'J': 'J',
  'kJ': 'kJ',
  'cal_th': 'calth',
  'cal_IT': 'calIT',
  'Btu_IT': 'BtuIT',
  'J/g': 'J/g',
  'MJ/kg': 'MJ/kg',
  'cal_IT/g': 'calIT/g',
  'cal_th/g': 'calth/g',
  'Btu/lb': 'BtuIT/lb',
  'MPa': 'MPa',
  'bar': 'bar',
  'atm': 'atm',
  'psi': 'psi',
  'g': 'g',
  'mg': 'mg',
  'mL': 'mL',
  'L': 'L',
}

let instance: MathJsInstance | undefined

// Created on first use so importing this file costs nothing until a conversion is asked for.
export function mathjs(): MathJsInstance {
  if (!instance) {
    if (!all) throw new Error('mathjs was loaded without its function factories')
    const m = create(all)
    // NIST SP 811 App. B: the thermochemical and international-table calories and the IT Btu (kcal… with prefixes).
    m.createUnit('calth', { definition: '4.184 J', prefixes: 'short' })
    m.createUnit('calIT', { definition: '4.1868 J', prefixes: 'short' })
    m.createUnit('BtuIT', '1055.05585262 J')
    instance = m
  }
  return instance
}
const math = mathjs

function convert(value: number, from: string, to: string): number {
  const a = MATHJS_NAME[from]
  const b = MATHJS_NAME[to]
  if (a === undefined || b === undefined) throw new Error(`Unknown unit: ${a === undefined ? from : to}`)
  return math().unit(value, a).toNumber(b)
}

/** Converts energy between J, kJ, cal_th, cal_IT and Btu_IT (NIST SP 811, Appendix B). */
export function convertEnergy(value: number, from: EnergyUnit, to: EnergyUnit): number {
  return convert(value, from, to)
}

/** Converts specific energy between J/g, MJ/kg, cal_IT/g, cal_th/g and Btu/lb (NIST SP 811, Appendix B). */
export function convertSpecificEnergy(value: number, from: SpecificEnergyUnitName, to: SpecificEnergyUnitName): number {
  return convert(value, from, to)
}

/** Converts pressure between MPa, bar, atm and psi (NIST SP 811, Appendix B). */
export function convertPressure(value: number, from: PressureUnit, to: PressureUnit): number {
  return convert(value, from, to)
}

/** Converts mass between g and mg (SI prefixes, NIST SP 811). */
export function convertMass(value: number, from: MassUnit, to: MassUnit): number {
  return convert(value, from, to)
}

/** Converts volume between mL and L (SI, NIST SP 811). */
export function convertVolume(value: number, from: VolumeUnit, to: VolumeUnit): number {
  return convert(value, from, to)
}
