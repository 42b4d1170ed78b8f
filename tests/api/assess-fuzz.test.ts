import { describe, expect, it } from 'vitest'
import { as, baseURL } from '../support/api'

// Malformed bodies for POST /api/assess: whatever arrives, the answer is JSON and never a 5xx (bad input is
// 400/422). The generator is seeded, so a failure repeats exactly; the seed is printed with each failure.
// Prototype-pollution keys (__proto__, constructor) only come as raw text: the JSON reader refuses them with 400.

/** mulberry32: small, seedable pseudo-random numbers in [0, 1). */
function seeded(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6D2B79F5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

const SEED = 20260401
const COUNT = 3000
const CONCURRENCY = 8

const NASTY_STRINGS = [
  '', ' ', 'NaN', 'Infinity', '-Infinity', '1e999', '-0', '0x1F', '1,5', '3.0 MPa', 'null', 'undefined', 'true',
  '\'; DROP TABLE vessels; --', '1 OR 1=1', '" OR ""="', '<script>alert(1)</script>', '<img src=x onerror=alert(1)>',
  '${7*7}', '{{7*7}}', '../../etc/passwd', '%00', '\u0000', '\uFFFF', '𝔈𝔪𝔟𝔢𝔯', 'é'.repeat(300), 'A'.repeat(5000),
  '__proto__', 'constructor', 'prototype', 'toString',
]
const NASTY_NUMBERS = [0, -0, -1, 1e-300, 1e300, Number.MAX_VALUE, -Number.MAX_VALUE, Number.MAX_SAFE_INTEGER, 2 ** 53 + 1, 0.1 + 0.2, 50.0000001, 1000.5, 100000, 1e7]
const KEYS = ['vessel', 'vesselId', 'fillPressureMPa', 'temperatureC', 'waterMl', 'components', 'standardEnergyJ', 'runRole', 'role', 'massG', 'lengthCm', 'wire',
  'heatingValueJPerG', 'formula', 'smiles', 'composition', 'declaredHazard', 'decompositionEnergyJPerG', 'resolved', 'state', 'class', 'proofCharge', 'x']
const FORMULA_TOKENS = ['C', 'H', 'N', 'O', 'S', 'Cl', 'Xx', 'Zz', 'Na', '(', ')', '[', ']', '.', '2', '10', '999999999', '-', '+', '*', '·', ' ', 'c', 'h']
const SMILES_TOKENS = ['C', 'c', '1', '2', '(', ')', '=', '#', '[N+]', '[O-]', 'O', 'N', 'n', '%12', '%', 'Cl', 'Br', '[Xx]', '@', '/', '\\', '.', '[', ']', '[C@@H]', '*', ' ']

function valid() {
  return {
    vessel: { ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4.05, volumeMl: 300, class: 'standard' },
    fillPressureMPa: 3.0,
    components: [{ role: 'sample', massG: 1.0, heatingValueJPerG: 26454, smiles: 'OC(=O)c1ccccc1' }, { role: 'fuse', wire: 'nichrome', lengthCm: 10 }],
  }
}

type Json = null | boolean | number | string | Json[] | { [key: string]: Json }

function maker(rand: () => number) {
  const pick = <T>(list: readonly T[]): T => list[Math.floor(rand() * list.length)]!
  const tokens = (list: readonly string[], max: number) => Array.from({ length: 1 + Math.floor(rand() * max) }, () => pick(list)).join('')
  const nested = (depth: number): Json => (depth === 0 ? pick(NASTY_NUMBERS) : rand() < 0.5 ? [nested(depth - 1)] : { [pick(KEYS)]: nested(depth - 1) })

  function value(depth = 0): Json {
    const r = rand()
    if (r < 0.2) return pick(NASTY_NUMBERS)
    if (r < 0.4) return pick(NASTY_STRINGS)
    if (r < 0.45) return rand() < 0.5
    if (r < 0.5) return null
    if (r < 0.6) return tokens(FORMULA_TOKENS, 12)
    if (r < 0.7) return tokens(SMILES_TOKENS, 20)
    if (r < 0.8 && depth < 3) return Array.from({ length: Math.floor(rand() * 4) }, () => value(depth + 1))
    if (r < 0.9 && depth < 3) return Object.fromEntries(Array.from({ length: Math.floor(rand() * 4) }, () => [pick(KEYS), value(depth + 1)]))
    if (r < 0.95) return nested(20 + Math.floor(rand() * 200))
    return (rand() - 0.5) * 10 ** Math.floor(rand() * 12)
  }

  /** A valid body with one to four parts broken: a field replaced, removed, or a random key added, at any depth. */
  function mutated(): Json {
    const body = valid() as unknown as { [key: string]: Json }
    const n = 1 + Math.floor(rand() * 4)
    for (let i = 0; i < n; i++) {
      const spot = rand()
      const components = body.components as Json[]
      const target: { [key: string]: Json } = spot < 0.3 ? body : spot < 0.5 && body.vessel && typeof body.vessel === 'object' && !Array.isArray(body.vessel) ? body.vessel : Array.isArray(components) && components.length && typeof components[0] === 'object' && components[0] !== null && !Array.isArray(components[0]) ? components[0] as { [key: string]: Json } : body
      const how = rand()
      if (how < 0.6) target[pick(KEYS)] = value()
      else if (how < 0.8) Reflect.deleteProperty(target, pick(Object.keys(target)))
      else if (how < 0.9) target.formula = tokens(FORMULA_TOKENS, 12)
      else target.smiles = tokens(SMILES_TOKENS, 24)
    }
    if (rand() < 0.1) (body.components as Json[]) = Array.from({ length: Math.floor(rand() * 30) }, () => value())
    return body
  }

  /** Raw text that is not JSON, or JSON of an odd shape, or numbers JSON cannot hold exactly. */
  function raw(): string {
    const r = rand()
    const text = JSON.stringify(valid())
    if (r < 0.2) return text.slice(0, Math.floor(rand() * text.length))
    if (r < 0.3) return text.replace('3', pick(['1e999', '-1e999', 'NaN', 'Infinity', '3,0', '03', '.3', '3.']))
    if (r < 0.4) return '['.repeat(1 + Math.floor(rand() * 20000))
    if (r < 0.5) return `${'['.repeat(3000)}${']'.repeat(3000)}`
    if (r < 0.6) return pick(['', 'null', 'true', '0', '"text"', '[]', '{}', '{"components":null}', '\u0000', '\uFEFF{}'])
    if (r < 0.7) return text.replace(/"/g, '\'')
    if (r < 0.8) return `${text}${pick(['}', ',', ']', ' garbage', '\n{}'])}`
    if (r < 0.9) return `{"__proto__":{"isAdmin":true},"constructor":{"prototype":{"x":1}},${text.slice(1)}`
    return Array.from({ length: 1 + Math.floor(rand() * 200) }, () => String.fromCharCode(Math.floor(rand() * 0x7F))).join('')
  }

  return { value, mutated, raw, rand }
}

interface Case { index: number, text: string, contentType: string }

function cases(): Case[] {
  const m = maker(seeded(SEED))
  const out: Case[] = []
  for (let index = 0; index < COUNT; index++) {
    const r = m.rand()
    const text = r < 0.55 ? JSON.stringify(m.mutated()) : r < 0.8 ? JSON.stringify(m.value()) : m.raw()
    const contentType = m.rand() < 0.97 ? 'application/json' : m.rand() < 0.5 ? 'text/plain' : 'application/json; charset=utf-8'
    out.push({ index, text, contentType })
  }
  return out
}

async function pool<T, R>(items: T[], limit: number, work: (item: T) => Promise<R>): Promise<R[]> {
  const results: R[] = []
  let next = 0
  await Promise.all(Array.from({ length: limit }, async () => {
    while (next < items.length) {
      const i = next++
      results[i] = await work(items[i]!)
    }
  }))
  return results
}

describe('POST /api/assess under malformed input', () => {
  it(`answers ${COUNT} seeded malformed bodies with JSON and never a 5xx`, async () => {
    const cookie = await as('analyst')
    const failures: string[] = []
    const statuses = new Map<number, number>()
    await pool(cases(), CONCURRENCY, async (c) => {
      const res = await fetch(`${baseURL()}/api/assess`, { method: 'POST', headers: { 'content-type': c.contentType, cookie }, body: c.text })
      const text = await res.text()
      statuses.set(res.status, (statuses.get(res.status) ?? 0) + 1)
      let body: { statusCode?: number, verdict?: string } | undefined
      try { body = JSON.parse(text) }
      catch { /* judged below */ }
      const ok = res.status === 200
        ? typeof body?.verdict === 'string'
        : res.status >= 400 && res.status < 500 && body?.statusCode === res.status
      if (!ok || !(res.headers.get('content-type') ?? '').includes('application/json')) {
        failures.push(`seed ${SEED} case ${c.index}: ${res.status} ${text.slice(0, 200)} ← ${c.text.slice(0, 300)}`)
      }
    })
    if (failures.length) console.error(failures.slice(0, 10).join('\n'))
    expect(failures).toEqual([])
    // The mix reaches every kind of refusal, and some random bodies are valid.
    expect([...statuses.keys()].sort()).toEqual(expect.arrayContaining([200, 400, 415, 422]))
  }, 120_000)
})
