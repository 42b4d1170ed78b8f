// Validation messages in the product's own words: zod's defaults ("Too small: expected string to have >=1
// characters") never reach a page. Messages a schema gives itself still win; this map only fills in the rest.
import { z } from 'zod'

const TYPE_WORDS: Record<string, string> = {
  string: 'text', number: 'a number', int: 'a whole number', boolean: 'yes or no', array: 'a list', object: 'a group of fields', date: 'a date',
}

function sizeWords(origin: string, bound: number | bigint, inclusive: boolean | undefined, more: boolean): string {
  const n = Number(bound)
  if (origin === 'string') {
    if (!more && n === 1) return 'required'
    return `${more ? 'at most' : 'at least'} ${n} character${n === 1 ? '' : 's'}`
  }
  if (origin === 'array' || origin === 'set') return `${more ? 'at most' : 'at least'} ${n} item${n === 1 ? '' : 's'}`
  if (inclusive === false) return more ? `below ${n}` : `above ${n}`
  return more ? `at most ${n}` : `at least ${n}`
}

/** The product's error map for zod: short phrases that follow the field's name ("Password: required"). */
export const productErrorMap: z.core.$ZodErrorMap = (issue) => {
  switch (issue.code) {
    case 'invalid_type':
      return issue.input === undefined || issue.input === null ? 'required' : `must be ${TYPE_WORDS[issue.expected] ?? issue.expected}`
    case 'too_small':
      return sizeWords(issue.origin, issue.minimum, issue.inclusive, false)
    case 'too_big':
      return sizeWords(issue.origin, issue.maximum, issue.inclusive, true)
    case 'invalid_format':
      return issue.format === 'email' ? 'a valid e-mail address' : issue.format === 'uuid' || issue.format === 'guid' ? 'not a valid record id' : issue.format === 'datetime' || issue.format === 'date' ? 'a valid date' : `not in the expected ${issue.format} form`
    case 'invalid_value':
      return `one of ${issue.values.map(String).join(', ')}`
    case 'unrecognized_keys':
      return `unknown field${issue.keys.length === 1 ? '' : 's'}: ${issue.keys.join(', ')}`
    case 'not_multiple_of':
      return `a multiple of ${String(issue.divisor)}`
    case 'invalid_union':
      return 'not one of the accepted forms'
    default:
      return undefined
  }
}

/** Installs the product's words as zod's error map (the server and the browser each call it once at start). */
export function installProductMessages() {
  z.config({ customError: productErrorMap })
}

installProductMessages()
