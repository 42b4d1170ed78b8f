// The client and receipt lines of the certificate's header block.
import type { CertificateReceipt } from './certificate-items'

export function receiptFields(r: CertificateReceipt, field: (label: string, value: string) => void) {
  field('Client', [r.clientName, r.address].filter(Boolean).join(', '))
  field('Contact', [r.contactName, r.contactEmail].filter(Boolean).join(', '))
  if (r.clientReference) field('Client\'s reference', r.clientReference)
  field('Received', `${r.receivedAt.slice(0, 10)}${r.condition ? `, condition: ${r.condition}` : ''}`)
}
