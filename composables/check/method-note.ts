
import { formatSpecificEnergy, type SpecificEnergyUnit } from '#shared/domain/specific-energy'

// Input names of the method notes end in their unit (heatJ, fillPressureMPaGauge…): the suffix gives the unit shown.
const SUFFIXES: readonly [string, string][] = [
  ['MPaGauge', 'MPa gauge'],
  ['MPaAbsolute', 'MPa absolute'],
  ['MPa', 'MPa'],
  ['JPerG', 'J/g'],
  ['MolPerG', 'mol O₂ per g'],
  ['Mol', 'mol'],
  ['Ml', 'mL'],
  ['Cm', 'cm'],
  ['G', 'g'],
  ['J', 'J'],
  ['K', 'K'],
  ['C', '°C'],
]

const NUMBER = new Intl.NumberFormat('en-GB', { maximumSignificantDigits: 5 })

export interface NoteInput { label: string, value: string, unit: string }

/** One input of a method note as label, value and unit; heating values follow the display unit. */
export function noteInput(key: string, value: number | string, unit: SpecificEnergyUnit): NoteInput {
  const suffix = SUFFIXES.find(([s]) => key.endsWith(s) && key.length > s.length)
  const stem = suffix ? key.slice(0, -suffix[0].length) : key
  const label = stem.replace(/([A-Z])/g, ' $1').toLowerCase().replace(/\bmpa\b/, 'MPa')
  if (typeof value === 'string') return { label, value, unit: '' }
  if (suffix?.[1] === 'J/g') {
    const [number, ...rest] = formatSpecificEnergy(value, unit).split(' ')
    return { label, value: number ?? '', unit: rest.join(' ') }
  }
  return { label, value: NUMBER.format(value), unit: suffix?.[1] ?? '' }
}
