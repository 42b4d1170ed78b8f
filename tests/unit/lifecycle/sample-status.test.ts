import { describe, expect, it } from 'vitest'
import { sampleBenchState } from '../../../shared/domain/sample-status'

// Duplicates by default (lab policy: 2 determinations; ISO 1928 reports the mean of duplicate determinations, from memory).
// A firing gives a determination only after complete combustion (common practice: soot or unburnt sample means a repeat).
const DUPLICATES = 2

describe('when a sample is tested', () => {
  it('is tested once both determinations are fired completely', () => {
    expect(sampleBenchState(['fired', 'ready'], ['complete'], DUPLICATES)).toMatchObject({ status: 'planned', why: '1 run of the sample still to be fired' })
    expect(sampleBenchState(['fired', 'fired'], ['complete', 'complete'], DUPLICATES).status).toBe('tested')
  })

  it('stays planned after a misfire until the repeat is fired', () => {
    const misfire = sampleBenchState(['fired', 'fired'], ['complete', 'misfire'], DUPLICATES)
    expect(misfire.status).toBe('planned')
    expect(misfire.why).toMatch(/1 of 2 determinations gave a result: fire a repeat/)
    expect(sampleBenchState(['fired', 'fired', 'draft'], ['complete', 'incomplete'], DUPLICATES).status).toBe('planned')
    expect(sampleBenchState(['fired', 'fired', 'fired'], ['complete', 'incomplete', 'complete'], DUPLICATES).status).toBe('tested')
  })

  it('does not count withdrawn or rejected runs', () => {
    expect(sampleBenchState(['fired', 'withdrawn'], ['complete'], DUPLICATES).status).toBe('tested')
    expect(sampleBenchState(['rejected', 'fired', 'fired'], ['complete', 'complete'], DUPLICATES).status).toBe('tested')
    // Nothing fired and nothing left to fire: not tested.
    expect(sampleBenchState(['withdrawn', 'withdrawn'], [], DUPLICATES).status).toBe('planned')
  })

  it('asks for the lab\'s number of determinations, or as many as were planned when fewer', () => {
    expect(sampleBenchState(['fired'], ['complete'], DUPLICATES).status).toBe('tested')
    expect(sampleBenchState(['fired', 'fired', 'fired'], ['complete', 'complete', 'complete'], 3).status).toBe('tested')
    expect(sampleBenchState(['fired', 'fired', 'fired'], ['complete', 'complete', 'leak'], 3).status).toBe('planned')
  })

  it('counts against the determinations planned for the sample: a repeat of a failed firing is not a further one', () => {
    // One determination planned; it misfired, and its repeat burned completely: tested.
    expect(sampleBenchState(['fired'], ['misfire'], 1)).toMatchObject({ status: 'planned' })
    expect(sampleBenchState(['fired', 'fired'], ['misfire', 'complete'], 1).status).toBe('tested')
    // Duplicates planned, one misfired and not yet repeated: the same two runs and outcomes, still planned.
    expect(sampleBenchState(['fired', 'fired'], ['misfire', 'complete'], 2).status).toBe('planned')
  })
})
