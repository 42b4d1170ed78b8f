import type { VesselState } from '#shared/domain/vessel-state'
import type { InternalApi } from 'nitropack'
import type { ResultView } from '~/composables/results/result-view'

// Shapes of GET /api/results/bench (server/api/results/bench.get.ts).
export interface BenchVessel {
  id: string, name: string, serialNumber: string, class: 'standard' | 'high-strength', state: VesselState, stateReasons: string[], conditionReason: string | null
  blocksSampleRuns: boolean, blocksAllFirings: boolean, firingsSinceService: number, serviceIntervalFirings: number, firingsTotal: number
  energyEquivalent: { id: string, valueJPerK: number, relativeStandardDeviationPct: number, runs: number, acceptedAt: string } | null
}
interface RunBits {
  id: string, planId: string, planName: string, seq: number, sampleCode: string, kind: 'sample' | 'standardisation' | 'check', vesselId: string
  sampleName: string | null, plannedSampleMassG: number, aid: { name: string, massG: number } | null, fuse: { wire: string, lengthCm: number | null, massG: number | null } | null
}
export interface QueueRun extends RunBits {
  fillPressureMPa: number, status: string, verdict: string, heatReleaseJ: number
  topFinding: { code: string, severity: 'block' | 'approval' | 'info', message: string } | null
  signatures: { id: string, signerName: string, meaning: string, signedAt: string, current: boolean }[]
}
export interface FiredRun extends RunBits {
  firing: { id: string, outcome: string, weighedMassG: number, aidMassG: number | null, observations: string, firedAt: string, firedByName: string }
  result: ResultView | null
}
/** The firing route's answer, as the client receives it. */
export type FiringAnswer = InternalApi['/api/runs/:id/firing']['post']

export const OUTCOMES = [
  { value: 'complete', label: 'Complete', hint: 'burnt cleanly: no soot, no unburnt sample' },
  { value: 'incomplete', label: 'Incomplete', hint: 'soot or unburnt residue: no valid result' },
  { value: 'misfire', label: 'Misfire', hint: 'did not ignite' },
  { value: 'leak', label: 'Leak', hint: 'gas escaped: locks the vessel out' },
  { value: 'overpressure', label: 'Overpressure', hint: 'pressure event: locks the vessel out' },
] as const

export const KIND_LABELS: Record<string, string> = { sample: 'Sample', standardisation: 'Standardisation', check: 'Check run' }

/** A fresh random Idempotency-Key; getRandomValues also works where randomUUID is missing (plain http on a LAN address). */
export function newIdempotencyKey(): string {
  if (typeof crypto.randomUUID === 'function') return crypto.randomUUID()
  return Array.from(crypto.getRandomValues(new Uint8Array(16)), b => b.toString(16).padStart(2, '0')).join('')
}
