

/** A servicing record as stored (server/utils/services.ts): the fields of its kind, its effect and signature. */
export interface ServiceRecordBody {
  seals?: { position: string, name: string, renewed: boolean, lot?: string }[]
  valveSeatRenewed?: boolean
  electrodeInsulators?: string
  packingNutTorqueNm?: number
  electrodeResistanceOhm?: number
  electrodeResistanceLimitOhm?: number
  leakTest?: { passed: boolean, pressureMPa: number, where?: string }
  sealingSurfaces?: string
  threads?: string
  partsUsed?: { part: string, lot: string, quantity: number }[]
  body?: string
  certificateNumber?: string
  testPressureMPa?: number
  testedFrom?: string
  testedTo?: string
  passed?: boolean
  findings?: string
  damageOrCorrosionSeen?: boolean
  description?: string
  reason?: string
  destination?: string
  purpose?: string
  notes?: string
  effect?: { condition?: string, lockCause?: string | null, checksPassed?: boolean, message?: string }
  signature?: { signerName: string, signedAt: string, meaning: string }
}

export interface ServiceItem {
  id: string
  kind: string
  performedAt: string
  record: ServiceRecordBody
  signerName: string
  signedAt: string
  correctsId: string | null
  correctedById: string | null
  attachments: import('~/composables/vessel/attachments').AttachmentItem[]
}
