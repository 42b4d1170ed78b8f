// Which errors mean "the database is not reachable" (answered 503) and which are bugs or bad data (not 503).
// Codes: PostgreSQL manual, Appendix A "PostgreSQL Error Codes" (class 08, 57P01–57P03, 53300); Node.js errno names.
import { describe, expect, it } from 'vitest'
import { isDatabaseUnavailable } from '~~/server/utils/db-outage'

const withCode = (code: string, message = 'x') => Object.assign(new Error(message), { code })
// Drizzle wraps the driver's error ("Failed query: …") and h3 wraps that again, each keeping it as `cause`.
const wrapped = (inner: unknown) => Object.assign(new Error('[h3] request failed'), { cause: Object.assign(new Error('Failed query: select 1'), { cause: inner }) })

describe('isDatabaseUnavailable', () => {
  it('recognises a refused, reset or unreachable connection, however deeply wrapped', () => {
    for (const code of ['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EHOSTUNREACH', 'ENOTFOUND']) expect(isDatabaseUnavailable(wrapped(withCode(code))), code).toBe(true)
    // Node reports a refused connection to a name with several addresses as an AggregateError.
    expect(isDatabaseUnavailable(new AggregateError([withCode('ECONNREFUSED')], 'connect failed'))).toBe(true)
  })

  it('recognises the server shutting down, starting up, out of connections, and connection exceptions', () => {
    for (const code of ['57P01', '57P02', '57P03', '53300', '08006', '08001', '08003']) expect(isDatabaseUnavailable(wrapped(withCode(code))), code).toBe(true)
  })

  it('recognises node-postgres and pg-pool messages that carry no code', () => {
    for (const message of ['Connection terminated unexpectedly', 'Connection terminated due to connection timeout', 'timeout exceeded when trying to connect']) {
      expect(isDatabaseUnavailable(wrapped(new Error(message))), message).toBe(true)
    }
  })

  it('leaves every other error alone: those are answered as what they are', () => {
    // 23505 unique_violation, 42601 syntax_error, 22P02 invalid_text_representation, 40001 serialization_failure.
    for (const code of ['23505', '42601', '22P02', '40001']) expect(isDatabaseUnavailable(wrapped(withCode(code))), code).toBe(false)
    expect(isDatabaseUnavailable(new TypeError('Cannot read properties of undefined'))).toBe(false)
    expect(isDatabaseUnavailable(null)).toBe(false)
    expect(isDatabaseUnavailable('ECONNREFUSED')).toBe(false)
    // A cycle of causes ends the walk.
    const a: { cause?: unknown } = {}
    a.cause = { cause: a }
    expect(isDatabaseUnavailable(a)).toBe(false)
  })
})
