// The shipped reference materials and the demo lab's own still give sensible verdicts in an ordinary charge:
// fuels, foods and polymers clear within the vessel's limits; what the screen should stop, it stops.
import { describe, expect, it } from 'vitest'
import { assess, type Verdict } from '#shared/domain/assessment'
import { DEFAULT_POLICY } from '#shared/domain/policy'
import { componentFromMaterial, type MaterialLike } from '#shared/material-component'
import { DEMO_MATERIALS } from '../../../data/demo-lab'
import { REFERENCE_MATERIALS } from '../../../data/reference-materials'
import { makeCharge, makeVessel, nichromeFuse } from '../assessment/factories'

const asRecord = (m: Record<string, unknown>, recorded: boolean): MaterialLike => ({
  name: String(m.name), category: (m.category as string) ?? null, heatingValueJPerG: (m.heatingValueJPerG as number) ?? null,
  composition: m.composition ?? null, compositionBasis: (m.compositionBasis as string) ?? null, formula: (m.formula as string) ?? null,
  smiles: (m.smiles as string) ?? null, declaredHazard: (m.declaredHazard as string) ?? 'none', decompositionEnergyJPerG: null,
  reference: !!m.reference, identityRecordedBy: recorded ? 'demo-supervisor' : null, boilingPointC: (m.boilingPointC as number) ?? null,
  chlorinePct: (m.chlorinePct as number) ?? null,
})

// Expected verdict in a standard 33 kJ vessel at a mass releasing about 20 kJ (at most 1.0 g); the lab's rules.
const EXPECTED: Record<string, Verdict> = {
  'Poly(vinyl chloride) (typical)': 'needs-approval', // 56.7 % Cl, standard vessel not halogen-resistant
  'Ammonium nitrate': 'blocked', // nitrate group, OB +20 %: energetic by Table A6.1
  '2,2,4-Trimethylpentane (isooctane)': 'needs-approval', // boils at 99.2 °C, below the 100 °C policy: capsule needed
  'Nitrocellulose': 'blocked',
  'Recovered propellant fines (client RP-1)': 'blocked',
  'n-Pentane': 'needs-approval', // boils at 36.1 °C, no capsule
}

describe('demo and reference materials', () => {
  const all = [...REFERENCE_MATERIALS.map(m => asRecord(m as unknown as Record<string, unknown>, false)), ...DEMO_MATERIALS.map(m => asRecord(m as unknown as Record<string, unknown>, true))]
  for (const m of all) {
    it(m.name, async () => {
      const massG = Math.min(1.0, 20000 / (m.heatingValueJPerG ?? 26000))
      const a = await assess(makeCharge([componentFromMaterial(m, { massG }), nichromeFuse()], { vessel: makeVessel() }), DEFAULT_POLICY)
      const expected = EXPECTED[m.name] ?? 'clear'
      expect(a.verdict, a.findings.filter(f => f.severity !== 'info').map(f => f.message).join(' | ')).toBe(expected)
    })
  }
})
