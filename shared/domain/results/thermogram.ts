// Thermogram of a firing: CSV parsing, fore/main/after periods, and the corrected temperature rise θ by
// Regnault–Pfaundler and by Dickinson extrapolation. Temperatures are kept in °C; a rise in °C equals a rise in K.
import { assertFinite } from './guards'
import { linearFit, mean } from './statistics'

export interface ThermogramPoint {
  timeS: number
  temperatureC: number
}

export interface ThermogramRowError {
  /** Line number in the file (the header is line 1); null for an error about the whole file. */
  row: number | null
  message: string
}

export interface ThermogramParseResult {
  ok: boolean
  /** Points from the valid rows, in file order, temperatures converted to °C. */
  points: ThermogramPoint[]
  errors: ThermogramRowError[]
  /** Unit named in the header; null when the header is not recognised. */
  sourceUnit: 'C' | 'K' | null
}

export interface ThermogramParseOptions {
  /** Fewest data rows accepted; default THERMOGRAM_MIN_POINTS. */
  minPoints?: number
}

/** Default fewest points: a fore-period, main period and after-period of at least 10 readings each. */
export const THERMOGRAM_MIN_POINTS = 30

/** Most readings accepted in one thermogram: over 27 h at one reading per second (common practice: a firing's record
 * lasts well under an hour). Larger files are refused before any analysis. */
export const THERMOGRAM_MAX_POINTS = 100_000

/** Fraction of the observed rise at which Dickinson extrapolates the drift lines — ASTM D5865 / ASTM D240 (60 %). */
export const DICKINSON_FRACTION = 0.6

const HEADERS = { 'time_s,temperature_c': 'C', 'time_s,temperature_k': 'K' } as const
const DECIMAL = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/
const ZERO_CELSIUS_K = 273.15

/** Parses `time_s,temperature_c` (or `time_s,temperature_k`) CSV with row-level errors: numbers, strictly increasing time, enough points; K converted by t/°C = T/K − 273.15 (ITS-90 / SI definition). */
export function parseThermogramCsv(text: string, options: ThermogramParseOptions = {}): ThermogramParseResult {
  const minPoints = options.minPoints ?? THERMOGRAM_MIN_POINTS
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/)
  const errors: ThermogramRowError[] = []
  const points: ThermogramPoint[] = []

  const headerIndex = lines.findIndex((l) => l.trim() !== '')
  const header = headerIndex < 0 ? '' : (lines[headerIndex] as string).replace(/\s+/g, '').toLowerCase()
  const sourceUnit = header in HEADERS ? HEADERS[header as keyof typeof HEADERS] : null
  if (sourceUnit === null) {
    errors.push({
      row: headerIndex < 0 ? null : headerIndex + 1,
      message: headerIndex < 0 ? 'The file is empty.' : 'The first line must be the header time_s,temperature_c (or time_s,temperature_k).',
    })
    return { ok: false, points, errors, sourceUnit }
  }

  let lastTime = -Infinity
  for (let i = headerIndex + 1; i < lines.length; i++) {
    const line = (lines[i] as string).trim()
    if (line === '') continue
    const row = i + 1
    if (points.length >= THERMOGRAM_MAX_POINTS) {
      errors.push({ row, message: `The thermogram has more than ${THERMOGRAM_MAX_POINTS.toLocaleString('en-GB')} readings, the most accepted; send a thinned record (for example one reading per second).` })
      break
    }
    const fields = line.split(',').map((f) => f.trim())
    if (fields.length !== 2) {
      errors.push({ row, message: `Expected 2 values (time, temperature), found ${fields.length}.` })
      continue
    }
    const [timeText, tempText] = fields as [string, string]
    if (!DECIMAL.test(timeText)) {
      errors.push({ row, message: `Time "${timeText}" is not a number.` })
      continue
    }
    if (!DECIMAL.test(tempText)) {
      errors.push({ row, message: `Temperature "${tempText}" is not a number.` })
      continue
    }
    const timeS = Number(timeText)
    const reading = Number(tempText)
    if (!Number.isFinite(timeS) || !Number.isFinite(reading)) {
      errors.push({ row, message: 'The value is out of range.' })
      continue
    }
    const temperatureC = sourceUnit === 'K' ? reading - ZERO_CELSIUS_K : reading
    if (temperatureC <= -ZERO_CELSIUS_K) {
      errors.push({ row, message: `Temperature ${tempText} is at or below absolute zero.` })
      continue
    }
    if (timeS <= lastTime) {
      errors.push({ row, message: `Time ${timeText} s does not increase (the previous reading is at ${lastTime} s).` })
      continue
    }
    lastTime = timeS
    points.push({ timeS, temperatureC })
  }
  if (points.length < minPoints) {
    errors.push({ row: null, message: `The thermogram has ${points.length} valid readings; at least ${minPoints} are needed.` })
  }
  return { ok: errors.length === 0, points, errors, sourceUnit }
}

