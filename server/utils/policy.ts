import { eq, sql } from 'drizzle-orm'
import pg from 'pg'
import { DEFAULT_POLICY, labPolicySchema } from '#shared/domain/policy'
import type { LabPolicy } from '#shared/domain/policy'

export interface LabSettings { labName: string, policy: LabPolicy, updatedAt: Date | null }

/** The channel on which a policy change is announced to every instance that shares the database. */
export const POLICY_CHANNEL = 'emberline_policy'
// A safety net only: a missed notification can leave a copy at most this old.
const MAX_AGE_MS = 60_000

let cached: { settings: LabSettings, at: number } | undefined
let listener: Promise<boolean> | undefined

/**
 * Listens for policy changes on a dedicated connection. The in-process copy is trusted only while
 * this connection is up; when it drops, every read goes to the database until it is back.
 */
function ensureListener(): Promise<boolean> {
  if (listener) return listener
  listener = (async () => {
    const url = databaseUrl()
    const client = new pg.Client({ connectionString: url, connectionTimeoutMillis: 5_000 })
    const drop = () => {
      cached = undefined
      listener = undefined
      client.removeAllListeners()
      client.on('error', () => {})
      client.end().catch(() => {})
    }
    client.on('notification', () => { cached = undefined })
    client.on('error', drop)
    client.on('end', drop)
    try {
      await client.connect()
      await client.query(`LISTEN ${POLICY_CHANNEL}`)
      return true
    }
    catch {
      drop()
      return false
    }
  })()
  return listener
}

async function readLabSettings(): Promise<LabSettings> {
  const [row] = await useDb().select().from(schema.labSettings).where(eq(schema.labSettings.id, 1))
  const merged = labPolicySchema.safeParse({ ...DEFAULT_POLICY, ...row?.policy })
  if (!merged.success) console.error('[policy] stored policy is invalid; the defaults are in force:', merged.error.message)
  return {
    labName: row?.labName ?? 'Emberline laboratory',
    policy: merged.success ? merged.data : DEFAULT_POLICY,
    updatedAt: row?.updatedAt ?? null,
  }
}

/**
 * The lab's policy in force: the stored values over the product defaults. Kept in the process while
 * the change listener is connected (a change on any instance announces itself through PostgreSQL
 * NOTIFY), read fresh otherwise.
 */
export async function getLabSettings(): Promise<LabSettings> {
  const now = Date.now()
  if (cached && now - cached.at < MAX_AGE_MS) return cached.settings
  const listening = await ensureListener()
  const settings = await readLabSettings()
  if (listening) cached = { settings, at: now }
  return settings
}

export async function getPolicy(): Promise<LabPolicy> {
  return (await getLabSettings()).policy
}

/** Drops this process's copy and tells every other instance to do the same when the transaction commits. */
export async function announcePolicyChange(tx: Tx) {
  cached = undefined
  await tx.execute(sql`select pg_notify(${POLICY_CHANNEL}, '')`)
}

/** Forgets the copy in this process (after a change is committed, so a stale read cannot refill it first). */
export function forgetLabSettings() {
  cached = undefined
}
