// Elemental composition of a component (mass-%), its checks, its bases, and its derivation from a formula.

export const COMPOSITION_BASES = ['dry', 'as-received', 'air-dried'] as const
export type CompositionBasis = typeof COMPOSITION_BASES[number]

/**
 * Mass-% of the component. On the 'as-received' and 'air-dried' bases (the default is 'as-received')
 * every figure, moisture included, is of the sample as weighed. On the 'dry' basis C…ash are of the
 * dry solid and moisture, when given, is that of the sample as weighed. H and O exclude the moisture.
 */
export interface Composition {
  C?: number | undefined
  H?: number | undefined
  N?: number | undefined
  S?: number | undefined
  O?: number | undefined
  Cl?: number | undefined
  ash?: number | undefined
  moisture?: number | undefined
  basis?: CompositionBasis | undefined
}

export const COMPOSITION_FIELDS = ['C', 'H', 'N', 'S', 'O', 'Cl', 'ash', 'moisture'] as const
export type CompositionField = (typeof COMPOSITION_FIELDS)[number]

/** Rounding slack allowed on the sum of an analysis, in mass-% (common practice). */
export const COMPOSITION_SUM_TOLERANCE_PCT = 0.5

/** Mass fractions (0–1) of one gram of the component as it is fired. */
export interface AsFiredFractions {
  C: number
  H: number
  N: number
  S: number
  O: number
  Cl: number
  ash: number
  moisture: number
}

export class CompositionError extends Error {
  constructor(message: string) {
    super(message)
    this.name = 'CompositionError'
  }
}

// IUPAC/CIAAW abridged standard atomic weights (conventional values for H, Li, B, C, N, O, Mg, Si, S, Cl, Ar, Br, Tl).
export const ATOMIC_WEIGHTS: Readonly<Record<string, number>> = {
  H: 1.008, He: 4.0026, Li: 6.94, Be: 9.0122, B: 10.81, C: 12.011, N: 14.007, O: 15.999, F: 18.998,
  Ne: 20.18, Na: 22.99, Mg: 24.305, Al: 26.982, Si: 28.085, P: 30.974, S: 32.06, Cl: 35.45, Ar: 39.95,
  K: 39.098, Ca: 40.078, Sc: 44.956, Ti: 47.867, V: 50.942, Cr: 51.996, Mn: 54.938, Fe: 55.845,
  Co: 58.933, Ni: 58.693, Cu: 63.546, Zn: 65.38, Ga: 69.723, Ge: 72.63, As: 74.922, Se: 78.971,
  Br: 79.904, Kr: 83.798, Rb: 85.468, Sr: 87.62, Y: 88.906, Zr: 91.224, Nb: 92.906, Mo: 95.95,
  Ru: 101.07, Rh: 102.91, Pd: 106.42, Ag: 107.87, Cd: 112.41, In: 114.82, Sn: 118.71, Sb: 121.76,
  Te: 127.6, I: 126.9, Xe: 131.29, Cs: 132.91, Ba: 137.33, La: 138.91, Ce: 140.12, Hf: 178.49,
  Ta: 180.95, W: 183.84, Re: 186.21, Os: 190.23, Ir: 192.22, Pt: 195.08, Au: 196.97, Hg: 200.59,
  Tl: 204.38, Pb: 207.2, Bi: 208.98, Th: 232.04, U: 238.03,
}

/** Atom counts of a formula, e.g. { C: 7, H: 6, O: 2 }. */
export type AtomCounts = Readonly<Record<string, number>>

export interface FormulaComposition {
  formula: string
  atoms: AtomCounts
  molarMassGPerMol: number
  composition: Composition
}

/** Lists what is wrong with a composition: negatives, or a sum above 100 % + tolerance (common practice). */
export function compositionProblems(c: Composition): string[] {
  const problems: string[] = []
  for (const field of COMPOSITION_FIELDS) {
    const v = c[field]
    if (v === undefined) continue
    if (!Number.isFinite(v)) problems.push(`${field} is not a number`)
    else if (v < 0) problems.push(`${field} is negative (${v} %)`)
    else if (v > 100) problems.push(`${field} is above 100 % (${v} %)`)
  }
  const dry = c.basis === 'dry'
  // On the dry basis the moisture belongs to another basis, so it is not part of the sum.
  const sum = COMPOSITION_FIELDS.reduce((s, f) => (dry && f === 'moisture' ? s : s + (c[f] ?? 0)), 0)
  if (sum > 100 + COMPOSITION_SUM_TOLERANCE_PCT) {
    problems.push(`the parts add up to ${round2(sum)} %, more than 100 %${dry ? ' on the dry basis' : ' (moisture and ash included)'}`)
  }
  return problems
}