export interface ThermogramPeriodOptions {
  /** Explicit ignition time, s (the nearest reading is used); detected when absent. */
  ignitionTimeS?: number
  /** Explicit end of the main period, s (the nearest reading is used); detected when absent. */
  mainPeriodEndTimeS?: number
  /** Fewest readings in the fore-period and in the after-period; default 5. */
  minPeriodPoints?: number
}

/** Least-squares drift line of a period: T = interceptC + slopeKPerS·t. */
export interface DriftFit {
  slopeKPerS: number
  interceptC: number
  /** Mean of the period's temperatures, the temperature its drift rate belongs to. */
  meanTemperatureC: number
  startIndex: number
  endIndex: number
}

export interface ThermogramPeriods {
  /** Last reading of the fore-period and first of the main period. */
  ignitionIndex: number
  /** Last reading of the main period and first of the after-period. */
  mainPeriodEndIndex: number
  ignitionTimeS: number
  mainPeriodEndTimeS: number
  /** True where the boundary was found automatically rather than given. */
  detected: { ignition: boolean; mainPeriodEnd: boolean }
  fore: DriftFit
  after: DriftFit
}

export type PeriodDetection = { ok: true; periods: ThermogramPeriods } | { ok: false; reason: string }

function fitPeriod(points: readonly ThermogramPoint[], start: number, end: number): DriftFit {
  const slice = points.slice(start, end + 1)
  const temps = slice.map((p) => p.temperatureC)
  const { slope, intercept } = linearFit(slice.map((p) => p.timeS), temps)
  return { slopeKPerS: slope, interceptC: intercept, meanTemperatureC: mean(temps), startIndex: start, endIndex: end }
}

function residual(fit: DriftFit, p: ThermogramPoint): number {
  return p.temperatureC - (fit.interceptC + fit.slopeKPerS * p.timeS)
}

function rms(points: readonly ThermogramPoint[], fit: DriftFit): number {
  let sum = 0
  for (let i = fit.startIndex; i <= fit.endIndex; i++) sum += residual(fit, points[i] as ThermogramPoint) ** 2
  return Math.sqrt(sum / (fit.endIndex - fit.startIndex + 1))
}

function nearestIndex(points: readonly ThermogramPoint[], timeS: number): number {
  let best = 0
  for (let i = 1; i < points.length; i++) {
    if (Math.abs((points[i] as ThermogramPoint).timeS - timeS) < Math.abs((points[best] as ThermogramPoint).timeS - timeS)) best = i
  }
  return best
}

