// Quantities as people type them ("950 mg", "3,05 MPa", "435 psig", "6318 cal/g"), parsed with mathjs into the
// number the API names (g, MPa gauge, J/g …). Loaded lazily by the quantity field so mathjs stays off page loads.
import type { MathJsInstance, Unit } from 'mathjs'
import { STANDARD_ATMOSPHERE_MPA } from './oxygen'
import { mathjs } from './units'

export type QuantityKind = 'mass' | 'pressure' | 'specificEnergy' | 'energy' | 'length' | 'volume'

interface KindInfo { unit: string, math: string, what: string, examples: string }
/** The unit the API stores for each kind, and what a person may type instead. */
export const QUANTITY_KINDS: Readonly<Record<QuantityKind, KindInfo>> = {
  mass: { unit: 'g', math: 'g', what: 'a mass', examples: '0.95 g, 950 mg' },
  pressure: { unit: 'MPa', math: 'MPa', what: 'a pressure', examples: '3 MPa, 30 bar, 435 psi' },
  specificEnergy: { unit: 'J/g', math: 'J/g', what: 'an energy per mass', examples: '26450 J/g, 26.45 MJ/kg, 6318 cal/g' },
  energy: { unit: 'J', math: 'J', what: 'an energy', examples: '33000 J, 33 kJ' },
  length: { unit: 'cm', math: 'cm', what: 'a length', examples: '10 cm, 100 mm' },
  volume: { unit: 'mL', math: 'mL', what: 'a volume', examples: '300 mL, 0.3 L' },
}

export type PressureBasis = 'gauge' | 'absolute'
export type ParsedQuantity =
  | { ok: true, value: number, unit: string, understood: string, basis?: PressureBasis }
  | { ok: false, error: string }

// Words people type for units, as mathjs names (mathjs names are alphanumeric). A bare "cal" is the
// international-table calorie, the one fuel and coal trade figures use (common practice); cal_th must be asked for.
const ALIASES: Readonly<Record<string, string>> = {
  'cal': 'calIT', 'cal_IT': 'calIT', 'calIT': 'calIT', 'cal_th': 'calth', 'calth': 'calth',
  'kcal': 'kcalIT', 'kcal_IT': 'kcalIT', 'kcal_th': 'kcalth',
  'Btu': 'BtuIT', 'BTU': 'BtuIT', 'btu': 'BtuIT', 'Btu_IT': 'BtuIT',
  'lbm': 'lb', 'ml': 'mL', 'l': 'L', 'µg': 'ug', 'μg': 'ug',
}
// Pressure units with a gauge or absolute mark: "barg", "bar(a)", "psia", "MPa g" …
const PRESSURE_MARK = /^(bar|psi|MPa|kPa|Pa|atm)\s*(?:\(?\s*([ga])\s*\)?|\s+(gauge|abs|absolute))$/i

/** "3,05" → "3.05": a single comma between digits is a decimal comma; thin and plain spaces between digit groups go. */
export function normaliseNumberText(text: string): string {
  let t = text.trim().replace(/(\d)[\s\u2009\u202F](?=\d{3}(\D|$))/g, '$1')
  if (/^[-+]?\d+,\d+/.test(t) && !/^[-+]?\d+,\d+\./.test(t)) t = t.replace(',', '.')
  return t
}

function mathUnit(math: MathJsInstance, value: number, expr: string): Unit | undefined {
  try { return math.unit(value, expr) }
  catch { return undefined }
}

/**
 * Reads "950 mg", "0.95 g", "30 bar", "435 psig", "3,05 MPa", "26.45 MJ/kg", "6318 cal/g" as the number in the
 * kind's API unit. A bare number is taken in that unit. Pressures are gauge unless marked absolute ("bara",
 * "psia", "MPa abs"): absolute = gauge + 1 standard atmosphere (0.101325 MPa, NIST SP 811). Empty text → null.
 */
