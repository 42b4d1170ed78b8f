// Starts the built server once for a test project, against the test database prepared by scripts/test.sh.
import { spawn } from 'node:child_process'
import { fileURLToPath } from 'node:url'
import type { TestProject } from 'vitest/node'
import { serverEntry, serverEnv } from './server-env'

declare module 'vitest' {
  export interface ProvidedContext { baseURL: string }
}

const root = fileURLToPath(new URL('../..', import.meta.url))

export default async function setup(project: TestProject) {
  if (!process.env.NUXT_DATABASE_URL) throw new Error('Run the API and browser tests through `npm test` (it prepares the test database).')
  const port = String(3100 + Math.floor(Math.random() * 800))
  const server = spawn(process.execPath, [serverEntry()], {
    cwd: root,
    env: serverEnv(port),
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  let output = ''
  server.stdout.on('data', (d: Buffer) => { output += d.toString() })
  server.stderr.on('data', (d: Buffer) => { output += d.toString() })
  const baseURL = `http://127.0.0.1:${port}`
  const deadline = Date.now() + 120_000
  for (;;) {
    if (server.exitCode !== null) throw new Error(`server exited:\n${output}`)
    try {
      const res = await fetch(`${baseURL}/api/health`)
      if (res.ok) break
    }
    catch { /* not listening yet */ }
    if (Date.now() > deadline) throw new Error(`server did not start:\n${output}`)
    await new Promise(r => setTimeout(r, 200))
  }
  project.provide('baseURL', baseURL)
  return async () => {
    server.kill('SIGTERM')
    if (process.env.EMBERLINE_TEST_SERVER_LOG) console.log(output)
  }
}
