import { describe, expect, it } from 'vitest'
import { chargeInputSchema } from '#shared/domain/assessment'
import { chemicalTextProblem, normaliseChemicalText } from '#shared/domain/hygiene'

// Unicode NFKC (Unicode Standard Annex #15) maps compatibility forms to ASCII; other scripts stay what they are.
describe('formula and structure text', () => {
  it('normalises full-width letters and subscript digits to ASCII', () => {
    expect(normaliseChemicalText('C₇H₆O₂')).toBe('C7H6O2')
    expect(normaliseChemicalText('ＯＣ(=Ｏ)c1ccccc1')).toBe('OC(=O)c1ccccc1')
    expect(chemicalTextProblem('C₇H₆O₂', 'formula')).toBeUndefined()
  })

  it('refuses a Cyrillic look-alike with the character and its position', () => {
    const p = chemicalTextProblem('\u0421(C)C', 'structure')
    expect(p).toMatchObject({ character: 'С', position: 1 })
    expect(p!.message).toContain('U+0421')
    expect(chemicalTextProblem('CC\u043EC', 'structure')).toMatchObject({ position: 3 }) // Cyrillic о
    expect(chemicalTextProblem('C\u200BC', 'structure')).toMatchObject({ position: 2 }) // zero-width space
    expect(chemicalTextProblem(' CCO\n', 'structure')).toBeUndefined()
  })

  it('answers through the request schema with the field path', () => {
    const r = chargeInputSchema.safeParse({ vessel: { ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4, volumeMl: 300, class: 'standard' }, fillPressureMPa: 3, components: [{ role: 'sample', massG: 0.5, smiles: '\u0421C' }] })
    expect(r.success).toBe(false)
    expect(r.error!.issues[0]!.path).toEqual(['components', 0, 'smiles'])
    expect(r.error!.issues[0]!.message).toContain('position 1')
    const ok = chargeInputSchema.parse({ vessel: { ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4, volumeMl: 300, class: 'standard' }, fillPressureMPa: 3, components: [{ role: 'sample', massG: 0.5, formula: ' C₇H₆O₂ ' }] })
    expect(ok.components[0]!.formula).toBe('C7H6O2')
  })
})
