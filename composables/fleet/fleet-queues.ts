import type { FleetVessel } from '~/composables/fleet/fleet-table'

export interface QueueRun {
  id: string, planId: string, seq: number, sampleCode: string, kind: string, status: string, verdict: string
  fillPressureMPa: number, planName: string, plannerName: string, vesselName: string, ownRun: boolean
}
export interface FleetQueuesData {
  approvals?: { count: number, runs: QueueRun[] }
  ready?: { count: number, runs: QueueRun[] }
  attention?: { count: number, vessels: FleetVessel[] }
}
