// What a formula alone says for certain: inorganic oxidisers and the unambiguous inorganic azides and acetylides.
import type { AtomCounts } from './composition'
import { METALS } from './elements'
import type { ExplosophoreGroup } from './screening'

export interface FormulaRecognition {
  groups: ExplosophoreGroup[]
  /** Kind of inorganic oxidiser recognised, e.g. "a perchlorate". */
  oxidiser?: string
}

// Usual positive valence of the metals in peroxides and salts (common practice; group 1 and 2 and a few others).
const VALENCE: Readonly<Record<string, number>> = {
  H: 1, Li: 1, Na: 1, K: 1, Rb: 1, Cs: 1, Ag: 1, Be: 2, Mg: 2, Ca: 2, Sr: 2, Ba: 2, Zn: 2,
}

/**
 * Inorganic (carbon-free) formulas read as: chlorate, perchlorate, bromate or iodate (halogen with ≥ 3 O each);
 * nitrate or nitrite (N with ≥ 2 O per N that is not ammonium); permanganate (Mn with ≥ 4 O); chromate or
 * dichromate (Cr with ≥ 3.5 O per Cr … CrO3 counted); peroxide or superoxide (more O than the metals' and
 * hydrogen's valence binds); azide (only metals, H and ≥ 3 N); acetylide (one metal and C2). The oxidiser kinds
 * are those named by UN Manual of Tests and Criteria, Appendix 6 for oxidising mixtures.
 */
export function recogniseFromFormula(atoms: AtomCounts): FormulaRecognition {
  const out: FormulaRecognition = { groups: [] }
  const count = (e: string) => atoms[e] ?? 0
  const elements = Object.keys(atoms).filter(e => count(e) > 0)
  const metals = elements.filter(e => METALS.has(e))
  const c = count('C')
  const o = count('O')
  const n = count('N')
  if (c === 0) {
    const halogens = ['Cl', 'Br', 'I'].filter(x => count(x) > 0)
    for (const x of halogens) {
      if (o >= 3 * count(x)) {
        out.oxidiser = o >= 4 * count(x) ? `a per${x === 'Cl' ? 'chlor' : x === 'Br' ? 'brom' : 'iod'}ate` : `a ${x === 'Cl' ? 'chlor' : x === 'Br' ? 'brom' : 'iod'}ate`
      }
    }
    // Ammonium takes one N with four H; the remaining N with its O is the nitrate or nitrite.
    const ammoniumN = Math.min(n, Math.floor(count('H') / 4))
    const oxoN = n - ammoniumN
    if (!out.oxidiser && oxoN > 0 && o >= 2 * oxoN) out.oxidiser = o >= 3 * oxoN ? 'a nitrate' : 'a nitrite'
    if (!out.oxidiser && count('Mn') > 0 && o >= 4 * count('Mn')) out.oxidiser = 'a permanganate'
    if (!out.oxidiser && count('Cr') > 0 && o >= 3 * count('Cr') && elements.every(e => e === 'Cr' || e === 'O' || METALS.has(e) || e === 'H' || e === 'N')) {
      out.oxidiser = 'a chromate or dichromate'
    }
    const onlyValenceKnown = elements.every(e => e === 'O' || VALENCE[e] !== undefined)
    if (!out.oxidiser && o > 0 && onlyValenceKnown && elements.some(e => e !== 'O')) {
      const bound = elements.reduce((s, e) => s + (e === 'O' ? 0 : (VALENCE[e] ?? 0) * count(e)), 0) / 2
      if (o > bound + 1e-9) out.oxidiser = 'a peroxide or superoxide'
    }
    if (n >= 3 && o === 0 && elements.every(e => e === 'N' || e === 'H' || METALS.has(e)) && (metals.length > 0 || count('H') > 0)) {
      out.groups.push('azide')
    }
  }
  if (c === 2 && metals.length === 1 && elements.length === 2) out.groups.push('acetylide')
  return out
}
