// CSV downloads (results, audit trail) through papaparse: RFC 4180 quoting, and formula-injection escaping — a text
// cell starting with = + - @, tab or CR gets a leading ' so a spreadsheet shows it as text instead of running it
// (OWASP, CSV injection). Numbers stay numbers, so a negative value is not escaped.
import { type H3Event, setResponseHeaders } from 'h3'
import Papa from 'papaparse'

export type CsvCell = string | number | boolean | null | undefined

const cell = (v: CsvCell) => (typeof v === 'number' && !Number.isFinite(v) ? null : v)

/** Rows as CSV lines, each ended by CRLF (so chunks of a stream can be joined). */
export function csvLines(rows: readonly (readonly CsvCell[])[]): string {
  if (!rows.length) return ''
  return `${Papa.unparse(rows.map(r => r.map(cell)), { escapeFormulae: true, newline: '\r\n' })}\r\n`
}

/** The header line, with the byte-order mark that lets spreadsheet programs read the names as UTF-8. */
export const csvHeader = (columns: readonly string[]) => `\uFEFF${csvLines([columns])}`

/** Download headers for a CSV named emberline-<what>-<yyyymmdd>.csv. */
export function setCsvDownload(event: H3Event, what: string, extra: Record<string, string> = {}) {
  const stamp = new Date().toISOString().slice(0, 10).replace(/-/g, '')
  setResponseHeaders(event, {
    'Content-Type': 'text/csv; charset=utf-8',
    'Content-Disposition': `attachment; filename="emberline-${what}-${stamp}.csv"`,
    'Cache-Control': 'no-store',
    ...extra,
  })
}
