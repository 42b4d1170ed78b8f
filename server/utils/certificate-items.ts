// The items a certificate must carry about the client and the item (ISO/IEC 17025:2017 §7.8.2.1), kept apart from the
// certificate's results so that each can change alone: the receipt record behind a lab code, and what is missing.
import { eq } from 'drizzle-orm'
import type { CertificateContent } from './certificate'

export interface CertificateReceipt {
  clientName: string
  contactName: string | null
  contactEmail: string | null
  address: string | null
  labCode: string
  clientReference: string | null
  description: string
  condition: string | null
  receivedAt: string
}

export const ITEM_TESTED_STATEMENT = 'The results relate only to the item tested, as received.'

/** The receipt of the sample behind a lab code, or null when the code was typed on a plan and never received. */
export async function certificateReceipt(db: Db | Tx, sampleCode: string): Promise<{ sampleId: string | null, receipt: CertificateReceipt | null }> {
  const [row] = await db.select({ s: schema.samples, c: schema.clients }).from(schema.samples)
    .innerJoin(schema.clients, eq(schema.clients.id, schema.samples.clientId)).where(eq(schema.samples.labCode, sampleCode))
  if (!row) return { sampleId: null, receipt: null }
  return {
    sampleId: row.s.id,
    receipt: {
      clientName: row.c.name, contactName: row.c.contactName, contactEmail: row.c.contactEmail, address: row.c.address,
      labCode: row.s.labCode, clientReference: row.s.clientReference, description: row.s.description, condition: row.s.condition,
      receivedAt: row.s.receivedAt.toISOString(),
    },
  }
}

/** Every item the standard asks for that the certificate would lack, in words a supervisor can act on; empty when complete. */
export function missingCertificateItems(content: CertificateContent, receipt: CertificateReceipt | null): string[] {
  const missing: string[] = []
  if (!receipt) {
    missing.push(`the receipt record of ${content.sampleCode} (client, client's reference, description and condition as received, date of receipt): receive the sample under Samples and plan it from the queue`)
  }
  else {
    if (!receipt.contactName && !receipt.contactEmail) missing.push(`a contact person or e-mail for ${receipt.clientName} (Clients)`)
    if (!receipt.clientReference) missing.push('the client\'s reference of the item')
    if (!receipt.condition) missing.push('the condition of the item as received')
  }
  if (!content.testedFrom) missing.push('the dates of testing (no firing on record)')
  if (!content.method.length) missing.push('the method')
  if (!content.rows.length) missing.push('results with their units')
  if (!content.rows.some(r => r.expandedUncertaintyJPerG !== null)) missing.push('the measurement uncertainty of the result')
  // Duplicate agreement is checked before this list: a single determination is refused (409) unless the policy allows it.
  if (!content.signers.length) missing.push('the authorised signatory of the results')
  return missing
}

/** The content with the receipt items and the statement that the results relate only to the item tested. */
export function withReceiptItems<T extends CertificateContent>(content: T, receipt: CertificateReceipt) {
  const statements = content.statements.includes(ITEM_TESTED_STATEMENT) ? content.statements : [ITEM_TESTED_STATEMENT, ...content.statements]
  return { ...content, receipt, sampleDescription: receipt.description, statements }
}
