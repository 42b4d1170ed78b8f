// Reporting bases of a fuel analysis: as-received, air-dried (as-determined), dry, dry ash-free.
// Valid for quantities that exclude the moisture (ash, volatile matter, sulfur, gross calorific value, hydrogen and
// oxygen reported without those of the moisture); moisture itself and the net calorific value do not convert this way.
import { assertFinite } from './guards'

export type Basis = 'as-received' | 'air-dried' | 'dry' | 'dry-ash-free'

export const BASES: readonly Basis[] = ['as-received', 'air-dried', 'dry', 'dry-ash-free']

/** The analysis figures a conversion may need, mass-%; only those the two bases involve are required. */
export interface BasisConditions {
  /** Moisture of the air-dried (analysis) sample, M_ad. */
  moistureAd?: number
  /** Total moisture as received, M_ar. */
  moistureAr?: number
  /** Ash on the dry basis, A_d. */
  ashDry?: number
}

function percentBelow100(value: number | undefined, name: string, needFor: string): number {
  if (value === undefined) throw new RangeError(`${name} is needed to convert ${needFor}`)
  assertFinite(value, name)
  if (value < 0 || value >= 100) throw new RangeError(`${name} must be at least 0 and below 100 % (got ${value})`)
  return value
}

/** dry = ad·100/(100 − M_ad) — ASTM D3180; ISO 1170. */
export function dryFromAirDried(value: number, moistureAdPct: number): number {
  const m = percentBelow100(moistureAdPct, 'moistureAd', 'from air-dried')
  return (value * 100) / (100 - m)
}

/** ad = dry·(100 − M_ad)/100 — ASTM D3180; ISO 1170. */
export function airDriedFromDry(value: number, moistureAdPct: number): number {
  const m = percentBelow100(moistureAdPct, 'moistureAd', 'to air-dried')
  return (value * (100 - m)) / 100
}

/** ar = dry·(100 − M_ar)/100 — ASTM D3180; ISO 1170. */
export function asReceivedFromDry(value: number, moistureArPct: number): number {
  const m = percentBelow100(moistureArPct, 'moistureAr', 'to as-received')
  return (value * (100 - m)) / 100
}

/** dry = ar·100/(100 − M_ar) — ASTM D3180; ISO 1170. */
export function dryFromAsReceived(value: number, moistureArPct: number): number {
  const m = percentBelow100(moistureArPct, 'moistureAr', 'from as-received')
  return (value * 100) / (100 - m)
}

/** daf = dry·100/(100 − A_d) — ASTM D3180; ISO 1170. */
export function dryAshFreeFromDry(value: number, ashDryPct: number): number {
  const a = percentBelow100(ashDryPct, 'ashDry', 'to dry ash-free')
  return (value * 100) / (100 - a)
}

/** dry = daf·(100 − A_d)/100 — ASTM D3180; ISO 1170. */
export function dryFromDryAshFree(value: number, ashDryPct: number): number {
  const a = percentBelow100(ashDryPct, 'ashDry', 'from dry ash-free')
  return (value * (100 - a)) / 100
}

/** Converts a value between any two bases through the dry basis — ASTM D3180; ISO 1170 (formulas above). */
export function convertBasis(value: number, from: Basis, to: Basis, conditions: BasisConditions): number {
  assertFinite(value, 'value')
  if (from === to) return value
  return fromDry(toDry(value, from, conditions), to, conditions)
}

function toDry(value: number, from: Basis, c: BasisConditions): number {
  switch (from) {
    case 'dry': return value
    case 'air-dried': return dryFromAirDried(value, percentBelow100(c.moistureAd, 'moistureAd', 'from air-dried'))
    case 'as-received': return dryFromAsReceived(value, percentBelow100(c.moistureAr, 'moistureAr', 'from as-received'))
    case 'dry-ash-free': return dryFromDryAshFree(value, percentBelow100(c.ashDry, 'ashDry', 'from dry ash-free'))
  }
}

function fromDry(dry: number, to: Basis, c: BasisConditions): number {
  switch (to) {
    case 'dry': return dry
    case 'air-dried': return airDriedFromDry(dry, percentBelow100(c.moistureAd, 'moistureAd', 'to air-dried'))
    case 'as-received': return asReceivedFromDry(dry, percentBelow100(c.moistureAr, 'moistureAr', 'to as-received'))
    case 'dry-ash-free': return dryAshFreeFromDry(dry, percentBelow100(c.ashDry, 'ashDry', 'to dry ash-free'))
  }
}
