import { readFile } from 'node:fs/promises'
import { describe, expect, it } from 'vitest'
import { as, call, unique } from '../support/api'
import { SCREENSHOT_DIR, openPage, shot, signInAs } from '../support/browser'
import { BA_J_PER_G, FUSE_10CM_J, PASSWORD, benzoicAcidId, enterResult, fire, readyRuns, registerVessel, standardisedVessel } from '../unit/bench/bench-api'
import { newClient, receive } from '../support/samples'
import { pdfText } from '../unit/bench/pdf-text'
import { synthesiseThermogram, thermogramCsv } from '../unit/bench/synthetic-thermogram'

// The bench journey: the analyst records a firing and its thermogram and sees the result; the supervisor signs it
// off and issues the certificate, whose text is read back. Benzoic acid as the unknown must come back at its certified
// 26 454 J/g (NIST SRM 39j, weighed in air) within what Regnault–Pfaundler recovers from the synthetic curve (0.02 %).
describe('bench: firing, thermogram, result, sign-off, certificate', () => {
  it('runs the whole journey in the browser', async () => {
    const { vessel } = await standardisedVessel([10_000, 10_005, 9_995, 10_002, 9_998]) // accepted ε = 10 000.0 J/K
    // A sample received from a client: the certificate names the client and the item as received.
    const code = (await receive((await newClient()).id)).labCode
    await readyRuns(vessel.id, [{ sampleCode: code, materialId: await benzoicAcidId(), massG: 0.8 }])
    const theta = (0.8 * BA_J_PER_G + FUSE_10CM_J) / 10_000 // θ = (m·q + e_fuse)/ε, ASTM D5865 rearranged: 2.1259 K

    const page = await openPage({ width: 1400, height: 1000 })
    await signInAs(page, 'analyst@emberline.test')
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Bench' }).click()
    await page.getByTestId(`record-firing-${code}`).click()
    const form = page.getByTestId(`firing-form-${code}`)
    await expect.poll(() => form.isVisible()).toBe(true)
    await form.getByTestId('weighed-mass').fill('0.8000')
    // The test database holds many other runs: the shots frame the part of the bench this journey uses.
    await page.getByTestId(`bench-vessel-${vessel.name}`).screenshot({ path: `${SCREENSHOT_DIR}/bench-record-firing.png` })
    await form.getByTestId('record-firing-submit').click()
    await expect.poll(() => page.getByTestId('bench-notice').textContent()).toContain('Firing recorded')

    // The result form opens by itself; the thermogram is uploaded and analysed in the page.
    const resultForm = page.getByTestId(`result-form-${code}`)
    await expect.poll(() => resultForm.isVisible()).toBe(true)
    await resultForm.getByTestId('thermogram-file').setInputFiles({ name: 'firing.csv', mimeType: 'text/csv', buffer: Buffer.from(thermogramCsv(synthesiseThermogram({ thetaK: theta }))) })
    await expect.poll(() => resultForm.getByTestId('thermogram-chart').isVisible()).toBe(true)
    const used = Number((await resultForm.getByTestId('theta-used').textContent())!.replace(/,/g, ''))
    expect(Math.abs(used - theta) / theta).toBeLessThan(2e-4)
    // The period boundaries move from the chart (keyboard on the handle) and come back with "detect again".
    await resultForm.locator('[data-handle="end"]').focus()
    await page.keyboard.press('ArrowRight')
    await expect.poll(() => resultForm.getByTestId('main-end-time').inputValue()).not.toBe('')
    await resultForm.getByRole('button', { name: 'Detect the periods again' }).click()
    await expect.poll(() => resultForm.getByTestId('main-end-time').inputValue()).toBe('')
    expect(await resultForm.locator('[data-band]').count()).toBe(3)
    expect(await resultForm.locator('[data-line="fore-extrapolation"]').count()).toBe(1)
    await resultForm.getByTestId('moisture-ad').fill('0')
    await resultForm.screenshot({ path: `${SCREENSHOT_DIR}/bench-thermogram.png` })
    await resultForm.getByTestId('result-submit').click()
    await expect.poll(() => page.getByTestId('bench-notice').textContent()).toContain('result saved')
    await expect.poll(() => page.getByTestId(`result-figure-${code}`).textContent()).toMatch(/J\/g/)
    const figure = (await page.getByTestId(`result-figure-${code}`).textContent())!
    const gross = Number(/([\d,]+)\s*J\/g/.exec(figure)![1]!.replace(/,/g, ''))
    expect(Math.abs(gross - BA_J_PER_G)).toBeLessThanOrEqual(6)
    await page.getByTestId(`fired-${code}`).screenshot({ path: `${SCREENSHOT_DIR}/bench-result.png` })

    // A certificate needs agreeing duplicates (lab policy): a second determination of the sample, typed θ, signed off.
    const [dup] = await readyRuns(vessel.id, [{ sampleCode: code, materialId: await benzoicAcidId(), massG: 0.8 }])
    expect((await fire(dup!.id, { weighedMassG: 0.8 })).status).toBe(201)
    const second = await enterResult(dup!.id, { temperatureRiseK: theta, fuse: { wire: 'nichrome', burntLengthCm: 10 }, moistureAdPct: 0 })
    expect(second.status).toBe(201)
    expect((await call('POST', `/api/results/${second.body.result.id}/sign`, { cookie: await as('supervisor'), body: { password: PASSWORD, reason: 'duplicate checked' } })).status).toBe(200)
    const first = (await call('GET', `/api/results?sampleCode=${code}`, { cookie: await as('analyst') })).body.rows.find((r: { id: string }) => r.id !== second.body.result.id)

    // The supervisor signs the first off from the result page and issues the certificate.
    await page.getByRole('button', { name: 'Sign out' }).click()
    await signInAs(page, 'supervisor@emberline.test')
    await page.goto(`/results/${first.id}`)
    await expect.poll(() => page.getByTestId('uncertainty-budget').isVisible()).toBe(true)
    await expect.poll(() => page.getByTestId('legend-method').textContent()).toContain('θ used: Regnault–Pfaundler')
    await page.getByTestId('uncertainty-budget').screenshot({ path: `${SCREENSHOT_DIR}/result-budget.png` })
    await page.getByTestId('sign-reason').fill('Corrections and thermogram checked')
    await page.getByTestId('sign-password').fill('ember-demo-2026')
    await page.getByTestId('sign-submit').click()
    await expect.poll(() => page.getByTestId('signed-badge').textContent()).toContain('Signed off by Helena Ruiz')
    await page.getByTestId(`issue-certificate-${code}`).click()
    const link = page.locator('[data-testid^="certificate-1"]').first()
    await expect.poll(() => link.isVisible()).toBe(true)
    await shot(page, 'result-signed')
    const [download] = await Promise.all([page.waitForEvent('download'), link.click()])
    expect(download.suggestedFilename()).toMatch(new RegExp(`^certificate-\\d+-${code}\\.pdf$`))
    const text = pdfText(await readFile((await download.path())!))
    expect(text).toContain(code)
    expect(text).toContain('Certificate of analysis')
    expect(text).toContain('Gross calorific value at constant volume')
    expect(text).toMatch(/26,4(4[89]|5\d|60)/)
    expect(text).toContain('Helena Ruiz')
    expect(text).toContain('End of report')
  })

  it('shows a vessel locked out by a leak on the bench and in the quick-check vessel picker', async () => {
    const v = await registerVessel({ name: unique('Leaky') })
    const [leaky, waiting] = await readyRuns(v.id, [{ sampleCode: unique('LEAK') }, { sampleCode: unique('NEXT') }])
    expect((await fire(leaky!.id, { outcome: 'leak', observations: 'hiss at the valve' })).body.lockedOut).toBe(true)
    const page = await openPage({ width: 1400, height: 1000 })
    await signInAs(page, 'analyst@emberline.test')
    await page.goto('/bench')
    const block = page.getByTestId(`vessel-block-${v.name}`)
    await expect.poll(() => block.textContent()).toContain('No run may be fired in this vessel')
    expect(await page.getByTestId(`record-firing-${waiting!.sampleCode}`).isDisabled()).toBe(true)
    await page.getByTestId(`bench-vessel-${v.name}`).screenshot({ path: `${SCREENSHOT_DIR}/bench-locked-out.png` })
    await page.goto('/check')
    const picker = page.getByTestId(`pick-vessel-${v.name}`)
    await expect.poll(() => picker.textContent()).toContain('Locked out')
    await page.goto('/standardisation')
    await expect.poll(() => page.getByRole('heading', { name: 'Standardisation', level: 1 }).isVisible()).toBe(true)
    await shot(page, 'standardisation')
  })
})
