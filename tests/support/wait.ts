import { vi } from 'vitest'

/**
 * Polls `probe` (every 250 ms, through vi.waitFor) until it gives a value, and returns it; fails naming `what` after
 * `timeoutMs`. For things a worker does in its own time (the mail worker, reminders, a server coming back).
 */
export function waitUntil<T>(what: string, probe: () => Promise<T | null | undefined | false>, timeoutMs = 20_000): Promise<T> {
  return vi.waitFor(async () => {
    const value = await probe()
    if (!value) throw new Error(`timed out waiting for ${what}`)
    return value
  }, { timeout: timeoutMs, interval: 250 })
}
