import { describe, expect, it } from 'vitest'
import { SAMPLE_STATUSES } from '#shared/schemas/samples'
import { RUN_STATUSES } from '#shared/schemas/plans'
import { testDb } from '../support/db'

// Every status and kind column accepts only its listed values, whoever connects: the CHECK constraints are generated
// from the same shared arrays the zod schemas and the pages use.
describe('status and kind columns refuse unknown values at the database', () => {
  const db = () => testDb()
  const oneId = async (table: string) => (await db().query(`select id from ${table} limit 1`)).rows[0]?.id as string | undefined

  it.each([
    ['samples', 'status', 'samples_status_check'],
    ['runs', 'status', 'runs_status_check'],
    ['runs', 'kind', 'runs_kind_check'],
    ['vessels', 'condition', 'vessels_condition_check'],
    ['materials', 'declared_hazard', 'materials_declared_hazard_check'],
  ])('%s.%s = a made-up value is refused (%s)', async (table, column, constraint) => {
    const id = await oneId(table)
    expect(id, `the test database has a row in ${table}`).toBeTruthy()
    await expect(db().query(`update ${table} set ${column} = 'finished-ish' where id = $1`, [id])).rejects.toThrow(constraint)
  })

  it('a known value still passes (the constraint lists the shared values)', async () => {
    const id = await oneId('samples')
    const client = await db().connect()
    try {
      await client.query('begin')
      for (const s of SAMPLE_STATUSES) await client.query('update samples set status = $2 where id = $1', [id, s])
      const runId = (await client.query('select id from runs limit 1')).rows[0]?.id
      for (const s of RUN_STATUSES) await client.query('update runs set status = $2 where id = $1', [runId, s])
    } finally {
      await client.query('rollback')
      client.release()
    }
  })

  it('a role outside the four is refused on users.roles', async () => {
    const id = await oneId('users')
    await expect(db().query(`update users set roles = array['analyst', 'superuser'] where id = $1`, [id])).rejects.toThrow('users_roles_check')
  })

  it('an outbox message with an unknown status is refused, and a signature with an unknown meaning', async () => {
    await expect(db().query(`insert into mail_outbox ("to", subject, text, status) values (array['a@example.test'], 's', 't', 'queued')`)).rejects.toThrow('mail_outbox_status_check')
    const user = await oneId('users')
    await expect(db().query(
      `insert into signatures (entity, entity_id, signer_id, signer_name, meaning, reason, bound_hash) values ('run', gen_random_uuid(), $1, 'x', 'looked at it', 'r', 'h')`, [user],
    )).rejects.toThrow('signatures_meaning_check')
  })
})
