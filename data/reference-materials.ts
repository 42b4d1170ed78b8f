// Reference data shipped with Emberline. Each value names where it comes from; "typical" entries are
// ranges for planning only (the upper end is used, so a check errs on the safe side) and never results.
import type { MaterialCategory } from '../shared/schemas/materials'

export interface SeedMaterial {
  name: string
  category: MaterialCategory
  heatingValueJPerG?: number
  heatingValueUncertaintyJPerG?: number
  heatingValueSource?: string
  typicalRange?: { minJPerG: number, maxJPerG: number, note?: string }
  composition?: Record<string, number>
  compositionBasis?: 'dry' | 'as-received' | 'air-dried'
  formula?: string
  smiles?: string
  declaredHazard?: 'none' | 'energetic' | 'oxidiser'
  decompositionEnergyJPerG?: number
  /** Boiling point, °C (CRC Handbook of Chemistry and Physics, from memory). */
  boilingPointC?: number
  chlorinePct?: number
  notes?: string
  reference?: boolean
}

const typical = (min: number, max: number, what: string) => ({
  heatingValueJPerG: max,
  // Typical ranges recalled from handbooks (from memory): the page says only what the figure is for.
  heatingValueSource: `Typical range for ${what}; the upper end is used for planning so that the check errs on the safe side. Not a certified value.`,
  typicalRange: { minJPerG: min, maxJPerG: max, note: 'typical, not a certified value' },
})

const SHIPPED: SeedMaterial[] = [
  {
    name: 'Benzoic acid, calorimetric standard', category: 'reference standard', formula: 'C7H6O2', smiles: 'OC(=O)c1ccccc1',
    heatingValueJPerG: 26454, heatingValueUncertaintyJPerG: 3,
    heatingValueSource: 'NIST SRM 39j certificate: 26,434 J/g (mass in vacuum), 26,454 J/g weighed in air; use your own lot certificate.',
    notes: 'For standardisation runs of the energy equivalent. Press into pellets; 0.9–1.1 g per run (ASTM D240).',
  },
  {
    name: 'Benzoic acid pellet (combustion aid)', category: 'combustion aid', formula: 'C7H6O2', smiles: 'OC(=O)c1ccccc1',
    heatingValueJPerG: 26454, heatingValueUncertaintyJPerG: 3,
    heatingValueSource: 'NIST SRM 39j certificate (weighed in air); a lab lot should carry its own certificate.',
    notes: 'Added to samples that burn poorly or release too little heat.',
  },
  { name: 'Paraffin oil (combustion aid)', category: 'combustion aid', ...typical(45500, 46500, 'liquid paraffin'), notes: 'Determine the lot\'s own value before using it as an aid in results.' },
  { name: 'Gelatin capsule (combustion aid)', category: 'combustion aid', ...typical(17500, 19500, 'hard gelatin capsules'), notes: 'For volatile liquids; determine the lot\'s own value.' },
  { name: 'Cotton thread (fuse)', category: 'combustion aid', heatingValueJPerG: 17500, heatingValueSource: 'About 17.5 kJ/g for cellulose thread; the lab\'s own planning value.' }, // from memory
  {
    name: '2,2,4-Trimethylpentane (isooctane)', category: 'reference standard', formula: 'C8H18', smiles: 'CC(C)CC(C)(C)C', boilingPointC: 99.2,
    heatingValueJPerG: 47788, heatingValueSource: 'ASTM D240 (check standard for volatile fuels): 47.788 MJ/kg.',
  },
  {
    name: 'Sucrose', category: 'reference standard', formula: 'C12H22O11', smiles: 'OC[C@H]1O[C@@](CO)(O[C@H]2O[C@H](CO)[C@@H](O)[C@H](O)[C@H]2O)[C@@H](O)[C@@H]1O',
    heatingValueJPerG: 16490, heatingValueSource: 'NIST Chemistry WebBook, enthalpy of combustion of the solid: 16.49 MJ/kg.',
  },
  { name: 'Bituminous coal (typical)', category: 'coal', ...typical(24000, 35000, 'bituminous coals, air-dried') },
  { name: 'Lignite (typical)', category: 'coal', ...typical(10000, 20000, 'lignites, as received') },
  { name: 'Anthracite (typical)', category: 'coal', ...typical(29000, 35000, 'anthracites, air-dried') },
  { name: 'Metallurgical coke (typical)', category: 'coke', ...typical(27000, 32000, 'cokes, dry') },
  { name: 'Wood pellets (typical)', category: 'biomass', ...typical(16500, 20500, 'wood pellets, as received') },
  { name: 'Straw (typical)', category: 'biomass', ...typical(14000, 19000, 'cereal straw, as received') },
  { name: 'Diesel fuel (typical)', category: 'liquid fuel', ...typical(44800, 46000, 'automotive diesel') },
  { name: 'Heavy fuel oil (typical)', category: 'liquid fuel', ...typical(41500, 44000, 'residual fuel oils') },
  { name: 'Refuse-derived fuel (typical)', category: 'waste fuel', ...typical(13000, 25000, 'refuse-derived fuels, as received') },
  { name: 'Polyethylene (typical)', category: 'polymer', formula: 'C2H4', ...typical(45500, 46600, 'polyethylenes') },
  { name: 'Polystyrene (typical)', category: 'polymer', formula: 'C8H8', ...typical(40500, 42000, 'polystyrenes') },
  { name: 'Poly(vinyl chloride) (typical)', category: 'polymer', formula: 'C2H3Cl', chlorinePct: 56.7, ...typical(17500, 20500, 'unfilled PVC'), notes: 'Forms hydrochloric acid on combustion: rinse and check the vessel for corrosion.' },
  {
    name: 'n-Pentane', category: 'chemical', formula: 'C5H12', smiles: 'CCCCC', boilingPointC: 36.1,
    heatingValueJPerG: 48640, heatingValueSource: 'NIST Chemistry WebBook, enthalpy of combustion of the liquid: about 48.6 MJ/kg (from memory).',
    notes: 'Volatile: seal it in a gelatin capsule before the vessel is filled.',
  },
  {
    name: 'Naphthalene', category: 'chemical', formula: 'C10H8', smiles: 'c1ccc2ccccc2c1',
    heatingValueJPerG: 40230, heatingValueSource: 'NIST Chemistry WebBook, enthalpy of combustion of the solid: about 40.2 MJ/kg (from memory).',
  },
  {
    name: 'Ammonium nitrate', category: 'chemical', formula: 'H4N2O3', smiles: '[NH4+].[O-][N+](=O)[O-]', declaredHazard: 'oxidiser',
    notes: 'Strong oxidiser, oxygen balance +20 % (handbook value). Never in a standard vessel as a sample or as more than a trace in a mixture.',
  },
  {
    name: 'Nitrocellulose', category: 'chemical', declaredHazard: 'energetic',
    notes: 'Propellant base. Energetic: only in a high-strength vessel rated for it, and only with a supervisor\'s signature.',
  },
]

export const REFERENCE_MATERIALS: SeedMaterial[] = SHIPPED.map(m => ({ ...m, reference: true }))
