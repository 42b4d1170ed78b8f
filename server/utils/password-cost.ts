// scrypt settings for password hashes. nuxt.config.ts builds the production default into the server's runtime config
// (hash.scrypt); the seed scripts and the test harness read EMBERLINE_PASSWORD_HASH_COST through scryptOptions(), and
// the harness hands the chosen cost to the servers it starts as NUXT_HASH_SCRYPT_COST (Nuxt's runtime-config override).
// Pure: no Nitro auto-imports, so scripts and nuxt.config.ts can import it by path.

export interface ScryptOptions { cost: number, blockSize: number, parallelization: number, maxMemory: number }

/** OWASP Password Storage Cheat Sheet (scrypt): N = 2^17, r = 8, p = 1, about 128 MiB and a few hundred ms per hash. */
export const PRODUCTION_SCRYPT: ScryptOptions = { cost: 131072, blockSize: 8, parallelization: 1, maxMemory: 256 * 1024 * 1024 }

/**
 * The test suite's own setting (N = 2^10, about 1 MiB): the same algorithm and code path, cheap enough for the
 * ~100 sign-ins of a test run. scripts/test.sh and scripts/test-some.sh set it for the test database only;
 * a hash stores its own parameters, so a database seeded with it must never be used for a real lab.
 */
export const TEST_SCRYPT: ScryptOptions = { cost: 1024, blockSize: 8, parallelization: 1, maxMemory: 256 * 1024 * 1024 }

/** EMBERLINE_PASSWORD_HASH_COST: unset or "default" → production cost; "test" → the test suite's; anything else is refused. */
export function scryptOptions(setting: string | undefined): ScryptOptions {
  if (setting === undefined || setting === '' || setting === 'default') return PRODUCTION_SCRYPT
  if (setting === 'test') return TEST_SCRYPT
  throw new Error(`EMBERLINE_PASSWORD_HASH_COST must be "default" or "test", not "${setting}"`)
}
