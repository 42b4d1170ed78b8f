// Create or edit a library material (supervisor). Empty fields are sent as null: "not known".
export interface MaterialDraft {
  name: string, category: string, heatingValueJPerG: number | null, heatingValueUncertaintyJPerG: number | null, heatingValueSource: string
  formula: string, smiles: string, declaredHazard: 'none' | 'energetic' | 'oxidiser', decompositionEnergyJPerG: number | null, notes: string
  decompositionOnsetC: number | null, decompositionMethod: string, decompositionEvidence: string
  boilingPointC: number | null, vapourPressureKPa: number | null, chlorinePct: number | null
  composition: Record<'C' | 'H' | 'N' | 'S' | 'O' | 'Cl' | 'ash' | 'moisture', number | null>
}

const COMPOSITION_KEYS = ['C', 'H', 'N', 'S', 'O', 'Cl', 'ash', 'moisture'] as const
const numOrNull = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : null)
const textOrNull = (v: string) => (v.trim() ? v.trim() : null)

export function blankMaterial(): MaterialDraft {
  return {
    name: '', category: 'coal', heatingValueJPerG: null, heatingValueUncertaintyJPerG: null, heatingValueSource: '', formula: '', smiles: '',
    declaredHazard: 'none', decompositionEnergyJPerG: null, notes: '',
    decompositionOnsetC: null, decompositionMethod: '', decompositionEvidence: '', boilingPointC: null, vapourPressureKPa: null, chlorinePct: null,
    composition: { C: null, H: null, N: null, S: null, O: null, Cl: null, ash: null, moisture: null },
  }
}

/** The form's draft as the API body: empty means "not known" (null). */
export function materialBody(d: MaterialDraft) {
  const comp = Object.fromEntries(COMPOSITION_KEYS.flatMap(k => numOrNull(d.composition[k]) === null ? [] : [[k, d.composition[k]]]))
  const hasComp = Object.keys(comp).length > 0
  return {
    name: d.name,
    category: d.category,
    heatingValueJPerG: numOrNull(d.heatingValueJPerG),
    heatingValueUncertaintyJPerG: numOrNull(d.heatingValueUncertaintyJPerG),
    heatingValueSource: textOrNull(d.heatingValueSource),
    formula: textOrNull(d.formula),
    smiles: textOrNull(d.smiles),
    declaredHazard: d.declaredHazard,
    decompositionEnergyJPerG: numOrNull(d.decompositionEnergyJPerG),
    decompositionOnsetC: numOrNull(d.decompositionOnsetC),
    decompositionMethod: textOrNull(d.decompositionMethod),
    decompositionEvidence: textOrNull(d.decompositionEvidence),
    boilingPointC: numOrNull(d.boilingPointC),
    vapourPressureKPa: numOrNull(d.vapourPressureKPa),
    chlorinePct: numOrNull(d.chlorinePct),
    notes: d.notes,
    composition: hasComp ? comp : null,
    compositionBasis: hasComp ? 'dry' : null,
  }
}

export function draftFromMaterial(m: Record<string, unknown>): MaterialDraft {
  const d = blankMaterial()
  const comp = (m.composition ?? {}) as Record<string, number>
  return {
    ...d,
    name: String(m.name ?? ''),
    category: String(m.category ?? 'other'),
    heatingValueJPerG: (m.heatingValueJPerG as number | null) ?? null,
    heatingValueUncertaintyJPerG: (m.heatingValueUncertaintyJPerG as number | null) ?? null,
    heatingValueSource: String(m.heatingValueSource ?? ''),
    formula: String(m.formula ?? ''),
    smiles: String(m.smiles ?? ''),
    declaredHazard: (m.declaredHazard as MaterialDraft['declaredHazard']) ?? 'none',
    decompositionEnergyJPerG: (m.decompositionEnergyJPerG as number | null) ?? null,
    decompositionOnsetC: (m.decompositionOnsetC as number | null) ?? null,
    decompositionMethod: String(m.decompositionMethod ?? ''),
    decompositionEvidence: String(m.decompositionEvidence ?? ''),
    boilingPointC: (m.boilingPointC as number | null) ?? null,
    vapourPressureKPa: (m.vapourPressureKPa as number | null) ?? null,
    chlorinePct: (m.chlorinePct as number | null) ?? null,
    notes: String(m.notes ?? ''),
    composition: Object.fromEntries(COMPOSITION_KEYS.map(k => [k, comp[k] ?? null])) as MaterialDraft['composition'],
  }
}
