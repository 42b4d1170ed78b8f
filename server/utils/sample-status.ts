// A received sample's state follows its runs: `planned` while a determination is still to be fired, `tested` once the
// bench work is done, `reported` when a certificate is issued. Moved inside the transaction of the act that changes it.
import { eq, inArray } from 'drizzle-orm'
import { sampleBenchState } from '#shared/domain/sample-status'

type Actor = NonNullable<Parameters<typeof audit>[1]>

/**
 * Sets the sample of a run to `tested` or back to `planned` from its runs and their firings (the rule is
 * `sampleBenchState`), with an audit row naming the act. A sample still waiting in the queue, rejected or reported
 * is left as it is. Returns the new status when it changed.
 */
export async function settleSampleStatus(tx: Tx, actor: Actor, sampleId: string | null, act: string, policy: { determinationsPerSample: number }) {
  if (!sampleId) return null
  const sample = await findSampleOr404(tx, sampleId, true)
  if (sample.status !== 'planned' && sample.status !== 'tested') return null
  const runs = await tx.select({ id: schema.runs.id, status: schema.runs.status }).from(schema.runs).where(eq(schema.runs.sampleId, sampleId))
  const fired = runs.filter(r => r.status === 'fired').map(r => r.id)
  const firings = fired.length
    ? await tx.select({ outcome: schema.firings.outcome }).from(schema.firings).where(inArray(schema.firings.runId, fired))
    : []
  const state = sampleBenchState(runs.map(r => r.status), firings.map(f => f.outcome), sample.determinations ?? policy.determinationsPerSample)
  if (state.status === sample.status) return null
  await tx.update(schema.samples).set({ status: state.status, updatedAt: new Date() }).where(eq(schema.samples.id, sampleId))
  await audit(tx, actor, {
    action: state.status === 'tested' ? 'sample.tested' : 'sample.reopen', entity: 'sample', entityId: sampleId,
    oldValues: { status: sample.status }, newValues: { status: state.status, act }, reason: state.why,
  })
  return state.status
}

/** A certificate was issued: the sample is reported (whatever bench state it had), audited with the report number. */
export async function reportSample(tx: Tx, actor: Actor, sampleId: string, reportNumber: unknown) {
  const sample = await findSampleOr404(tx, sampleId, true)
  if (sample.status === 'reported') return
  await tx.update(schema.samples).set({ status: 'reported', updatedAt: new Date() }).where(eq(schema.samples.id, sampleId))
  await audit(tx, actor, { action: 'sample.report', entity: 'sample', entityId: sampleId, oldValues: { status: sample.status }, newValues: { status: 'reported', reportNumber } })
}
