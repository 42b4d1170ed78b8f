// Every way around the charge check that a lab user or an attacker tried is now refused or not clear, through the
// same routes the browser uses. Rules: UN Manual of Tests and Criteria, Appendix 6; the lab's identity rules.
import { beforeAll, describe, expect, it } from 'vitest'
import { as, call, unique } from '../support/api'
import { auditRows } from '../support/db'
import { addRun, demoVessel, material, newPlan, newVessel } from '../support/factories'

// A typical standard vessel, ≈ 33 kJ rating (secondary summaries of ASTM E144 and makers' safety guidance).
const VESSEL = { ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4.05, volumeMl: 300, class: 'standard' }
const fuse = { role: 'fuse', wire: 'nichrome', lengthCm: 10 }
const codes = (a: { findings: { code: string }[] }) => a.findings.map(f => f.code)
const NO2 = '[N+](=O)[O-]'

async function assess(sample: Record<string, unknown>, extra: Record<string, unknown> = {}) {
  return call('POST', '/api/assess', { cookie: await as('analyst'), body: { vessel: VESSEL, fillPressureMPa: 3.0, components: [{ role: 'sample', massG: 0.5, ...sample }, fuse], ...extra } })
}

let plan: { id: string }
beforeAll(async () => {
  const kr1 = await demoVessel('KR-1')
  plan = await newPlan(kr1.id)
})

describe('a library material keeps its identity in every run', () => {
  it('blocks an energetic library material planned with declaredHazard "none" on the run', async () => {
    const propellant = await material('Recovered propellant fines')
    const res = await addRun(plan.id, { sampleCode: unique('RP'), components: [{ role: 'sample', materialId: propellant.id, massG: 0.5, declaredHazard: 'none', heatingValueJPerG: 5000 }, fuse] })
    expect(res.status).toBe(201)
    expect(res.body.verdict).toBe('blocked')
    const block = res.body.assessment.findings.find((f: { code: string }) => f.code === 'energetic-in-standard-vessel')
    expect(block.message).toContain('declared energetic in the materials library')
  })

  it('blocks the same material through the CSV import column', async () => {
    const csv = `sample_code,material,mass_g,declared_hazard,fuse_wire,fuse_length_cm\n${unique('RP')},Recovered propellant fines (client RP-1),0.5,none,nichrome,10\n`
    const res = await call('POST', `/api/plans/${plan.id}/import`, { cookie: await as('analyst'), body: { csv } })
    expect(res.status).toBe(200)
    expect(res.body.rows[0].verdict).toBe('blocked')
  })

  it('refuses a look-alike letter in a CSV formula, naming the column, the character and its position', async () => {
    const csv = `sample_code,formula,mass_g,fuse_wire,fuse_length_cm\n${unique('X')},\u0421H3NO2,0.5,nichrome,10\n`
    const res = await call('POST', `/api/plans/${plan.id}/import`, { cookie: await as('analyst'), body: { csv } })
    expect(res.body.rows[0].errors.join(' ')).toMatch(/formula: character "С" \(U\+0421\) at position 1/)
  })
})

describe('formula-only samples are never cleared', () => {
  // C9H18O6 (a cyclic peroxide), PbN6 and NaN3 (azides), Ag2C2 (acetylide), KClO4 (oxidiser), C14H10O4 (benzoyl peroxide).
  for (const formula of ['C9H18O6', 'PbN6', 'NaN3', 'Ag2C2', 'KClO4', 'C14H10O4']) {
    it(`${formula} is not clear`, async () => {
      const res = await assess({ formula, declaredHazard: 'none' })
      expect(res.status).toBe(200)
      expect(res.body.verdict).not.toBe('clear')
    })
  }

  it('says how to clear a formula-only sample: give the structure', async () => {
    const res = await assess({ formula: 'C9H18O6' })
    const f = res.body.findings.find((x: { code: string }) => x.code === 'structure-needed')
    expect(f.severity).toBe('approval')
    expect(f.message).toContain('Give the structure (SMILES)')
  })
})

