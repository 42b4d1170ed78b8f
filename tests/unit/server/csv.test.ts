import { describe, expect, it } from 'vitest'
import { csvHeader, csvLines } from '../../../server/utils/csv'

// CSV as RFC 4180 writes it, with the OWASP "CSV injection" advice: a text cell that a spreadsheet would run as a
// formula (leading = + - @, tab or CR) is prefixed with ' and so shown as text.
describe('csvLines', () => {
  it('escapes a formula and quotes it as RFC 4180 asks (inner quotes doubled)', () => {
    expect(csvLines([['=HYPERLINK("http://example.test","open")']])).toBe(`"'=HYPERLINK(""http://example.test"",""open"")"\r\n`)
  })

  it.each(['+1+1', '-2+3', '@SUM(A1)', '\t=1', '\r=1'])('escapes %j', (cell) => {
    expect(csvLines([[cell]])).toMatch(/^"'/)
  })

  it('leaves numbers (negative ones too), booleans and plain text alone; empty for null and non-finite numbers', () => {
    expect(csvLines([[-5.2, true, 'plain', null, undefined, Number.NaN, 'a,b']])).toBe('-5.2,true,plain,,,,"a,b"\r\n')
  })

  it('ends every line with CRLF, so streamed chunks join into one file', () => {
    expect(csvLines([['a'], ['b']]) + csvLines([['c']])).toBe('a\r\nb\r\nc\r\n')
    expect(csvLines([])).toBe('')
  })

  it('starts the header with the UTF-8 byte-order mark', () => {
    expect(csvHeader(['x (J/g)', 'y'])).toBe('\uFEFFx (J/g),y\r\n')
  })
})
