import { describe, expect, it } from 'vitest'
import { fmtDate, fmtDateTime, fmtKJ, fmtLongDate, fmtNum } from '../../../composables/useFormat'

// The figures a page shows: British English grouping and dates (CLDR en-GB patterns, as ECMA-402 formatters give them),
// the same text that toLocaleString wrote before the formatters were kept for reuse.
describe('formatting for the pages', () => {
  it('groups thousands with a comma and fixes the decimals (CLDR en-GB)', () => {
    expect(fmtNum(26454)).toBe('26,454')
    expect(fmtNum(26.4541, 2)).toBe('26.45')
    expect(fmtNum(0.5, 1)).toBe('0.5')
    expect(fmtNum(-1234.5, 1)).toBe('-1,234.5')
    expect(fmtKJ(33000)).toBe('33.0')
    for (const [v, d] of [[1234.5678, 3], [1e7, 0], [-0.05, 1]] as const) {
      expect(fmtNum(v, d)).toBe(v.toLocaleString('en-GB', { minimumFractionDigits: d, maximumFractionDigits: d }))
    }
  })

  it('writes a dash for what is missing or not a number', () => {
    expect(fmtNum(null)).toBe('—')
    expect(fmtNum(Number.NaN)).toBe('—')
    expect(fmtNum(Number.POSITIVE_INFINITY)).toBe('—')
    expect(fmtKJ(undefined)).toBe('—')
    expect(fmtDate(null)).toBe('—')
    expect(fmtDate('not a date')).toBe('—')
    expect(fmtDateTime('')).toBe('—')
  })

  it('writes dates as day, short month, year (CLDR en-GB)', () => {
    // Noon UTC: the same calendar day in every time zone the test may run in, from UTC−11 to UTC+11.
    expect(fmtDate('2026-12-02T12:00:00Z')).toBe('2 Dec 2026')
    const at = new Date('2026-12-02T12:00:00Z')
    expect(fmtDateTime(at)).toBe(at.toLocaleString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' }))
    // The head of Today: 2 December 2026 is a Wednesday (ISO 8601 calendar).
    expect(fmtLongDate(at)).toBe('Wednesday, 2 December 2026')
    expect(fmtLongDate(at)).toBe(at.toLocaleDateString('en-GB', { weekday: 'long', day: 'numeric', month: 'long', year: 'numeric' }))
  })
})
