// CSV (or pasted spreadsheet) rows of a batch → run inputs, with row-level errors that say what to fix.
import Papa from 'papaparse'
import type { RunComponent, RunInput } from './schemas/plans'
import { compositionProblems } from './domain/composition'
import { chemicalTextProblem, normaliseChemicalText } from './domain/hygiene'
import { MATERIAL_CATEGORIES } from './schemas/materials'
import { parseColumnCell } from './domain/quantity'

export const IMPORT_COLUMNS = [
  'sample_code', 'kind', 'material', 'mass_g', 'heating_value_j_per_g', 'formula', 'smiles', 'category', 'boiling_point_c', 'C', 'H', 'N', 'S', 'O', 'Cl', 'ash', 'moisture',
  'declared_hazard', 'aid_material', 'aid_mass_g', 'fuse_wire', 'fuse_length_cm', 'vessel', 'fill_pressure_mpa', 'note',
] as const

export const IMPORT_TEMPLATE = `${IMPORT_COLUMNS.join(',')}
KRC-2611-A,sample,Client coal KRC-2611 (bituminous blend),0.95,,,,,,,,,,,,,,,,,nichrome,10,,,first of a duplicate
PP44-01,sample,,1.00,,,,biomass,,50.2,6.1,0.2,,43.1,,0.4,7.5,none,,,nichrome,10,,,composition entered inline (mass-%)
OAT-7,sample,Rolled oat flakes,0.80,,,,,,,,,,,,,,,Benzoic acid pellet (combustion aid),0.30,cotton,,,,weak sample: aid added
,,,`

export interface ImportRow {
  line: number
  sampleCode: string
  input: (Omit<RunInput, 'vesselId'> & { vesselName?: string }) | null
  errors: string[]
}

export interface MaterialRef { id: string, name: string }
export interface VesselRef { id: string, name: string }

const WIRES = ['nichrome', 'iron', 'platinum', 'cotton']
const HAZARDS = ['none', 'energetic', 'oxidiser']

function num(raw: string | undefined, field: string, errors: string[], opts: { min?: number, max?: number } = {}): number | undefined {
  const text = (raw ?? '').trim().replace(',', '.')
  if (!text) return undefined
  const value = parseColumnCell(raw ?? '', field)
  if (value instanceof Error) { errors.push(`${field} ${value.message}`); return undefined }
  if (opts.min !== undefined && value < opts.min) { errors.push(`${field} must be at least ${opts.min}`); return undefined }
  if (opts.max !== undefined && value > opts.max) { errors.push(`${field} must be at most ${opts.max}`); return undefined }
  return value
}

