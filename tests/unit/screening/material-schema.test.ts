import { describe, expect, it } from 'vitest'
import { materialCreateSchema, materialPatchSchema } from '#shared/schemas/materials'
import { runComponentSchema } from '#shared/schemas/plans'
import { vesselCreateSchema, vesselPatchSchema } from '#shared/schemas/vessels'

// The library keeps a decomposition energy only with the evidence UN Appendix 6 asks for (onset, method, document).
describe('materials, runs and vessels: what the schemas accept', () => {
  const base = { name: 'Nitro lot', category: 'chemical', smiles: 'CCCCCC[N+](=O)[O-]' }
  it('refuses a decomposition energy without onset, method and evidence, naming each', () => {
    const r = materialCreateSchema.safeParse({ ...base, decompositionEnergyJPerG: 300 })
    expect(r.success).toBe(false)
    expect(r.error!.issues.map(i => i.path[0])).toEqual(expect.arrayContaining(['decompositionOnsetC', 'decompositionMethod', 'decompositionEvidence']))
    expect(materialCreateSchema.safeParse({ ...base, decompositionEnergyJPerG: 300, decompositionOnsetC: 210, decompositionMethod: 'DSC 5 K/min', decompositionEvidence: 'DSC-0042' }).success).toBe(true)
    expect(materialPatchSchema.safeParse({ decompositionEnergyJPerG: 300, reason: 'new lot' }).success).toBe(false)
  })

  it('refuses a look-alike letter in a library structure and a run formula', () => {
    expect(materialCreateSchema.safeParse({ ...base, smiles: '\u0421CO' }).success).toBe(false)
    const run = runComponentSchema.safeParse({ role: 'sample', formula: 'C7H6\u041E2' })
    expect(run.success).toBe(false)
    expect(run.error!.issues[0]!.message).toContain('position 5')
  })

  it('takes the halogen-resistant mark on a vessel, false unless said', () => {
    const v = { name: 'T', serialNumber: 'S', class: 'standard', ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4.05, volumeMl: 300 }
    expect(vesselCreateSchema.parse(v).halogenResistant).toBe(false)
    expect(vesselCreateSchema.parse({ ...v, halogenResistant: true }).halogenResistant).toBe(true)
    expect(vesselPatchSchema.safeParse({ halogenResistant: 'yes' }).success).toBe(false)
  })
})
