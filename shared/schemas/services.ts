// What each kind of servicing record holds (write schema, shared by the service form and the server).
import { z } from 'zod'

export const SERVICE_KINDS = ['routine', 'requalification', 'inspection', 'repair', 'lock-out', 'return-to-service', 'sent-away'] as const
export type ServiceKind = typeof SERVICE_KINDS[number]
export const SEAL_POSITIONS = ['head', 'valve', 'electrode', 'other'] as const
export const SURFACE_CONDITIONS = ['good', 'worn', 'damaged', 'corroded'] as const
const text = (max: number) => z.string().trim().max(max, `at most ${max} characters`)
const needed = (max: number, what: string) => text(max).min(1, what)
const dateTime = z.iso.datetime({ offset: true, error: 'a date-time with its offset, e.g. 2026-11-30T14:00:00Z' })
const day = z.iso.date({ error: 'a date as YYYY-MM-DD' })
const part = z.object({
  part: needed(120, 'name the part'),
  lot: needed(60, 'the lot number of the part'),
  quantity: z.number().int('a whole number').min(1, 'at least 1').max(1000).default(1),
}).strict()

const common = {
  performedAt: dateTime,
  password: z.string().min(1, 'your password signs this record').max(1024),
  notes: text(4000).default(''),
  correctsId: z.string().uuid('the id of the record this corrects').optional(),
  attachmentIds: z.array(z.string().uuid('an attachment id (UUID)')).max(20, 'at most 20 files').default([]),
}

export const serviceInputSchema = z.discriminatedUnion('kind', [
  z.object({
    kind: z.literal('routine'),
    ...common,
    seals: z.array(z.object({
      position: z.enum(SEAL_POSITIONS),
      name: needed(80, 'name the seal'),
      renewed: z.boolean(),
      lot: text(60).default(''),
    }).strict()).min(1, 'list the vessel\'s seals').max(30),
    valveSeatRenewed: z.boolean(),
    electrodeInsulators: z.enum(['inspected', 'renewed']),
    packingNutTorqueNm: z.number().positive('above 0').max(100, 'at most 100 N·m'),
    electrodeResistanceOhm: z.number().min(0, 'at least 0').max(10_000_000),
    leakTest: z.object({
      passed: z.boolean(),
      pressureMPa: z.number().positive('above 0').max(20, 'at most 20 MPa'),
      where: text(300).default(''),
    }).strict(),
    sealingSurfaces: z.enum(SURFACE_CONDITIONS),
    threads: z.enum(SURFACE_CONDITIONS),
    partsUsed: z.array(part).max(50).default([]),
  }).strict(),
  z.object({
    kind: z.literal('requalification'),
    ...common,
    body: needed(160, 'name the outside body that tested the vessel'),
    certificateNumber: needed(80, 'the certificate number'),
    testPressureMPa: z.number().positive('above 0').max(200, 'at most 200 MPa'),
    testedFrom: day,
    testedTo: day,
    passed: z.boolean(),
    findings: text(4000).default(''),
  }).strict(),
  z.object({
    kind: z.literal('inspection'),
    ...common,
    findings: needed(4000, 'say what was inspected and found'),
    damageOrCorrosionSeen: z.boolean(),
  }).strict(),
  z.object({
    kind: z.literal('repair'),
    ...common,
    description: needed(4000, 'say what was repaired'),
    partsUsed: z.array(part).max(50).default([]),
  }).strict(),
  z.object({ kind: z.literal('lock-out'), ...common, reason: text(1000).min(3, 'say why the vessel is locked out') }).strict(),
  z.object({ kind: z.literal('return-to-service'), ...common, reason: text(1000).min(3, 'say what ended the lock-out') }).strict(),
  z.object({
    kind: z.literal('sent-away'),
    ...common,
    destination: needed(160, 'where the vessel goes'),
    purpose: text(300).default('requalification'),
  }).strict(),
], { error: `kind must be one of ${SERVICE_KINDS.join(', ')}` })

export type ServiceInput = z.output<typeof serviceInputSchema>