export function parseQuantity(text: string, kind: QuantityKind): ParsedQuantity | null {
  const info = QUANTITY_KINDS[kind]
  const t = normaliseNumberText(text)
  if (!t) return null
  const m = /^([-+]?(?:\d+\.?\d*|\.\d+)(?:e[-+]?\d+)?)\s*(.*)$/i.exec(t)
  if (!m) return { ok: false, error: `"${text.trim()}" is not a number (try ${info.examples})` }
  const value = Number(m[1])
  let unitText = m[2]!.trim()
  let basis: PressureBasis | undefined
  if (kind === 'pressure') {
    const mark = PRESSURE_MARK.exec(unitText)
    if (mark) {
      unitText = mark[1]!
      const word = (mark[2] ?? mark[3])!.toLowerCase()
      basis = word.startsWith('a') ? 'absolute' : 'gauge'
    }
    else if (/^(bar|psi)[ga]$/i.test(unitText)) {
      basis = unitText.slice(-1).toLowerCase() === 'a' ? 'absolute' : 'gauge'
      unitText = unitText.slice(0, -1)
    }
  }
  if (!unitText) return done(value, basis ?? (kind === 'pressure' ? 'gauge' : undefined), kind)
  if (!/^[A-Za-zµμ_]+(?:\s*\/\s*[A-Za-z_]+)?$/.test(unitText)) return { ok: false, error: `"${unitText}" is not a unit Emberline knows (try ${info.examples})` }
  const expr = unitText.split('/').map(p => ALIASES[p.trim()] ?? p.trim()).join('/')
  const math = mathjs()
  const u = mathUnit(math, value, expr)
  if (!u) return { ok: false, error: `"${unitText}" is not a unit Emberline knows (try ${info.examples})` }
  if (!u.equalBase(math.unit(1, info.math))) return { ok: false, error: `${value} ${unitText} is not ${info.what}: this field wants ${info.what} (${info.examples})` }
  let inApiUnit = u.toNumber(info.math)
  if (kind === 'pressure' && basis === 'absolute') inApiUnit -= STANDARD_ATMOSPHERE_MPA
  return done(inApiUnit, basis ?? (kind === 'pressure' ? 'gauge' : undefined), kind)
}

function done(value: number, basis: PressureBasis | undefined, kind: QuantityKind): ParsedQuantity {
  if (!Number.isFinite(value)) return { ok: false, error: 'The number is too large' }
  const unit = QUANTITY_KINDS[kind].unit
  const shown = Number(value.toPrecision(6))
  return { ok: true, value, unit, basis, understood: `${shown} ${unit}${basis ? ' gauge' : ''}` }
}

/** A value in the kind's API unit expressed in another unit of the same kind (a field kept in kJ, mg, L …). */
export function inUnit(value: number, kind: QuantityKind, unit: string): number {
  return mathjs().unit(value, QUANTITY_KINDS[kind].math).toNumber(unit.split('/').map(p => ALIASES[p.trim()] ?? p.trim()).join('/'))
}

/** One CSV cell: undefined when empty, the number in the API unit, or an Error naming what is wrong. */
export function parseQuantityCell(raw: string | undefined, kind: QuantityKind): number | undefined | Error {
  const parsed = parseQuantity(raw ?? '', kind)
  if (!parsed) return undefined
  return parsed.ok ? parsed.value : new Error(parsed.error)
}

// Import columns carry their unit in the name (mass_g, fill_pressure_mpa …); a cell may still say "950 mg" or "30 bar".
const COLUMN_KINDS: readonly [RegExp, QuantityKind][] = [[/_j_per_g$/, 'specificEnergy'], [/_mpa$/, 'pressure'], [/_g$/, 'mass'], [/_cm$/, 'length'], [/_ml$/, 'volume']]

/** A cell of an import column: the number in the column's unit (a unit typed in the cell is converted), or an Error. */
export function parseColumnCell(raw: string, column: string): number | Error {
  const kind = COLUMN_KINDS.find(([re]) => re.test(column.toLowerCase()))?.[1]
  if (!kind) {
    const value = Number(normaliseNumberText(raw))
    return Number.isFinite(value) ? value : new Error(`"${raw.trim()}" is not a number`)
  }
  const parsed = parseQuantity(raw, kind)
  return !parsed ? new Error('is empty') : parsed.ok ? parsed.value : new Error(parsed.error)
}
