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

  it('flags an oxygen-holding group when OB is at the limit and clears it just below', () => {
    const obTnt = oxygenBalancePct(tnt.atoms, tnt.molarMassGPerMol)
    // UN App. 6: the exemption needs OB below −200 %; moving the policy limit around TNT's OB tests both sides.
    expect(screenComponent({ groups: ['nitro'], ...tnt }, policyWith({ energeticObThresholdPct: obTnt })).status).toBe('energetic')
    expect(screenComponent({ groups: ['nitro'], ...tnt }, policyWith({ energeticObThresholdPct: obTnt + 0.01 })).status).toBe('cleared')
    expect(screenComponent({ groups: ['nitro'], ...tnt }, DEFAULT_POLICY).status).toBe('energetic')
  })

  it('never lets the oxygen balance clear a group without oxygen, nor a mix with one', () => {
    // UN App. 6: the OB exemption applies only when the group contains oxygen. Dodecyl azide C12H25N3, OB −276 %.
    const azide = { atoms: { C: 12, H: 25, N: 3 }, molarMassGPerMol: 211.353 }
    expect(screenComponent({ groups: ['azide'], ...azide }, DEFAULT_POLICY).status).toBe('energetic')
    expect(screenComponent({ groups: ['nitro', 'azo'], ...azide }, DEFAULT_POLICY).status).toBe('energetic')
    expect(screenComponent({ groups: ['nitro'], ...azide }, DEFAULT_POLICY).status).toBe('cleared')
  })

  it('clears by decomposition energy only from an evidenced library record of an organic substance', () => {
    // UN App. 6: exothermic decomposition energy < 500 J/g with onset < 500 °C clears an organic substance.
    const record = { energyJPerG: 499, onsetC: 180, method: 'DSC, 5 K/min, sealed crucible', evidence: 'attachment DSC-0042', recordedBy: 'supervisor-1' }
    expect(screenComponent({ groups: ['nitro'], ...tnt, decompositionRecord: record }, DEFAULT_POLICY)).toMatchObject({ status: 'cleared', clearedBy: 'decomposition-energy' })
    expect(screenComponent({ groups: ['nitro'], ...tnt, decompositionRecord: { ...record, energyJPerG: 500 } }, DEFAULT_POLICY).status).toBe('energetic')
    expect(screenComponent({ groups: ['nitro'], ...tnt, decompositionRecord: { ...record, onsetC: 500 } }, DEFAULT_POLICY).status).toBe('energetic')
    expect(screenComponent({ groups: ['nitro'], ...tnt, decompositionRecord: { ...record, evidence: undefined } }, DEFAULT_POLICY).status).toBe('energetic')
    expect(screenComponent({ groups: ['nitro'], ...tnt, decompositionRecord: { ...record, onsetC: undefined } }, DEFAULT_POLICY).status).toBe('energetic')
    // A value typed on a run never clears, however low.
    const typed = screenComponent({ groups: ['nitro'], ...tnt, typedDecompositionEnergyJPerG: 1 }, DEFAULT_POLICY)
    expect(typed.status).toBe('energetic')
    expect(typed.reasons.join(' ')).toContain('never used to clear')
    // Not organic: the exemption does not apply (lead azide PbN6).
    expect(screenComponent({ groups: ['azide'], atoms: { Pb: 1, N: 6 }, molarMassGPerMol: 291.24, decompositionRecord: record }, DEFAULT_POLICY).status).toBe('energetic')
  })

  it('needs the structure of a formula that could hold a group, even when declared "none"', () => {
    // Identity rule: N with O; two or more N; two or more O with OB above −200 %; halogen with O or N; metal with C, N or O.
    expect(screenComponent({ declaredHazard: 'none', atoms: { C: 1, H: 3, N: 1, O: 2 }, molarMassGPerMol: 61.04 }, DEFAULT_POLICY).status).toBe('structure-needed')
    expect(screenComponent({ atoms: { C: 8, H: 10, N: 4, O: 2 }, molarMassGPerMol: 194.194 }, DEFAULT_POLICY).status).toBe('structure-needed')
    expect(screenComponent({ atoms: { C: 6, H: 11, N: 1, O: 1 }, molarMassGPerMol: 113.16 }, DEFAULT_POLICY).status).toBe('structure-needed')
    // Benzoic acid C7H6O2: OB −196.5 % is above −200 %, so two O need the structure too.
    expect(screenComponent({ atoms: { C: 7, H: 6, O: 2 }, molarMassGPerMol: 122.123 }, DEFAULT_POLICY).status).toBe('structure-needed')
    // Ethanol C2H6O: one O, no N: it cannot hold a group.
    expect(screenComponent({ atoms: { C: 2, H: 6, O: 1 }, molarMassGPerMol: 46.069 }, DEFAULT_POLICY)).toMatchObject({ status: 'cleared', clearedBy: 'formula-cannot-hold-group' })
    // Dioctyl ether-like C16H34O2: OB −1600·(32 + 17 − 2)/258.4 = −291 %: two O but OB below −200 %.
    expect(screenComponent({ atoms: { C: 16, H: 34, O: 2 }, molarMassGPerMol: 258.446 }, DEFAULT_POLICY).status).toBe('cleared')
    expect(screenComponent({}, DEFAULT_POLICY).status).toBe('identity-unknown')
    expect(screenComponent({ composition: { C: 70, H: 5 } }, DEFAULT_POLICY).status).toBe('identity-unknown')
    expect(screenComponent({ composition: { C: 70, H: 5 }, category: 'coal' }, DEFAULT_POLICY)).toMatchObject({ status: 'cleared', clearedBy: 'category' })
  })

  it('measures the oxidiser share of a mixture', () => {
    expect(oxidiserFractionPct([{ massG: 0.85, oxidiser: false }, { massG: 0.15, oxidiser: true }])).toBeCloseTo(15, 10)
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
    ['potassium perchlorate', '[K+].[O-]Cl(=O)(=O)=O', 'o-halogen'],
    ['allene', 'C=C=C', '1,2-diene'],
    ['isoxazole', 'c1cnoc1', '1,2-oxazole'],
    ['hydroxylamine', 'NO', 'hydroxylamine'],
    ['sodium amide', '[Na]N', 'n-metal'],
    ['methyllithium', 'C[Li]', 'c-metal'],
    ['tosyl hydrazide', 'Cc1ccc(cc1)S(=O)(=O)NN', 'sulfonyl-hydrazide'],
    ['iodosylbenzene', 'O=Ic1ccccc1', 'o-halogen'],
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
