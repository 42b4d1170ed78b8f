// Mineral-matter-free bases for the rank of coal: the mineral-matter formula ASTM D388 uses.
import { assertFinite } from './guards'

/** Mineral matter: MM = 1.08·A + 0.55·S (mass-%, same basis) — ASTM D388 (from memory). */
export function mineralMatterPct(ashPct: number, sulfurPct: number): number {
  assertFinite(ashPct, 'ashPct')
  assertFinite(sulfurPct, 'sulfurPct')
  if (ashPct < 0 || sulfurPct < 0) throw new RangeError('ash and sulfur must not be negative')
  return 1.08 * ashPct + 0.55 * sulfurPct
}

/** 50 Btu/lb per % S (the pyritic-sulfur term of the ASTM D388 mineral-matter-free calorific value) in J/g: 50 × 2.326 (NIST SP 811) = 116.3. */
export const MMF_SULFUR_J_PER_G_PER_PCT = 50 * 2.326

/**
 * Mineral-matter-free calorific value (ASTM D388): Q_mmf = (Q − 116.3·S)/(100 − (1.08·A + 0.55·S))·100 with Q, A, S on one basis
 * (dry for the dry mmf value; moist, i.e. with the inherent moisture, for the moist mmf value) — ASTM D388 (from memory).
 */
export function mineralMatterFreeValue(valueJPerG: number, ashPct: number, sulfurPct: number): number {
  assertFinite(valueJPerG, 'valueJPerG')
  const mm = mineralMatterPct(ashPct, sulfurPct)
  if (mm >= 100) throw new RangeError('the mineral matter must be below 100 %')
  return ((valueJPerG - MMF_SULFUR_J_PER_G_PER_PCT * sulfurPct) / (100 - mm)) * 100
}
