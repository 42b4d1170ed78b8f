// The environment every server started by the tests gets beside the caller's: the built server in production mode on
// loopback (its public origin is its own address unless the caller names another), with the password hash cost of the test database (EMBERLINE_PASSWORD_HASH_COST, see server/utils/password-cost.ts).
import { scryptOptions } from '../../server/utils/password-cost'

export function serverEnv(port: string, extra: Record<string, string> = {}): NodeJS.ProcessEnv {
  return { ...process.env, PORT: port, NITRO_HOST: '127.0.0.1', NODE_ENV: 'production', NUXT_HASH_SCRYPT_COST: String(scryptOptions(process.env.EMBERLINE_PASSWORD_HASH_COST).cost), NUXT_PUBLIC_SITE_URL: `http://127.0.0.1:${port}`, ...extra }
}

export function serverEntry() {
  return process.env.EMBERLINE_BUILD_DIR ? `${process.env.EMBERLINE_BUILD_DIR}/.output/server/index.mjs` : '.output/server/index.mjs'
}
