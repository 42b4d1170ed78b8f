// Photos and certificates attached to servicing records, kept through Nitro's storage layer
// (mount `uploads`, nuxt.config.ts → nitro.storage). The type is read from the content, never the name.
import { randomUUID } from 'node:crypto'
import { and, inArray, isNull, lt } from 'drizzle-orm'
import fsDriver from 'unstorage/drivers/fs'
import type { attachments } from '../database/schema'

export type AttachmentRow = typeof attachments.$inferSelect

export interface UploadType {
  contentType: 'image/jpeg' | 'image/png' | 'image/webp' | 'application/pdf'
  ext: 'jpg' | 'png' | 'webp' | 'pdf'
  /** Extensions a sanitised name may keep for this type. */
  exts: readonly string[]
  image: boolean
}

export const UPLOAD_TYPES: readonly UploadType[] = [
  { contentType: 'image/jpeg', ext: 'jpg', exts: ['jpg', 'jpeg'], image: true },
  { contentType: 'image/png', ext: 'png', exts: ['png'], image: true },
  { contentType: 'image/webp', ext: 'webp', exts: ['webp'], image: true },
  { contentType: 'application/pdf', ext: 'pdf', exts: ['pdf'], image: false },
]

/** How many files one upload request may carry. */
export const MAX_FILES_PER_UPLOAD = 10

const ascii = (s: string) => Array.from(s, c => c.charCodeAt(0))
const SIGNATURES: { type: UploadType['contentType'], at: number, bytes: number[] }[][] = [
  // JPEG: SOI marker FF D8 followed by another marker FF (ISO/IEC 10918-1, Annex B).
  [{ type: 'image/jpeg', at: 0, bytes: [0xFF, 0xD8, 0xFF] }],
  // PNG: the eight-byte signature (PNG specification, ISO/IEC 15948 §5.2).
  [{ type: 'image/png', at: 0, bytes: [0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A] }],
  // WebP: a RIFF container whose form type is "WEBP" (RFC 9649 §2).
  [{ type: 'image/webp', at: 0, bytes: ascii('RIFF') }, { type: 'image/webp', at: 8, bytes: ascii('WEBP') }],
  // PDF: the header "%PDF-" (ISO 32000-1 §7.5.2).
  [{ type: 'application/pdf', at: 0, bytes: ascii('%PDF-') }],
]

/** The accepted type of a file from its first bytes, or null (an executable renamed photo.jpg stays an executable). */
export function detectUploadType(data: Uint8Array): UploadType | null {
  for (const parts of SIGNATURES) {
    if (parts.every(p => p.bytes.every((b, i) => data[p.at + i] === b))) return UPLOAD_TYPES.find(t => t.contentType === parts[0]!.type) ?? null
  }
  return null
}

/**
 * A name safe to show and to send in a header: the last path part only, ASCII letters, digits, dot,
 * dash, underscore and space, no leading dots, at most 100 characters, ending in the detected type's extension.
 */
export function sanitizeFileName(name: string | undefined, type: UploadType): string {
  const last = (name ?? '').split(/[\\/]/).pop() ?? ''
  let stem = last.normalize('NFKD').replace(/[\u0300-\u036F]/g, '').replace(/[^\w. -]+/g, '_')
  const dot = stem.lastIndexOf('.')
  const ext = dot > 0 ? stem.slice(dot + 1).toLowerCase() : ''
  // A known extension of the detected type stays; any other (e.g. ".exe", or ".jpg" on a PNG) is replaced.
  if (dot > 0 && (type.exts.includes(ext) || /^[a-z0-9]{1,5}$/.test(ext))) stem = stem.slice(0, dot)
  stem = stem.replace(/\s+/g, ' ').replace(/_{2,}/g, '_').replace(/^[\s._-]+|[\s._-]+$/g, '').slice(0, 100).trim()
  return `${stem || 'upload'}.${type.exts.includes(ext) ? ext : type.ext}`
}

/** Storage key of a new upload: the vessel it belongs to, then a random name (never the uploader's file name). */
export function newStorageKey(vesselId: string, type: UploadType): string {
  return `vessel:${vesselId}:${randomUUID()}.${type.ext}`
}

export const storageKeyPrefix = (vesselId: string) => `vessel:${vesselId}:`

let remount: Promise<void> | undefined

/**
 * The `uploads` storage. EMBERLINE_UPLOAD_DIR at run time moves the filesystem store without a rebuild
 * (the build's default is nuxt.config.ts → nitro.storage.uploads).
 */
export async function uploadStorage() {
  const dir = process.env.EMBERLINE_UPLOAD_DIR
  if (dir) {
    remount ??= (async () => {
      await useStorage().unmount('uploads', false)
      useStorage().mount('uploads', fsDriver({ base: dir }))
    })()
    await remount
  }
  return useStorage('uploads')
}

/** Uploads never named by a record within this time are removed (the technician gave up the form). */
export const ORPHAN_UPLOAD_HOURS = 24

/** Removes uploads that no record took up within ORPHAN_UPLOAD_HOURS: the row, then its stored file. */
export async function discardOrphanUploads(now = new Date()): Promise<number> {
  const a = schema.attachments
  const cutoff = new Date(now.getTime() - ORPHAN_UPLOAD_HOURS * 3_600_000)
  const gone = await useDb().transaction(async (tx) => {
    const rows = await tx.select().from(a).where(and(isNull(a.serviceId), isNull(a.sampleId), lt(a.createdAt, cutoff))).limit(200).for('update', { skipLocked: true })
    if (!rows.length) return []
    await tx.delete(a).where(and(inArray(a.id, rows.map(r => r.id)), isNull(a.serviceId), isNull(a.sampleId)))
    await audit(tx, null, { action: 'attachment.discard', entity: 'attachment', entityId: null, oldValues: rows.map(r => ({ id: r.id, fileName: r.fileName, storageKey: r.storageKey })), reason: `not part of any servicing record after ${ORPHAN_UPLOAD_HOURS} h` })
    return rows
  })
  const storage = await uploadStorage()
  await Promise.allSettled(gone.map(r => storage.removeItem(r.storageKey)))
  return gone.length
}

/** What the API shows of an attachment (the storage key stays on the server). */
export function attachmentView(a: AttachmentRow) {
  return {
    id: a.id,
    serviceId: a.serviceId,
    fileName: a.fileName,
    contentType: a.contentType,
    sizeBytes: a.sizeBytes,
    image: a.contentType.startsWith('image/'),
    url: `/api/attachments/${a.id}`,
    createdAt: a.createdAt,
  }
}
export type AttachmentView = ReturnType<typeof attachmentView>
