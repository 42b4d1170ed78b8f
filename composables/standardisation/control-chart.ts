// Shapes of the charts in GET /api/standardisation/:vesselId (server/utils/standardisation.ts).
export interface ChartPoint { resultId: string, sampleCode: string, firedAt: string | null, value: number, zone: string, violations: string[] }
export interface ChartLimits { centre: number, sigma: number, upperWarning: number, lowerWarning: number, upperAction: number, lowerAction: number }
export type ChartView =
  | { ok: true, unit: string, limits: ChartLimits, basis: string, points: ChartPoint[], violations: string[], outOfControl: boolean, band?: { lower: number, upper: number, label: string } }
  | { ok: false, unit: string, reason: string, points: ChartPoint[], band?: { lower: number, upper: number, label: string } }
