import { formatSpecificEnergy, type SpecificEnergyUnit } from '#shared/domain/specific-energy'

// Shapes of the results API as the pages read them; the values are those shared/domain/results computes.
import type { Basis, ByBasis, ResultValues } from '#shared/domain/results'

export type { Basis, ByBasis, ResultValues }
export type ResultNote = ResultValues['notes'][number]
export type UncertaintyBudget = NonNullable<ResultValues['uncertainty']>
export type UncertaintyByBasis = NonNullable<ResultValues['expandedUncertaintyByBasis']>
export interface ResultView {
  id: string, runId: string, firingId: string, vesselId: string, vesselName: string | null, sampleCode: string, kind: 'sample' | 'standardisation' | 'check'
  revision: number, supersedesId: string | null, current: boolean, inputs: Record<string, unknown>, values: ResultValues, energyEquivalentId: string | null
  status: 'unsigned' | 'signed', reason: string | null, createdBy: string, createdByName: string | null, createdAt: string
  firedAt: string | null, firedBy: string | null, firedByName: string | null
  signature: { id: string, signerName: string, meaning: string, reason: string, signedAt: string, valid: boolean } | null
}
export interface DuplicateSummary {
  sampleCode: string, status: 'needs-duplicate' | 'accepted' | 'third-determination-needed' | 'median-flagged' | 'review-needed'
  value: number | null, method: 'mean' | 'median' | null, range: number | null, limit: number | null, n: number, message: string
  resultIds: string[], signed: boolean
  provisional: string[]
  reported: {
    grossJPerG: ByBasis, netConstantPressureJPerG: ByBasis, netConstantVolumeJPerG: ByBasis, expandedUncertaintyJPerG: number | null
    expandedUncertaintyByBasis: UncertaintyByBasis | null, mineralMatterFreeDryJPerG: number | null
  }
}

export const BASIS_LABELS: Record<Basis, string> = { 'as-received': 'As received', 'air-dried': 'As determined', 'dry': 'Dry', 'dry-ash-free': 'Dry, ash-free' }
export const BASIS_ORDER: Basis[] = ['as-received', 'air-dried', 'dry', 'dry-ash-free']

/** A value in J/g written in the display unit: number and unit apart, for the table cells. */
export function inUnit(jPerG: number | null | undefined, unit: SpecificEnergyUnit): { number: string, unit: string } {
  if (jPerG === null || jPerG === undefined || !Number.isFinite(jPerG)) return { number: '—', unit: '' }
  const [number, ...rest] = formatSpecificEnergy(jPerG, unit).split(' ')
  return { number: number ?? '', unit: rest.join(' ') }
}
