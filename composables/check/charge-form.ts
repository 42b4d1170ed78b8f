import type { ChargeComponentInput } from '#shared/domain/assessment'
import { type Composition, type CompositionBasis, compositionFromAtoms } from '#shared/domain/composition'
import { BENZOIC_ACID_ATOMS } from '#shared/domain/peak-pressure'
import type { LabPolicy } from '#shared/domain/policy'
import type { DeclaredHazard } from '#shared/domain/screening'
import { fromJPerG, type SpecificEnergyUnit, SPECIFIC_ENERGY_UNITS, toJPerG } from '#shared/domain/specific-energy'

export type ChemistryFrom = 'none' | 'formula' | 'smiles' | 'composition'
export type AidKind = 'benzoic-acid' | 'paraffin-oil' | 'gelatin-capsule' | 'other'
export type FuseWire = 'nichrome' | 'iron' | 'platinum' | 'cotton'
export const COMPOSITION_INPUTS = ['C', 'H', 'N', 'S', 'O', 'Cl', 'ash', 'moisture'] as const

/** One row of the Quick check form; fields that a role does not use are kept so switching back loses nothing. */
export interface ComponentForm {
  key: number
  role: 'sample' | 'aid' | 'fuse'
  name: string
  massG: number | null
  heatingValue: number | null
  heatingValueUnit: SpecificEnergyUnit
  chemistry: ChemistryFrom
  formula: string
  smiles: string
  composition: Record<(typeof COMPOSITION_INPUTS)[number], number | string | null>
  basis: CompositionBasis
  declaredHazard: DeclaredHazard
  decompositionEnergyJPerG: number | null
  category: string
  boilingPointC: number | string | null
  aidKind: AidKind
  wire: FuseWire
  lengthCm: number | null
}

/** A blank row; the page hands out the keys so that server and browser render the same ids. */
export function newComponent(key: number, role: ComponentForm['role'], unit: SpecificEnergyUnit, policy: LabPolicy): ComponentForm {
  const form: ComponentForm = {
    key,
    role,
    name: '',
    massG: null,
    heatingValue: null,
    heatingValueUnit: unit,
    chemistry: 'none',
    formula: '',
    smiles: '',
    composition: { C: null, H: null, N: null, S: null, O: null, Cl: null, ash: null, moisture: null },
    basis: 'as-received',
    declaredHazard: 'none',
    decompositionEnergyJPerG: null,
    category: '',
    boilingPointC: null,
    aidKind: 'benzoic-acid',
    wire: 'nichrome',
    lengthCm: null,
  }
  if (role === 'aid') setAidKind(form, 'benzoic-acid', policy)
  return form
}

/** Benzoic acid gets the policy's certified value (NIST SRM 39j); other aids take the value from their certificate. */
export function setAidKind(form: ComponentForm, kind: AidKind, policy: LabPolicy) {
  form.aidKind = kind
  form.heatingValue = kind === 'benzoic-acid' ? round(fromJPerG(policy.aidHeatingValueJPerG, form.heatingValueUnit), 4) : null
}

export const round = (x: number, digits: number) => Number(x.toFixed(digits))

/** A number typed in a field, or undefined while the field is empty or not a number. */
export function asNumber(value: unknown): number | undefined {
  if (typeof value === 'number') return Number.isFinite(value) ? value : undefined
  if (typeof value !== 'string' || value.trim() === '') return undefined
  const n = Number(value.replace(',', '.'))
  return Number.isFinite(n) ? n : undefined
}

const AID_NAMES: Record<AidKind, string> = { 'benzoic-acid': 'benzoic acid', 'paraffin-oil': 'paraffin oil', 'gelatin-capsule': 'gelatin capsule', 'other': 'combustion aid' }
// Benzoic acid's composition from C7H6O2 (stoichiometry, IUPAC atomic weights) so its oxygen demand is exact; its
// structure lets the screen clear it.
const BENZOIC_ACID_COMPOSITION: Composition = compositionFromAtoms(BENZOIC_ACID_ATOMS).composition
// What the screen and the oxygen demand need to know of the other common aids: liquid paraffin as (CH2)n, C 85.6 %,
// H 14.4 % (stoichiometry); gelatin about C 50, H 7, N 18, O 25 % (a protein, from memory).
const AID_IDENTITY: Record<AidKind, Partial<ChargeComponentInput>> = {
  'benzoic-acid': { composition: BENZOIC_ACID_COMPOSITION, smiles: 'OC(=O)c1ccccc1' },
  'paraffin-oil': { composition: { C: 85.6, H: 14.4, basis: 'dry' }, category: 'liquid fuel' },
  'gelatin-capsule': { composition: { C: 50, H: 7, N: 18, O: 25, basis: 'dry' }, category: 'food', containment: 'capsule' },
  'other': {},
}

export type RowResult = { input: ChargeComponentInput, missing?: undefined } | { input?: undefined, missing: { field: string, message: string } }

/** The row as the assessment takes it, or what is still missing before it can count. */
export function componentInput(form: ComponentForm): RowResult {
  const mass = asNumber(form.massG)
  const name = form.name.trim() || undefined
  if (form.role === 'fuse') {
    if (form.wire === 'cotton') {
      return mass === undefined ? { missing: { field: 'massG', message: 'enter the mass of the cotton thread in g' } } : { input: { role: 'fuse', wire: 'cotton', massG: mass, name: name ?? 'cotton thread' } }
    }
    const length = asNumber(form.lengthCm)
    return length === undefined ? { missing: { field: 'lengthCm', message: 'enter the burnt length of the wire in cm' } } : { input: { role: 'fuse', wire: form.wire, lengthCm: length, ...(name ? { name } : {}) } }
  }
  const hv = asNumber(form.heatingValue)
  const heatingValueJPerG = hv === undefined ? undefined : toJPerG(hv, form.heatingValueUnit)
  if (form.role === 'aid') {
    if (mass === undefined) return { missing: { field: 'massG', message: 'enter the mass of the aid in g' } }
    return {
      input: {
        role: 'aid',
        massG: mass,
        name: name ?? AID_NAMES[form.aidKind],
        ...(heatingValueJPerG !== undefined ? { heatingValueJPerG } : {}),
        ...AID_IDENTITY[form.aidKind],
      },
    }
  }
  const input: ChargeComponentInput = { role: 'sample', declaredHazard: form.declaredHazard }
  if (name) input.name = name
  // A sample without a mass is assessed at the suggested mass: the result offers it.
  if (mass !== undefined) input.massG = mass
  if (heatingValueJPerG !== undefined) input.heatingValueJPerG = heatingValueJPerG
  if (form.chemistry === 'formula' && form.formula.trim()) input.formula = form.formula.trim()
  if (form.chemistry === 'smiles' && form.smiles.trim()) input.smiles = form.smiles.trim()
  if (form.chemistry === 'composition') {
    const c: Composition = { basis: form.basis }
    let any = false
    for (const field of COMPOSITION_INPUTS) {
      const v = asNumber(form.composition[field])
      if (v !== undefined) {
        c[field] = v
        any = true
      }
    }
    if (any) input.composition = c
  }
  const ed = asNumber(form.decompositionEnergyJPerG)
  if (ed !== undefined) input.decompositionEnergyJPerG = ed
  if (form.category) input.category = form.category
  const bp = asNumber(form.boilingPointC)
  if (bp !== undefined) input.boilingPointC = bp
  return { input }
}

export const UNIT_OPTIONS = SPECIFIC_ENERGY_UNITS
