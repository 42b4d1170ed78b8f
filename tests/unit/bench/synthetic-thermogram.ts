// A synthetic isoperibol thermogram with Newtonian heat exchange, the model behind Regnault–Pfaundler (ISO 1928):
//   dT/dt = k·(T∞ − T) + P(t)/C, with P/C = (θ/τ)·e^(−s/τ) after ignition (s = t − t_ign), so that the heat input
// integrates to exactly θ. Closed form as in tests/unit/results/thermogram.test.ts; θ is the rise without heat exchange.

export interface SyntheticThermogram {
  /** The corrected temperature rise to build in, K. */
  thetaK: number
  /** Heat-input time constant, s. */
  tauS?: number
  /** Newton cooling constant, 1/s (3·10⁻⁵ s⁻¹ ≈ 0.002 min⁻¹, a plausible isoperibol jacket; from memory). */
  kPerS?: number
  convergenceC?: number
  startC?: number
  ignitionS?: number
  stepS?: number
  durationS?: number
}

export function synthesiseThermogram(s: SyntheticThermogram): { timeS: number, temperatureC: number }[] {
  const tau = s.tauS ?? 40
  const k = s.kPerS ?? 3e-5
  const tInf = s.convergenceC ?? 25.05
  const t0 = s.startC ?? 23.5
  const ign = s.ignitionS ?? 300
  const step = s.stepS ?? 5
  const duration = s.durationS ?? 1200
  const c = s.thetaK / tau
  const lambda = 1 / tau
  const tIgn = tInf + (t0 - tInf) * Math.exp(-k * ign)
  const p = c / (k - lambda)
  const points: { timeS: number, temperatureC: number }[] = []
  for (let i = 0; i * step <= duration + 1e-9; i++) {
    const t = i * step
    const temp = t <= ign
      ? tInf + (t0 - tInf) * Math.exp(-k * t)
      : tInf + (tIgn - tInf - p) * Math.exp(-k * (t - ign)) + p * Math.exp(-lambda * (t - ign))
    points.push({ timeS: t, temperatureC: temp })
  }
  return points
}

/** As the template (data/thermogram-template.csv): header time_s,temperature_c, one reading per line, 5 decimals. */
export function thermogramCsv(points: { timeS: number, temperatureC: number }[]): string {
  return ['time_s,temperature_c', ...points.map(p => `${p.timeS},${p.temperatureC.toFixed(5)}`)].join('\n') + '\n'
}
