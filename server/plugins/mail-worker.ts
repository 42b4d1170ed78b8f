// Sends the outbox every few seconds. A failing SMTP server or database is logged and retried on
// the next pass; nothing here may throw into Nitro, and the timer stops when the server closes.
export default defineNitroPlugin((nitroApp) => {
  if (import.meta.prerender) return
  const pollMs = Math.max(200, Number(process.env.EMBERLINE_MAIL_POLL_MS) || 2000)
  const smtp = smtpSettings()
  const transport = createMailTransport(smtp)
  let timer: ReturnType<typeof setTimeout> | undefined
  let stopped = false
  let lastProblem = ''
  let lastProblemAt = 0

  // The same outage is logged once a minute, not every pass.
  function logProblem(message: string) {
    if (message !== lastProblem || Date.now() - lastProblemAt > 60_000) {
      console.error(`[mail] outbox pass failed (will retry): ${message}`)
      lastProblem = message
      lastProblemAt = Date.now()
    }
  }

  async function pass() {
    try {
      // A full batch means more may be waiting: go on at once rather than after a pause.
      for (let i = 0; i < 10 && !stopped; i++) {
        const report = await deliverDueMail(transport, smtp.from)
        if (report.claimed < MAIL_BATCH_SIZE) break
      }
      lastProblem = ''
    }
    catch (err) {
      // Drizzle wraps the driver's error with the whole SQL text; the cause says what went wrong.
      const e = err as Error & { cause?: Error }
      logProblem(e?.cause?.message || e?.message || String(err))
    }
    finally {
      if (!stopped) {
        timer = setTimeout(pass, pollMs)
        timer.unref?.()
      }
    }
  }

  timer = setTimeout(pass, pollMs)
  timer.unref?.()

  nitroApp.hooks.hook('close', () => {
    stopped = true
    if (timer) clearTimeout(timer)
    transport.close()
  })
})
