// Energetic screening of a component (UN Manual of Tests and Criteria, Appendix 6).
import { type AtomCounts, type Composition, asFiredFractions, ATOMIC_WEIGHTS } from './composition'
import type { LabPolicy } from './policy'

/** Groups associated with explosive properties (UN Manual of Tests and Criteria, Appendix 6, Table A6.1). */
export const EXPLOSOPHORE_GROUPS = {
  'nitro': 'nitro group on C or N (nitro compounds, nitramines)',
  'nitrate-ester': 'nitrate ester, C–O–NO2',
  'nitrate': 'nitrate anion or nitric acid',
  'nitroso': 'nitroso group, C–N=O or N–N=O',
  'n-oxide': 'N-oxide (amine oxides, aromatic N-oxides, nitrones)',
  'azide': 'azide, –N3',
  'azo': 'azo group, C–N=N–C',
  'diazo': 'diazo compound or diazonium salt',
  'hydrazine': 'N–N single bond (hydrazines, hydrazides, N-amino heterocycles)',
  'peroxide': 'peroxide, O–O',
  'ozonide': 'ozonide ring',
  'n-halogen': 'N–halogen bond (chloramines, fluoroamines)',
  'chlorate': 'chlorate, perchlorate and other O–halogen oxyanions',
  'acetylide': 'acetylide, metal–C≡C or C≡C anion',
  'fulminate': 'fulminate or nitrile oxide, C≡N–O',
  'acetylene': 'C≡C triple bond (acetylenes)',
} as const

export type ExplosophoreGroup = keyof typeof EXPLOSOPHORE_GROUPS

export type DeclaredHazard = 'none' | 'energetic' | 'oxidiser'

/**
 * energetic: treat as explosive; unclearable: formula only, the screen cannot clear it; oxidiser: declared,
 * judged on its share of the charge; cleared: the screen clears it; not-screened: nothing to screen on.
 */
export type ScreeningStatus = 'energetic' | 'unclearable' | 'oxidiser' | 'cleared' | 'not-screened'

/** What cleared a component: nothing found, or a finding outweighed by oxygen balance or decomposition energy. */
export type ClearedBy = 'no-groups' | 'no-n-and-o' | 'oxygen-balance' | 'decomposition-energy'

export interface ScreeningResult {
  status: ScreeningStatus
  reasons: string[]
  groups: ExplosophoreGroup[]
  oxygenBalancePct?: number
  clearedBy?: ClearedBy
}

export interface ScreeningInput {
  declaredHazard?: DeclaredHazard | undefined
  /** Groups found in the structure; undefined when no structure is known. */
  groups?: readonly ExplosophoreGroup[] | undefined
  /** Atom counts from a formula or structure. */
  atoms?: AtomCounts | undefined
  molarMassGPerMol?: number | undefined
  decompositionEnergyJPerG?: number | undefined
}

const A_O = ATOMIC_WEIGHTS.O ?? 15.999

/**
 * Oxygen balance OB% = −1600·(2C + H/2 − O)/M for CxHyNwOz (Meyer, Köhler & Homburg, Explosives); S is counted
 * to SO2 and H bound by Cl to HCl; other elements are taken as not binding oxygen.
 */
export function oxygenBalancePct(atoms: AtomCounts, molarMassGPerMol: number): number {
  const c = atoms.C ?? 0
  const h = Math.max(0, (atoms.H ?? 0) - (atoms.Cl ?? 0))
  const s = atoms.S ?? 0
  const o = atoms.O ?? 0
  return (-1600 * (2 * c + h / 2 + 2 * s - o)) / molarMassGPerMol
}

/** Oxygen balance of a mass-% composition, OB% = −1600·Σ per gram (same definition as oxygenBalancePct). */
export function oxygenBalanceFromComposition(c: Composition): number {
  const f = asFiredFractions(c)
  const nC = f.C / (ATOMIC_WEIGHTS.C ?? 12.011)
  const nH = Math.max(0, f.H / (ATOMIC_WEIGHTS.H ?? 1.008) - f.Cl / (ATOMIC_WEIGHTS.Cl ?? 35.45))
  const nS = f.S / (ATOMIC_WEIGHTS.S ?? 32.06)
  const nO = f.O / A_O
  return -1600 * (2 * nC + nH / 2 + 2 * nS - nO)
}

