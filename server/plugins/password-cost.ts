// Says so at start-up when password hashes are made below the production scrypt cost. The cost is runtime config
// (hash.scrypt.cost, overridden by NUXT_HASH_SCRYPT_COST); only the test suite lowers it, for its own database.
import { PRODUCTION_SCRYPT } from '../utils/password-cost'

export default defineNitroPlugin(() => {
  const cost = Number((useRuntimeConfig() as { hash?: { scrypt?: { cost?: number } } }).hash?.scrypt?.cost)
  if (cost < PRODUCTION_SCRYPT.cost) console.warn(`[emberline] password hashes use scrypt N = ${cost}, below the production N = ${PRODUCTION_SCRYPT.cost}: for a test database only`)
})