/** Parses the file; every problem is reported against its line, and nothing is partly accepted. */
export function parsePlanImport(text: string, materials: MaterialRef[], vessels: VesselRef[]): { rows: ImportRow[], fileErrors: string[] } {
  const parsed = Papa.parse<Record<string, string>>(text.trim(), { header: true, skipEmptyLines: 'greedy', transformHeader: h => h.trim() })
  const fileErrors: string[] = []
  const headers = parsed.meta.fields ?? []
  if (!headers.includes('sample_code')) fileErrors.push('The first line must be the header row and include sample_code (download the template).')
  const unknown = headers.filter(h => !(IMPORT_COLUMNS as readonly string[]).includes(h))
  if (unknown.length) fileErrors.push(`Unknown column${unknown.length > 1 ? 's' : ''}: ${unknown.join(', ')}. Use the template's column names.`)
  if (parsed.data.length > 500) fileErrors.push('At most 500 rows per import.')
  if (parsed.data.length === 0) fileErrors.push('The file has no rows below the header.')
  const byName = new Map(materials.map(m => [m.name.toLowerCase(), m]))
  const byId = new Map(materials.map(m => [m.id, m]))
  const vesselByName = new Map(vessels.map(v => [v.name.toLowerCase(), v]))
  const findMaterial = (ref: string) => byId.get(ref.trim()) ?? byName.get(ref.trim().toLowerCase())

  const rows = fileErrors.length ? [] : parsed.data.map((r, i): ImportRow => {
    const errors: string[] = []
    const line = i + 2
    const sampleCode = (r.sample_code ?? '').trim()
    if (!sampleCode) errors.push('sample_code is empty')
    const kind = (r.kind ?? '').trim() || 'sample'
    if (!['sample', 'standardisation', 'check'].includes(kind)) errors.push(`kind "${kind}" must be sample, standardisation or check`)
    const sample: RunComponent = { role: 'sample' }
    const materialName = (r.material ?? '').trim()
    if (materialName) {
      const m = findMaterial(materialName)
      if (m) sample.materialId = m.id
      else errors.push(`material "${materialName}" is not in the materials library (check the spelling or add it first)`)
    }
    const mass = num(r.mass_g, 'mass_g', errors, { min: 0.001, max: 100 })
    if (mass === undefined && !errors.some(e => e.startsWith('mass_g'))) errors.push('mass_g is empty: give the planned sample mass in g')
    if (mass !== undefined) sample.massG = mass
    const hv = num(r.heating_value_j_per_g, 'heating_value_j_per_g', errors, { min: 1, max: 200_000 })
    if (hv !== undefined) sample.heatingValueJPerG = hv
    for (const [column, field, what] of [['formula', 'formula', 'formula'], ['smiles', 'smiles', 'structure']] as const) {
      const text = (r[column] ?? '').trim()
      if (!text) continue
      const problem = chemicalTextProblem(text, what)
      if (problem) errors.push(`${column}: ${problem.message}`)
      else sample[field] = normaliseChemicalText(text).trim()
    }
    const category = (r.category ?? '').trim()
    if (category) {
      if ((MATERIAL_CATEGORIES as readonly string[]).includes(category)) sample.category = category
      else errors.push(`category "${category}" must be one of: ${MATERIAL_CATEGORIES.join(', ')}`)
    }
    const boiling = num(r.boiling_point_c, 'boiling_point_c', errors, { min: -273, max: 2000 })
    if (boiling !== undefined) sample.boilingPointC = boiling
    const composition: Record<string, number> = {}
    for (const k of ['C', 'H', 'N', 'S', 'O', 'Cl', 'ash', 'moisture'] as const) {
      const v = num(r[k], k, errors, { min: 0, max: 100 })
      if (v !== undefined) composition[k] = v
    }
    if (Object.keys(composition).length) {
      sample.composition = { ...composition, basis: 'dry' }
      errors.push(...compositionProblems(sample.composition).map(p => `composition: ${p}`))
    }
    const hazard = (r.declared_hazard ?? '').trim()
    if (hazard) {
      if (HAZARDS.includes(hazard)) sample.declaredHazard = hazard as RunComponent['declaredHazard']
      else errors.push(`declared_hazard "${hazard}" must be none, energetic or oxidiser`)
    }
    if (!materialName && hv === undefined && !sample.formula && !sample.smiles && !sample.composition) {
      errors.push('say what the sample is: a material, a structure (SMILES), a formula or a composition with its category')
    }
    const components: RunComponent[] = [sample]
    const aidName = (r.aid_material ?? '').trim()
    const aidMass = num(r.aid_mass_g, 'aid_mass_g', errors, { min: 0.001, max: 100 })
    if (aidName || aidMass !== undefined) {
      const aid = aidName ? findMaterial(aidName) : undefined
      if (aidName && !aid) errors.push(`aid_material "${aidName}" is not in the materials library`)
      if (!aidName) errors.push('aid_mass_g is given without aid_material')
      if (aidMass === undefined) errors.push('aid_material is given without aid_mass_g')
      if (aid && aidMass !== undefined) components.push({ role: 'aid', materialId: aid.id, massG: aidMass })
    }
    const wire = (r.fuse_wire ?? '').trim()
    if (wire) {
      if (!WIRES.includes(wire)) errors.push(`fuse_wire "${wire}" must be nichrome, iron, platinum or cotton`)
      else if (wire === 'cotton') components.push({ role: 'fuse', wire: 'cotton', massG: 0.003 })
      else {
        const length = num(r.fuse_length_cm, 'fuse_length_cm', errors, { min: 0.1, max: 100 })
        if (length === undefined && !errors.some(e => e.startsWith('fuse_length_cm'))) errors.push('fuse_length_cm is empty for a wire fuse')
        if (length !== undefined) components.push({ role: 'fuse', wire: wire as RunComponent['wire'], lengthCm: length })
      }
    }
    const vesselName = (r.vessel ?? '').trim()
    if (vesselName && !vesselByName.has(vesselName.toLowerCase())) errors.push(`vessel "${vesselName}" is not registered`)
    const fill = num(r.fill_pressure_mpa, 'fill_pressure_mpa', errors, { min: 0.1, max: 20 })
    return {
      line,
      sampleCode,
      errors,
      input: errors.length
        ? null
        : {
            sampleCode,
            kind: kind as RunInput['kind'],
            components,
            note: (r.note ?? '').trim(),
            ...(fill !== undefined ? { fillPressureMPa: fill } : {}),
            ...(vesselName ? { vesselName: vesselByName.get(vesselName.toLowerCase())!.name } : {}),
          },
    }
  })
  return { rows, fileErrors }
}
