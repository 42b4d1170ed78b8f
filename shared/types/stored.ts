// Shapes of the jsonb columns that have no zod schema or domain type of their own (the schema types its columns with them).
import type { Verdict } from '../domain/assessment/contract'
import type { DayPlanProposal, DaySettings } from '../domain/day-plan'
import type { Composition } from '../domain/composition'
import type { LockCause } from '../domain/vessel-lifecycle'
import type { VesselCondition } from '../domain/vessel-state'
import type { RunComponent } from '../schemas/plans'

/** A typical-value material's range (no certified value). */
export interface TypicalRange { minJPerG: number, maxJPerG: number, note?: string }

/** A material's composition in mass-% on its basis (the basis is a column of its own). */
export type StoredComposition = Omit<Composition, 'basis'>

/** What a firing recorded beside its outcome: the request's fingerprint, the weighed charge and the verdict at the time. */
export interface StoredFiringData {
  requestHash: string
  aidMassG?: number | null
  observations?: string
  components?: RunComponent[]
  plannedComponents?: RunComponent[]
  verdictAtFiring?: Verdict
  findingsAtFiring?: string[]
  signedMassG?: number
  massExcessPct?: number
}

/** A service record: the form's fields as entered, and what the record did to its vessel. */
export type StoredServiceRecord = Record<string, unknown> & {
  passed?: boolean
  effect?: { condition?: VesselCondition, lockCause?: LockCause | null, checksPassed?: boolean, message?: string }
  signature?: { signerName: string, signedAt: string, meaning: string }
}

/** An accepted day plan as stored: the proposal's vessels and leftovers, and the settings it was laid out with. */
export type StoredDayPlan = Pick<DayPlanProposal, 'vessels' | 'leftovers'> & { settings?: DaySettings }

/** An audit row's before and after values. */
export type AuditValues = object
