// Serves the built app on every core: a primary process forks one worker per core (EMBERLINE_WORKERS
// overrides), each running the same built server on the same port; a worker that dies is replaced.
// Nothing is kept per process that another worker needs (sessions, throttles, mail and counters live
// in PostgreSQL), so any worker can answer any request.
import cluster from 'node:cluster'
import { availableParallelism } from 'node:os'
import { fileURLToPath } from 'node:url'

const entry = process.env.EMBERLINE_SERVER_ENTRY ?? fileURLToPath(new URL('../.output/server/index.mjs', import.meta.url))
const given = Number.parseInt(process.env.EMBERLINE_WORKERS ?? '', 10)
const workers = Number.isFinite(given) && given > 0 ? given : availableParallelism()

if (workers === 1) {
  await import(entry)
}
else {
  cluster.setupPrimary({ exec: entry })
  let stopping = false
  for (let i = 0; i < workers; i++) cluster.fork()
  console.log(`Serving with ${workers} workers (one per core; EMBERLINE_WORKERS changes it).`)
  cluster.on('exit', (worker, code, signal) => {
    if (stopping) return
    console.error(`worker ${worker.process.pid} ended (${signal ?? code}); starting another`)
    cluster.fork()
  })
  const stop = (signal) => {
    stopping = true
    for (const w of Object.values(cluster.workers ?? {})) w?.process.kill(signal)
    setTimeout(() => process.exit(0), 10_000).unref()
    cluster.on('exit', () => {
      if (Object.values(cluster.workers ?? {}).every(w => !w || w.isDead())) process.exit(0)
    })
  }
  process.on('SIGTERM', () => stop('SIGTERM'))
  process.on('SIGINT', () => stop('SIGINT'))
}
