import { describe, expect, it } from 'vitest'
import { openPage, shot, signInAs } from '../support/browser'

// The analyst's day: a plan typed by keyboard, a block and a needs-approval row, submit; the supervisor signs.
// Benzoic acid 26,454 J/g (NIST SRM 39j, weighed in air) in KR-1 Aster rated 33 kJ (demo record):
// 1.00 g → clear; 1.20 g → ≥ 90 % of the rating → needs approval; 1.40 g → above the rating → blocked.
const PLAN = `Browser batch ${Date.now().toString(36)}`

describe('planning a batch and signing an exception', () => {
  it('the analyst builds a plan by keyboard and submits it', async () => {
    const page = await openPage({ width: 1400, height: 1000 })
    await signInAs(page, 'analyst@emberline.test')
    await page.goto('/plans')
    await page.getByLabel('Name').fill(PLAN)
    await page.getByLabel('Default vessel').selectOption({ label: await page.locator('select option', { hasText: 'KR-1 Aster' }).first().textContent() ?? '' })
    await page.getByRole('button', { name: 'Create and add runs' }).click()
    await page.waitForURL(/\/plans\/[0-9a-f-]{36}$/)
    await page.locator('main h1', { hasText: PLAN }).waitFor()

    for (const [code, mass] of [['BA-1', '1.0'], ['BA-2', '1.2'], ['BA-3', '1.4']] as const) {
      await page.getByTestId('entry-code').fill(code)
      await page.getByTestId('entry-material').fill('Benzoic acid, calorimetric standard')
      await page.getByTestId('entry-mass').fill(mass)
      await page.getByTestId('entry-mass').press('Enter')
      await page.getByTestId('plan-table').locator('td', { hasText: code }).first().waitFor()
      // The entry row is ready for the next run, focused on the sample code.
      await expect.poll(() => page.evaluate(() => (document.activeElement as HTMLElement | null)?.dataset.testid)).toBe('entry-code')
    }
    const rows = page.getByTestId('plan-table').locator('tbody > tr[data-testid^="run-"]')
    await expect.poll(() => rows.count()).toBe(3)
    await expect(page.getByTestId('run-1').textContent()).resolves.toContain('Clear')
    await expect(page.getByTestId('run-2').textContent()).resolves.toContain('Needs approval')
    const blocked = await page.getByTestId('run-3').textContent()
    expect(blocked).toContain('Blocked')
    expect(blocked).toMatch(/reduce the sample to ≤ 1\.24 g/)
    await shot(page, 'plan-table')

    await page.getByTestId('submit-plan').click()
    await page.getByRole('status').filter({ hasText: 'Submitted' }).waitFor()
    await expect.poll(() => page.getByTestId('run-2').textContent()).toContain('Awaiting signature')
    await page.close()
  })

  it('the supervisor signs the exception and the analyst sees it', async () => {
    const page = await openPage({ width: 1400, height: 1000 })
    await signInAs(page, 'supervisor@emberline.test')
    await page.goto('/approvals')
    const card = page.locator('article', { hasText: PLAN }).first()
    await card.waitFor()
    await shot(page, 'approvals-queue')
    await card.getByLabel('Reason').fill('Within rating; fresh seals on KR-1')
    await card.getByLabel('Your password (signs)').fill('ember-demo-2026')
    await card.getByRole('button', { name: 'Approve as an exception' }).click()
    await page.getByRole('status').filter({ hasText: 'approved as an exception' }).waitFor()
    await page.close()

    const analyst = await openPage({ width: 1400, height: 1000 })
    await signInAs(analyst, 'analyst@emberline.test')
    await analyst.goto('/plans')
    await analyst.getByRole('link', { name: PLAN }).click()
    await analyst.getByTestId('run-2').waitFor()
    const row = await analyst.getByTestId('run-2').textContent()
    expect(row).toContain('Ready to fire')
    expect(row).toContain('approved as an exception by Helena Ruiz')
    await shot(analyst, 'plan-after-signature')
    await analyst.close()
  })
})
