import { describe, expect, it } from 'vitest'
import { CRITICAL_RANGE_FACTORS, assessDuplicates } from '../../../shared/domain/results/duplicates'

const R_ISO_1928 = 120 // J/g, repeatability limit of ISO 1928 (from memory)
const SRM_39J = 26_434 // J/g, NIST SRM 39j: a plausible level for the results
const assess = (...results: number[]) => assessDuplicates(results, { repeatabilityLimit: R_ISO_1928 })

describe('critical range factors (ISO 5725-6 §5.2)', () => {
  it('are the 95 % studentised-range quantiles f(n) divided by f(2), rounded as the methods state them', () => {
    // f(n) = q(0.95; n, ∞): 2.772, 3.314, 3.633 (studentised range tables; ISO 5725-6 Table 1 lists 2.8, 3.3, 3.6).
    expect((3.314 / 2.772).toFixed(1)).toBe(String(CRITICAL_RANGE_FACTORS[3])) // 1.196 → 1.2
    expect((3.633 / 2.772).toFixed(1)).toBe(String(CRITICAL_RANGE_FACTORS[4])) // 1.311 → 1.3
  })
})

describe('assessDuplicates', () => {
  it('asks for a duplicate before reporting anything', () => {
    expect(assess(SRM_39J)).toMatchObject({ status: 'needs-duplicate', value: null })
    expect(assess()).toMatchObject({ status: 'needs-duplicate', n: 0 })
  })

  it('accepts two results exactly r apart and reports their mean', () => {
    const a = assess(SRM_39J, SRM_39J + R_ISO_1928)
    expect(a).toMatchObject({ status: 'accepted', method: 'mean', range: 120, limit: 120 })
    expect(a.value).toBeCloseTo(SRM_39J + 60, 9)
    expect(a.message).toBe('The two results differ by 120 J/g, within 120 J/g (r); the mean is reported.')
  })

  it('asks for a third determination when two results are more than r apart, and reports no value', () => {
    const a = assess(SRM_39J, SRM_39J + R_ISO_1928 + 1)
    expect(a).toMatchObject({ status: 'third-determination-needed', value: null, method: null, range: 121 })
    expect(a.message).toBe('The two results differ by 121 J/g, more than the repeatability limit of 120 J/g; make a third determination.')
  })

  it('takes the mean of three when their range is within 1.2 r = 144 J/g', () => {
    const a = assess(SRM_39J, SRM_39J + 144, SRM_39J + 30)
    expect(a).toMatchObject({ status: 'accepted', method: 'mean', range: 144, limit: 144 })
    expect(a.value).toBeCloseTo(SRM_39J + 58, 9) // (0 + 144 + 30)/3
  })

  it('reports the median of three, flagged, when their range exceeds 1.2 r', () => {
    const a = assess(SRM_39J, SRM_39J + 145, SRM_39J + 30)
    expect(a).toMatchObject({ status: 'median-flagged', method: 'median', value: SRM_39J + 30, range: 145 })
    expect(a.message).toContain('the median 26,464 J/g is reported and flagged for review')
  })

  it('holds four results to 1.3 r = 156 J/g', () => {
    expect(assess(SRM_39J, SRM_39J + 156, SRM_39J + 10, SRM_39J + 20)).toMatchObject({ status: 'accepted', method: 'mean', limit: 156 })
    expect(assess(SRM_39J, SRM_39J + 157, SRM_39J + 10, SRM_39J + 20)).toMatchObject({ status: 'median-flagged', value: SRM_39J + 15 })
  })

  it('leaves five or more results to a supervisor', () => {
    expect(assess(1, 2, 3, 4, 5)).toMatchObject({ status: 'review-needed', value: null })
  })

  it('uses the unit it is given', () => {
    const a = assessDuplicates([11.36, 11.41], { repeatabilityLimit: 0.12, unit: 'MJ/kg', decimals: 2 })
    expect(a.status).toBe('accepted')
    expect(a.message).toBe('The two results differ by 0.05 MJ/kg, within 0.12 MJ/kg (r); the mean is reported.')
  })
})
