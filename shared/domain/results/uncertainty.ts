// GUM first-order uncertainty budget of the gross calorific value q = (ε·θ − Σe)/m.
import { assertFinite, assertNonNegative, assertPositive } from './guards'

/** A best estimate with its standard uncertainty, in the same unit. */
export interface Estimate {
  value: number
  standardUncertainty: number
}

/** One thermochemical correction (fuse, acid, sulfur, aid) in joules. */
export interface CorrectionEstimate extends Estimate {
  name: string
}

export interface CalorificValueUncertaintyInput {
  energyEquivalentJPerK: Estimate
  temperatureRiseK: Estimate
  sampleMassG: Estimate
  corrections?: readonly CorrectionEstimate[]
  /** Further inputs entering q directly: their sensitivity coefficients are given (e.g. repeatability, c = 1). */
  extraTerms?: readonly ExtraTerm[]
  /** Coverage factor k; default 2 (about 95 % for a normal distribution). */
  coverageFactor?: number
}

/** An input of the model y = q + Σ c_i·δ_i whose value is 0 (a correction of unknown sign) and whose c is known. */
export interface ExtraTerm {
  quantity: string
  sensitivity: number
  standardUncertainty: number
  unit: string
}

export interface UncertaintyContribution {
  quantity: string
  /** Unit of the standard uncertainty of the quantity. */
  unit: string
  /** Sensitivity coefficient c = ∂q/∂x, in (J/g) per unit of the quantity. */
  sensitivity: number
  standardUncertainty: number
  /** |c·u(x)|, J/g. */
  contributionJPerG: number
  /** Share of the combined variance, (c·u)²/u_c², 0–1. */
  varianceShare: number
}

export interface UncertaintyBudget {
  valueJPerG: number
  combinedStandardUncertaintyJPerG: number
  coverageFactor: number
  expandedUncertaintyJPerG: number
  relativeExpandedUncertaintyPct: number
  contributions: UncertaintyContribution[]
}

/** u(x̄) = s/√n, standard uncertainty of a mean of n observations — JCGM 100:2008 §4.2.3, eq. (5). */
export function standardUncertaintyOfMean(standardDeviation: number, n: number): number {
  assertNonNegative(standardDeviation, 'standardDeviation')
  if (!Number.isInteger(n) || n < 1) throw new RangeError('n must be a positive integer')
  return standardDeviation / Math.sqrt(n)
}

/** u = a/√3 for a rectangular distribution of half-width a — JCGM 100:2008 §4.3.7, eq. (7). */
export function rectangularStandardUncertainty(halfWidth: number): number {
  assertNonNegative(halfWidth, 'halfWidth')
  return halfWidth / Math.sqrt(3)
}

/** u = U/k from a certificate's expanded uncertainty — JCGM 100:2008 §4.3.3. */
export function standardUncertaintyFromExpanded(expanded: number, coverageFactor: number): number {
  assertNonNegative(expanded, 'expanded')
  assertPositive(coverageFactor, 'coverageFactor')
  return expanded / coverageFactor
}

/** u_c² = Σ(∂q/∂x_i · u(x_i))² (extra terms with their own c) with ∂q/∂ε = θ/m, ∂q/∂θ = ε/m, ∂q/∂m = −q/m, ∂q/∂e = −1/m (uncorrelated inputs); U = k·u_c — JCGM 100:2008 §5.1.2 eq. (10), §6.2. */
export function calorificValueUncertainty(input: CalorificValueUncertaintyInput): UncertaintyBudget {
  const { energyEquivalentJPerK: eps, temperatureRiseK: theta, sampleMassG: mass } = input
  const corrections = input.corrections ?? []
  const k = input.coverageFactor ?? 2
  assertPositive(eps.value, 'energyEquivalentJPerK.value')
  assertPositive(theta.value, 'temperatureRiseK.value')
  assertPositive(mass.value, 'sampleMassG.value')
  assertPositive(k, 'coverageFactor')
  for (const e of [eps, theta, mass, ...corrections]) assertNonNegative(e.standardUncertainty, 'standardUncertainty')
  corrections.forEach((e) => assertFinite(e.value, `correction ${e.name}`))

  const sumE = corrections.reduce((acc, e) => acc + e.value, 0)
  const q = (eps.value * theta.value - sumE) / mass.value
  if (!(q > 0)) throw new RangeError('the corrections are not smaller than ε·θ, so there is no calorific value to qualify')
  const inputs = [
    { quantity: 'energy equivalent', unit: 'J/K', sensitivity: theta.value / mass.value, standardUncertainty: eps.standardUncertainty },
    { quantity: 'temperature rise', unit: 'K', sensitivity: eps.value / mass.value, standardUncertainty: theta.standardUncertainty },
    { quantity: 'sample mass', unit: 'g', sensitivity: -q / mass.value, standardUncertainty: mass.standardUncertainty },
    ...corrections.map((e) => ({ quantity: e.name, unit: 'J', sensitivity: -1 / mass.value, standardUncertainty: e.standardUncertainty })),
    ...(input.extraTerms ?? []).map(t => ({ quantity: t.quantity, unit: t.unit, sensitivity: t.sensitivity, standardUncertainty: t.standardUncertainty })),
  ]
  for (const t of input.extraTerms ?? []) { assertFinite(t.sensitivity, `sensitivity of ${t.quantity}`); assertNonNegative(t.standardUncertainty, `u(${t.quantity})`) }
  const terms = inputs.map((t) => ({ ...t, contributionJPerG: Math.abs(t.sensitivity * t.standardUncertainty) }))

  const variance = terms.reduce((acc, t) => acc + t.contributionJPerG ** 2, 0)
  const uc = Math.sqrt(variance)
  return {
    valueJPerG: q,
    combinedStandardUncertaintyJPerG: uc,
    coverageFactor: k,
    expandedUncertaintyJPerG: k * uc,
    relativeExpandedUncertaintyPct: (100 * k * uc) / q,
    contributions: terms.map((t) => ({ ...t, varianceShare: variance > 0 ? t.contributionJPerG ** 2 / variance : 0 })),
  }
}

/**
 * u_c and U of y = f(x) for uncorrelated inputs, with c_i = ∂f/∂x_i found by central differences — JCGM 100:2008 §5.1.3
 * (Note 2: sensitivity coefficients may be obtained numerically). Steps of 1e-6 of the value (or of 1) keep f smooth.
 */
export function propagate(f: (x: readonly number[]) => number, x: readonly number[], u: readonly number[], coverageFactor = 2): { value: number, combinedStandardUncertainty: number, expandedUncertainty: number, sensitivities: number[] } {
  if (x.length !== u.length) throw new RangeError('each input needs its standard uncertainty')
  const value = f(x)
  const sensitivities = x.map((xi, i) => {
    const h = Math.max(Math.abs(xi), Math.abs(u[i] as number), 1) * 1e-6
    const up = [...x]; up[i] = xi + h
    // A non-negative input (a mass fraction, a moisture of 0 %) is never stepped below zero: forward difference there.
    if (xi >= 0 && xi - h < 0) return (f(up) - value) / h
    const dn = [...x]; dn[i] = xi - h
    return (f(up) - f(dn)) / (2 * h)
  })
  const uc = Math.sqrt(sensitivities.reduce((a, c, i) => a + (c * (u[i] as number)) ** 2, 0))
  return { value, combinedStandardUncertainty: uc, expandedUncertainty: coverageFactor * uc, sensitivities }
}
