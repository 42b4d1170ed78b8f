// Argument guards and message formatting shared by the results modules; internal, not re-exported by index.ts.

/** Throws a RangeError unless value is a finite number — guards every public entry point; no formula. */
export function assertFinite(value: number, name: string): void {
  if (!Number.isFinite(value)) throw new RangeError(`${name} must be a finite number (got ${value})`)
}

/** Throws a RangeError unless value is finite and > 0; no formula. */
export function assertPositive(value: number, name: string): void {
  assertFinite(value, name)
  if (value <= 0) throw new RangeError(`${name} must be greater than 0 (got ${value})`)
}

/** Throws a RangeError unless value is finite and ≥ 0; no formula. */
export function assertNonNegative(value: number, name: string): void {
  assertFinite(value, name)
  if (value < 0) throw new RangeError(`${name} must not be negative (got ${value})`)
}

/** Formats a number for messages with a fixed number of decimals and comma thousands separators (en-GB); no formula. */
export function formatNumber(value: number, decimals: number): string {
  return new Intl.NumberFormat('en-GB', { minimumFractionDigits: decimals, maximumFractionDigits: decimals }).format(value)
}
