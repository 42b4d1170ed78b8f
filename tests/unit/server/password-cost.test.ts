// The password hash cost: production keeps the full scrypt cost; only the test database may lower it.
import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'
import { describe, expect, it } from 'vitest'
import { PRODUCTION_SCRYPT, scryptOptions, TEST_SCRYPT } from '~~/server/utils/password-cost'

describe('scryptOptions', () => {
  it('defaults to N = 2^17, r = 8, p = 1 when nothing is set (OWASP Password Storage Cheat Sheet, scrypt)', () => {
    expect(scryptOptions(undefined)).toMatchObject({ cost: 2 ** 17, blockSize: 8, parallelization: 1 })
    expect(scryptOptions('')).toBe(PRODUCTION_SCRYPT)
    expect(scryptOptions('default')).toBe(PRODUCTION_SCRYPT)
  })

  it('lowers the cost only for the named test setting and refuses anything else', () => {
    expect(scryptOptions('test')).toBe(TEST_SCRYPT)
    expect(TEST_SCRYPT.cost).toBeLessThan(PRODUCTION_SCRYPT.cost)
    for (const bad of ['1024', 'low', 'TEST', 'production']) expect(() => scryptOptions(bad), bad).toThrow(/EMBERLINE_PASSWORD_HASH_COST/)
  })

  it('writes the cost into the hash, so a hash made at the default verifies at the default whatever the server runs with', async () => {
    const hash = await new Hash(new Scrypt(PRODUCTION_SCRYPT)).make('correct horse')
    // PHC string format: $scrypt$n=…,r=…,p=…$salt$hash
    expect(hash).toMatch(/^\$scrypt\$n=131072,r=8,p=1\$/)
    expect(await new Hash(new Scrypt(TEST_SCRYPT)).verify(hash, 'correct horse')).toBe(true)
  })
})
