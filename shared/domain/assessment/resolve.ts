// Resolution of formulas (mf-parser) and structures (openchemlib), both loaded on first need.
import { type AtomCounts, compositionFromFormula, CompositionError } from '../composition'
import { chemicalTextProblem, normaliseChemicalText } from '../hygiene'
import type { LabPolicy } from '../policy'
import type { StructureAnalysis } from '../structure'
import { assessCharge } from './assess'
import { type Assessment, type ChargeComponentInput, type ChargeInput, ChargeInputError, type InputIssue, type ResolvedChemistry } from './contract'

const RESOLVE_CACHE_LIMIT = 500
const resolveCache = new Map<string, Promise<ResolvedChemistry>>()

function cached(key: string, make: () => Promise<ResolvedChemistry>): Promise<ResolvedChemistry> {
  const hit = resolveCache.get(key)
  if (hit) return hit
  if (resolveCache.size >= RESOLVE_CACHE_LIMIT) resolveCache.clear()
  const promise = make()
  resolveCache.set(key, promise)
  promise.catch(() => resolveCache.delete(key))
  return promise
}

function fromStructure(analysis: StructureAnalysis): ResolvedChemistry {
  return {
    source: 'structure',
    formula: analysis.formula,
    atoms: analysis.atoms,
    molarMassGPerMol: analysis.molarMassGPerMol,
    composition: analysis.composition,
    explosophores: analysis.explosophores,
  }
}

function sameAtoms(a: AtomCounts, b: AtomCounts): boolean {
  const keys = new Set([...Object.keys(a), ...Object.keys(b)])
  for (const k of keys) if (Math.abs((a[k] ?? 0) - (b[k] ?? 0)) > 1e-9) return false
  return true
}

/**
 * Turns each formula (mf-parser) or SMILES (openchemlib) into atoms, composition and explosophores; both
 * libraries load on first need. Any `resolved` already on a component is replaced. Throws ChargeInputError.
 */
export async function resolveComponents<T extends ChargeComponentInput>(components: readonly T[]): Promise<(T & { resolved?: ResolvedChemistry })[]> {
  const issues: InputIssue[] = []
  const attempt = async (path: (string | number)[], work: () => Promise<ResolvedChemistry>): Promise<ResolvedChemistry | undefined> => {
    try {
      return await work()
    }
    catch (error) {
      if (!(error instanceof CompositionError)) throw error
      issues.push({ path, message: error.message })
      return undefined
    }
  }
  const out = await Promise.all(
    components.map(async (component, index) => {
      // A caller's own `resolved` is never trusted: it is replaced or dropped.
      const base: T & { resolved?: ResolvedChemistry } = { ...component }
      delete base.resolved
      // The same hygiene as the request schema, so the browser and the server say the same.
      const clean = (text: string | undefined, field: 'smiles' | 'formula') => {
        if (text === undefined) return undefined
        const problem = chemicalTextProblem(text, field === 'smiles' ? 'structure' : 'formula')
        if (problem) {
          issues.push({ path: ['components', index, field], message: problem.message })
          return undefined
        }
        return normaliseChemicalText(text).trim() || undefined
      }
      const smiles = clean(component.smiles, 'smiles')
      const formula = clean(component.formula, 'formula')
      const fromStructureText = smiles
        ? await attempt(['components', index, 'smiles'], () => cached(`s:${smiles}`, async () => {
            const { analyseStructure } = await import('../structure')
            return fromStructure(analyseStructure(smiles))
          }))
        : undefined
      const fromFormulaText = formula
        ? await attempt(['components', index, 'formula'], () => cached(`f:${formula}`, async () => ({ source: 'formula', ...(await compositionFromFormula(formula)) })))
        : undefined
      if (fromStructureText && fromFormulaText && !sameAtoms(fromFormulaText.atoms, fromStructureText.atoms)) {
        issues.push({ path: ['components', index, 'formula'], message: `Formula ${formula} does not match the structure, which is ${fromStructureText.formula}` })
      }
      const resolved = fromStructureText ?? fromFormulaText
      if (resolved) base.resolved = resolved
      return base
    }),
  )
  if (issues.length > 0) throw new ChargeInputError(issues)
  return out
}

/** Resolves formulas and structures, then assesses the charge. */
export async function assess(input: ChargeInput, policy: LabPolicy): Promise<Assessment> {
  return assessCharge({ ...input, components: await resolveComponents(input.components) }, policy)
}
