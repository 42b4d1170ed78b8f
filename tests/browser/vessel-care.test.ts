import { deflateSync } from 'node:zlib'
import { describe, expect, it } from 'vitest'
import { as, call, DEMO_PASSWORD, unique } from '../support/api'
import { openPage, shot, signInAs } from '../support/browser'
import { benzoicAcidMaterialId } from '../support/factories'

// A real, small PNG drawn here (PNG specification, ISO/IEC 15948: signature, IHDR, zlib IDAT, IEND, CRC-32 per chunk).
function crc32(buf: Buffer) {
  let c = 0xFFFFFFFF
  for (const b of buf) {
    c ^= b
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xEDB88320 ^ (c >>> 1) : c >>> 1
  }
  return (c ^ 0xFFFFFFFF) >>> 0
}
function chunk(type: string, data: Buffer) {
  const out = Buffer.alloc(12 + data.length)
  out.writeUInt32BE(data.length, 0)
  out.write(type, 4, 'latin1')
  data.copy(out, 8)
  out.writeUInt32BE(crc32(out.subarray(4, 8 + data.length)), 8 + data.length)
  return out
}
function sealPhoto(size = 48): Buffer {
  const raw = Buffer.alloc(size * (1 + size * 3))
  for (let y = 0; y < size; y++) {
    for (let x = 0; x < size; x++) {
      const ring = Math.abs(Math.hypot(x - size / 2, y - size / 2) - size / 3) < 2
      raw.set(ring ? [60, 60, 60] : [170, 165, 160], y * (1 + size * 3) + 1 + x * 3)
    }
  }
  const ihdr = Buffer.alloc(13)
  ihdr.writeUInt32BE(size, 0)
  ihdr.writeUInt32BE(size, 4)
  ihdr.set([8, 2, 0, 0, 0], 8)
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A]), chunk('IHDR', ihdr), chunk('IDAT', deflateSync(raw)), chunk('IEND', Buffer.alloc(0))])
}

