// Opening the sealed session cookie (key derivation, decryption and integrity check) was the largest single cost of a
// signed-in request in the CPU profile (docs/benchmarks.md). A sealed value can only ever open to the same content,
// so each process keeps what a value opened to, for a few minutes and never past the session's own age limit. This
// decides nothing: whether the session is still open and its user active is read from the database at every request
// (loadSessionUser). Only values that opened to a signed-in session are kept, so forged cookies cannot fill the map.
import type { H3Event } from 'h3'

interface OpenedSession { id: string, createdAt: number, data: Record<string, unknown>, until: number }

const KEEP_MS = 5 * 60_000
const MAX_ENTRIES = 5_000
const opened = new Map<string, OpenedSession>()

function sessionConfig() {
  const { name, maxAge } = useRuntimeConfig().session as { name?: string, maxAge?: number }
  return { name: name || 'nuxt-session', maxAgeMs: maxAge ? maxAge * 1000 : 0 }
}

// Where h3 looks for the sealed value, in its order: the session header, then the cookie.
function sealedValue(event: H3Event, name: string): string | undefined {
  const header = getRequestHeader(event, `x-${name.toLowerCase()}-session`)
  return typeof header === 'string' && header ? header : getCookie(event, name)
}

/**
 * Puts the opened session on the event before anything reads it (h3 keeps one per event in `context.sessions`), from
 * this process's memory when the same sealed value was opened before, otherwise by opening it once and remembering it.
 */
export async function openSessionCookie(event: H3Event): Promise<void> {
  const { name, maxAgeMs } = sessionConfig()
  const sealed = sealedValue(event, name)
  if (!sealed) return
  const sessions = (event.context.sessions ??= Object.create(null)) as Record<string, unknown>
  if (sessions[name]) return
  const now = Date.now()
  const known = opened.get(sealed)
  if (known && known.until > now) {
    sessions[name] = { id: known.id, createdAt: known.createdAt, data: structuredClone(known.data) }
    return
  }
  if (known) opened.delete(sealed)
  const session = await getUserSession(event)
  const stored = sessions[name] as Omit<OpenedSession, 'until'> | undefined
  if (!session.user || !stored?.createdAt) return
  const until = Math.min(now + KEEP_MS, maxAgeMs ? stored.createdAt + maxAgeMs : Number.POSITIVE_INFINITY)
  // Oldest first out: a Map iterates in insertion order.
  if (opened.size >= MAX_ENTRIES) opened.delete(opened.keys().next().value!)
  opened.set(sealed, { id: stored.id, createdAt: stored.createdAt, data: structuredClone(stored.data), until })
}
