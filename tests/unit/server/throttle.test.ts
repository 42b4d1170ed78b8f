import { describe, expect, it } from 'vitest'
import { THROTTLE, throttleDecision } from '../../../server/utils/throttle'

// The password throttle's rules, walked without a database (the API tests check them against PostgreSQL).
// Limits follow OWASP ASVS 4.0.3 V2.2.1 (anti-automation: throttling that does not let an attacker lock the owner out).
const now = Date.parse('2026-12-02T10:00:00Z')
const ago = (s: number) => new Date(now - s * 1000)
const base = { pair: 0, pairOldest: null, pairLast: null, account: 0, accountAddresses: 0, accountOldest: null, known: false, address: 0, addressOldest: null }

describe('password throttle rules', () => {
  it('lets the first three wrong passwords from one address through at once', () => {
    for (let pair = 0; pair < THROTTLE.backoffAfter; pair++) expect(throttleDecision({ ...base, pair, pairLast: ago(0) }, now)).toBeNull()
  })

  it('backs off 2 s after the third failure and 4 s after the fourth, then refuses the pair for the window', () => {
    expect(throttleDecision({ ...base, pair: 3, pairLast: ago(1) }, now)).toMatchObject({ rule: 'back-off', retryAfterS: 1 })
    expect(throttleDecision({ ...base, pair: 3, pairLast: ago(2.5) }, now)).toBeNull()
    expect(throttleDecision({ ...base, pair: 4, pairLast: ago(1) }, now)).toMatchObject({ rule: 'back-off', retryAfterS: 3 })
    expect(throttleDecision({ ...base, pair: 4, pairLast: ago(4.5) }, now)).toBeNull()
    const locked = throttleDecision({ ...base, pair: 5, pairOldest: ago(60), pairLast: ago(600) }, now)
    expect(locked).toMatchObject({ rule: 'account-and-address' })
    expect(locked!.retryAfterS).toBe(15 * 60 - 60)
  })

  it('locks an account from new addresses only after failures from several addresses, and never from one it signed in from', () => {
    const flood = { ...base, account: 20, accountOldest: ago(30) }
    expect(throttleDecision({ ...flood, accountAddresses: 2 }, now)).toBeNull()
    expect(throttleDecision({ ...flood, accountAddresses: 3 }, now)).toMatchObject({ rule: 'account', retryAfterS: 5 * 60 - 30 })
    expect(throttleDecision({ ...flood, accountAddresses: 3, known: true }, now)).toBeNull()
  })

  it('refuses an address that failed on many accounts', () => {
    expect(throttleDecision({ ...base, address: THROTTLE.addressLimit, addressOldest: ago(100) }, now)).toMatchObject({ rule: 'address', retryAfterS: 800 })
  })
})
