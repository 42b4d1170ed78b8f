// Properties of the charge check over many seeded random charges (mulberry32, so every run repeats exactly):
// the library's word on a material cannot be weakened from a run, and more in the vessel never means less heat.
import { describe, expect, it } from 'vitest'
import { assess, type ChargeComponentInput, type Verdict } from '#shared/domain/assessment'
import { DEFAULT_POLICY } from '#shared/domain/policy'
import { componentFromMaterial, type MaterialLike } from '#shared/material-component'
import { makeCharge, makeVessel, seededRandom } from '../assessment/factories'

const RANK: Record<Verdict, number> = { 'clear': 0, 'needs-approval': 1, 'blocked': 2 }
const pick = <T>(rnd: () => number, list: readonly T[]): T => list[Math.floor(rnd() * list.length)]!

const base: MaterialLike = { name: 'm', category: 'chemical', heatingValueJPerG: null, composition: null, compositionBasis: null, formula: null, smiles: null, declaredHazard: 'none', decompositionEnergyJPerG: null }
// Library records of every kind: energetic, oxidiser, structure, formula, analysis with category, classified, bare.
const MATERIALS: MaterialLike[] = [
  { ...base, name: 'propellant fines', category: 'waste fuel', declaredHazard: 'energetic' },
  { ...base, name: 'ammonium nitrate', formula: 'H4N2O3', declaredHazard: 'oxidiser' },
  { ...base, name: 'benzoic acid', category: 'reference standard', smiles: 'OC(=O)c1ccccc1', heatingValueJPerG: 26454, reference: true },
  { ...base, name: 'nitrobenzene', smiles: 'c1ccccc1[N+](=O)[O-]' },
  { ...base, name: 'cyclic peroxide by formula', formula: 'C9H18O6' },
  { ...base, name: 'coal', category: 'coal', composition: { C: 72, H: 4.8, N: 1.5, S: 0.9, O: 8.2, ash: 12.5 }, compositionBasis: 'dry' },
  { ...base, name: 'oats', category: 'food', heatingValueJPerG: 17800, identityRecordedBy: 'supervisor-1' },
  { ...base, name: 'unrecorded oil', category: 'liquid fuel', heatingValueJPerG: 45000 },
  { ...base, name: 'pentane', smiles: 'CCCCC', boilingPointC: 36.1, heatingValueJPerG: 48640, reference: true },
  { ...base, name: 'PVC', category: 'polymer', formula: 'C2H3Cl', chlorinePct: 56.7, heatingValueJPerG: 19000, reference: true },
]
// What a planner might type on the run for each identity field.
const RUN_FIELDS: (() => Partial<ChargeComponentInput>)[] = [
  () => ({ declaredHazard: 'none' }),
  () => ({ declaredHazard: 'oxidiser' }),
  () => ({ formula: 'C7H6O2' }),
  () => ({ smiles: 'CCCCCCCC' }),
  () => ({ composition: { C: 85, H: 15, basis: 'dry' } }),
  () => ({ category: 'coal' }),
  () => ({ decompositionEnergyJPerG: 1 }),
  () => ({ boilingPointC: 250 }),
  () => ({ chlorinePct: 0 }),
]

describe('property: a run cannot weaken the library record of its material', () => {
  it('never lowers the verdict, over 300 random charges', async () => {
    const rnd = seededRandom(20261202)
    for (let i = 0; i < 300; i++) {
      const m = pick(rnd, MATERIALS)
      const massG = 0.05 + rnd() * 0.9
      const overrides = Object.assign({}, ...Array.from({ length: 1 + Math.floor(rnd() * 4) }, () => pick(rnd, RUN_FIELDS)()))
      const fuse: ChargeComponentInput = { role: 'fuse', wire: 'nichrome', lengthCm: 10 }
      const vessel = makeVessel({ class: rnd() < 0.5 ? 'standard' : 'high-strength' })
      const plain = await assess(makeCharge([componentFromMaterial(m, { massG }), fuse], { vessel }), DEFAULT_POLICY)
      const typed = await assess(makeCharge([componentFromMaterial(m, { massG, ...overrides }), fuse], { vessel }), DEFAULT_POLICY)
      expect(RANK[typed.verdict], `${m.name} with ${JSON.stringify(overrides)}`).toBeGreaterThanOrEqual(RANK[plain.verdict])
    }
  })
})

