// Structure (SMILES) → atoms, composition and explosophore groups; loaded lazily because openchemlib is large.
import { Molecule, SSSearcher } from 'openchemlib'
import { type AtomCounts, type Composition, compositionFromAtoms, CompositionError } from './composition'
import type { ExplosophoreGroup } from './screening'

export interface StructureAnalysis {
  smiles: string
  /** Hill formula built from the atom counts. */
  formula: string
  atoms: AtomCounts
  molarMassGPerMol: number
  composition: Composition
  explosophores: ExplosophoreGroup[]
}

// SMARTS of each group of UN Manual of Tests and Criteria, Appendix 6, Table A6.1 (charges matched exactly).
// Azo compounds are matched on any carbon (the Table names aliphatic azo; aromatic ones are flagged too, to err safe).
const METAL_LIST = 'Li,Na,K,Rb,Cs,Be,Mg,Ca,Sr,Ba,Al,Ga,In,Tl,Sn,Pb,Bi,Ti,Zr,Hf,V,Cr,Mn,Fe,Co,Ni,Cu,Ag,Au,Zn,Cd,Hg,Pd,Pt'
const GROUP_SMARTS: Readonly<Record<ExplosophoreGroup, readonly string[]>> = {
  'acetylene': ['C#C'],
  'acetylide': ['[C-]#C', '[C-]#[C-]', `[${METAL_LIST}]C#C`],
  '1,2-diene': ['C=C=C'],
  'c-metal': [`[#6][${METAL_LIST}]`],
  'n-metal': [`[#7][${METAL_LIST}]`],
  'azide': ['N=[N+]=[N-]', '[N-]=[N+]=[N-]', '[N-][N+]#N'],
  'azo': ['[#6]N=N[#6]'],
  'diazo': ['[#6]=[N+]=[N-]', '[#6][N+]#N'],
  'hydrazine': ['N-N'],
  'sulfonyl-hydrazide': ['S(=O)(=O)NN'],
  'peroxide': ['O-O'],
  'ozonide': ['C1OOCO1'],
  'hydroxylamine': ['N-O'],
  'nitrate-ester': ['[#6]O[N+](=O)[O-]', '[#6]ON(=O)=O'],
  'nitrate': ['[O-][N+](=O)[O-]', '[OH][N+](=O)[O-]'],
  'nitro': ['[#6,#7][N+](=O)[O-]', '[#6,#7]N(=O)=O'],
  'nitroso': ['[#6,#7]N=O'],
  'n-oxide': ['[#6][N+]([#6])([#6])[O-]', '[n+][O-]', '[#6]=[N+][O-]'],
  '1,2-oxazole': ['c1cnoc1', 'C1=NOCC1'],
  'fulminate': ['[C-]#[N+][O-]', 'C#[N+][O-]'],
  'n-halogen': ['[#7][F,Cl,Br,I]'],
  'o-halogen': ['[O-][Cl,Br,I](=O)=O', 'O[Cl,Br,I](=O)=O', '[#6]I=O', '[#8][F,Cl,Br,I]'],
}

let fragments: { group: ExplosophoreGroup; fragment: Molecule }[] | undefined

function groupFragments(): { group: ExplosophoreGroup; fragment: Molecule }[] {
  if (!fragments) {
    fragments = []
    for (const [group, list] of Object.entries(GROUP_SMARTS) as [ExplosophoreGroup, readonly string[]][]) {
      for (const smarts of list) {
        const fragment = Molecule.fromSmiles(smarts, { smartsMode: 'smarts', noCoordinates: true, noStereo: true })
        fragment.setFragment(true)
        fragments.push({ group, fragment })
      }
    }
  }
  return fragments
}

