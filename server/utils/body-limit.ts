// Request body ceilings, one table for every route (server/middleware/00.body-limit.ts enforces them on the stream,
// chunked or not, before anything parses the body). Sizes in bytes.
import type { H3Event } from 'h3'

export const JSON_BODY_LIMIT = 64 * 1024
export const PLAN_IMPORT_BODY_LIMIT = 4 * 1024 * 1024
export const RESULT_BODY_LIMIT = 6 * 1024 * 1024
// Multipart framing allowance beside the files of an upload.
export const UPLOAD_FRAMING_BYTES = 64 * 1024

const UUID = '[0-9a-fA-F-]{36}'
const LARGER: [RegExp, number, string][] = [
  [new RegExp(`^/api/plans/${UUID}/import$`), PLAN_IMPORT_BODY_LIMIT, 'a plan import (CSV of at most 1 MB)'],
  [new RegExp(`^/api/runs/${UUID}/result$`), RESULT_BODY_LIMIT, 'a result with its thermogram'],
  [new RegExp(`^/api/results/${UUID}/revise$`), RESULT_BODY_LIMIT, 'a result revision with its thermogram'],
]
const UPLOAD = new RegExp(`^/api/vessels/${UUID}/attachments$`)

export const formatBytes = (n: number) => (n >= 1_048_576 ? `${(n / 1_048_576).toLocaleString('en-GB', { maximumFractionDigits: 2 })} MB` : `${Math.round(n / 1024)} kB`)

/** The largest body this request may send, and what the route takes (for the 413 message). */
export async function bodyCeiling(event: H3Event): Promise<{ limit: number, what: string }> {
  const path = (event.path.split('?')[0] ?? '').replace(/\/+$/, '')
  if (UPLOAD.test(path)) {
    const { uploadMaxBytes } = await getPolicy()
    return { limit: uploadMaxBytes * MAX_FILES_PER_UPLOAD + UPLOAD_FRAMING_BYTES, what: `an upload (at most ${MAX_FILES_PER_UPLOAD} files of ${formatBytes(uploadMaxBytes)} each, the lab policy's limit)` }
  }
  for (const [re, limit, what] of LARGER) if (re.test(path)) return { limit, what }
  return { limit: JSON_BODY_LIMIT, what: 'this request' }
}
