// Quantities typed as people say them, read into the API's units.
import { describe, expect, it } from 'vitest'
import { inUnit, normaliseNumberText, parseColumnCell, parseQuantity, parseQuantityCell } from '#shared/domain/quantity'

const value = (text: string, kind: Parameters<typeof parseQuantity>[1]) => {
  const p = parseQuantity(text, kind)
  if (!p || !p.ok) throw new Error(`not parsed: ${text} → ${JSON.stringify(p)}`)
  return p.value
}

describe('parseQuantity', () => {
  it('reads masses in g and mg (SI prefixes, NIST SP 811)', () => {
    expect(value('950 mg', 'mass')).toBeCloseTo(0.95, 12)
    expect(value('0.95 g', 'mass')).toBeCloseTo(0.95, 12)
    expect(value('0,95', 'mass')).toBeCloseTo(0.95, 12)
    expect(value('950mg', 'mass')).toBeCloseTo(0.95, 12)
  })

  it('reads pressures as gauge MPa: 1 bar = 0.1 MPa, 1 psi = 6.894757 kPa (NIST SP 811 App. B)', () => {
    expect(value('30 bar', 'pressure')).toBeCloseTo(3, 12)
    expect(value('435 psi', 'pressure')).toBeCloseTo(2.999219, 5) // 435 × 6.894757 kPa
    expect(value('3 MPa', 'pressure')).toBe(3)
    expect(value('3,05 MPa', 'pressure')).toBeCloseTo(3.05, 12)
    expect(value('3050 kPa', 'pressure')).toBeCloseTo(3.05, 12)
    const p = parseQuantity('30 bar', 'pressure')
    expect(p).toMatchObject({ ok: true, basis: 'gauge', understood: '3 MPa gauge' })
  })

  it('turns an absolute pressure into gauge by one standard atmosphere, 0.101325 MPa (NIST SP 811 App. B)', () => {
    for (const t of ['31.01325 bara', '31.01325 bar(a)', '3.101325 MPa abs', '3.101325 MPa (a)']) expect(value(t, 'pressure'), t).toBeCloseTo(3, 9)
    expect(value('30 barg', 'pressure')).toBeCloseTo(3, 12)
    expect(value('450 psia', 'pressure')).toBeCloseTo(450 * 0.006894757 - 0.101325, 6) // NIST SP 811 App. B: psi
  })

  it('reads specific energy: 1 MJ/kg = 1000 J/g; a bare cal is cal_IT = 4.1868 J (NIST SP 811 App. B)', () => {
    expect(value('26.45 MJ/kg', 'specificEnergy')).toBeCloseTo(26450, 8)
    expect(value('6318 cal/g', 'specificEnergy')).toBeCloseTo(6318 * 4.1868, 6)
    expect(value('6318 cal_IT/g', 'specificEnergy')).toBeCloseTo(26452.2, 1)
    expect(value('6318 cal_th/g', 'specificEnergy')).toBeCloseTo(6318 * 4.184, 6)
    expect(value('6318 kcal/kg', 'specificEnergy')).toBeCloseTo(6318 * 4.1868, 6)
    expect(value('11372 Btu/lb', 'specificEnergy')).toBeCloseTo(11372 * 2.326, 4) // NIST SP 811: 1 Btu_IT/lb = 2.326 J/g
    expect(value('26 450 J/g', 'specificEnergy')).toBe(26450)
  })

  it('says so when the dimension is wrong, the unit unknown or the text not a number', () => {
    expect(parseQuantity('30 g', 'pressure')).toMatchObject({ ok: false, error: expect.stringMatching(/not a pressure/) })
    expect(parseQuantity('3 MPa', 'mass')).toMatchObject({ ok: false, error: expect.stringMatching(/not a mass/) })
    expect(parseQuantity('26 MJ', 'specificEnergy')).toMatchObject({ ok: false, error: expect.stringMatching(/energy per mass/) })
    expect(parseQuantity('3 furlongs', 'pressure')).toMatchObject({ ok: false, error: expect.stringMatching(/not a unit/) })
    expect(parseQuantity('abc', 'mass')).toMatchObject({ ok: false, error: expect.stringMatching(/is not a number/) })
    expect(parseQuantity('3 MPa; 1+1', 'pressure')).toMatchObject({ ok: false })
    expect(parseQuantity('   ', 'mass')).toBeNull()
  })

  it('takes a bare number in the field unit', () => {
    expect(parseQuantity('1.2', 'mass')).toMatchObject({ ok: true, value: 1.2, understood: '1.2 g' })
    expect(parseQuantity('3', 'pressure')).toMatchObject({ ok: true, value: 3, basis: 'gauge' })
  })
})

describe('normaliseNumberText and parseQuantityCell', () => {
  it('accepts a decimal comma and grouped thousands', () => {
    expect(normaliseNumberText('3,05 MPa')).toBe('3.05 MPa')
    expect(normaliseNumberText('26 450 J/g')).toBe('26450 J/g')
  })
  it('gives undefined for an empty cell, the number, or an Error', () => {
    expect(parseQuantityCell('', 'mass')).toBeUndefined()
    expect(parseQuantityCell('950 mg', 'mass')).toBeCloseTo(0.95, 12)
    expect(parseQuantityCell('30 g', 'pressure')).toBeInstanceOf(Error)
  })
})

describe('parseColumnCell', () => {
  it('reads import cells in the unit their column names, converting a unit typed in the cell (NIST SP 811)', () => {
    expect(parseColumnCell('0.95', 'mass_g')).toBe(0.95)
    expect(parseColumnCell('950 mg', 'mass_g')).toBeCloseTo(0.95, 12)
    expect(parseColumnCell('30 bar', 'fill_pressure_mpa')).toBeCloseTo(3, 12)
    expect(parseColumnCell('26.45 MJ/kg', 'heating_value_j_per_g')).toBeCloseTo(26450, 8)
    expect(parseColumnCell('3,5', 'C')).toBe(3.5)
    expect(parseColumnCell('30 g', 'fill_pressure_mpa')).toBeInstanceOf(Error)
    expect(parseColumnCell('lots', 'ash')).toBeInstanceOf(Error)
  })
})

describe('inUnit', () => {
  it('gives a field kept in another unit of its kind its own figure (SI prefixes and calories, NIST SP 811)', () => {
    expect(inUnit(33000, 'energy', 'kJ')).toBeCloseTo(33, 12)
    expect(inUnit(0.95, 'mass', 'mg')).toBeCloseTo(950, 9)
    expect(inUnit(300, 'volume', 'L')).toBeCloseTo(0.3, 12)
    // 26 454 J/g ÷ 4.1868 J/cal_IT = 6318.43 cal_IT/g (NIST SP 811, Appendix B).
    expect(inUnit(26454, 'specificEnergy', 'cal/g')).toBeCloseTo(6318.43, 2)
    expect(inUnit(26454, 'specificEnergy', 'cal_th/g')).toBeCloseTo(26454 / 4.184, 6)
  })
})
