// What the sample page shows of the runs that test a sample and of its certificates (GET /api/samples/:id).
export interface SampleRun {
  id: string, planId: string, planName: string, seq: number, status: string, verdict: string, vesselName: string, day: string | null, dayOrder: number | null
  outcome: string | null, result: { id: string, status: string, grossJPerG: number | null } | null
}
export interface SampleReport { id: string, reportNumber: number, issuedAt: string, download: string }
