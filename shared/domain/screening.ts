// Energetic screening of a component by the rules of UN Manual of Tests and Criteria, Appendix 6.
import { type AtomCounts, type Composition, asFiredFractions, ATOMIC_WEIGHTS } from './composition'
import { METALS } from './elements'
import { recogniseFromFormula } from './formula-groups'
import type { LabPolicy } from './policy'

/**
 * Groups associated with explosive properties (UN Manual of Tests and Criteria, Appendix 6, Table A6.1), with
 * whether the group itself contains oxygen: the oxygen-balance exemption applies only to those that do.
 */
export const EXPLOSOPHORE_GROUPS = {
  'acetylene': { label: 'C≡C triple bond (acetylene)', oxygen: false },
  'acetylide': { label: 'acetylide (metal–C≡C or C≡C anion)', oxygen: false },
  '1,2-diene': { label: '1,2-diene (allene, C=C=C)', oxygen: false },
  'c-metal': { label: 'carbon–metal bond', oxygen: false },
  'n-metal': { label: 'nitrogen–metal bond', oxygen: false },
  'azide': { label: 'azide (–N3 or N3⁻)', oxygen: false },
  'azo': { label: 'azo group (C–N=N–C)', oxygen: false },
  'diazo': { label: 'diazo compound or diazonium salt', oxygen: false },
  'hydrazine': { label: 'hydrazine (N–N single bond)', oxygen: false },
  // Counted as a contiguous-nitrogen group: the sulfonyl oxygens are not part of the N–N group itself.
  'sulfonyl-hydrazide': { label: 'sulfonyl hydrazide (S(=O)2–N–N)', oxygen: false },
  'peroxide': { label: 'peroxide (O–O)', oxygen: true },
  'ozonide': { label: 'ozonide ring', oxygen: true },
  'hydroxylamine': { label: 'hydroxylamine (N–O single bond)', oxygen: true },
  'nitrate-ester': { label: 'nitrate ester (C–O–NO2)', oxygen: true },
  'nitrate': { label: 'nitrate (NO3⁻ or HNO3)', oxygen: true },
  'nitro': { label: 'nitro group (C–NO2 or N–NO2)', oxygen: true },
  'nitroso': { label: 'nitroso group (C–N=O or N–N=O)', oxygen: true },
  'n-oxide': { label: 'N-oxide', oxygen: true },
  '1,2-oxazole': { label: '1,2-oxazole ring (isoxazole)', oxygen: true },
  'fulminate': { label: 'fulminate or nitrile oxide (C≡N–O)', oxygen: true },
  'n-halogen': { label: 'N–halogen bond', oxygen: false },
  'o-halogen': { label: 'O–halogen (chlorate, perchlorate, iodosyl)', oxygen: true },
} as const satisfies Record<string, { label: string; oxygen: boolean }>

export type ExplosophoreGroup = keyof typeof EXPLOSOPHORE_GROUPS

export const DECLARED_HAZARDS = ['none', 'energetic', 'oxidiser'] as const
export type DeclaredHazard = typeof DECLARED_HAZARDS[number]

/** Strictness of a declared hazard: a run may raise it, never lower it. */
export const HAZARD_RANK: Readonly<Record<DeclaredHazard, number>> = { none: 0, oxidiser: 1, energetic: 2 }

/** The stricter of two declared hazards. */
export function stricterHazard(a: DeclaredHazard | undefined, b: DeclaredHazard | undefined): DeclaredHazard | undefined {
  if (a === undefined) return b
  if (b === undefined) return a
  return HAZARD_RANK[b] > HAZARD_RANK[a] ? b : a
}

/** Material categories whose ultimate analysis identifies them well enough: natural fuels and foods (not screened by groups). */
export const COMPOSITION_CATEGORIES = ['coal', 'coke', 'biomass', 'liquid fuel', 'waste fuel', 'food', 'feed', 'polymer'] as const

/**
 * energetic: treat as explosive; structure-needed: a formula that could hold a group; identity-unknown: nothing
 * says what it is; cleared: the screen clears it. An oxidiser is flagged apart and judged on its share.
 */
export type ScreeningStatus = 'energetic' | 'structure-needed' | 'identity-unknown' | 'cleared'

/** What cleared a component. */
export type ClearedBy = 'no-groups' | 'formula-cannot-hold-group' | 'oxygen-balance' | 'decomposition-energy' | 'category' | 'library-classification'

/** Decomposition energy as recorded in the materials library by a supervisor, with its evidence. */
export interface DecompositionRecord {
  energyJPerG: number
  onsetC?: number | undefined
  method?: string | undefined
  evidence?: string | undefined
  recordedBy?: string | undefined
}

export interface ScreeningResult {
  status: ScreeningStatus
  reasons: string[]
  groups: ExplosophoreGroup[]
  /** The Appendix 6 rule (or identity rule) that decided the status. */
  rule: string
  oxygenBalancePct?: number
  clearedBy?: ClearedBy
  /** Inorganic oxidiser, declared or recognised from the formula: judged on its share of the charge. */
  oxidiser?: { recognised: string } | undefined
  /** The component holds organic matter (carbon) for the oxidiser-mixture rule. */
  organic: boolean
}