/** Throws a CompositionError naming every problem of compositionProblems (common practice). */
export function assertComposition(c: Composition): void {
  const problems = compositionProblems(c)
  if (problems.length > 0) throw new CompositionError(`Composition is not valid: ${problems.join('; ')}`)
}

/** Converts to the dry basis, x_d = x·100/(100 − M) (ASTM D3180 / ISO 1170); moisture stays as the as-weighed value. */
export function toDryBasis(c: Composition): Composition {
  if (c.basis === 'dry') return { ...c }
  const m = c.moisture ?? 0
  if (m >= 100) throw new CompositionError('Composition is not valid: moisture of 100 % leaves no dry solid')
  const k = 100 / (100 - m)
  const out: Composition = { basis: 'dry' }
  for (const field of COMPOSITION_FIELDS) {
    const v = c[field]
    if (v === undefined || field === 'moisture') continue
    out[field] = v * k
  }
  if (c.moisture !== undefined) out.moisture = c.moisture
  return out
}

/** Mass fractions of one gram as fired: dry figures × (1 − M/100) (ASTM D3180 / ISO 1170). */
export function asFiredFractions(c: Composition): AsFiredFractions {
  const m = c.moisture ?? 0
  const k = c.basis === 'dry' ? (1 - m / 100) / 100 : 1 / 100
  return {
    C: (c.C ?? 0) * k,
    H: (c.H ?? 0) * k,
    N: (c.N ?? 0) * k,
    S: (c.S ?? 0) * k,
    O: (c.O ?? 0) * k,
    Cl: (c.Cl ?? 0) * k,
    ash: (c.ash ?? 0) * k,
    moisture: m / 100,
  }
}

/** Molar mass from atom counts with IUPAC/CIAAW standard atomic weights. */
export function molarMassGPerMol(atoms: AtomCounts): number {
  let mass = 0
  for (const [element, n] of Object.entries(atoms)) mass += n * atomicWeight(element)
  return mass
}

/** Composition (dry, mass-%) of a pure compound from its atom counts; other elements count as ash (IUPAC atomic weights). */
export function compositionFromAtoms(atoms: AtomCounts): { composition: Composition; molarMassGPerMol: number } {
  const total = molarMassGPerMol(atoms)
  if (!(total > 0)) throw new CompositionError('Formula has no atoms')
  const pct = (element: string) => ((atoms[element] ?? 0) * atomicWeight(element) * 100) / total
  const known = ['C', 'H', 'N', 'S', 'O', 'Cl'] as const
  const composition: Composition = { basis: 'dry' }
  let rest = 100
  for (const element of known) {
    const v = pct(element)
    if (v > 0) composition[element] = v
    rest -= v
  }
  if (rest > 1e-9) composition.ash = rest
  return { composition, molarMassGPerMol: total }
}

/** Parses a molecular formula with mf-parser (loaded on demand) and derives its composition (IUPAC atomic weights). */
export async function compositionFromFormula(formula: string): Promise<FormulaComposition> {
  const text = formula.trim()
  if (text === '') throw new CompositionError('Formula is empty')
  const { MF } = await import('mf-parser')
  let atoms: Record<string, number>
  let canonical: string
  try {
    const info = new MF(text).getInfo() as { atoms?: Record<string, number>; mf?: string }
    atoms = { ...(info.atoms ?? {}) }
    canonical = info.mf ?? text
  }
  catch (error) {
    const detail = error instanceof Error ? error.message.split('\n')[0] : String(error)
    throw new CompositionError(`Formula "${text}" cannot be read: ${detail}`)
  }
  for (const [element, n] of Object.entries(atoms)) {
    if (!(n > 0)) throw new CompositionError(`Formula "${text}" has a non-positive count for ${element}`)
    if (ATOMIC_WEIGHTS[element] === undefined) {
      throw new CompositionError(`Formula "${text}" has an element without a standard atomic weight in this table: ${element}`)
    }
  }
  const { composition, molarMassGPerMol: molarMass } = compositionFromAtoms(atoms)
  return { formula: canonical, atoms, molarMassGPerMol: molarMass, composition }
}

/** Atomic weight of an element symbol (IUPAC/CIAAW), throwing a CompositionError for an unknown one. */
export function atomicWeight(element: string): number {
  const w = ATOMIC_WEIGHTS[element]
  if (w === undefined) throw new CompositionError(`Unknown element: ${element}`)
  return w
}

function round2(x: number): number {
  return Math.round(x * 100) / 100
}
