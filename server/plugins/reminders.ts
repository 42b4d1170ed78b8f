// Reminders: pg-boss on the app's own database (its own schema, `pgboss`) runs the fleet check
// every few minutes on one instance at a time; the once-per-change rule lives in runFleetCheck itself.
// A database outage is logged and retried, never thrown into Nitro; pg-boss stops when the server closes.
//   EMBERLINE_REMINDERS=off                 no scheduled checks in this process (POST /api/admin/reminders/run still works)
//   EMBERLINE_REMINDER_CRON                 when to check, a cron expression in UTC (default every 5 minutes)
//   EMBERLINE_REMINDER_INTERVAL_SECONDS     check every N seconds instead of the cron (tests; pg-boss cron has minute steps)
import PgBoss from 'pg-boss'
import pg from 'pg'

const DEFAULT_CRON = '*/5 * * * *'

export default defineNitroPlugin((nitroApp) => {
  if (import.meta.prerender) return
  if ((process.env.EMBERLINE_REMINDERS ?? '').trim().toLowerCase() === 'off') {
    console.info('[reminders] scheduled fleet checks are off in this process (EMBERLINE_REMINDERS=off)')
    return
  }
  const url = useRuntimeConfig().databaseUrl || process.env.NUXT_DATABASE_URL
  if (!url) return
  const cron = process.env.EMBERLINE_REMINDER_CRON?.trim() || DEFAULT_CRON
  const intervalS = Math.max(0, Number(process.env.EMBERLINE_REMINDER_INTERVAL_SECONDS) || 0)

  // pg-boss gets its own small pool: its polling must never take the connections requests need.
  const pool = new pg.Pool({ connectionString: url, max: 2, connectionTimeoutMillis: 5_000, application_name: 'emberline-reminders' })
  pool.on('error', err => logProblem(`idle database client: ${err.message}`))
  const db = { executeSql: (text: string, values: unknown[]) => pool.query(text, values) }

  let boss: PgBoss | undefined
  let stopped = false
  let failures = 0
  let retry: ReturnType<typeof setTimeout> | undefined
  let tick: ReturnType<typeof setInterval> | undefined
  let lastProblem = ''
  let lastProblemAt = 0

  // The same outage is logged once a minute, not on every poll.
  function logProblem(message: string) {
    if (message !== lastProblem || Date.now() - lastProblemAt > 60_000) {
      console.error(`[reminders] ${message}`)
      lastProblem = message
      lastProblemAt = Date.now()
    }
  }

  async function check() {
    const report = await runFleetCheck(null)
    const mailed = report.transitions.filter(t => t.mailed)
    if (mailed.length) console.info(`[reminders] mailed ${mailed.map(t => `${t.name} → ${t.to}`).join(', ')}`)
    await discardOrphanUploads()
  }

  async function start() {
    // A new instance per attempt: pg-boss does not restart after a failed start.
    const b = new PgBoss({ db, schema: 'pgboss', supervise: true, schedule: !intervalS })
    b.on('error', err => logProblem(`pg-boss: ${err.message}`))
    try {
      await b.start()
      // One queued and one running check at most, whatever the number of instances.
      await b.createQueue(FLEET_CHECK_QUEUE, { name: FLEET_CHECK_QUEUE, policy: 'stately', retryLimit: 2, retryDelay: 30, expireInSeconds: 600 })
      await b.work(FLEET_CHECK_QUEUE, { pollingIntervalSeconds: intervalS ? Math.min(2, Math.max(0.5, intervalS / 2)) : 10 }, check)
      if (intervalS) {
        const send = () => b.send(FLEET_CHECK_QUEUE, {}, { singletonKey: 'fleet', singletonSeconds: intervalS }).catch(err => logProblem(`could not queue a check: ${(err as Error).message}`))
        tick = setInterval(send, intervalS * 1000)
        tick.unref?.()
        void send()
      }
      else {
        await b.schedule(FLEET_CHECK_QUEUE, cron, {}, { tz: 'UTC' })
      }
      if (stopped) return await b.stop({ graceful: false, close: false })
      boss = b
      failures = 0
      console.info(`[reminders] fleet check ${intervalS ? `every ${intervalS} s` : `on "${cron}" (UTC)`}`)
    }
    catch (err) {
      failures++
      const wait = Math.min(10 * 60_000, 5_000 * 2 ** Math.min(failures - 1, 7))
      logProblem(`could not start the job queue (next try in ${Math.round(wait / 1000)} s): ${(err as Error).message}`)
      if (tick) clearInterval(tick)
      await b.stop({ graceful: false, close: false }).catch(() => {})
      if (!stopped) {
        retry = setTimeout(() => void start(), wait)
        retry.unref?.()
      }
    }
  }

  void start()

  nitroApp.hooks.hook('close', async () => {
    stopped = true
    if (retry) clearTimeout(retry)
    if (tick) clearInterval(tick)
    try {
      await boss?.stop({ graceful: true, timeout: 5_000, wait: true, close: false })
    }
    catch (err) {
      console.error(`[reminders] stopping pg-boss: ${(err as Error).message}`)
    }
    await pool.end().catch(() => {})
  })
})
