// The built-in test mail server: accepts SMTP on 127.0.0.1 without authentication and stores every
// message in the captured_mail table of NUXT_DATABASE_URL, where the admin's Mail page shows it.
// Run: npx tsx scripts/fake-smtp.ts (or scripts/mail.sh start, which runs it in the background).
import { unlinkSync, writeFileSync } from 'node:fs'
import { simpleParser } from 'mailparser'
import pg from 'pg'
import { SMTPServer } from 'smtp-server'

const url = process.env.NUXT_DATABASE_URL
if (!url) throw new Error('NUXT_DATABASE_URL is not set')
const port = Number(process.env.EMBERLINE_FAKE_SMTP_PORT ?? 2525)
const pidFile = process.env.EMBERLINE_FAKE_SMTP_PID_FILE
const MAX_BYTES = 10 * 1024 * 1024

const pool = new pg.Pool({ connectionString: url, max: 2, connectionTimeoutMillis: 5_000 })
// A dropped connection (database restarted or recreated by the test script) must not end the server.
pool.on('error', err => console.error('[fake-smtp] idle database client error:', err.message))

function log(message: string) {
  console.log(`${new Date().toISOString()} [fake-smtp] ${message}`)
}

const server = new SMTPServer({
  name: 'emberline-test-mail',
  authOptional: true,
  // Plain SMTP on loopback only: no TLS and no login to set up.
  disabledCommands: ['AUTH', 'STARTTLS'],
  size: MAX_BYTES,
  logger: false,
  onRcptTo(addr, _session, callback) {
    // The reserved .invalid domain (RFC 2606) is refused like a real server would, so the retry path can be seen.
    if (/\.invalid$/i.test(addr.address)) {
      const err = Object.assign(new Error(`Mailbox unavailable: ${addr.address}`), { responseCode: 550 })
      return callback(err)
    }
    callback()
  },
  onData(stream, session, callback) {
    simpleParser(stream)
      .then(async (mail) => {
        if (stream.sizeExceeded) throw Object.assign(new Error('Message exceeds the size limit'), { responseCode: 552 })
        const from = mail.from?.text || (session.envelope.mailFrom ? session.envelope.mailFrom.address : '')
        // The envelope holds every recipient the sender named, Bcc included.
        const to = session.envelope.rcptTo.map(r => r.address)
        await pool.query(
          'insert into captured_mail ("from", "to", subject, text) values ($1, $2, $3, $4)',
          [from, to, mail.subject ?? '', (mail.text ?? '').replace(/\s+$/, '')],
        )
        log(`stored "${mail.subject ?? ''}" for ${to.join(', ')}`)
        callback()
      })
      .catch((err: Error & { responseCode?: number }) => {
        log(`refused a message: ${err.message}`)
        // 451: a temporary failure, so the sender keeps the message and tries again.
        callback(Object.assign(new Error(err.message), { responseCode: err.responseCode ?? 451 }))
      })
  },
})

server.on('error', (err: Error) => {
  log(`error: ${err.message}`)
  if ((err as NodeJS.ErrnoException).code === 'EADDRINUSE') process.exit(1)
})

server.listen(port, '127.0.0.1', () => {
  if (pidFile) writeFileSync(pidFile, String(process.pid))
  log(`listening on 127.0.0.1:${port}, storing into ${new URL(url).pathname.slice(1)}`)
})

function stop() {
  log('stopping')
  if (pidFile) {
    try { unlinkSync(pidFile) }
    catch { /* already gone */ }
  }
  server.close(() => { void pool.end().finally(() => process.exit(0)) })
  // Open client connections must not keep the process alive.
  setTimeout(() => process.exit(0), 3_000).unref()
}
process.on('SIGTERM', stop)
process.on('SIGINT', stop)
