import { describe, expect, it } from 'vitest'
import {
  BASES,
  airDriedFromDry,
  asReceivedFromDry,
  convertBasis,
  dryAshFreeFromDry,
  dryFromAirDried,
  type BasisConditions,
} from '../../../shared/domain/results/bases'

const BTU_PER_LB_J_PER_G = 2.326 // NIST SP 811, Appendix B

// A published US mid-volatile coking-coal analysis (laboratory report of March 2011, reproduced as
// "US Coking Coal Specifications" on studymode.com), as received and dry. Its two columns were produced
// independently of this code, so they check the ASTM D3180 factor (100 − M_ar)/100 to the report's rounding.
const report = {
  moistureAr: 7.28,
  asReceived: { volatile: 25.45, ash: 8.78, fixedCarbon: 58.49, grossBtuPerLb: 13_053 },
  dry: { volatile: 27.45, ash: 9.47, fixedCarbon: 63.08, grossBtuPerLb: 14_078 },
}

describe('basis conversion against a published coal analysis (ASTM D3180; ISO 1170)', () => {
  const c: BasisConditions = { moistureAr: report.moistureAr }

  it('as received → dry reproduces the report’s dry column to its last digit', () => {
    expect(convertBasis(report.asReceived.ash, 'as-received', 'dry', c)).toBeCloseTo(report.dry.ash, 2)
    expect(convertBasis(report.asReceived.volatile, 'as-received', 'dry', c)).toBeCloseTo(report.dry.volatile, 2)
    expect(convertBasis(report.asReceived.fixedCarbon, 'as-received', 'dry', c)).toBeCloseTo(report.dry.fixedCarbon, 2)
    expect(convertBasis(report.asReceived.grossBtuPerLb, 'as-received', 'dry', c)).toBeCloseTo(report.dry.grossBtuPerLb, 0)
  })

  it('dry → as received, in J/g too (1 Btu/lb = 2.326 J/g)', () => {
    const dryJPerG = report.dry.grossBtuPerLb * BTU_PER_LB_J_PER_G
    const arJPerG = convertBasis(dryJPerG, 'dry', 'as-received', c)
    expect(arJPerG / BTU_PER_LB_J_PER_G).toBeCloseTo(report.asReceived.grossBtuPerLb, 0)
  })

  it('dry ash-free volatile matter and fixed carbon add to 100 % (proximate closure, ASTM D3172)', () => {
    const ashDry = { ashDry: report.dry.ash }
    const vmDaf = convertBasis(report.dry.volatile, 'dry', 'dry-ash-free', ashDry)
    const fcDaf = convertBasis(report.dry.fixedCarbon, 'dry', 'dry-ash-free', ashDry)
    expect(vmDaf + fcDaf).toBeCloseTo(100, 2)
  })
})

describe('basis formulas (ASTM D3180; ISO 1170)', () => {
  // Arbitrary analysis figures; every expectation is the standard's formula worked by hand beside it.
  const conditions: BasisConditions = { moistureAd: 2.0, moistureAr: 10.0, ashDry: 12.0 }

  it('dry = ad·100/(100 − M_ad) and back', () => {
    expect(dryFromAirDried(24_500, 2)).toBeCloseTo((24_500 * 100) / 98, 9) // 25 000.000
    expect(airDriedFromDry(25_000, 2)).toBeCloseTo(24_500, 9)
  })

  it('ar = dry·(100 − M_ar)/100; daf = dry·100/(100 − A_d)', () => {
    expect(asReceivedFromDry(25_000, 10)).toBeCloseTo(22_500, 9)
    expect(dryAshFreeFromDry(25_000, 12)).toBeCloseTo((25_000 * 100) / 88, 9) // 28 409.091
  })

  it('air-dried → as-received is (100 − M_ar)/(100 − M_ad) (ASTM D3180 table of factors)', () => {
    expect(convertBasis(24_500, 'air-dried', 'as-received', conditions)).toBeCloseTo((24_500 * 90) / 98, 9)
  })

  it('air-dried → dry ash-free is 100/(100 − M_ad) × 100/(100 − A_d)', () => {
    expect(convertBasis(24_500, 'air-dried', 'dry-ash-free', conditions)).toBeCloseTo(((24_500 * 100) / 98) * (100 / 88), 9)
  })

  it('every pair of bases round-trips', () => {
    for (const from of BASES) {
      for (const to of BASES) {
        const there = convertBasis(25_000, from, to, conditions)
        expect(convertBasis(there, to, from, conditions)).toBeCloseTo(25_000, 8)
      }
    }
  })

  it('names the figure that is missing or impossible', () => {
    expect(() => convertBasis(25_000, 'dry', 'as-received', {})).toThrow('moistureAr is needed to convert to as-received')
    expect(() => convertBasis(25_000, 'dry', 'dry-ash-free', { ashDry: 100 })).toThrow(RangeError)
    expect(convertBasis(25_000, 'dry', 'dry', {})).toBe(25_000)
  })
})
