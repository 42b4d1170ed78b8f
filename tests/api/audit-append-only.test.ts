import { describe, expect, it } from 'vitest'
import { testDb } from '../support/db'

// The audit trail is protected by the database itself, whoever connects.
describe('audit_log is append-only at the database', () => {
  it('accepts an insert', async () => {
    const { rowCount } = await testDb().query(`insert into audit_log (action, entity) values ('test.append', 'test')`)
    expect(rowCount).toBe(1)
  })
  it('refuses UPDATE', async () => {
    await expect(testDb().query(`update audit_log set reason = 'changed' where action = 'test.append'`)).rejects.toThrow(/append-only/)
  })
  it('refuses DELETE', async () => {
    await expect(testDb().query(`delete from audit_log where action = 'test.append'`)).rejects.toThrow(/append-only/)
  })
  it('refuses TRUNCATE', async () => {
    await expect(testDb().query('truncate audit_log')).rejects.toThrow(/append-only/)
  })
})
