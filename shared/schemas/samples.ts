// Clients and sample receipt: what the receipt form sends and the words for a sample's states.
import { z } from 'zod'

export const SAMPLE_STATUSES = ['received', 'planned', 'tested', 'reported', 'rejected'] as const
export type SampleStatus = typeof SAMPLE_STATUSES[number]

export const SAMPLE_STATUS_LABELS: Record<SampleStatus, string> = {
  received: 'Waiting (received)',
  planned: 'Planned',
  tested: 'Tested',
  reported: 'Reported',
  rejected: 'Rejected at receipt',
}

const optionalText = (max: number) => z.string().trim().max(max).optional().transform(v => (v ? v : undefined))

export const clientCreateSchema = z.object({
  name: z.string().trim().min(1, 'required').max(200),
  contactName: optionalText(200),
  contactEmail: z.string().trim().max(254).optional().transform(v => (v ? v : undefined)).pipe(z.email('an e-mail address').optional()),
  address: optionalText(1000),
}).strict()
export type ClientCreate = z.infer<typeof clientCreateSchema>

export const sampleReceiptSchema = z.object({
  clientId: z.string().uuid('choose a client'),
  clientReference: optionalText(120),
  description: z.string().trim().min(1, 'say what arrived').max(2000),
  materialId: z.string().uuid('a material id (UUID)').optional(),
  receivedAt: z.iso.datetime({ offset: true, message: 'a date and time (ISO 8601 with a time zone)' }),
  condition: optionalText(500),
  receivedMassG: z.number().positive('above 0 g').max(100_000, 'at most 100 kg').optional(),
  note: z.string().trim().max(2000).default(''),
}).strict()
export type SampleReceipt = z.infer<typeof sampleReceiptSchema>

export const sampleRejectSchema = z.object({
  reason: z.string().trim().min(3, 'say why the sample is refused').max(2000),
}).strict()

/** A lab code: PREFIX-YEAR-NNNNN, the number from a database sequence that never repeats (e.g. KR-2026-00042). */
export function formatLabCode(prefix: string, year: number, n: number): string {
  return `${prefix}-${year}-${String(n).padStart(5, '0')}`
}

/** The code's prefix from the lab's name: the initials of its first two words ("Kestrel Ridge Fuels Laboratory" → "KR"). */
export function labCodePrefix(labName: string): string {
  const initials = labName.normalize('NFKD').replace(/[^A-Za-z\s]/g, '').split(/\s+/).filter(Boolean).slice(0, 2).map(w => w[0]!.toUpperCase()).join('')
  return initials || 'S'
}

/** True when text typed into a search box looks like a lab code (a bench scanner types it followed by Enter). */
export const LAB_CODE_PATTERN = /^[A-Z]{1,6}-\d{4}-\d{5,}$/
