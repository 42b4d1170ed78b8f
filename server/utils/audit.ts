import type { H3Event } from 'h3'
import type { AuditValues } from '#shared/types/stored'
import type { Tx } from './db'

export interface AuditEntry {
  action: string
  entity: string
  entityId?: string | null
  oldValues?: AuditValues | null
  newValues?: AuditValues | null
  reason?: string | null
  actor?: { id: string, name: string } | null
}

/** Writes one audit row inside the caller's transaction, so the change and its record commit together. */
export async function audit(tx: Tx, event: Pick<H3Event, 'context'> | null, entry: AuditEntry) {
  const actor = entry.actor === undefined ? event?.context.user ?? null : entry.actor
  await tx.insert(schema.auditLog).values({
    actorId: actor?.id ?? null,
    actorName: actor?.name ?? null,
    action: entry.action,
    entity: entry.entity,
    entityId: entry.entityId ?? null,
    oldValues: entry.oldValues ?? null,
    newValues: entry.newValues ?? null,
    reason: entry.reason ?? null,
    requestId: event?.context.requestId ?? null,
  })
}
