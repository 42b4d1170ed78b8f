// Password throttling for sign-in and e-signatures. Every password check goes through `checkPasswordThrottled`:
// under a PostgreSQL advisory lock on the account it counts the recent failures and, when the attempt may go on,
// records it (success still unknown) before the lock is released — so concurrent attempts see each other and the
// expensive scrypt hash is never computed for a refused one. The rules (docs/security.md explains them):
// - one account from one address: after 3 failures each further try waits 2 s, then 4 s; after 5 failures that
//   address is refused for this account for 15 minutes. A correct password from that address starts the count anew.
// - one account from everywhere: 20 failures within 5 minutes from at least 3 addresses refuse new addresses for
//   the rest of those 5 minutes; addresses the account signed in from in the last 30 days are never refused by
//   this rule, so a stranger cannot keep the owner out.
// - one address, any accounts: 50 failures within 15 minutes refuse that address.
import type { H3Event } from 'h3'
import { eq, sql } from 'drizzle-orm'
import type { PasswordCheckPurpose } from '#shared/states'

export const THROTTLE = {
  windowMs: 15 * 60_000,
  backoffAfter: 3,
  pairLimit: 5,
  accountWindowMs: 5 * 60_000,
  accountLimit: 20,
  accountMinAddresses: 3,
  knownAddressDays: 30,
  addressLimit: 50,
} as const

export type PasswordPurpose = PasswordCheckPurpose

export class ThrottledError extends Error {
  constructor(public retryAfterS: number, public rule: 'back-off' | 'account-and-address' | 'account' | 'address') {
    super('throttled')
  }
}

// At most two scrypt hashes (128 MiB each) run at once in this process; the rest wait their turn.
const HASH_SLOTS = 2
let running = 0
const waiting: (() => void)[] = []

/** Runs an expensive hash in one of the process's few slots, so a burst cannot exhaust memory or the thread pool. */
export async function inHashSlot<T>(fn: () => Promise<T>): Promise<T> {
  if (running >= HASH_SLOTS) await new Promise<void>(resolve => waiting.push(resolve))
  else running++
  try {
    return await fn()
  }
  finally {
    const next = waiting.shift()
    if (next) next()
    else running--
  }
}

interface Counts { pair: number, pairOldest: Date | null, pairLast: Date | null, account: number, accountAddresses: number, accountOldest: Date | null, known: boolean, address: number, addressOldest: Date | null }

/** Decides on an attempt from the counts: null to go on, or the refusal. Pure, so that unit tests can walk the rules. */
export function throttleDecision(c: Counts, now: number): ThrottledError | null {
  const until = (d: Date | null, ms: number) => Math.max(1, Math.ceil(((d?.getTime() ?? now) + ms - now) / 1000))
  if (c.pair >= THROTTLE.pairLimit) return new ThrottledError(until(c.pairOldest, THROTTLE.windowMs), 'account-and-address')
  if (c.address >= THROTTLE.addressLimit) return new ThrottledError(until(c.addressOldest, THROTTLE.windowMs), 'address')
  if (!c.known && c.account >= THROTTLE.accountLimit && c.accountAddresses >= THROTTLE.accountMinAddresses) {
    return new ThrottledError(until(c.accountOldest, THROTTLE.accountWindowMs), 'account')
  }
  if (c.pair >= THROTTLE.backoffAfter) {
    const waitMs = 1000 * 2 ** (c.pair - THROTTLE.backoffAfter + 1)
    if (now < (c.pairLast?.getTime() ?? 0) + waitMs) return new ThrottledError(until(c.pairLast, waitMs), 'back-off')
  }
  return null
}

const asDate = (v: unknown) => (v ? new Date(v as string) : null)

/** Counts under the account's advisory lock and, when allowed, records the attempt as running. Returns its id. */
async function reserve(email: string, ip: string, purpose: PasswordPurpose): Promise<string> {
  return useDb().transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(hashtextextended(${`emberline:password:${email}`}, 0))`)
    const since = new Date(Date.now() - THROTTLE.windowMs)
    const accountSince = new Date(Date.now() - THROTTLE.accountWindowMs)
    const knownSince = new Date(Date.now() - THROTTLE.knownAddressDays * 86_400_000)
    const { rows } = await tx.execute(sql`
      with pair_reset as (
        select coalesce(max(at), ${since}) as at from login_attempts where email = ${email} and ip = ${ip} and success and at > ${since}
      )
      select
        (select count(*) from login_attempts a, pair_reset r where a.email = ${email} and a.ip = ${ip} and a.success is not true and a.at > r.at)::int as pair,
        (select min(a.at) from login_attempts a, pair_reset r where a.email = ${email} and a.ip = ${ip} and a.success is not true and a.at > r.at) as pair_oldest,
        (select max(a.at) from login_attempts a, pair_reset r where a.email = ${email} and a.ip = ${ip} and a.success is not true and a.at > r.at) as pair_last,
        (select count(*) from login_attempts where email = ${email} and success is not true and at > ${accountSince})::int as account,
        (select count(distinct ip) from login_attempts where email = ${email} and success is not true and at > ${accountSince})::int as account_addresses,
        (select min(at) from login_attempts where email = ${email} and success is not true and at > ${accountSince}) as account_oldest,
        exists (select 1 from login_attempts where email = ${email} and ip = ${ip} and success and purpose = 'sign-in' and at > ${knownSince}) as known,
        (select count(*) from login_attempts where ip = ${ip} and success is not true and at > ${since})::int as address,
        (select min(at) from login_attempts where ip = ${ip} and success is not true and at > ${since}) as address_oldest`)
    const r = rows[0] as Record<string, unknown>
    const refusal = throttleDecision({
      pair: Number(r.pair), pairOldest: asDate(r.pair_oldest), pairLast: asDate(r.pair_last),
      account: Number(r.account), accountAddresses: Number(r.account_addresses), accountOldest: asDate(r.account_oldest),
      known: r.known === true, address: Number(r.address), addressOldest: asDate(r.address_oldest),
    }, Date.now())
    if (refusal) throw refusal
    const [row] = await tx.insert(schema.loginAttempts).values({ email, ip, success: null, purpose }).returning({ id: schema.loginAttempts.id })
    return row!.id
  })
}

/**
 * Checks a password against a stored hash under the throttle: throws ThrottledError (no hash computed) when the
 * account, the pair or the address is throttled; otherwise verifies in a hash slot and records the outcome.
 */
export async function checkPasswordThrottled(event: H3Event, email: string, purpose: PasswordPurpose, passwordHash: string, password: string): Promise<boolean> {
  const attemptId = await reserve(email, clientAddress(event), purpose)
  let ok = false
  try {
    ok = await inHashSlot(() => verifyPassword(passwordHash, password))
  }
  finally {
    // Stamped when the answer is known, so that the back-off counts from the failure the client saw.
    await useDb().update(schema.loginAttempts).set({ success: ok, at: new Date() }).where(eq(schema.loginAttempts.id, attemptId))
  }
  return ok
}

/** The 429 answer of a throttled attempt, with Retry-After. */
export function throttledAnswer(event: H3Event, err: ThrottledError, what: string) {
  setResponseHeader(event, 'Retry-After', err.retryAfterS)
  const wait = err.retryAfterS >= 90 ? `${Math.ceil(err.retryAfterS / 60)} minutes` : `${err.retryAfterS} s`
  return createError({
    statusCode: 429,
    message: `Too many wrong passwords: ${what} is paused. Try again in ${wait}, or ask an admin to reset the password.`,
    data: { retryAfterS: err.retryAfterS, rule: err.rule },
  })
}
