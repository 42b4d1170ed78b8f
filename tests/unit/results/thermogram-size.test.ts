import { describe, expect, it } from 'vitest'
import { THERMOGRAM_MAX_POINTS, analyseThermogram, parseThermogramCsv } from '#shared/domain/results/thermogram'
import { range } from '#shared/domain/results/statistics'
import { synthesiseThermogram, thermogramCsv } from '../bench/synthetic-thermogram'

// Long records: the analysis loops over readings (no spread of the whole array into one call, which overflows the
// call stack near 10⁵ arguments), and the parser refuses a record above the ceiling with a message naming the line.
describe('thermogram size', () => {
  it('analyses 230 000 readings without overflowing the call stack and recovers θ (Regnault–Pfaundler, ISO 1928)', () => {
    // 20 ms steps over 4 600 s: 230 001 readings of the same Newtonian model as the other thermogram tests.
    const points = synthesiseThermogram({ thetaK: 2.5, stepS: 0.02, durationS: 4600, ignitionS: 600 })
    expect(points.length).toBeGreaterThan(230_000)
    const a = analyseThermogram(points)
    expect(a.ok).toBe(true)
    if (a.ok) expect(a.regnaultPfaundler.riseK).toBeCloseTo(2.5, 2)
  })

  it('refuses a file with more readings than the ceiling, naming the line where it stopped', () => {
    const points = synthesiseThermogram({ thetaK: 2, stepS: 0.01, durationS: (THERMOGRAM_MAX_POINTS + 10) * 0.01 })
    const parsed = parseThermogramCsv(thermogramCsv(points))
    expect(parsed.ok).toBe(false)
    expect(parsed.errors.at(-1)?.message).toMatch(/more than 100,000 readings/)
    expect(parsed.errors.at(-1)?.row).toBe(THERMOGRAM_MAX_POINTS + 2)
  })

  it('takes the range of a long series with a loop (ISO 5725-6 range, max − min)', () => {
    const values = Array.from({ length: 300_000 }, (_, i) => (i % 1000) / 10)
    expect(range(values)).toBeCloseTo(99.9, 9)
  })
})
