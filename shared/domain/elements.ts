// Heats of combustion of elements that burn to a solid oxide (metals, boron, silicon, phosphorus).
import { ATOMIC_WEIGHTS, type AtomCounts } from './composition'

export interface ElementCombustion {
  element: string
  oxide: string
  /** Standard enthalpy of formation of the oxide at 298.15 K, kJ/mol (negative). */
  oxideFormationKJPerMol: number
  /** Atoms of the element in one formula unit of the oxide. */
  atomsPerOxide: number
  /** O2 taken per atom of the element. */
  oxygenPerAtom: number
}

// ΔfH°(298.15 K) of the oxides, kJ/mol, as tabulated in the NIST-JANAF Thermochemical Tables (Chase 1998,
// J. Phys. Chem. Ref. Data Monograph 9) and the CODATA key values; from memory, not re-read: each figure is
// checked in the tests against the per-gram values of secondary sources (Al ≈ 31.0 kJ/g, Mg ≈ 24.7 kJ/g).
const TABLE: readonly ElementCombustion[] = [
  { element: 'Al', oxide: 'Al2O3', oxideFormationKJPerMol: -1675.7, atomsPerOxide: 2, oxygenPerAtom: 0.75 },
  { element: 'Mg', oxide: 'MgO', oxideFormationKJPerMol: -601.6, atomsPerOxide: 1, oxygenPerAtom: 0.5 },
  { element: 'Si', oxide: 'SiO2', oxideFormationKJPerMol: -910.7, atomsPerOxide: 1, oxygenPerAtom: 1 },
  { element: 'Ti', oxide: 'TiO2', oxideFormationKJPerMol: -944.0, atomsPerOxide: 1, oxygenPerAtom: 1 },
  { element: 'Zr', oxide: 'ZrO2', oxideFormationKJPerMol: -1100.6, atomsPerOxide: 1, oxygenPerAtom: 1 },
  { element: 'B', oxide: 'B2O3', oxideFormationKJPerMol: -1273.5, atomsPerOxide: 2, oxygenPerAtom: 0.75 },
  { element: 'Fe', oxide: 'Fe2O3', oxideFormationKJPerMol: -824.2, atomsPerOxide: 2, oxygenPerAtom: 0.75 },
  { element: 'Zn', oxide: 'ZnO', oxideFormationKJPerMol: -350.5, atomsPerOxide: 1, oxygenPerAtom: 0.5 },
  { element: 'P', oxide: 'P4O10', oxideFormationKJPerMol: -2984.0, atomsPerOxide: 4, oxygenPerAtom: 1.25 },
  { element: 'Be', oxide: 'BeO', oxideFormationKJPerMol: -609.4, atomsPerOxide: 1, oxygenPerAtom: 0.5 },
  { element: 'Li', oxide: 'Li2O', oxideFormationKJPerMol: -597.9, atomsPerOxide: 2, oxygenPerAtom: 0.25 },
  { element: 'Na', oxide: 'Na2O', oxideFormationKJPerMol: -418.0, atomsPerOxide: 2, oxygenPerAtom: 0.25 },
  { element: 'K', oxide: 'K2O', oxideFormationKJPerMol: -363.2, atomsPerOxide: 2, oxygenPerAtom: 0.25 },
  { element: 'Ca', oxide: 'CaO', oxideFormationKJPerMol: -635.1, atomsPerOxide: 1, oxygenPerAtom: 0.5 },
  { element: 'Cr', oxide: 'Cr2O3', oxideFormationKJPerMol: -1139.7, atomsPerOxide: 2, oxygenPerAtom: 0.75 },
  { element: 'Mn', oxide: 'MnO2', oxideFormationKJPerMol: -520.0, atomsPerOxide: 1, oxygenPerAtom: 1 },
  { element: 'Ni', oxide: 'NiO', oxideFormationKJPerMol: -239.7, atomsPerOxide: 1, oxygenPerAtom: 0.5 },
  { element: 'Cu', oxide: 'CuO', oxideFormationKJPerMol: -157.3, atomsPerOxide: 1, oxygenPerAtom: 0.5 },
  { element: 'Sn', oxide: 'SnO2', oxideFormationKJPerMol: -577.6, atomsPerOxide: 1, oxygenPerAtom: 1 },
  { element: 'Hf', oxide: 'HfO2', oxideFormationKJPerMol: -1144.7, atomsPerOxide: 1, oxygenPerAtom: 1 },
]

export const ELEMENT_COMBUSTION: Readonly<Record<string, ElementCombustion>> = Object.fromEntries(TABLE.map(e => [e.element, e]))

/** Metals by symbol (periodic table; B, Si, P, As, Se, Te and the non-metals excluded). */
export const METALS: ReadonlySet<string> = new Set([
  'Li', 'Be', 'Na', 'Mg', 'Al', 'K', 'Ca', 'Sc', 'Ti', 'V', 'Cr', 'Mn', 'Fe', 'Co', 'Ni', 'Cu', 'Zn', 'Ga', 'Rb', 'Sr',
  'Y', 'Zr', 'Nb', 'Mo', 'Ru', 'Rh', 'Pd', 'Ag', 'Cd', 'In', 'Sn', 'Sb', 'Cs', 'Ba', 'La', 'Ce', 'Hf', 'Ta', 'W', 'Re',
  'Os', 'Ir', 'Pt', 'Au', 'Hg', 'Tl', 'Pb', 'Bi', 'Th', 'U', 'Ge',
])

export interface ElementFuel {
  element: string
  oxide: string
  /** Heat released per gram of the element burnt to its oxide, J/g. */
  heatingValueJPerG: number
  /** O2 taken per gram, mol/g. */
  oxygenDemandMolPerG: number
}

/** Heat of combustion of a pure element, J/g = −ΔfH°(oxide)/(atoms per oxide × atomic weight) (NIST-JANAF). */
export function elementFuel(element: string): ElementFuel | undefined {
  const e = ELEMENT_COMBUSTION[element]
  const w = ATOMIC_WEIGHTS[element]
  if (!e || !w) return undefined
  return {
    element,
    oxide: e.oxide,
    heatingValueJPerG: (-e.oxideFormationKJPerMol * 1000) / (e.atomsPerOxide * w),
    oxygenDemandMolPerG: e.oxygenPerAtom / w,
  }
}

/** The single element of a formula such as "Al" or "Mg", else undefined. */
export function soleElement(atoms: AtomCounts): string | undefined {
  const elements = Object.keys(atoms).filter(k => (atoms[k] ?? 0) > 0)
  return elements.length === 1 ? elements[0] : undefined
}

/** Elements whose combustion the composition route knows (C, H, N, O, S, Cl); any other needs another value. */
export const CORRELATION_ELEMENTS: ReadonlySet<string> = new Set(['C', 'H', 'N', 'O', 'S', 'Cl'])

/** Elements of a formula outside C, H, N, O, S and Cl. */
export function elementsOutsideCorrelation(atoms: AtomCounts): string[] {
  return Object.keys(atoms).filter(k => (atoms[k] ?? 0) > 0 && !CORRELATION_ELEMENTS.has(k))
}
