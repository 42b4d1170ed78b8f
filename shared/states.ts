// The fixed values of stored status and kind columns that have no home in a domain file. The database refuses any
// other value (CHECK constraints in server/database/schema.ts are built from these same arrays).

/** What a row of `signatures` is on. */
export const SIGNATURE_ENTITIES = ['run', 'result', 'energy-equivalent', 'aid-value', 'vessel'] as const
export type SignatureEntity = typeof SIGNATURE_ENTITIES[number]

/** What a signature means, in the words the signer agreed to. */
export const SIGNATURE_MEANINGS = {
  approve: 'approved as an exception',
  reject: 'rejected',
  resultSignOff: 'result signed off',
  standardisation: 'standardisation series accepted',
  aidValue: 'aid value series accepted',
} as const
export type SignatureMeaning = typeof SIGNATURE_MEANINGS[keyof typeof SIGNATURE_MEANINGS]

/** A result revision is signed off or not. */
export const RESULT_STATUSES = ['unsigned', 'signed'] as const
export type ResultStatus = typeof RESULT_STATUSES[number]

/** An outbox message: waiting (or retrying), sent, or given up. */
export const MAIL_STATUSES = ['pending', 'sent', 'failed'] as const
export type MailStatus = typeof MAIL_STATUSES[number]

/** Why a password was checked (both count towards the same throttle). */
export const PASSWORD_CHECK_PURPOSES = ['sign-in', 'signature'] as const
export type PasswordCheckPurpose = typeof PASSWORD_CHECK_PURPOSES[number]

/** Why a server-side session ended. */
export const SESSION_END_REASONS = ['sign-out', 'expired', 'password-change', 'password-reset', 'role-change', 'disabled', 'ended-by-user', 'ended-by-admin'] as const
export type SessionEndReason = typeof SESSION_END_REASONS[number]