// The parser forgives unbalanced brackets, so they are checked here before it runs.
function syntaxProblem(smiles: string): string | undefined {
  if (smiles.trim() === '') return 'it is empty'
  if (/\s/.test(smiles.trim())) return 'it contains spaces'
  let round = 0
  let square = 0
  for (const ch of smiles) {
    if (ch === '(') round++
    else if (ch === ')') round--
    else if (ch === '[') square++
    else if (ch === ']') square--
    if (round < 0 || square < 0) return 'a bracket closes before it opens'
  }
  if (round !== 0) return 'its parentheses are unbalanced'
  if (square !== 0) return 'its square brackets are unbalanced'
  if (/%(?!\d\d)/.test(smiles)) return 'a % ring closure lacks its two digits'
  return undefined
}

/** Parses a SMILES string with openchemlib, throwing a CompositionError with a clear message when it cannot. */
export function parseSmiles(smiles: string): Molecule {
  const problem = syntaxProblem(smiles)
  if (problem) throw new CompositionError(`Structure "${smiles}" is not valid SMILES: ${problem}`)
  let molecule: Molecule
  try {
    molecule = Molecule.fromSmiles(smiles.trim(), { noCoordinates: true, noStereo: true })
  }
  catch (error) {
    const raw = error instanceof Error ? error.message : String(error)
    const detail = raw.replace(/^.*SmilesParser:\s*/, '')
    throw new CompositionError(`Structure "${smiles}" is not valid SMILES: ${detail}`)
  }
  if (molecule.getAllAtoms() === 0) throw new CompositionError(`Structure "${smiles}" is not valid SMILES: it has no atoms`)
  return molecule
}

/** Atom counts of a molecule, implicit hydrogens included (openchemlib atom labels). */
export function atomCounts(molecule: Molecule): Record<string, number> {
  const atoms: Record<string, number> = {}
  const add = (label: string, n: number) => {
    if (n > 0) atoms[label] = (atoms[label] ?? 0) + n
  }
  for (let i = 0; i < molecule.getAllAtoms(); i++) {
    add(molecule.getAtomLabel(i), 1)
    add('H', molecule.getImplicitHydrogens(i))
  }
  return atoms
}

/** Hill-order formula (C, H, then alphabetical; alphabetical without carbon) (Hill 1900, J. Am. Chem. Soc. 22:478). */
export function hillFormula(atoms: AtomCounts): string {
  const elements = Object.keys(atoms)
  const hasC = (atoms.C ?? 0) > 0
  const order = hasC
    ? ['C', 'H', ...elements.filter(e => e !== 'C' && e !== 'H').sort()]
    : [...elements].sort()
  return order
    .filter(e => (atoms[e] ?? 0) > 0)
    .map(e => (atoms[e] === 1 ? e : `${e}${atoms[e]}`))
    .join('')
}

/** Explosophore groups found by substructure search (UN Manual of Tests and Criteria, Appendix 6, Table A6.1). */
export function findExplosophores(molecule: Molecule): ExplosophoreGroup[] {
  const searcher = new SSSearcher({ matchAtomCharge: true })
  const found = new Set<ExplosophoreGroup>()
  for (const { group, fragment } of groupFragments()) {
    if (found.has(group)) continue
    searcher.setMol(fragment, molecule)
    if (searcher.isFragmentInMolecule()) found.add(group)
  }
  return [...found]
}

/** Atoms, molar mass, composition (IUPAC atomic weights) and explosophores of a SMILES structure (openchemlib). */
export function analyseStructure(smiles: string): StructureAnalysis {
  const molecule = parseSmiles(smiles)
  const atoms = atomCounts(molecule)
  for (const element of Object.keys(atoms)) {
    if (!/^[A-Z][a-z]?$/.test(element)) throw new CompositionError(`Structure "${smiles}" has an atom that is not an element: ${element}`)
  }
  const { composition, molarMassGPerMol } = compositionFromAtoms(atoms)
  return {
    smiles: smiles.trim(),
    formula: hillFormula(atoms),
    atoms,
    molarMassGPerMol,
    composition,
    explosophores: findExplosophores(molecule),
  }
}
