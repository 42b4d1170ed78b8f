import { describe, expect, it } from 'vitest'
import { as, call, unique } from '../support/api'
import { testDb } from '../support/db'
import { waitUntil } from '../support/wait'

// The mail worker of the server under test sends the outbox to the test mail server (scripts/test.sh:
// port 2526), which stores what it receives in captured_mail. No route enqueues mail yet, so the
// tests put rows in the outbox the way enqueueMail does (server/utils/mail.ts).

async function enqueue(row: { to: string[], subject: string, text?: string, dedupeKey?: string, attempts?: number }) {
  const { rows } = await testDb().query(
    `insert into mail_outbox ("to", subject, text, dedupe_key, attempts) values ($1, $2, $3, $4, $5)
     on conflict (dedupe_key) do nothing returning id`,
    [row.to, row.subject, row.text ?? 'Body of the test message.', row.dedupeKey ?? null, row.attempts ?? 0],
  )
  return rows[0]?.id as string | undefined
}

const outboxRow = async (id: string) => (await testDb().query('select * from mail_outbox where id = $1', [id])).rows[0]
const captured = async (subject: string) => (await testDb().query('select * from captured_mail where subject = $1', [subject])).rows

describe('mail worker (outbox → SMTP → test mail server)', () => {
  it('sends a queued message to every recipient and marks it sent', async () => {
    const subject = unique('Approval needed')
    const id = (await enqueue({ to: ['supervisor@emberline.test', 'admin@emberline.test'], subject, text: 'Run 7 waits for your signature.' }))!
    const [mail] = await waitUntil('the captured message', async () => { const r = await captured(subject); return r.length ? r : null })
    expect(mail.to).toEqual(['supervisor@emberline.test', 'admin@emberline.test'])
    expect(mail.from).toContain('no-reply@emberline.test')
    expect(mail.text).toBe('Run 7 waits for your signature.')
    const row = await waitUntil('the outbox row to be sent', async () => { const r = await outboxRow(id); return r.status === 'sent' ? r : null })
    expect(row.attempts).toBe(1)
    expect(row.sent_at).toBeInstanceOf(Date)
    expect(row.last_error).toBeNull()
  })

  it('keeps a refused message for a later try, with the error and a backoff of about 30 s', async () => {
    const id = (await enqueue({ to: ['nobody@refused.invalid'], subject: unique('Refused') }))!
    const row = await waitUntil('the first failed try', async () => { const r = await outboxRow(id); return r.last_error ? r : null })
    expect(row.status).toBe('pending')
    expect(row.attempts).toBe(1)
    expect(row.last_error).toMatch(/550/)
    const waitMs = new Date(row.next_attempt_at).getTime() - Date.now()
    expect(waitMs).toBeGreaterThan(15_000)
    expect(waitMs).toBeLessThanOrEqual(30_000)
  })

  it('marks a message failed after its 8th try', async () => {
    const subject = unique('Last try')
    const id = (await enqueue({ to: ['nobody@refused.invalid'], subject, attempts: 7 }))!
    const row = await waitUntil('the message to fail', async () => { const r = await outboxRow(id); return r.status === 'failed' ? r : null })
    expect(row.attempts).toBe(8)
    expect(row.last_error).toMatch(/refused\.invalid/)
    expect(await captured(subject)).toHaveLength(0)
  })

  it('adds a message with a repeated dedupe key once, and sends it once', async () => {
    const key = unique('run:approval-requested')
    const subject = unique('Deduplicated')
    expect(await enqueue({ to: ['analyst@emberline.test'], subject, dedupeKey: key })).toBeTruthy()
    expect(await enqueue({ to: ['analyst@emberline.test'], subject, dedupeKey: key })).toBeUndefined()
    // The database itself holds the key unique, whoever inserts.
    await expect(testDb().query(`insert into mail_outbox ("to", subject, text, dedupe_key) values ('{a@b.test}', 's', 't', $1)`, [key]))
      .rejects.toThrow(/duplicate key/)
    await waitUntil('the captured message', async () => ((await captured(subject)).length ? true : null))
    const { rows } = await testDb().query('select count(*)::int as n from mail_outbox where dedupe_key = $1', [key])
    expect(rows[0].n).toBe(1)
    // Another pass must not deliver it again.
    await new Promise(r => setTimeout(r, 2_500))
    expect(await captured(subject)).toHaveLength(1)
  })
})

describe('GET /api/admin/mail', () => {
  it('shows the admin the captured messages, newest first, and the outbox with each state', async () => {
    const subject = unique('Shown on the mail page')
    const id = (await enqueue({ to: ['technician@emberline.test'], subject }))!
    await waitUntil('the captured message', async () => ((await captured(subject)).length ? true : null))
    const res = await call('GET', '/api/admin/mail?pageSize=100', { cookie: await as('admin') })
    expect(res.status).toBe(200)
    expect(res.body.captured).toMatchObject({ page: 1, pageSize: 100 })
    expect(res.body.captured.rows[0].subject).toBe(subject)
    const times = res.body.captured.rows.map((r: any) => Date.parse(r.receivedAt))
    expect(times).toEqual([...times].sort((a, b) => b - a))
    const out = res.body.outbox.rows.find((r: any) => r.id === id)
    expect(out).toMatchObject({ status: 'sent', attempts: 1, lastError: null, to: ['technician@emberline.test'] })
    expect(res.body.outbox.counts.sent).toBeGreaterThanOrEqual(1)
    // Failed rows come first: they need the admin's attention.
    expect(res.body.outbox.rows[0].status).toBe('failed')
    expect(res.body.smtp).toMatchObject({ host: process.env.NUXT_SMTP_HOST ?? '127.0.0.1', port: Number(process.env.NUXT_SMTP_PORT ?? 2525) })
    expect(res.body.smtp.pass).toBeUndefined()
  })

  it('pages the captured messages', async () => {
    const admin = await as('admin')
    const first = await call('GET', '/api/admin/mail?page=1&pageSize=1', { cookie: admin })
    const second = await call('GET', '/api/admin/mail?page=2&pageSize=1', { cookie: admin })
    expect(first.body.captured.rows).toHaveLength(1)
    expect(second.body.captured.rows).toHaveLength(1)
    expect(first.body.captured.rows[0].id).not.toBe(second.body.captured.rows[0].id)
    expect(first.body.captured.total).toBeGreaterThanOrEqual(2)
  })

  it('refuses a page size above 100 with 422 naming pageSize', async () => {
    const res = await call('GET', '/api/admin/mail?pageSize=101', { cookie: await as('admin') })
    expect(res.status).toBe(422)
    expect(res.body.data.fields.map((f: any) => f.path)).toEqual(['pageSize'])
  })

  for (const role of ['analyst', 'supervisor', 'technician'] as const) {
    it(`refuses the ${role} with 403`, async () => {
      expect((await call('GET', '/api/admin/mail', { cookie: await as(role) })).status).toBe(403)
    })
  }

  it('refuses a caller without a session with 401', async () => {
    expect((await call('GET', '/api/admin/mail')).status).toBe(401)
  })
})