export interface ScreeningInput {
  declaredHazard?: DeclaredHazard | undefined
  /** Who declared the hazard: the materials library or the planner. */
  declaredBy?: 'library' | 'planner' | undefined
  /** Groups found in the structure; undefined when no structure is known. */
  groups?: readonly ExplosophoreGroup[] | undefined
  /** Atom counts from a formula or structure. */
  atoms?: AtomCounts | undefined
  molarMassGPerMol?: number | undefined
  /** A composition (ultimate analysis) was given. */
  composition?: Composition | undefined
  category?: string | undefined
  /** The materials library recorded this component's classification (a supervisor or a shipped reference). */
  libraryClassification?: string | undefined
  /** Decomposition energy with its evidence, from the materials library only. */
  decompositionRecord?: DecompositionRecord | undefined
  /** A decomposition energy typed on a run or a quick check: shown, never used to clear. */
  typedDecompositionEnergyJPerG?: number | undefined
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

const HALOGENS = ['F', 'Cl', 'Br', 'I']

/**
 * Why a formula alone could hold a Table A6.1 group, or undefined when it cannot: N with O; two or more N; two or
 * more O with OB above the limit; a halogen with O or N; a metal with C, N or O (the product's identity rule).
 */
export function formulaCouldHoldGroup(atoms: AtomCounts, ob: number | undefined, obLimit: number): string | undefined {
  const n = atoms.N ?? 0
  const o = atoms.O ?? 0
  const halogen = HALOGENS.some(x => (atoms[x] ?? 0) > 0)
  const metals = Object.keys(atoms).filter(k => METALS.has(k) && (atoms[k] ?? 0) > 0)
  if (n > 0 && o > 0) return 'it holds both N and O (nitro, nitrate, nitroso, N-oxide, N–O or 1,2-oxazole possible)'
  if (n >= 2) return 'it holds two or more N (azide, azo, diazo or hydrazine possible)'
  if (o >= 2 && (ob === undefined || ob > obLimit)) return `it holds two or more O with oxygen balance ${ob === undefined ? 'unknown' : fmtPct(ob)} above ${fmtLimit(obLimit)} (peroxide or ozonide possible)`
  if (halogen && (o > 0 || n > 0)) return 'it holds a halogen with O or N (chlorate, perchlorate, iodosyl or N–halogen possible)'
  if (metals.length > 0 && ((atoms.C ?? 0) > 0 || n > 0 || o > 0)) return `it holds ${metals.join(', ')} with C, N or O (acetylide, C–metal, N–metal, azide or metal peroxide possible)`
  return undefined
}

function groupNames(groups: readonly ExplosophoreGroup[]): string {
  return groups.map(g => EXPLOSOPHORE_GROUPS[g].label).join(', ')
}

/**
 * Screens one component by UN Manual of Tests and Criteria, Appendix 6: a declared hazard stands; with a
 * structure, any Table A6.1 group is energetic unless every group found contains oxygen and OB < −200 %, or the
 * materials library holds a supervisor's decomposition energy < 500 J/g with onset < 500 °C, method and evidence
 * for an organic substance. Without a structure the identity rules apply (formula, composition with category,
 * library classification); inorganic oxidisers are recognised from the formula.
 */
export function screenComponent(input: ScreeningInput, policy: LabPolicy): ScreeningResult {
  const atoms = input.atoms
  const ob = atoms && input.molarMassGPerMol ? oxygenBalancePct(atoms, input.molarMassGPerMol) : undefined
  const organic = atoms ? (atoms.C ?? 0) > 0 : input.composition ? (input.composition.C ?? 0) > 0 : true
  const fromFormula = atoms && input.groups === undefined ? recogniseFromFormula(atoms) : undefined
  const groups: ExplosophoreGroup[] = input.groups ? [...input.groups] : [...(fromFormula?.groups ?? [])]
  let oxidiser: ScreeningResult['oxidiser']
  if (fromFormula?.oxidiser) oxidiser = { recognised: fromFormula.oxidiser }
  if (input.declaredHazard === 'oxidiser') oxidiser = { recognised: oxidiser ? `${oxidiser.recognised}, declared an oxidiser` : 'declared an oxidiser' }

  const result = (status: ScreeningStatus, rule: string, reason: string, clearedBy?: ClearedBy): ScreeningResult => {
    const out: ScreeningResult = { status, reasons: [reason], groups, rule, organic }
    if (ob !== undefined) out.oxygenBalancePct = ob
    if (clearedBy) out.clearedBy = clearedBy
    if (oxidiser) out.oxidiser = oxidiser
    if (input.typedDecompositionEnergyJPerG !== undefined && status !== 'cleared') {
      out.reasons.push(`the decomposition energy of ${input.typedDecompositionEnergyJPerG} J/g typed here is shown, never used to clear: only a supervisor's record in the materials library, with onset temperature, method and evidence, can`)
    }
    return out
  }
  const obLimit = policy.energeticObThresholdPct
  const edLimit = policy.decompositionEnergyThresholdJPerG
  const onsetLimit = policy.decompositionOnsetLimitC

  if (input.declaredHazard === 'energetic') {
    return result('energetic', 'declared energetic', input.declaredBy === 'library' ? 'declared energetic in the materials library' : 'declared energetic by the planner')
  }

  if (groups.length > 0) {
    const names = groupNames(groups)
    const where = input.groups ? 'in the structure' : 'from the formula'
    const allOxygen = groups.every(g => EXPLOSOPHORE_GROUPS[g].oxygen)
    if (ob !== undefined && ob < obLimit && allOxygen) {
      return result('cleared', 'Appendix 6 oxygen-balance exemption (groups containing oxygen, OB below −200 %)', `${names} found ${where}, but every group found contains oxygen and the oxygen balance ${fmtPct(ob)} is below ${fmtLimit(obLimit)}`, 'oxygen-balance')
    }
    const d = input.decompositionRecord
    const evidenced = d && d.recordedBy && d.method && d.evidence && d.onsetC !== undefined
    if (d && evidenced && organic && d.energyJPerG < edLimit && d.onsetC! < onsetLimit) {
      return result('cleared', 'Appendix 6 decomposition-energy exemption (organic substance, below 500 J/g, onset below 500 °C)', `${names} found ${where}, but the materials library records a decomposition energy of ${d.energyJPerG} J/g (onset ${d.onsetC} °C, ${d.method}, evidence ${d.evidence}) below ${edLimit} J/g`, 'decomposition-energy')
    }
    const why: string[] = []
    if (ob === undefined) why.push('oxygen balance unknown')
    else if (!allOxygen && ob < obLimit) why.push(`oxygen balance ${fmtPct(ob)} is below ${fmtLimit(obLimit)}, but the exemption does not apply to ${groupNames(groups.filter(g => !EXPLOSOPHORE_GROUPS[g].oxygen))}, which contain no oxygen`)
    else why.push(`oxygen balance ${fmtPct(ob)} is not below ${fmtLimit(obLimit)}`)
    if (d && !organic) why.push('the decomposition-energy exemption applies to organic substances only')
    else if (d && !evidenced) why.push('the recorded decomposition energy lacks its onset temperature, method, evidence or the supervisor who recorded it')
    else if (d) why.push(`the recorded decomposition energy ${d.energyJPerG} J/g (onset ${d.onsetC} °C) does not meet < ${edLimit} J/g with onset < ${onsetLimit} °C`)
    else why.push('no decomposition energy recorded in the materials library')
    return result('energetic', 'UN Manual of Tests and Criteria, Appendix 6, Table A6.1 group without exemption', `${names} found ${where}; ${why.join('; ')}`)
  }

  if (input.groups !== undefined) {
    return result('cleared', 'Appendix 6: no group of Table A6.1', 'no group of Table A6.1 in the structure', 'no-groups')
  }
  if (input.libraryClassification) {
    return result('cleared', 'identity recorded in the materials library', `classified in the materials library (${input.libraryClassification})`, 'library-classification')
  }
  if (atoms) {
    if (oxidiser && fromFormula?.oxidiser) {
      return result('cleared', 'Appendix 6 oxidising mixtures: judged on the oxidiser share', `recognised from the formula as ${fromFormula.oxidiser}`, 'no-groups')
    }
    const could = formulaCouldHoldGroup(atoms, ob, obLimit)
    if (could) return result('structure-needed', 'identity: a formula alone cannot clear a possible Table A6.1 group', `formula only, and ${could}`)
    return result('cleared', 'identity: the formula cannot hold any Table A6.1 group', 'the formula cannot hold any group of Table A6.1', 'formula-cannot-hold-group')
  }
  if (input.composition) {
    const category = input.category
    if (category && (COMPOSITION_CATEGORIES as readonly string[]).includes(category)) {
      return result('cleared', 'identity: ultimate analysis of a named material category', `ultimate analysis of a ${category} (natural fuels, foods and polymers are not screened by groups)`, 'category')
    }
    return result('identity-unknown', 'identity: an ultimate analysis clears only with its material category', category ? `an ultimate analysis of category "${category}" does not say which compound it is` : 'an ultimate analysis without a material category does not say what the sample is')
  }
  return result('identity-unknown', 'identity: nothing says what the sample is', 'no structure, formula, composition or library record')
}

/** Share of oxidisers in the charge mass, % (UN Manual of Tests and Criteria, Appendix 6: limit 15 %). */
export function oxidiserFractionPct(components: readonly { massG: number; oxidiser: boolean }[]): number {
  let oxidiser = 0
  let total = 0
  for (const c of components) {
    total += c.massG
    if (c.oxidiser) oxidiser += c.massG
  }
  return total > 0 ? (oxidiser / total) * 100 : 0
}
