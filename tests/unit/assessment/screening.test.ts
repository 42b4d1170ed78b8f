import { describe, expect, it } from 'vitest'
import { compositionFromFormula } from '#shared/domain/composition'
import { DEFAULT_POLICY } from '#shared/domain/policy'
import { oxidiserFractionPct, oxygenBalancePct, screenComponent } from '#shared/domain/screening'
import { analyseStructure } from '#shared/domain/structure'
import { policyWith } from './factories'

async function ob(formula: string): Promise<number> {
  const f = await compositionFromFormula(formula)
  return oxygenBalancePct(f.atoms, f.molarMassGPerMol)
}

describe('oxygen balance OB% = −1600·(2C + H/2 − O)/M', () => {
  // Handbook values (Meyer, Köhler & Homburg, Explosives), to the 0.1 % they are quoted.
  it.each([
    ['TNT', 'C7H5N3O6', -74.0],
    ['RDX', 'C3H6N6O6', -21.6],
    ['PETN', 'C5H8N4O12', -10.1],
    ['nitroglycerin', 'C3H5N3O9', 3.5],
    ['ammonium nitrate', 'NH4NO3', 20.0],
    ['nitromethane', 'CH3NO2', -39.3],
  ])('%s (%s) is %f %%', async (_name, formula, expected) => {
    expect(await ob(formula)).toBeCloseTo(expected, 1)
  })
})

describe('screening rules (UN Manual of Tests and Criteria, Appendix 6)', () => {
  const tnt = { atoms: { C: 7, H: 5, N: 3, O: 6 }, molarMassGPerMol: 227.132 }

  it('treats a declared energetic as energetic whatever else is known', () => {
    expect(screenComponent({ declaredHazard: 'energetic' }, DEFAULT_POLICY).status).toBe('energetic')
  })

  it('clears a structure without explosophores', () => {
    expect(screenComponent({ groups: [], atoms: { C: 7, H: 6, O: 2 }, molarMassGPerMol: 122.123 }, DEFAULT_POLICY))
      .toMatchObject({ status: 'cleared', clearedBy: 'no-groups' })
  })

  it('flags an explosophore when OB is just above the limit and clears it just below', () => {
    const obTnt = oxygenBalancePct(tnt.atoms, tnt.molarMassGPerMol)
    // The −200 % limit is policy (UN App. 6); moving it around TNT's OB tests both sides of the boundary.
    expect(screenComponent({ groups: ['nitro'], ...tnt }, policyWith({ energeticObThresholdPct: obTnt - 0.01 })).status).toBe('energetic')
    expect(screenComponent({ groups: ['nitro'], ...tnt }, policyWith({ energeticObThresholdPct: obTnt })).status).toBe('cleared')
    expect(screenComponent({ groups: ['nitro'], ...tnt }, DEFAULT_POLICY).status).toBe('energetic')
  })

  it('clears an explosophore whose decomposition energy is below 500 J/g and not at 500 J/g', () => {
    // UN App. 6: exothermic decomposition energy < 500 J/g clears an organic substance.
    expect(screenComponent({ groups: ['nitro'], ...tnt, decompositionEnergyJPerG: 499 }, DEFAULT_POLICY)).toMatchObject({ status: 'cleared', clearedBy: 'decomposition-energy' })
    expect(screenComponent({ groups: ['nitro'], ...tnt, decompositionEnergyJPerG: 500 }, DEFAULT_POLICY).status).toBe('energetic')
  })

  it('cannot clear a formula with N and O and OB above −200 %, even when declared "none"', () => {
    // DESIGN §3.5: the planner's own "none" does not clear a formula without structure.
    expect(screenComponent({ declaredHazard: 'none', atoms: { C: 1, H: 3, N: 1, O: 2 }, molarMassGPerMol: 61.04 }, DEFAULT_POLICY).status).toBe('unclearable')
    // Caffeine C8H10N4O2: OB = −1600·(16 + 5 − 2)/194.19 = −156.5 % (> −200 %), so unclearable too.
    expect(screenComponent({ atoms: { C: 8, H: 10, N: 4, O: 2 }, molarMassGPerMol: 194.194 }, DEFAULT_POLICY).status).toBe('unclearable')
    // Nylon-6 repeat unit C6H11NO: OB = −1600·(12 + 5.5 − 1)/113.16 = −233 % (< −200 %): cleared.
    expect(screenComponent({ atoms: { C: 6, H: 11, N: 1, O: 1 }, molarMassGPerMol: 113.16 }, DEFAULT_POLICY)).toMatchObject({ status: 'cleared', clearedBy: 'oxygen-balance' })
    expect(screenComponent({ atoms: { C: 7, H: 6, O: 2 }, molarMassGPerMol: 122.123 }, DEFAULT_POLICY)).toMatchObject({ status: 'cleared', clearedBy: 'no-n-and-o' })
  })

  it('measures the oxidiser share of a mixture', () => {
    expect(oxidiserFractionPct([{ massG: 0.85 }, { massG: 0.15, declaredHazard: 'oxidiser' }])).toBeCloseTo(15, 10)
  })
})

