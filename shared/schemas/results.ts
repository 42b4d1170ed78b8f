// What an analyst enters for a fired run; the server validates it and shared/domain/results computes the result from it.
import { z } from 'zod'

const pct = (what: string) => z.number({ error: `${what} in mass-%` }).min(0, 'not negative').lt(100, 'below 100 %')

export const thermogramInputSchema = z.object({
  csv: z.string({ error: 'the thermogram as CSV text' }).min(1, 'the thermogram is empty').max(5_000_000, 'at most 5 MB of text'),
  fileName: z.string().trim().max(200).optional(),
  ignitionTimeS: z.number().min(0, 'not negative').optional(),
  mainPeriodEndTimeS: z.number().min(0, 'not negative').optional(),
  method: z.enum(['regnault-pfaundler', 'dickinson']).default('regnault-pfaundler'),
}).strict()

const resultFields = {
  temperatureRiseK: z.number({ error: 'the corrected temperature rise in K' }).positive('above 0 K').max(20, 'at most 20 K').optional(),
  thermogram: thermogramInputSchema.optional(),
  sampleMassG: z.number().positive('above 0 g').max(100, 'at most 100 g').optional(),
  fuse: z.object({
    wire: z.enum(['nichrome', 'iron', 'platinum', 'cotton']),
    burntLengthCm: z.number().min(0, 'not negative').max(100, 'at most 100 cm').optional(),
    cottonMassG: z.number().min(0, 'not negative').max(1, 'at most 1 g').optional(),
  }).strict().optional(),
  acid: z.object({
    /** Total acid by titration of the washings (counted as nitric acid). */
    titrantMl: z.number().min(0, 'not negative').max(500, 'at most 500 mL').optional(),
    titrantJPerMl: z.number().positive('above 0').max(100, 'at most 100 J/mL').optional(),
    /** Nitric acid alone, as determined (e.g. ion chromatography). */
    nitricAcidMol: z.number().min(0, 'not negative').max(1, 'at most 1 mol').optional(),
    /** Nitric acid alone, as the method's fixed value. */
    nitricAcidFixedJ: z.number().min(0, 'not negative').max(1000, 'at most 1000 J').optional(),
  }).strict().optional(),
  sulfurPct: pct('sulfur of the analysis sample').optional(),
  chlorinePct: pct('chlorine of the analysis sample').optional(),
  chlorineSource: z.string().trim().min(3, 'name where the chlorine figure comes from').max(200).optional(),
  aidMassG: z.number().min(0, 'not negative').max(20, 'at most 20 g').optional(),
  aidHeatingValueJPerG: z.number().positive('above 0').max(150_000).optional(),
  aidUncertaintyJPerG: z.number().min(0, 'not negative').max(10_000, 'at most 10,000 J/g').optional(),
  moistureAdPct: pct('moisture of the analysis sample').optional(),
  moistureArPct: pct('total moisture as received').optional(),
  hydrogenDryPct: pct('hydrogen, dry basis').optional(),
  oxygenDryPct: pct('oxygen, dry basis').optional(),
  nitrogenDryPct: pct('nitrogen, dry basis').optional(),
  ashDryPct: pct('ash, dry basis').optional(),
  certifiedValueJPerG: z.number().positive('above 0').max(100_000).optional(),
  uncertainty: z.object({
    temperatureRiseK: z.number().min(0).max(1).optional(),
    sampleMassG: z.number().min(0).max(1).optional(),
    fuseJ: z.number().min(0).max(10_000).optional(),
    acidJ: z.number().min(0).max(10_000).optional(),
    sulfurJ: z.number().min(0).max(10_000).optional(),
    aidJ: z.number().min(0).max(100_000).optional(),
  }).strict().optional(),
  note: z.string().trim().max(2000).default(''),
}

type RawInputs = z.output<z.ZodObject<typeof resultFields>>

function checkInputs(v: RawInputs, ctx: z.RefinementCtx) {
  if (v.temperatureRiseK === undefined && !v.thermogram) ctx.addIssue({ code: 'custom', path: ['temperatureRiseK'], message: 'give the corrected temperature rise or a thermogram' })
  if (v.temperatureRiseK !== undefined && v.thermogram) ctx.addIssue({ code: 'custom', path: ['temperatureRiseK'], message: 'give either the temperature rise or a thermogram, not both' })
  if (v.fuse?.wire === 'cotton' && v.fuse.cottonMassG === undefined) ctx.addIssue({ code: 'custom', path: ['fuse', 'cottonMassG'], message: 'the mass of cotton thread burnt' })
  if (v.fuse && v.fuse.wire !== 'cotton' && v.fuse.burntLengthCm === undefined) ctx.addIssue({ code: 'custom', path: ['fuse', 'burntLengthCm'], message: 'the length of wire burnt' })
  if (v.acid) {
    const titration = v.acid.titrantMl !== undefined || v.acid.titrantJPerMl !== undefined
    const nitric = v.acid.nitricAcidMol !== undefined || v.acid.nitricAcidFixedJ !== undefined
    if (titration && nitric) ctx.addIssue({ code: 'custom', path: ['acid'], message: 'give the total-acid titration or the nitric acid alone, not both' })
    if (v.acid.nitricAcidMol !== undefined && v.acid.nitricAcidFixedJ !== undefined) ctx.addIssue({ code: 'custom', path: ['acid', 'nitricAcidFixedJ'], message: 'give the nitric acid determined or the method\'s fixed value, not both' })
    if (titration && (v.acid.titrantMl === undefined || v.acid.titrantJPerMl === undefined)) {
      ctx.addIssue({ code: 'custom', path: ['acid', v.acid.titrantMl === undefined ? 'titrantMl' : 'titrantJPerMl'], message: 'the titration needs both the volume and the energy per mL' })
    }
    if (titration && v.chlorinePct !== undefined) ctx.addIssue({ code: 'custom', path: ['chlorinePct'], message: 'a total-acid titration already counts the hydrochloric acid: give the nitric acid alone to correct for chlorine' })
  }
  if (v.chlorinePct !== undefined && v.chlorineSource === undefined) ctx.addIssue({ code: 'custom', path: ['chlorineSource'], message: 'name where the chlorine figure comes from (method, report)' })
  if (v.aidUncertaintyJPerG !== undefined && v.aidHeatingValueJPerG === undefined) ctx.addIssue({ code: 'custom', path: ['aidUncertaintyJPerG'], message: 'an uncertainty belongs to an entered aid heating value' })
}

export const resultInputSchema = z.object(resultFields).strict().superRefine(checkInputs)
export type ResultInputs = z.output<typeof resultInputSchema>

export const resultReviseSchema = z.object({ ...resultFields, reason: z.string().trim().min(3, 'say why the result is revised').max(2000) }).strict().superRefine(checkInputs)
