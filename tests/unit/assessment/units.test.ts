import { describe, expect, it } from 'vitest'
import {
  convertEnergy,
  convertMass,
  convertPressure,
  convertSpecificEnergy,
  convertVolume,
  gaugeToAbsoluteMPa,
  absoluteToGaugeMPa,
  type SpecificEnergyUnitName,
} from '#shared/domain/units'
import { formatSpecificEnergy, fromJPerG, SPECIFIC_ENERGY_UNITS, type SpecificEnergyUnit, toJPerG } from '#shared/domain/specific-energy'
import { seededRandom } from './factories'

describe('unit factors', () => {
  it('defines the calories and the Btu as NIST does', () => {
    expect(convertEnergy(1, 'cal_th', 'J')).toBeCloseTo(4.184, 12) // NIST SP 811 App. B: cal_th = 4.184 J
    expect(convertEnergy(1, 'cal_IT', 'J')).toBeCloseTo(4.1868, 12) // NIST SP 811 App. B: cal_IT = 4.1868 J
    expect(convertEnergy(1, 'Btu_IT', 'J')).toBeCloseTo(1055.05585262, 8) // NIST SP 811 App. B: Btu_IT
    expect(convertEnergy(8000, 'cal_th', 'kJ')).toBeCloseTo(33.472, 9) // 8,000 cal ≈ 33 kJ (cal_th, NIST SP 811)
  })

  it('converts specific energy with 1 Btu/lb = 2.326 J/g and 1 cal_IT/g = 1.8 Btu/lb', () => {
    expect(convertSpecificEnergy(1, 'Btu/lb', 'J/g')).toBeCloseTo(2.326, 12) // NIST SP 811 App. B
    expect(convertSpecificEnergy(1, 'cal_IT/g', 'Btu/lb')).toBeCloseTo(1.8, 12) // NIST SP 811 App. B
    expect(convertSpecificEnergy(26.454, 'MJ/kg', 'J/g')).toBeCloseTo(26454, 8) // SI prefixes
  })

  it('converts pressure, mass and volume', () => {
    expect(convertPressure(1, 'atm', 'MPa')).toBeCloseTo(0.101325, 12) // NIST SP 811 App. B: standard atmosphere
    expect(convertPressure(1, 'psi', 'MPa')).toBeCloseTo(6.894757e-3, 9) // NIST SP 811 App. B: 1 psi = 6.894 757 kPa
    expect(convertPressure(1, 'bar', 'MPa')).toBeCloseTo(0.1, 12) // NIST SP 811 App. B
    expect(convertPressure(40, 'atm', 'MPa')).toBeCloseTo(4.053, 3) // 40 atm ≈ 4.05 MPa
    expect(convertMass(250, 'mg', 'g')).toBeCloseTo(0.25, 12) // SI prefixes
    expect(convertVolume(300, 'mL', 'L')).toBeCloseTo(0.3, 12) // SI prefixes
  })

  it('adds one standard atmosphere between gauge and absolute', () => {
    expect(gaugeToAbsoluteMPa(3.0)).toBeCloseTo(3.101325, 12) // NIST SP 811: 1 atm = 0.101325 MPa
    expect(absoluteToGaugeMPa(gaugeToAbsoluteMPa(2.5))).toBeCloseTo(2.5, 12)
    expect(gaugeToAbsoluteMPa(0)).toBeCloseTo(convertPressure(1, 'atm', 'MPa'), 12) // same constant as the mathjs unit
  })
})

describe('the mathjs-free specific-energy module', () => {
  const mathjsName: Record<SpecificEnergyUnit, SpecificEnergyUnitName> = { 'J/g': 'J/g', 'MJ/kg': 'MJ/kg', 'cal/g': 'cal_IT/g', 'cal_th/g': 'cal_th/g', 'Btu/lb': 'Btu/lb' }

  it('agrees with the mathjs conversion for every display unit', () => {
    const random = seededRandom(811)
    for (let i = 0; i < 200; i++) {
      const jPerG = random() * 60000
      for (const unit of SPECIFIC_ENERGY_UNITS) {
        const viaMathjs = convertSpecificEnergy(jPerG, 'J/g', mathjsName[unit])
        expect(fromJPerG(jPerG, unit)).toBeCloseTo(viaMathjs, 9)
        expect(toJPerG(fromJPerG(jPerG, unit), unit)).toBeCloseTo(jPerG, 9)
      }
    }
  })

  it('formats benzoic acid in each unit with the unit beside the number', () => {
    expect(formatSpecificEnergy(26454, 'J/g')).toBe('26,454 J/g') // NIST SRM 39j, weighed in air
    expect(formatSpecificEnergy(26454, 'MJ/kg')).toBe('26.454 MJ/kg')
    expect(formatSpecificEnergy(26454, 'cal/g')).toBe('6,318.4 cal/g') // 26,454 / 4.1868 (NIST SP 811) = 6,318.4
    expect(formatSpecificEnergy(26454, 'Btu/lb')).toBe('11,373 Btu/lb') // 26,454 / 2.326 (NIST SP 811) = 11,373.2
  })
})
