import { execFileSync } from 'node:child_process'
import { readdirSync, readFileSync, statSync } from 'node:fs'
import { join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'

// Secrets never reach the repository or the client bundle (OWASP ASVS 14.3).
const root = fileURLToPath(new URL('../..', import.meta.url))
const output = join(root, process.env.EMBERLINE_BUILD_DIR ?? '', '.output')

function secrets() {
  const session = process.env.NUXT_SESSION_PASSWORD ?? ''
  const dbPassword = new URL(process.env.NUXT_DATABASE_URL ?? 'postgres://x@y/z').password
  return [session, dbPassword].filter(s => s.length >= 8)
}

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = join(dir, name)
    return statSync(full).isDirectory() ? files(full) : [full]
  })
}

describe('secrets', () => {
  it('are set for the test run (so the checks below mean something)', () => {
    expect(secrets().length).toBe(2)
  })

  it('never appear in the client bundle', () => {
    const publicFiles = files(join(output, 'public'))
    expect(publicFiles.length).toBeGreaterThan(5)
    for (const file of publicFiles) {
      const text = readFileSync(file, 'latin1')
      for (const s of secrets()) expect(text.includes(s), `${file} holds a secret`).toBe(false)
    }
  })

  it('never appear in a file the repository tracks', () => {
    const tracked = execFileSync('git', ['ls-files', '-z'], { cwd: root }).toString().split('\0').filter(Boolean)
    expect(tracked.length).toBeGreaterThan(50)
    for (const rel of tracked) {
      const text = readFileSync(join(root, rel), 'latin1')
      for (const s of secrets()) expect(text.includes(s), `${rel} holds a secret`).toBe(false)
    }
  })
})
