// The kinds of servicing record in the lab's words (server/utils/services.ts holds the rules).
export const SERVICE_KIND_LABELS: Record<string, string> = {
  'routine': 'Routine seal service',
  'requalification': 'Requalification',
  'inspection': 'Inspection',
  'repair': 'Repair',
  'lock-out': 'Lock-out',
  'return-to-service': 'Return to service',
  'sent-away': 'Sent away',
}
export const SURFACE_LABELS: Record<string, string> = { good: 'Good', worn: 'Worn (serviceable)', damaged: 'Damaged', corroded: 'Corroded' }
export const SEAL_POSITION_LABELS: Record<string, string> = { head: 'Head', valve: 'Valve', electrode: 'Electrode', other: 'Other' }
