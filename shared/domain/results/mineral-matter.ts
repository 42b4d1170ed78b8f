// Mineral-matter-free bases for the rank of coal: Parr's mineral-matter formula as ASTM D388 uses it.
import { assertFinite } from './guards'

/** Parr: MM = 1.08·A + 0.55·S (mass-%, same basis) — ASTM D388 (from memory). */
export function parrMineralMatterPct(ashPct: number, sulfurPct: number): number {
  assertFinite(ashPct, 'ashPct')
  assertFinite(sulfurPct, 'sulfurPct')
  if (ashPct < 0 || sulfurPct < 0) throw new RangeError('ash and sulfur must not be negative')
  return 1.08 * ashPct + 0.55 * sulfurPct
}

/** 50 Btu/lb per % S (the pyritic-sulfur term of Parr's calorific value formula) in J/g: 50 × 2.326 (NIST SP 811) = 116.3. */
export const PARR_SULFUR_J_PER_G_PER_PCT = 50 * 2.326

/**
 * Parr's mineral-matter-free calorific value: Q_mmf = (Q − 116.3·S)/(100 − (1.08·A + 0.55·S))·100 with Q, A, S on one basis
 * (dry for the dry mmf value; moist, i.e. with the inherent moisture, for the moist mmf value) — ASTM D388 (from memory).
 */
export function parrMineralMatterFreeValue(valueJPerG: number, ashPct: number, sulfurPct: number): number {
  assertFinite(valueJPerG, 'valueJPerG')
  const mm = parrMineralMatterPct(ashPct, sulfurPct)
  if (mm >= 100) throw new RangeError('the mineral matter must be below 100 %')
  return ((valueJPerG - PARR_SULFUR_J_PER_G_PER_PCT * sulfurPct) / (100 - mm)) * 100
}
