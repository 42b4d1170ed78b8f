// Number and date formatting for the bench: fixed decimals, thin grouping, dates in the lab's locale.
export function fmtNum(value: number | null | undefined, digits = 0): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—'
  return value.toLocaleString('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits })
}

export function fmtDate(value: string | Date | null | undefined): string {
  if (!value) return '—'
  return new Date(value).toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric' })
}

export function fmtDateTime(value: string | Date | null | undefined): string {
  if (!value) return '—'
  return new Date(value).toLocaleString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' })
}

/** Energy in kJ with one decimal, the way ratings are written on a vessel. */
export function fmtKJ(joules: number | null | undefined, digits = 1): string {
  return joules === null || joules === undefined ? '—' : fmtNum(joules / 1000, digits)
}
