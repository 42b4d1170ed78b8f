// What a result needs besides the analyst's inputs, in a form both sides hold: the server loads the parts from the
// database, the result form fetches the same parts once, and both call resultContextFrom and computeResultValues, so the
// preview on the form is the value the server stores.
import type { LabPolicy } from '../policy'
import { resultInputSchema } from '../../schemas/results'
import { computeResultValues } from './compute'
import { repeatabilityTerm } from './repeatability'
import type { AidValue, EnergyEquivalentInput, ResultContext, ResultKind, ResultValues } from './result-types'
import { ResultInputError } from './result-types'

/** The database's share of a result context: everything but the lab policy, plain data (JSON-safe). */
export interface ResultContextParts {
  kind: ResultKind
  weighedMassG: number
  components: ResultContext['components']
  /** The ε in force with its series' standard deviation and number of runs (u(ε) = s/√n); null for standardisation runs. */
  energyEquivalent: EnergyEquivalentInput | null
  aid: AidValue | null
  cotton: AidValue | null
  /** The lab's pooled duplicate scatter, or null while it has none. */
  labRepeatability: { standardDeviation: number, degreesOfFreedom: number } | null
}

/** The context computeResultValues takes, from the parts and the policy in force. */
export function resultContextFrom(parts: ResultContextParts, policy: LabPolicy): ResultContext {
  return {
    kind: parts.kind,
    weighedMassG: parts.weighedMassG,
    components: parts.components,
    energyEquivalent: parts.energyEquivalent,
    aid: parts.aid,
    cotton: parts.cotton,
    repeatability: repeatabilityTerm(policy.repeatabilityJPerG, parts.labRepeatability, policy.ownRepeatabilityMinDof),
    policy,
  }
}

export interface InputProblem { path: string, message: string }
export type ResultPreview = { ok: true, values: ResultValues } | { ok: false, problems: InputProblem[] }

/**
 * The result as the server would compute it from this request body: the same schema, the same context, the same
 * function. Problems are named by input path, as the server's 422 names them.
 */
export function previewResult(body: unknown, parts: ResultContextParts, policy: LabPolicy): ResultPreview {
  const parsed = resultInputSchema.safeParse(body)
  if (!parsed.success) return { ok: false, problems: parsed.error.issues.map(i => ({ path: i.path.join('.') || '(inputs)', message: i.message })) }
  try {
    return { ok: true, values: computeResultValues(parsed.data, resultContextFrom(parts, policy)) }
  }
  catch (err) {
    if (err instanceof ResultInputError) return { ok: false, problems: [{ path: err.path, message: err.message }] }
    if (err instanceof RangeError) return { ok: false, problems: [{ path: '(inputs)', message: err.message }] }
    throw err
  }
}