describe('the oxygen-balance and decomposition exemptions apply only under their own conditions', () => {
  it('blocks an azide and an azo compound by structure whose OB is below −200 %', async () => {
    // Dodecyl azide C12H25N3 (OB −276 %) and AIBN C8H12N4 (OB −214 %), [C]: the groups hold no oxygen (UN App. 6).
    for (const smiles of ['CCCCCCCCCCCCN=[N+]=[N-]', 'CC(C)(C#N)N=NC(C)(C)C#N']) {
      const res = await assess({ smiles })
      expect(res.body.verdict).toBe('blocked')
      expect(codes(res.body)).toContain('energetic-in-standard-vessel')
    }
  })

  it('blocks a nitro compound by structure whatever decomposition energy is typed on a run', async () => {
    const res = await addRun(plan.id, { sampleCode: unique('NB'), components: [{ role: 'sample', smiles: `c1ccccc1${NO2}`, massG: 0.3, decompositionEnergyJPerG: 1 }, fuse] })
    expect(res.status).toBe(201)
    expect(res.body.verdict).toBe('blocked')
    expect(JSON.stringify(res.body.assessment.components[0].screening.reasons)).toContain('never used to clear')
  })
})

describe('input hygiene', () => {
  it('refuses tetranitromethane whose SMILES starts with a Cyrillic look-alike, naming the character and position', async () => {
    const smiles = `\u0421(${NO2})(${NO2})(${NO2})${NO2}`
    const res = await assess({ smiles })
    expect(res.status).toBe(422)
    const field = res.body.data.fields.find((f: { path: string }) => f.path === 'components.0.smiles')
    expect(field.message).toMatch(/"С" \(U\+0421\) at position 1/)
    const run = await addRun(plan.id, { sampleCode: unique('TNM'), components: [{ role: 'sample', smiles, massG: 0.3 }, fuse] })
    expect(run.status).toBe(422)
  })

  it('accepts full-width and subscript forms after NFKC normalisation', async () => {
    const res = await assess({ smiles: 'ＯＣ(=Ｏ)c1ccccc1', heatingValueJPerG: 26454 })
    expect(res.status).toBe(200)
    expect(res.body.verdict).toBe('clear')
  })
})

describe('metals and other fuels', () => {
  it('gives 1.2 g aluminium about 37 kJ and blocks it on a 33 kJ vessel', async () => {
    // Al → Al2O3: ΔfH° −1675.7 kJ/mol (NIST-JANAF, from memory) / (2 × 26.982 g/mol) = 31.05 kJ/g; 1.2 g → 37.3 kJ.
    const res = await assess({ formula: 'Al', massG: 1.2 })
    expect(res.body.heatReleaseJ).toBeGreaterThan(36000)
    expect(res.body.heatReleaseJ).toBeLessThan(38000)
    expect(res.body.oxygenDemandMol).toBeGreaterThan(0.03) // 1.2/26.982 × 0.75 = 0.0334 mol (stoichiometry)
    expect(res.body.verdict).toBe('blocked')
    expect(codes(res.body)).toEqual(expect.arrayContaining(['energy-over-rating', 'metal-powder']))
  })

  it('prices an unknown fuel above every pure liquid hydrocarbon', async () => {
    // n-pentane about 48.6 kJ/g (from memory), isooctane 47.788 kJ/g (ASTM D240): the policy value must exceed both.
    const res = await assess({ category: 'chemical' })
    expect(res.body.components[0].heatingValueJPerG).toBeGreaterThan(48600)
  })
})