describe('vessel care in Chromium', () => {
  it('the technician completes a routine service with a photo; the vessel waits for its check run, which returns it to service', async () => {
    // 500 firings since the last service: overdue (common practice).
    const name = unique('Care KR')
    const reg = await call('POST', '/api/vessels', {
      cookie: await as('admin'),
      body: { name, serialNumber: unique('SN'), class: 'standard', ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4.05, volumeMl: 300, location: 'Bench C', initialFiringsSinceService: 500, initialFiringsSinceRequalification: 1200, initialFiringsTotal: 2400 },
    })
    expect(reg.status).toBe(201)
    const id = reg.body.id

    const page = await openPage()
    await signInAs(page, 'technician@emberline.test')
    await page.goto(`/vessels/${id}`)
    await page.locator('main h1', { hasText: name }).waitFor()
    await expect(page.locator('main [data-state]').first().textContent()).resolves.toContain('Service overdue')

    await page.getByRole('button', { name: 'Record servicing' }).first().click()
    await expect(page.getByTestId('vessel-cautions').textContent()).resolves.toMatch(/Never fire a vessel with a failed leak test.*come first/s)
    await page.getByLabel('What you are recording').selectOption('routine')
    // The form refuses to call a partial renewal a routine service until every seal is ticked.
    await expect(page.getByTestId('service-outlook').textContent()).resolves.toMatch(/every seal of the vessel is renewed together/)
    for (const seal of ['Head O-ring', 'Inlet valve seal', 'Outlet valve seal', 'Electrode seal']) await page.getByLabel(`Renewed: ${seal}`).check()
    await page.getByLabel(`Lot of Head O-ring`).fill('HO-2611')
    await page.getByLabel('Valve seat renewed', { exact: true }).check()
    await page.getByLabel('inspected', { exact: true }).check()
    await page.getByLabel('Packing nut torque (N·m)').fill('12')
    await page.getByLabel('Electrode resistance (Ω)').fill('1.4')
    await page.getByLabel('passed — no bubbles').check()
    await page.getByLabel('Sealing surfaces inspected').selectOption('good')
    await page.getByLabel('Threads inspected').selectOption('good')
    await page.getByRole('button', { name: 'Add a part' }).click()
    await page.getByLabel('Part 1', { exact: true }).fill('Seal kit')
    await page.getByLabel('Lot of part 1', { exact: true }).fill('SK-2611')
    await page.getByTestId('service-files').setInputFiles({ name: 'head-sealing-face.png', mimeType: 'image/png', buffer: sealPhoto() })
    await page.getByTestId('service-form').getByTestId('thumbnail').waitFor()
    await expect(page.getByTestId('service-outlook').textContent()).resolves.toMatch(/resets the service counter/)
    await page.getByLabel('Your password (signs)').fill(DEMO_PASSWORD)
    await page.getByRole('button', { name: 'Sign and record' }).click()

    await page.getByRole('status').filter({ hasText: 'Routine service recorded' }).waitFor()
    // The notice comes with the answer; the page's data follows a moment later.
    await expect.poll(() => page.locator('main [data-state]').first().textContent()).toContain('Awaiting check run')
    const history = page.getByTestId('service-history')
    await expect(history.textContent()).resolves.toMatch(/Routine seal service.*Head O-ring \(lot HO-2611\) — renewed.*1 × Seal kit \(lot SK-2611\).*Signed by Sam Adeyemi/s)
    const thumb = history.getByTestId('thumbnail').first()
    await thumb.waitFor()
    await expect(thumb.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth)).resolves.toBe(48)
    await page.evaluate(() => window.scrollTo(0, 0))
    await shot(page, 'vessel-care-serviced')

    // The check run: five standardisation runs give ε, a supervisor accepts it, then a check run agrees with
    // benzoic acid's 26,454 J/g (NIST SRM 39j, weighed in air) within the policy's 0.3 % (common practice).
    const analyst = await as('analyst')
    const plan = (await call('POST', '/api/plans', { cookie: analyst, body: { name: unique('Verify'), vesselId: id, fillPressureMPa: 3.0 } })).body
    const ba = await benzoicAcidMaterialId()
    // Standardisation and check runs burn the library's reference standard; a sample run here is any sample at the same value.
    const charge = (kind: string) => ({ sampleCode: unique(kind.slice(0, 3).toUpperCase()), kind, components: [kind === 'sample' ? { role: 'sample', massG: 1.0, heatingValueJPerG: 26454, smiles: 'OC(=O)c1ccccc1' } : { role: 'sample', massG: 1.0, materialId: ba }, { role: 'fuse', wire: 'platinum', lengthCm: 10 }] })
    const runs = []
    for (let i = 0; i < 5; i++) runs.push((await call('POST', `/api/plans/${plan.id}/runs`, { cookie: analyst, body: charge('standardisation') })).body)
    expect((await call('POST', `/api/plans/${plan.id}/submit`, { cookie: analyst, body: {} })).status).toBe(200)
    const fire = async (runId: string) => expect((await call('POST', `/api/runs/${runId}/firing`, { cookie: analyst, headers: { 'idempotency-key': unique('f') }, body: { outcome: 'complete', weighedMassG: 1.0 } })).status).toBe(201)
    const resultIds: string[] = []
    for (const [i, r] of runs.entries()) {
      await fire(r.id)
      resultIds.push((await call('POST', `/api/runs/${r.id}/result`, { cookie: analyst, body: { temperatureRiseK: [2.6454, 2.6460, 2.6448, 2.6456, 2.6452][i], sampleMassG: 1.0 } })).body.result.id)
    }
    expect((await call('POST', `/api/vessels/${id}/energy-equivalent`, { cookie: await as('supervisor'), body: { resultIds, password: DEMO_PASSWORD, reason: 'Series after the routine service' } })).status).toBe(201)
    // The check run is planned once the vessel has an accepted energy equivalent (refused up front before).
    const check = (await call('POST', `/api/plans/${plan.id}/runs`, { cookie: analyst, body: charge('check') })).body
    expect((await call('POST', `/api/plans/${plan.id}/submit`, { cookie: analyst, body: {} })).status).toBe(200)
    await fire(check.id)
    const checked = await call('POST', `/api/runs/${check.id}/result`, { cookie: analyst, body: { temperatureRiseK: 2.6454, sampleMassG: 1.0, certifiedValueJPerG: 26454 } })
    expect(checked.body.check.returnedToService).toBe(true)

    await page.reload()
    await page.locator('main h1', { hasText: name }).waitFor()
    await expect(page.locator('main [data-state]').first().textContent()).resolves.toContain('In service')
    await page.getByTestId('firing-chart').waitFor()
    await expect(page.getByTestId('firing-list').locator('tbody tr').count()).resolves.toBe(6)
    await page.evaluate(() => window.scrollTo(0, 0))
    await shot(page, 'vessel-care-in-service')

    await page.getByRole('link', { name: 'Printable history' }).click()
    await page.getByTestId('vessel-history-print').waitFor()
    await expect(page.getByTestId('vessel-history-print').textContent()).resolves.toMatch(/Routine seal service/)
    await shot(page, 'vessel-care-history')
    await page.close()
  })

  for (const role of ['technician', 'supervisor', 'analyst', 'admin'] as const) {
    it(`Today shows the fleet with states, counters and forecasts to the ${role}`, async () => {
      const page = await openPage()
      await signInAs(page, `${role}@emberline.test`)
      await page.goto('/')
      await page.locator('main h1', { hasText: 'Today' }).waitFor()
      const table = page.getByTestId('fleet-table')
      await table.waitFor()
      const kr4 = table.locator('tr[data-vessel^="KR-4"]')
      await expect(kr4.getAttribute('data-state')).resolves.toBe('overdue')
      await expect(kr4.textContent()).resolves.toMatch(/Service overdue.*of 500 firings.*days overdue.*firings\/week over 28 days/s)
      await expect(page.getByRole('heading', { name: 'Rules in force' }).isVisible()).resolves.toBe(true)
      const queues = { technician: 'queue-attention', supervisor: 'queue-approvals', analyst: 'queue-ready', admin: null }[role]
      for (const q of ['queue-attention', 'queue-approvals', 'queue-ready']) {
        await expect(page.getByTestId(q).count()).resolves.toBe(q === queues ? 1 : 0)
      }
      if (role === 'technician') await expect(page.getByTestId('queue-attention').textContent()).resolves.toMatch(/KR-5 Elder.*Locked out/s)
      await shot(page, `today-${role}`)
      await page.close()
    })
  }
})
