import { describe, expect, it } from 'vitest'
import { openPage, shot, signInAs } from '../support/browser'

// From the counter to the bench day: receive a sample, print its label, plan it from the queue, accept the day plan,
// and find it again by typing the label's code into the header's search box, as a bench scanner does.
const REF = `BR-${Date.now().toString(36)}`

describe('a client\'s sample from receipt to the day plan', () => {
  it('receives, labels, plans and schedules a sample, then finds it by its code', async () => {
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

    // The scanner types the code and Enter into the search box of the header.
    await page.getByTestId('app-search').fill(code)
    await page.getByTestId('app-search').press('Enter')
    await page.locator('main h1', { hasText: code }).waitFor()
    const runs = page.getByRole('region', { name: 'Runs' })
    await expect.poll(async () => (await runs.locator('tbody tr').count())).toBe(2)
    // Each run has its place in the day.
    expect(await runs.locator('tbody tr td:nth-child(4)').allTextContents()).not.toContain('—')
    await shot(page, 'sample-page-scheduled')
    await page.close()
  })
})