describe('structure analysis (openchemlib)', () => {
  it('derives formula, molar mass and composition from SMILES', () => {
    const ba = analyseStructure('OC(=O)c1ccccc1')
    expect(ba.formula).toBe('C7H6O2')
    expect(ba.molarMassGPerMol).toBeCloseTo(122.123, 3) // IUPAC atomic weights
    expect(ba.explosophores).toEqual([])
  })

  it.each([
    ['TNT', 'Cc1c(cc(cc1[N+](=O)[O-])[N+](=O)[O-])[N+](=O)[O-]', 'nitro'],
    ['RDX (nitramine)', 'C1N(CN(CN1[N+](=O)[O-])[N+](=O)[O-])[N+](=O)[O-]', 'nitro'],
    ['nitromethane, uncharged notation', 'CN(=O)=O', 'nitro'],
    ['PETN', 'C(C(CO[N+](=O)[O-])(CO[N+](=O)[O-])CO[N+](=O)[O-])O[N+](=O)[O-]', 'nitrate-ester'],
    ['ammonium nitrate', '[NH4+].[O-][N+](=O)[O-]', 'nitrate'],
    ['nitrosobenzene', 'O=Nc1ccccc1', 'nitroso'],
    ['pyridine N-oxide', '[O-][n+]1ccccc1', 'n-oxide'],
    ['methyl azide', 'CN=[N+]=[N-]', 'azide'],
    ['sodium azide', '[Na+].[N-]=[N+]=[N-]', 'azide'],
    ['azobenzene', 'c1ccc(cc1)N=Nc1ccccc1', 'azo'],
    ['diazomethane', 'C=[N+]=[N-]', 'diazo'],
    ['phenylhydrazine', 'NNc1ccccc1', 'hydrazine'],
    ['di-tert-butyl peroxide', 'CC(C)(C)OOC(C)(C)C', 'peroxide'],
    ['propylene ozonide', 'CC1OCOO1', 'ozonide'],
    ['N-chlorosuccinimide', 'ClN1C(=O)CCC1=O', 'n-halogen'],
    ['potassium perchlorate', '[K+].[O-]Cl(=O)(=O)=O', 'chlorate'],
    ['silver acetylide', '[Ag]C#C[Ag]', 'acetylide'],
    ['mercury fulminate', '[Hg+2].[O-][N+]#[C-].[O-][N+]#[C-]', 'fulminate'],
  ])('finds the group of %s', (_name, smiles, group) => {
    // Groups of the UN Manual of Tests and Criteria, Appendix 6, Table A6.1
    expect(analyseStructure(smiles).explosophores).toContain(group)
  })

  it.each([
    ['sucrose', 'OCC1OC(OC2(CO)OC(CO)C(O)C2O)C(O)C(O)C1O'],
    ['isooctane', 'CC(C)CC(C)(C)C'],
    ['acetamide', 'CC(N)=O'],
    ['pyridine', 'c1ccncc1'],
    ['nitrobenzene has no nitroso', 'O=[N+]([O-])c1ccccc1'],
  ])('finds no false group in %s', (name, smiles) => {
    const groups = analyseStructure(smiles).explosophores
    if (name.startsWith('nitrobenzene')) expect(groups).toEqual(['nitro'])
    else expect(groups).toEqual([])
  })

  it('refuses unparseable SMILES with a clear message', () => {
    expect(() => analyseStructure('C1CC')).toThrow(/not valid SMILES: dangling ring closure/)
    expect(() => analyseStructure('C(C')).toThrow(/not valid SMILES: its parentheses are unbalanced/)
    expect(() => analyseStructure('xyz')).toThrow(/not valid SMILES: unknown element label/)
    expect(() => analyseStructure('')).toThrow(/not valid SMILES: it is empty/)
  })
})