describe('sample conditions', () => {
  it('needs a capsule for a volatile liquid, and clears it in one', async () => {
    // Diethyl ether, boiling point 34.6 °C (CRC Handbook, from memory); policy limit 100 °C.
    const bare = await assess({ smiles: 'CCOCC', boilingPointC: 34.6, heatingValueJPerG: 36700 })
    expect(codes(bare.body)).toContain('volatile-unsealed')
    expect(bare.body.verdict).toBe('needs-approval')
    const sealed = await call('POST', '/api/assess', { cookie: await as('analyst'), body: { vessel: VESSEL, fillPressureMPa: 3.0, components: [
      { role: 'sample', massG: 0.5, smiles: 'CCOCC', boilingPointC: 34.6, heatingValueJPerG: 36700 },
      { role: 'aid', massG: 0.1, containment: 'capsule', heatingValueJPerG: 19500, composition: { C: 50, H: 7, N: 18, O: 25 }, category: 'food' }, fuse] } })
    expect(codes(sealed.body)).not.toContain('volatile-unsealed')
  })

  it('asks for a halogen-resistant vessel above 2 % chlorine and speaks of hydrochloric acid', async () => {
    // PVC C2H3Cl: 56.7 % Cl (IUPAC atomic weights).
    const res = await assess({ formula: 'C2H3Cl', category: 'polymer', heatingValueJPerG: 19000 })
    const f = res.body.findings.find((x: { code: string }) => x.code === 'halogen-vessel')
    expect(f.severity).toBe('approval')
    expect(f.message).toContain('hydrochloric acid')
    const resistant = await newVessel({ halogenResistant: true })
    const ok = await call('POST', '/api/assess', { cookie: await as('analyst'), body: { vesselId: resistant.id, fillPressureMPa: 3.0, components: [{ role: 'sample', massG: 0.5, formula: 'C2H3Cl', category: 'polymer', heatingValueJPerG: 19000 }, fuse] } })
    expect(codes(ok.body)).not.toContain('halogen-vessel')
    expect(codes(ok.body)).toContain('halogen-acid')
  })

  it('refuses to fire 1e-300 g', async () => {
    const res = await assess({ smiles: 'OC(=O)c1ccccc1', heatingValueJPerG: 26454, massG: 1e-300 })
    expect(res.body.verdict).toBe('blocked')
    expect(res.body.findings.find((f: { code: string }) => f.code === 'sample-below-minimum').message).toContain('10 mg')
  })
})

describe('the library records who vouches for a material', () => {
  it('keeps a decomposition energy only with onset, method and evidence, from a supervisor, audited', async () => {
    const supervisor = await as('supervisor')
    const base = { name: unique('Nitro lot'), category: 'chemical', smiles: `CCCCCC${NO2}`, declaredHazard: 'none' }
    const bare = await call('POST', '/api/materials', { cookie: supervisor, body: { ...base, decompositionEnergyJPerG: 300 } })
    expect(bare.status).toBe(422)
    expect(bare.body.data.fields.map((f: { path: string }) => f.path)).toEqual(expect.arrayContaining(['decompositionOnsetC', 'decompositionMethod', 'decompositionEvidence']))
    const analyst = await call('POST', '/api/materials', { cookie: await as('analyst'), body: base })
    expect(analyst.status).toBe(403)
    const ok = await call('POST', '/api/materials', { cookie: supervisor, body: { ...base, decompositionEnergyJPerG: 300, decompositionOnsetC: 210, decompositionMethod: 'DSC, 5 K/min, sealed gold crucible', decompositionEvidence: 'report DSC-2026-014' } })
    expect(ok.status).toBe(201)
    expect(ok.body.decompositionRecordedBy).toBeTruthy()
    expect(ok.body.identityRecordedBy).toBeTruthy()
    expect(await auditRows({ action: 'material.create', entityId: ok.body.id })).toHaveLength(1)
    // 1-nitrohexane by structure: OB −1600·(12 + 6.5 − 2)/131.17 = −201 %, nitro holds oxygen: the OB exemption already
    // clears it; the library's evidenced decomposition energy is the rule named for a run on it either way.
    const run = await addRun(plan.id, { sampleCode: unique('NH'), components: [{ role: 'sample', materialId: ok.body.id, massG: 0.3, heatingValueJPerG: 30000 }, fuse] })
    expect(run.body.assessment.components[0].screening.status).toBe('cleared')
  })
})
