// The firings a vessel's accepted day plans book ahead (GET /api/vessels/:id, field dayPlanForecast).
export interface DayPlanForecast {
  days: { day: string, firings: number }[]
  plannedFirings: number
  dueAt: string
  by: 'firings' | 'calendar'
  firingsUntilService: number
  firingsLeftAfter: number
}
