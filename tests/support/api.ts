// Small helpers for API tests: requests with a session cookie, sign-in as a demo role.
import { inject } from 'vitest'

export const DEMO_PASSWORD = 'ember-demo-2026'
export type DemoRole = 'analyst' | 'analyst2' | 'supervisor' | 'technician' | 'admin'

export interface Reply<T = any> { status: number, body: T, headers: Headers }

export function baseURL() {
  return inject('baseURL')
}

export async function call<T = any>(method: string, path: string, opts: { body?: unknown, cookie?: string, headers?: Record<string, string>, raw?: string } = {}): Promise<Reply<T>> {
  const headers: Record<string, string> = { ...opts.headers }
  if (opts.cookie) headers.cookie = opts.cookie
  let payload: string | undefined
  if (opts.raw !== undefined) payload = opts.raw
  else if (opts.body !== undefined) {
    payload = JSON.stringify(opts.body)
    headers['content-type'] ??= 'application/json'
  }
  const res = await fetch(baseURL() + path, { method, headers, body: payload, redirect: 'manual' })
  const text = await res.text()
  let body: any = text
  try { body = text ? JSON.parse(text) : null }
  catch { /* not JSON */ }
  return { status: res.status, body, headers: res.headers }
}

export function sessionCookie(headers: Headers): string {
  const set = headers.getSetCookie().find(c => c.startsWith('emberline-session='))
  if (!set) throw new Error('no session cookie in the answer')
  return set.split(';')[0]!
}

export async function signIn(email: string, password = DEMO_PASSWORD): Promise<string> {
  const res = await call('POST', '/api/auth/login', { body: { email, password } })
  if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status} ${JSON.stringify(res.body)}`)
  return sessionCookie(res.headers)
}

const cache = new Map<string, Promise<string>>()
/** One session per demo role per test file. */
export function as(role: DemoRole): Promise<string> {
  const email = `${role}@emberline.test`
  if (!cache.has(email)) cache.set(email, signIn(email))
  return cache.get(email)!
}

export function unique(prefix: string) {
  return `${prefix}-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 7)}`
}
