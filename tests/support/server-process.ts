// Starts another instance of the built server, with an environment of its own (a database behind a proxy, a trusted
// proxy setting …), for tests that need more than the one server global-server.ts shares with every test file.
import { spawn } from 'node:child_process'
import { fileURLToPath } from 'node:url'
import { serverEntry, serverEnv } from './server-env'

const root = fileURLToPath(new URL('../..', import.meta.url))

export interface ServerProcess {
  baseURL: string
  /** Everything the server printed so far. */
  output: () => string
  stop: () => Promise<void>
  /** kill -9: no shutdown at all, as a power cut or an out-of-memory kill would leave it (crash-safety tests). */
  kill: () => Promise<void>
  pid: number
}

export async function startServer(env: Record<string, string> = {}): Promise<ServerProcess> {
  const port = String(4000 + Math.floor(Math.random() * 900))
  const child = spawn(process.execPath, [serverEntry()], {
    cwd: root,
    // The public origin is this instance's own address unless the test names another (a proxy's host).
    env: serverEnv(port, env),
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  let output = ''
  child.stdout.on('data', (d: Buffer) => { output += d.toString() })
  child.stderr.on('data', (d: Buffer) => { output += d.toString() })
  const exited = new Promise<void>(resolve => child.once('exit', () => resolve()))
  const baseURL = `http://127.0.0.1:${port}`
  const stop = async () => {
    if (child.exitCode === null) {
      child.kill('SIGTERM')
      await Promise.race([exited, new Promise(r => setTimeout(r, 5_000))])
      if (child.exitCode === null) child.kill('SIGKILL')
    }
  }
  const kill = async () => {
    if (child.exitCode === null && child.signalCode === null) {
      child.kill('SIGKILL')
      await exited
    }
  }
  const deadline = Date.now() + 120_000
  for (;;) {
    if (child.exitCode !== null) throw new Error(`server exited:\n${output}`)
    try {
      if ((await fetch(`${baseURL}/api/health`)).ok) break
    }
    catch { /* not listening yet */ }
    if (Date.now() > deadline) {
      await stop()
      throw new Error(`server did not start:\n${output}`)
    }
    await new Promise(r => setTimeout(r, 200))
  }
  return { baseURL, output: () => output, stop, kill, pid: child.pid! }
}