/** Finds the fore-, main and after-periods: ignition = start of the sharp rise (first reading leaving the fore drift line), end of the main period = first reading from which the after drift is linear again — the period definitions of ISO 1928 and ASTM D5865. */
export function detectPeriods(points: readonly ThermogramPoint[], options: ThermogramPeriodOptions = {}): PeriodDetection {
  const minPts = options.minPeriodPoints ?? 5
  if (!Number.isInteger(minPts) || minPts < 3) throw new RangeError('minPeriodPoints must be an integer of at least 3')
  const n = points.length
  if (n < 2 * minPts + 1) return { ok: false, reason: `The thermogram has ${n} readings; at least ${2 * minPts + 1} are needed.` }
  for (let i = 0; i < n; i++) {
    const p = points[i] as ThermogramPoint
    assertFinite(p.timeS, `points[${i}].timeS`)
    assertFinite(p.temperatureC, `points[${i}].temperatureC`)
    if (i > 0 && p.timeS <= (points[i - 1] as ThermogramPoint).timeS) throw new RangeError(`points[${i}].timeS must be later than the reading before it`)
  }
  const at = (i: number) => points[i] as ThermogramPoint

  // Steepest step locates the main period; everything else is judged relative to it.
  let jMax = 0
  let sMax = -Infinity
  for (let j = 0; j < n - 1; j++) {
    const s = (at(j + 1).temperatureC - at(j).temperatureC) / (at(j + 1).timeS - at(j).timeS)
    if (s > sMax) { sMax = s; jMax = j }
  }
  // A loop, not Math.max(...array): spreading a long record overflows the call stack.
  let highest = -Infinity
  for (const p of points) if (p.temperatureC > highest) highest = p.temperatureC
  const rise = highest - at(0).temperatureC
  if (!(sMax > 0) || !(rise > 0)) return { ok: false, reason: 'No temperature rise was found in the thermogram.' }
  // Smallest deviation treated as leaving a drift line: 3·10⁻⁵ of the rise, or 4× the fit's scatter if noisier.
  const tolerance = (fit: DriftFit) => Math.max(4 * rms(points, fit), 3e-5 * rise)

  let ignition: number
  const givenIgnition = options.ignitionTimeS
  if (givenIgnition !== undefined) {
    assertFinite(givenIgnition, 'ignitionTimeS')
    ignition = nearestIndex(points, givenIgnition)
  } else {
    let guess = 0
    for (let j = 0; j <= jMax; j++) {
      const s = (at(j + 1).temperatureC - at(j).temperatureC) / (at(j + 1).timeS - at(j).timeS)
      if (s > 0.1 * sMax) { guess = j; break }
    }
    if (guess + 1 < minPts) return { ok: false, reason: `The fore-period has ${guess + 1} readings before the rise; at least ${minPts} are needed.` }
    // Fit on the earlier part of the fore-period so a slow start of the rise does not tilt the line.
    const fitEnd = Math.max(minPts - 1, Math.floor(0.8 * guess))
    const fore = fitPeriod(points, 0, fitEnd)
    const tol = tolerance(fore)
    ignition = guess
    for (let j = fitEnd + 1; j <= guess; j++) {
      if (residual(fore, at(j)) > tol) { ignition = j - 1; break }
    }
  }

  let mainEnd: number
  const givenEnd = options.mainPeriodEndTimeS
  if (givenEnd !== undefined) {
    assertFinite(givenEnd, 'mainPeriodEndTimeS')
    mainEnd = nearestIndex(points, givenEnd)
  } else {
    const afterPeak = n - 1 - Math.max(jMax, ignition)
    const tail = Math.max(minPts, Math.round(0.25 * afterPeak))
    if (tail > afterPeak) return { ok: false, reason: `The after-period is too short; at least ${minPts} readings are needed after the rise.` }
    mainEnd = n - tail
    // Fit on the later half of the linear stretch so the knee of the curve cannot tilt the line it is tested against;
    // walk back while readings stay on that line, and repeat until the stretch stops growing.
    for (let pass = 0; pass < 10; pass++) {
      const fit = fitPeriod(points, Math.min(n - minPts, Math.floor((mainEnd + n - 1) / 2)), n - 1)
      const tol = tolerance(fit)
      let e = n - 1
      while (e - 1 > Math.max(jMax, ignition) && Math.abs(residual(fit, at(e - 1))) <= tol) e--
      if (e >= mainEnd) break
      mainEnd = e
    }
  }

  if (ignition + 1 < minPts) return { ok: false, reason: `The fore-period has ${ignition + 1} readings; at least ${minPts} are needed.` }
  if (n - mainEnd < minPts) return { ok: false, reason: `The after-period has ${n - mainEnd} readings; at least ${minPts} are needed.` }
  if (mainEnd <= ignition + 1) return { ok: false, reason: 'The main period must contain at least one reading between ignition and its end.' }

  return {
    ok: true,
    periods: {
      ignitionIndex: ignition,
      mainPeriodEndIndex: mainEnd,
      ignitionTimeS: at(ignition).timeS,
      mainPeriodEndTimeS: at(mainEnd).timeS,
      detected: { ignition: givenIgnition === undefined, mainPeriodEnd: givenEnd === undefined },
      fore: fitPeriod(points, 0, ignition),
      after: fitPeriod(points, mainEnd, n - 1),
    },
  }
}

export interface RegnaultPfaundlerResult {
  /** Corrected temperature rise θ, K. */
  riseK: number
  /** Heat-exchange correction subtracted from the observed rise, K. */
  coolingCorrectionK: number
  initialTemperatureC: number
  finalTemperatureC: number
  foreDriftKPerS: number
  afterDriftKPerS: number
  /** Newton cooling constant k = (g_i − g_f)/(T̄_f − T̄_i), 1/s. */
  coolingConstantPerS: number
}

/** θ = T_f − T_i − ∫ [g_i + (g_f − g_i)(T − T̄_i)/(T̄_f − T̄_i)] dt over the main period, integral by trapezoids — Regnault–Pfaundler, ISO 1928 (isoperibol calorimeters; clause from memory); ASTM D5865. */
export function regnaultPfaundlerRise(points: readonly ThermogramPoint[], periods: ThermogramPeriods): RegnaultPfaundlerResult {
  const { fore, after, ignitionIndex: i0, mainPeriodEndIndex: i1 } = periods
  const gi = fore.slopeKPerS
  const gf = after.slopeKPerS
  const span = after.meanTemperatureC - fore.meanTemperatureC
  if (!(Math.abs(span) > 0)) throw new RangeError('the fore- and after-periods have the same mean temperature')
  const drift = (t: number) => gi + ((gf - gi) * (t - fore.meanTemperatureC)) / span
  let correction = 0
  for (let j = i0; j < i1; j++) {
    const a = points[j] as ThermogramPoint
    const b = points[j + 1] as ThermogramPoint
    correction += ((b.timeS - a.timeS) * (drift(a.temperatureC) + drift(b.temperatureC))) / 2
  }
  const initial = (points[i0] as ThermogramPoint).temperatureC
  const final = (points[i1] as ThermogramPoint).temperatureC
  return {
    riseK: final - initial - correction,
    coolingCorrectionK: correction,
    initialTemperatureC: initial,
    finalTemperatureC: final,
    foreDriftKPerS: gi,
    afterDriftKPerS: gf,
    coolingConstantPerS: (gi - gf) / span,
  }
}

