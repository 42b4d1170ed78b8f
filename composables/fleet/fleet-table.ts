import type { VesselState } from '#shared/domain/vessel-state'


export interface FleetVessel {
  id: string, name: string, class: string, location: string, state: VesselState, stateReasons: string[], conditionReason: string | null
  firingsSinceService: number, serviceIntervalFirings: number, firingsSinceRequalification: number, requalificationIntervalFirings: number, firingsTotal: number
  serviceDueAt: string, daysUntilService: number
  forecast: { firingsInWindow: number, windowDays: number, firingsPerWeek: number, serviceDueForecastAt: string | null, decidedBy: 'firings' | 'calendar' | null, dayPlans?: { dueAt: string, plannedFirings: number } | null }
}
