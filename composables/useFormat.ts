// Number and date formatting for the bench: fixed decimals, thin grouping, dates in the lab's locale.
// The formatters are made once and reused: building one per call (`toLocaleString` with options does) was the largest
// cost of rendering the fleet table on the server (docs/benchmarks.md). The output is the same for every readable value.
const numberFormats = new Map<number, Intl.NumberFormat>()
const dateFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric' })
const dateTimeFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' })
const longDateFormat = new Intl.DateTimeFormat('en-GB', { weekday: 'long', day: 'numeric', month: 'long', year: 'numeric' })

function numberFormat(digits: number): Intl.NumberFormat {
  let format = numberFormats.get(digits)
  if (!format) numberFormats.set(digits, format = new Intl.NumberFormat('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits }))
  return format
}

export function fmtNum(value: number | null | undefined, digits = 0): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—'
  return numberFormat(digits).format(value)
}

// A date that cannot be read shows as a dash (a formatter throws where toLocaleString wrote "Invalid Date").
function formatDate(format: Intl.DateTimeFormat, value: string | Date | null | undefined): string {
  const date = value ? new Date(value) : null
  return date && Number.isFinite(date.getTime()) ? format.format(date) : '—'
}

export function fmtDate(value: string | Date | null | undefined): string {
  return formatDate(dateFormat, value)
}

export function fmtDateTime(value: string | Date | null | undefined): string {
  return formatDate(dateTimeFormat, value)
}

/** A day written out, "Wednesday, 2 December 2026" in en-GB, as at the head of Today. */
export function fmtLongDate(value: string | Date | null | undefined): string {
  return formatDate(longDateFormat, value)
}

/** Energy in kJ with one decimal, the way ratings are written on a vessel. */
export function fmtKJ(joules: number | null | undefined, digits = 1): string {
  return joules === null || joules === undefined ? '—' : fmtNum(joules / 1000, digits)
}
