import { readFile } from 'node:fs/promises'
import type { Page } from 'playwright-core'
import { describe, expect, it } from 'vitest'
import { as, call } from '../support/api'
import { SCREENSHOT_DIR, openPage, shot, signInAs } from '../support/browser'
import { pdfText } from '../unit/bench/pdf-text'

// From the counter to the certificate: receive a sample, print its label, plan it from the queue, accept the day plan,
// then find it by the label's code typed into the header's search box as a bench scanner does, submit its plan, fire
// both determinations on the bench, enter their results, sign them off and issue the certificate. The lab code is
// only ever read from the page and "scanned" (typed with Enter into the search box), never typed into a form.
const REF = `BR-${Date.now().toString(36)}`

/** The bench scanner: the code and Enter into the search box of the header, which opens the sample. */
async function scan(page: Page, code: string) {
  await page.getByTestId('app-search').fill(code)
  await page.getByTestId('app-search').press('Enter')
  await page.locator('main h1', { hasText: code }).waitFor()
}

describe('a client\'s sample from receipt to the certificate', () => {
  it('receives, labels, plans, schedules, fires, reports and certifies a sample, found by its scanned code', async () => {
    const page = await openPage({ width: 1400, height: 1000 })
    await signInAs(page, 'analyst@emberline.test')
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Samples' }).click()
    await page.getByRole('link', { name: 'Receive a sample' }).click()
    await page.getByTestId('receipt-client').selectOption({ label: 'Sablewick Mills Ltd' })
    await page.getByLabel('Client\'s reference').fill(REF)
    await page.getByLabel('Description as received').fill('Rolled oat flakes, milled, screw-top jar')
    // The library is searched as the analyst types; the choice links the sample to the record.
    await page.getByTestId('receipt-material').fill('rolled oat')
    await page.getByRole('option', { name: /Rolled oat flakes/ }).click()
    await page.getByText('Linked to the library record.').waitFor()
    await page.getByLabel('Condition').fill('sealed')
    await page.getByLabel('Mass received (g)').fill('150 g')
    await shot(page, 'sample-receipt-form')
    await page.getByRole('button', { name: 'Receive and give it a lab code' }).click()
    await page.waitForURL(/\/samples\/[0-9a-f-]{36}\?received=1$/)
    await page.locator('main h1', { hasText: /^KR-\d{4}-\d{5}$/ }).waitFor()
    const code = (await page.locator('main h1').textContent())!.trim()
    expect(code).toMatch(/^KR-\d{4}-\d{5}$/)

    await page.getByRole('link', { name: 'Print label' }).click()
    const label = page.getByTestId('sample-label')
    await label.waitFor()
    await expect.poll(() => label.locator('img').evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth > 0)).toBe(true)
    expect(await label.textContent()).toContain(code)
    await label.screenshot({ path: 'tests/.artifacts/screenshots/sample-label.png' })
    await page.getByRole('link', { name: `Back to ${code}` }).click()

    await page.goto('/samples')
    await page.getByLabel(`Choose ${code}`).check()
    await page.getByLabel('Vessel the charges are first checked on').selectOption({ label: 'KR-1 Aster' })
    await shot(page, 'sample-queue')
    await page.getByRole('button', { name: 'Plan 1 sample' }).click()
    await page.waitForURL(/\/plans\/[0-9a-f-]{36}$/)
    await expect.poll(() => page.locator('main').textContent()).toContain(code)

    await page.goto('/day-plan')
    await page.getByRole('button', { name: 'Propose the day' }).click()
    const firing = page.locator('li', { hasText: code }).first()
    await firing.waitFor()
    await shot(page, 'day-plan')
    // Keyboard move: Alt+→ moves the run to the next vessel, re-checked at once (it may be refused there, and says why).
    await firing.focus()
    await page.keyboard.press('Alt+ArrowRight')
    await page.locator('li', { hasText: code }).first().waitFor()
    await page.getByRole('button', { name: 'Start again from the proposal' }).click()
    await page.getByRole('button', { name: 'Accept the day plan' }).click()
    await page.getByRole('status').filter({ hasText: 'accepted' }).waitFor()

    await shot(page, 'day-plan-accepted')
    const day = await page.getByLabel('Day').inputValue()

    // The vessel page counts the firings booked on accepted day plans towards its service forecast.
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Vessels' }).click()
    await page.getByRole('link', { name: 'KR-1 Aster' }).click()
    const forecast = page.getByTestId('vessel-day-plan-forecast')
    const dayWords = new Date(`${day}T00:00:00Z`).toLocaleDateString('en-GB', { weekday: 'long', day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' }).replace(',', '')
    await expect.poll(() => forecast.textContent()).toContain(dayWords)
    await forecast.screenshot({ path: `${SCREENSHOT_DIR}/vessel-day-plan-forecast.png` })

    await scan(page, code)
    const runs = page.getByRole('region', { name: 'Runs' })
    await expect.poll(async () => (await runs.locator('tbody tr').count())).toBe(2)
    // Each run has its place in the day.
    expect(await runs.locator('tbody tr td:nth-child(4)').allTextContents()).not.toContain('—')
    await shot(page, 'sample-page-scheduled')

    // The runs are still drafts: the sample page says so and leads to the plan, whose submission sends them to the bench.
    const next = page.getByTestId('sample-next-step')
    await expect.poll(() => next.textContent()).toContain('still in draft')
    await next.getByRole('link', { name: 'Open the plan' }).click()
    await page.getByTestId('submit-plan').click()
    await expect.poll(() => page.locator('main').textContent()).toContain('2 ready to fire')
    await scan(page, code)
    await expect.poll(() => next.textContent()).toContain('2 runs ready to fire')
    const sampleId = new URL(page.url()).pathname.split('/').pop()
    const sample = (await call('GET', `/api/samples/${sampleId}`, { cookie: await as('analyst') })).body as { runs: { vesselId: string, vesselName: string }[] }
    await next.getByRole('link', { name: 'Bench' }).click()

    // Both determinations on the bench: the weighed mass as the balance shows it (here: as planned), θ typed from the
    // calorimeter. θ = (m·q + e_fuse)/ε (ASTM D5865 rearranged) with q = 18 400 J/g, about rolled oats (from memory),
    // 96 J for 10 cm of nickel-chromium fuse at 9.6 J/cm (from memory) and the vessel's accepted ε.
    for (let i = 0; i < 2; i++) {
      await page.getByTestId(`record-firing-${code}`).first().click()
      const form = page.getByTestId(`firing-form-${code}`)
      await form.waitFor()
      const planned = (await form.getByTestId('weighed-mass').getAttribute('placeholder'))!.replace('planned ', '')
      const onVessel = (await page.locator('[data-testid^="bench-vessel-"]', { has: form }).getAttribute('data-testid'))!.replace('bench-vessel-', '')
      await form.getByTestId('weighed-mass').fill(`${planned} g`)
      if (i === 0) await page.locator('[data-testid^="bench-vessel-"]', { has: form }).screenshot({ path: `${SCREENSHOT_DIR}/journey-bench-firing.png` })
      await form.getByTestId('record-firing-submit').click()
      await expect.poll(() => page.getByTestId('bench-notice').textContent()).toContain('Firing recorded')
      const resultForm = page.getByTestId(`result-form-${code}`)
      await resultForm.waitFor()
      const runVessel = sample.runs.find(r => r.vesselName === onVessel)!.vesselId
      const eps = (await call('GET', `/api/vessels/${runVessel}/energy-equivalent`, { cookie: await as('analyst') })).body.active.valueJPerK as number
      const theta = (Number(planned) * 18_400 + 96) / eps
      await resultForm.getByRole('radio', { name: 'Type θ' }).click()
      await resultForm.getByTestId('theta-entered').fill(theta.toFixed(4))
      await resultForm.getByTestId('moisture-ad').fill('9.2')
      if (i === 1) await resultForm.screenshot({ path: `${SCREENSHOT_DIR}/journey-result-form.png` })
      await resultForm.getByTestId('result-submit').click()
      await expect.poll(() => page.getByTestId('bench-notice').textContent()).toContain('result saved')
    }
    await shot(page, 'journey-bench')
    await scan(page, code)
    await expect.poll(() => page.getByRole('region', { name: 'Receipt' }).textContent()).toContain('Tested')
    // Gross as determined = (ε·θ − e_fuse)/m = 18 400 J/g for both determinations (ASTM D5865, with the θ above).
    expect((await runs.textContent())!.match(/18,400\s*J\/g/g)).toHaveLength(2)
    await expect.poll(() => next.textContent()).toContain('a supervisor reviews and signs off')
    await shot(page, 'sample-page-tested')

    // The supervisor scans the label, signs off both results from the sample page and issues the certificate.
    await page.getByRole('button', { name: 'Sign out' }).click()
    await signInAs(page, 'supervisor@emberline.test')
    await scan(page, code)
    for (let i = 0; i < 2; i++) {
      await next.getByRole('link', { name: 'Review the result' }).click()
      await page.getByTestId('sign-reason').fill('Duplicates, corrections and θ checked')
      await page.getByTestId('sign-password').fill('ember-demo-2026')
      await page.getByTestId('sign-submit').click()
      await expect.poll(() => page.getByTestId('signed-badge').textContent()).toContain('Signed off by')
      if (i === 0) await shot(page, 'journey-result-signed')
      await page.getByTestId('result-sample-link').click()
      await page.locator('main h1', { hasText: code }).waitFor()
    }
    await expect.poll(() => next.textContent()).toContain('the certificate can be issued')
    await next.getByRole('link', { name: 'Issue the certificate' }).click()
    await page.getByTestId(`issue-certificate-${code}`).click()
    await expect.poll(() => page.locator('[data-testid^="certificate-"]').count()).toBeGreaterThan(0)
    await shot(page, 'journey-certificate-issued')
    await page.getByTestId('result-sample-link').click()
    await page.locator('main h1', { hasText: code }).waitFor()
    await expect.poll(() => page.getByRole('region', { name: 'Receipt' }).textContent()).toContain('Reported')
    await expect.poll(() => next.textContent()).toMatch(/Reported on certificate No\. \d+/)
    await shot(page, 'sample-page-reported')
    const [download] = await Promise.all([page.waitForEvent('download'), page.locator('[data-testid^="sample-certificate-"]').first().click()])
    const text = pdfText(await readFile((await download.path())!))
    for (const item of [code, REF, 'Sablewick Mills Ltd', 'Rolled oat flakes, milled, screw-top jar', 'sealed', 'The results relate only to the item tested']) expect(text).toContain(item)
    await page.close()
  })
})
