// Password strength: the zxcvbn estimator (TypeScript port, common and English dictionaries) and a plain check
// against its list of common passwords. The estimate needs a score of at least 3 of 4 ("safely unguessable:
// moderate protection from offline slow-hash scenario", about 10^8 guesses and more) — the estimator's own scale.
import { ZxcvbnFactory } from '@zxcvbn-ts/core'
import * as common from '@zxcvbn-ts/language-common'
import * as en from '@zxcvbn-ts/language-en'
import { PASSWORD_RULE } from '#shared/password-rule'

const MIN_SCORE = 3
let estimator: ZxcvbnFactory | undefined
let commonList: Set<string> | undefined

function load() {
  estimator ??= new ZxcvbnFactory({ dictionary: { ...common.dictionary, ...en.dictionary }, graphs: common.adjacencyGraphs, translations: en.translations })
  commonList ??= new Set(common.dictionary['passwords-common'].map(p => p.toLowerCase()))
  return { estimator, commonList }
}

/** Why a password is too weak, in words for the form, or null when it is acceptable. */
export async function passwordWeakness(password: string, userInputs: string[] = []): Promise<string | null> {
  const { estimator, commonList } = load()
  const lower = password.toLowerCase()
  if (commonList.has(lower) || commonList.has(lower.replace(/\d+$/, ''))) return 'this is on a list of common passwords'
  // The e-mail, its local part and every word of it and of the name count as known to an attacker.
  const inputs = userInputs.flatMap(s => [s, s.toLowerCase().split('@')[0] ?? '', ...s.toLowerCase().split(/[@.\s_-]+/)]).filter(s => s.length >= 3)
  const result = await estimator.check(password.slice(0, 128), inputs)
  if (result.score >= MIN_SCORE) return null
  const hint = result.feedback.warning ?? result.feedback.suggestions[0] ?? null
  return `too easy to guess${hint ? ` (${hint.replace(/\.$/, '')})` : ''}: ${PASSWORD_RULE}`
}

/** 422 naming the field when the password is too weak. */
export async function assertStrongPassword(password: string, field: string, userInputs: string[] = []) {
  const problem = await passwordWeakness(password, userInputs)
  if (problem) invalidInput([{ path: field, message: problem }])
}