describe('property: adding a component never lowers the heat release', () => {
  const SAMPLES: Partial<ChargeComponentInput>[] = [
    { smiles: 'OC(=O)c1ccccc1' }, { formula: 'Al' }, { formula: 'Mg' }, { formula: 'KClO4' }, { formula: 'C9H18O6' },
    { composition: { C: 5, O: 90, basis: 'dry' }, category: 'waste fuel' }, { composition: { C: 50, H: 6, O: 43, basis: 'dry' }, category: 'biomass' },
    { heatingValueJPerG: 0 }, {}, { formula: 'NaCl' },
  ]
  const randomComponent = (rnd: () => number): ChargeComponentInput => {
    const r = rnd()
    if (r < 0.2) return { role: 'fuse', wire: pick(rnd, ['nichrome', 'iron', 'platinum'] as const), lengthCm: rnd() * 15 }
    if (r < 0.3) return { role: 'fuse', wire: 'cotton', massG: rnd() * 0.01 }
    return { role: r < 0.5 ? 'aid' : 'sample', massG: rnd() * 0.6, ...pick(rnd, SAMPLES) }
  }
  it('holds over 300 random charges', async () => {
    const rnd = seededRandom(42)
    for (let i = 0; i < 300; i++) {
      const components: ChargeComponentInput[] = [{ role: 'sample', massG: 0.05 + rnd() * 0.5, ...pick(rnd, SAMPLES) }]
      for (let k = Math.floor(rnd() * 3); k > 0; k--) components.push(randomComponent(rnd))
      const before = await assess(makeCharge(components), DEFAULT_POLICY)
      const extra = randomComponent(rnd)
      const after = await assess(makeCharge([...components, extra]), DEFAULT_POLICY)
      expect(after.heatReleaseJ, JSON.stringify(extra)).toBeGreaterThanOrEqual(before.heatReleaseJ - 1e-9)
    }
  })
})

describe('element fuels (NIST-JANAF formation enthalpies of the oxides, from memory)', () => {
  it.each([
    // element, kJ/g expected from secondary tabulations (REFERENCES sheet values: Al 31.0, Mg 24.7, Si 32.4, Ti 19.7, Zr 12.0, B 58.9)
    ['Al', 31.0], ['Mg', 24.7], ['Si', 32.4], ['Ti', 19.7], ['Zr', 12.0], ['B', 58.9],
  ])('%s burns at about %s kJ/g', async (element, kJPerG) => {
    const a = await assess(makeCharge([{ role: 'sample', massG: 1, formula: element as string }]), DEFAULT_POLICY)
    expect(a.components[0]!.heatingValueJPerG! / 1000).toBeCloseTo(kJPerG as number, 0)
    expect(a.components[0]!.heatingValueSource).toBe('element-oxide')
  })

  it('gives 1.2 g of aluminium about 37 kJ, blocked on a 33 kJ vessel, with its oxygen', async () => {
    // 1.2 g × 1675.7 kJ/mol / (2 × 26.982 g/mol) = 37.26 kJ; O2 = 1.2/26.982 × 0.75 = 0.03336 mol (stoichiometry).
    const a = await assess(makeCharge([{ role: 'sample', massG: 1.2, formula: 'Al' }]), DEFAULT_POLICY)
    expect(a.heatReleaseJ).toBeCloseTo(1.2 * 1675700 / (2 * 26.982), 0)
    expect(a.oxygenDemandMol).toBeCloseTo(1.2 / 26.982 * 0.75, 5)
    expect(a.verdict).toBe('blocked')
  })

  it('takes the policy value for a formula with elements outside C, H, N, O, S, Cl', async () => {
    const a = await assess(makeCharge([{ role: 'sample', massG: 0.2, formula: 'C2H6Zn' }]), DEFAULT_POLICY)
    expect(a.components[0]!.heatingValueJPerG).toBe(DEFAULT_POLICY.fallbackHeatingValueJPerG)
    expect(a.findings.find(f => f.code === 'heating-value-unknown')?.message).toContain('Zn')
  })
})