/** A drift line T(t) = anchorTemperatureC + slopeKPerS·(t − anchorTimeS), with the segment to draw. */
export interface ExtrapolationLine {
  slopeKPerS: number
  anchorTimeS: number
  anchorTemperatureC: number
  from: ThermogramPoint
  to: ThermogramPoint
}

export interface DickinsonResult {
  riseK: number
  fraction: number
  /** Time at which the given fraction of the observed rise is reached, where both drift lines are read. */
  extrapolationTimeS: number
  /** Fore drift line through the ignition reading, drawn from the first reading to the extrapolation time. */
  foreLine: ExtrapolationLine
  /** After drift line through the end-of-main-period reading, drawn from the extrapolation time to the last reading. */
  afterLine: ExtrapolationLine
}

/** θ = T_c − T_a − g_i(t_x − t_a) − g_f(t_c − t_x), t_x where 60 % of the observed rise is reached (the gap between the extrapolated drift lines at t_x) — Dickinson extrapolation, ASTM D5865 / ASTM D240. */
export function dickinsonRise(points: readonly ThermogramPoint[], periods: ThermogramPeriods, fraction: number = DICKINSON_FRACTION): DickinsonResult {
  if (!(fraction > 0 && fraction < 1)) throw new RangeError('fraction must lie between 0 and 1')
  const { ignitionIndex: i0, mainPeriodEndIndex: i1 } = periods
  const a = points[i0] as ThermogramPoint
  const c = points[i1] as ThermogramPoint
  const target = a.temperatureC + fraction * (c.temperatureC - a.temperatureC)
  let tx = Number.NaN
  for (let j = i0 + 1; j <= i1; j++) {
    const q = points[j] as ThermogramPoint
    if (q.temperatureC >= target) {
      const p = points[j - 1] as ThermogramPoint
      // Linear interpolation between the two readings that bracket the target temperature.
      tx = p.timeS + ((target - p.temperatureC) * (q.timeS - p.timeS)) / (q.temperatureC - p.temperatureC)
      break
    }
  }
  if (Number.isNaN(tx)) throw new RangeError(`the temperature never reaches ${fraction * 100} % of the rise within the main period`)
  const gi = periods.fore.slopeKPerS
  const gf = periods.after.slopeKPerS
  const first = points[0] as ThermogramPoint
  const last = points[points.length - 1] as ThermogramPoint
  const foreAt = (t: number) => a.temperatureC + gi * (t - a.timeS)
  const afterAt = (t: number) => c.temperatureC + gf * (t - c.timeS)
  return {
    riseK: afterAt(tx) - foreAt(tx),
    fraction,
    extrapolationTimeS: tx,
    foreLine: {
      slopeKPerS: gi, anchorTimeS: a.timeS, anchorTemperatureC: a.temperatureC,
      from: { timeS: first.timeS, temperatureC: foreAt(first.timeS) }, to: { timeS: tx, temperatureC: foreAt(tx) },
    },
    afterLine: {
      slopeKPerS: gf, anchorTimeS: c.timeS, anchorTemperatureC: c.temperatureC,
      from: { timeS: tx, temperatureC: afterAt(tx) }, to: { timeS: last.timeS, temperatureC: afterAt(last.timeS) },
    },
  }
}

export interface ThermogramAnalysisOptions extends ThermogramPeriodOptions {
  /** Dickinson fraction; default 0.6. */
  dickinsonFraction?: number
}

export type ThermogramAnalysis =
  | { ok: true; periods: ThermogramPeriods; regnaultPfaundler: RegnaultPfaundlerResult; dickinson: DickinsonResult }
  | { ok: false; reason: string }

/** Periods plus θ by both methods — Regnault–Pfaundler (ISO 1928) and Dickinson (ASTM D5865 / D240). */
export function analyseThermogram(points: readonly ThermogramPoint[], options: ThermogramAnalysisOptions = {}): ThermogramAnalysis {
  const detection = detectPeriods(points, options)
  if (!detection.ok) return detection
  const { periods } = detection
  try {
    return {
      ok: true,
      periods,
      regnaultPfaundler: regnaultPfaundlerRise(points, periods),
      dickinson: dickinsonRise(points, periods, options.dickinsonFraction ?? DICKINSON_FRACTION),
    }
  } catch (error) {
    if (error instanceof RangeError) return { ok: false, reason: error.message }
    throw error
  }
}
