import { describe, expect, it } from 'vitest'
import { z } from 'zod'
import { fieldLabel, pathWords } from '#shared/field-labels'
import '#shared/schemas/messages'

// Validation words: the product's own phrases, never zod's defaults.
const messages = (schema: z.ZodType, value: unknown) => (schema.safeParse(value).error?.issues ?? []).map(i => `${pathWords(i.path.map(String).join('.'))}: ${i.message}`)

describe('validation messages in the product\'s words', () => {
  it('says an empty password is required, not "Too small: expected string to have >=1 characters"', () => {
    const login = z.object({ email: z.string().trim().email().max(320), password: z.string().min(1).max(1024) })
    expect(messages(login, { email: 'a@b.test', password: '' })).toEqual(['Password: required'])
    expect(messages(login, { email: 'nope' })).toEqual(['E-mail: a valid e-mail address', 'Password: required'])
  })

  it('words sizes, types, choices and unknown fields plainly, and keeps a schema\'s own message', () => {
    expect(messages(z.object({ fillPressureMPa: z.number().positive().max(50) }), { fillPressureMPa: 0 })).toEqual(['Fill pressure (MPa gauge): above 0'])
    expect(messages(z.object({ massG: z.number().max(100) }), { massG: 'x' })).toEqual(['Mass (g): must be a number'])
    expect(messages(z.object({ kind: z.enum(['sample', 'check']) }), { kind: 'other' })).toEqual(['Kind: one of sample, check'])
    expect(messages(z.object({}).strict(), { extra: 1 })).toEqual(['The request: unknown field: extra'])
    expect(messages(z.object({ note: z.string().max(3, 'at most 3 letters') }), { note: 'abcd' })).toEqual(['Note: at most 3 letters'])
    for (const m of messages(z.object({ components: z.array(z.object({ massG: z.number().min(0) })).min(1) }), { components: [{ massG: -1 }] })) {
      expect(m).toBe('Components, item 1, mass (g): at least 0')
    }
  })

  it('spells out a key it has no label for', () => {
    expect(fieldLabel('fillPressureMPa')).toBe('Fill pressure (MPa gauge)')
    expect(fieldLabel('someNewThing')).toBe('Some new thing')
  })
})

describe('audit words', () => {
  it('names actions and nested fields as the pages do', async () => {
    const { actionWords } = await import('#shared/field-labels')
    expect(actionWords('run.approve')).toBe('Run: approve')
    expect(actionWords('vessel.ratings-change')).toBe('Vessel: ratings change')
    expect(pathWords('fillPressureMPa')).toBe('Fill pressure (MPa gauge)')
    expect(pathWords('policy.fillPressureWindowMaxMPa')).toBe('Lab policy, method fill window, upper end (MPa gauge)')
    expect(pathWords('service.record.effect.checksPassed')).toBe('Service, record, effect, checks passed')
    expect(pathWords('signature.boundHash')).toBe('Signature, signed charge fingerprint')
  })
})
