import { beforeAll, describe, expect, it } from 'vitest'
import { as, baseURL, call, unique } from '../support/api'
import { auditRows } from '../support/db'
import { newClient, receive } from '../support/samples'
import { BA_J_PER_G, FUSE_10CM_J, PASSWORD, benzoicAcidId, enterResult, fire, readyRuns, standardisedVessel } from '../unit/bench/bench-api'
import { pdfText } from '../unit/bench/pdf-text'

// The certificate carries what ISO/IEC 17025:2017 §7.8.2.1 asks for — client and contact, the lab code and the client's
// reference, the item's description and condition, the date of receipt, dates of testing, method, results with units and
// uncertainty, duplicate agreement, the signatory and "results relate only to the item tested" — and is refused without them.
// Benzoic acid as the unknown: 26 454 J/g weighed in air (NIST SRM 39j certificate); ε = 10 000 J/K (as results.test.ts).
const EPS = 10_000
const FUSE = { wire: 'nichrome', burntLengthCm: 10 }
let vesselId: string
let ba: string
beforeAll(async () => {
  vesselId = (await standardisedVessel([10_000, 10_005, 9_995, 10_002, 9_998])).vessel.id
  ba = await benzoicAcidId()
})

async function signedResult(code: string, q: number, m = 0.8) {
  const [run] = await readyRuns(vesselId, [{ sampleCode: code, materialId: ba, massG: m }])
  expect((await fire(run!.id, { weighedMassG: m })).status).toBe(201)
  const res = await enterResult(run!.id, { temperatureRiseK: (m * q + FUSE_10CM_J) / EPS, fuse: FUSE, moistureAdPct: 0 })
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  const signed = await call('POST', `/api/results/${res.body.result.id}/sign`, { cookie: await as('supervisor'), body: { password: PASSWORD, reason: 'checked' } })
  expect(signed.status).toBe(200)
}

const issue = async (sampleCode: string) => call('POST', '/api/reports', { cookie: await as('supervisor'), body: { sampleCode } })

describe('certificate items', () => {
  it('refuses a code that was never received, naming the receipt record', async () => {
    const code = unique('TYPED')
    await signedResult(code, BA_J_PER_G)
    await signedResult(code, BA_J_PER_G + 40)
    const res = await issue(code)
    expect(res.status).toBe(422)
    expect(res.body.data.missing[0]).toMatch(/the receipt record of/)
  })

  it('refuses while the condition, the client\'s reference or the contact is missing', async () => {
    const bare = await newClient({ contactName: undefined, contactEmail: undefined })
    const s = await receive(bare.id, { condition: undefined, clientReference: undefined })
    // Agreeing duplicates, so that only the receipt items are missing (a single determination is refused earlier, 409).
    await signedResult(s.labCode, BA_J_PER_G)
    await signedResult(s.labCode, BA_J_PER_G)
    const res = await issue(s.labCode)
    expect(res.status).toBe(422)
    expect(res.body.data.missing).toEqual([
      expect.stringMatching(/a contact person or e-mail/),
      'the client\'s reference of the item',
      'the condition of the item as received',
    ])
    expect(await auditRows({ action: 'report.issue', since: new Date(Date.now() - 60_000) }).then(r => r.filter(x => x.new_values.sampleCode === s.labCode))).toEqual([])
  })

  it('issues a complete certificate naming the client, the receipt and the item, and marks the sample reported', async () => {
    const client = await newClient({ contactName: 'Imke Rowan', contactEmail: 'imke@client.test', address: '1 Quay Street' })
    const s = await receive(client.id, { clientReference: 'PO-7781', condition: 'sealed, dry' })
    await signedResult(s.labCode, BA_J_PER_G)
    await signedResult(s.labCode, BA_J_PER_G + 40)
    const res = await issue(s.labCode)
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    const text = pdfText(Buffer.from(await (await fetch(`${baseURL()}${res.body.download}`, { headers: { cookie: await as('supervisor') } })).arrayBuffer()))
    for (const item of [client.name, 'Imke Rowan', 'imke@client.test', 'PO-7781', s.labCode, 'sealed, dry', 'Sealed jar of ground coal', 'The results relate only to the item tested', 'Helena Ruiz']) expect(text).toContain(item)
    expect((await call('GET', `/api/samples/${s.id}`, { cookie: await as('analyst') })).body.status).toBe('reported')
    expect(await auditRows({ action: 'sample.report', entityId: s.id })).toHaveLength(1)
  })
})
