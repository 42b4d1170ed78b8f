import { describe, expect, it } from 'vitest'
import { dutyConflict, runActRefusal, runAllows, runDutyConflict, runKindProblems, RUN_TRANSITIONS, withHandler } from '../../../shared/domain/run-lifecycle'
import { RUN_STATUSES } from '../../../shared/schemas/plans'

// The run lifecycle as a transition table (the lab's own rules, common practice for signed records).
describe('run transitions', () => {
  it('allows each act only from its statuses', () => {
    const table = Object.fromEntries(RUN_STATUSES.map(s => [s, (Object.keys(RUN_TRANSITIONS) as (keyof typeof RUN_TRANSITIONS)[]).filter(a => runAllows(a, s))]))
    expect(table).toEqual({
      'draft': ['edit', 'withdraw', 'submit'],
      'ready': ['edit', 'withdraw', 'fire'],
      'awaiting-approval': ['edit', 'withdraw', 'approve', 'reject'],
      'blocked': ['edit', 'withdraw'],
      'rejected': ['edit', 'withdraw'],
      'fired': [],
      'withdrawn': [],
    })
  })

  it('says in words why an act is refused', () => {
    expect(runActRefusal('fire', 'awaiting-approval', 'S-1')).toBe('Run S-1 cannot be fired: it awaits a supervisor\'s signature.')
    expect(runActRefusal('approve', 'fired')).toBe('This run cannot be approved: it has already been fired.')
    expect(runActRefusal('edit', 'draft')).toBeNull()
  })
})

describe('separation of duties', () => {
  const run = { plannedBy: 'a', editedBy: ['b'], submittedBy: ['b', 'c'] }
  it('refuses everyone who planned, edited or submitted, whatever their roles', () => {
    expect(runDutyConflict(run, 'a')).toMatch(/^You planned this run: another supervisor must sign it/)
    expect(runDutyConflict(run, 'b')).toMatch(/^You edited and submitted this run/)
    expect(runDutyConflict(run, 'c')).toMatch(/^You submitted this run/)
    expect(runDutyConflict(run, 'd')).toBeNull()
  })

  it('names every part a signer had in a result', () => {
    expect(dutyConflict('x', 'this result', { fired: ['x'], entered: ['x'] })).toMatch(/^You fired and entered this result/)
    expect(dutyConflict('x', 'this result', { fired: [null], entered: ['y'] })).toBeNull()
  })

  it('adds a handler once', () => {
    expect(withHandler(['a'], 'a')).toEqual(['a'])
    expect(withHandler(null, 'a')).toEqual(['a'])
  })
})

describe('run kinds', () => {
  const ba = { index: 0, materialId: 'm1', materialName: 'Benzoic acid, calorimetric standard', category: 'reference standard' }
  const coal = { index: 0, materialId: 'm2', materialName: 'Bituminous coal (typical)', category: 'coal' }
  it('lets a standardisation or check run burn only the reference standard', () => {
    expect(runKindProblems('check', [ba])).toEqual([])
    expect(runKindProblems('standardisation', [ba])).toEqual([])
    expect(runKindProblems('check', [coal])[0]!.message).toMatch(/a check run burns the lab's reference standard .* Bituminous coal \(typical\) is a coal, not a reference standard/)
    expect(runKindProblems('standardisation', [{ index: 1, description: 'test sample' }])[0]).toMatchObject({ index: 1, message: expect.stringMatching(/"test sample" is not a library reference standard/) })
    expect(runKindProblems('check', [])).toHaveLength(1)
  })

  it('leaves sample runs alone', () => {
    expect(runKindProblems('sample', [coal])).toEqual([])
  })
})