function fmtPct(x: number): string {
  return `${x >= 0 ? '+' : '−'}${Math.abs(x).toFixed(1)} %`
}

function fmtLimit(x: number): string {
  return `${x < 0 ? '−' : ''}${Math.abs(x)} %`
}

/**
 * Screen one component (UN Manual of Tests and Criteria, Appendix 6): declared energetic → energetic;
 * with a structure, energetic when it has an explosophore AND OB > −200 % AND decomposition energy unknown or
 * ≥ 500 J/g; with a formula only, N and O together with OB > −200 % cannot be cleared (DESIGN §3.5).
 */
export function screenComponent(input: ScreeningInput, policy: LabPolicy): ScreeningResult {
  const ob = input.atoms && input.molarMassGPerMol ? oxygenBalancePct(input.atoms, input.molarMassGPerMol) : undefined
  const groups = input.groups ? [...input.groups] : []
  const result = (status: ScreeningStatus, reason: string, clearedBy?: ClearedBy): ScreeningResult => {
    const out: ScreeningResult = { status, reasons: [reason], groups }
    if (ob !== undefined) out.oxygenBalancePct = ob
    if (clearedBy) out.clearedBy = clearedBy
    return out
  }
  const obLimit = policy.energeticObThresholdPct
  const edLimit = policy.decompositionEnergyThresholdJPerG
  const ed = input.decompositionEnergyJPerG
  const lowEd = ed !== undefined && ed < edLimit

  if (input.declaredHazard === 'energetic') return result('energetic', 'declared energetic by the planner')
  if (input.declaredHazard === 'oxidiser') return result('oxidiser', 'declared an oxidiser by the planner')
  if (input.groups !== undefined) {
    if (groups.length === 0) return result('cleared', 'no group associated with explosive properties', 'no-groups')
    const names = groups.join(', ')
    if (ob !== undefined && ob <= obLimit) {
      return result('cleared', `${names} found, but oxygen balance ${fmtPct(ob)} is not above ${fmtLimit(obLimit)}`, 'oxygen-balance')
    }
    if (lowEd) return result('cleared', `${names} found, but decomposition energy ${ed} J/g is below ${edLimit} J/g`, 'decomposition-energy')
    const obText = ob === undefined ? 'oxygen balance unknown' : `oxygen balance ${fmtPct(ob)} above ${fmtLimit(obLimit)}`
    const edText = ed === undefined ? 'decomposition energy unknown' : `decomposition energy ${ed} J/g ≥ ${edLimit} J/g`
    return result('energetic', `${names} found; ${obText}; ${edText}`)
  }
  if (input.atoms !== undefined && ob !== undefined) {
    const hasNAndO = (input.atoms.N ?? 0) > 0 && (input.atoms.O ?? 0) > 0
    if (!hasNAndO) return result('cleared', 'formula does not hold both N and O', 'no-n-and-o')
    if (ob <= obLimit) return result('cleared', `formula has N and O, but oxygen balance ${fmtPct(ob)} is not above ${fmtLimit(obLimit)}`, 'oxygen-balance')
    if (lowEd) return result('cleared', `formula has N and O, but decomposition energy ${ed} J/g is below ${edLimit} J/g`, 'decomposition-energy')
    return result('unclearable', `formula has N and O with oxygen balance ${fmtPct(ob)} above ${fmtLimit(obLimit)} and no structure to screen`)
  }
  return result('not-screened', 'no formula or structure to screen')
}

/** Share of declared oxidisers in the charge mass, % (UN Manual of Tests and Criteria, Appendix 6: limit 15 %). */
export function oxidiserFractionPct(components: readonly { massG: number; declaredHazard?: DeclaredHazard | undefined }[]): number {
  let oxidiser = 0
  let total = 0
  for (const c of components) {
    total += c.massG
    if (c.declaredHazard === 'oxidiser') oxidiser += c.massG
  }
  return total > 0 ? (oxidiser / total) * 100 : 0
}
