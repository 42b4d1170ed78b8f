import { describe, expect, it } from 'vitest'
import { unique } from '../support/api'
import { openPage, shot, signInAs } from '../support/browser'
import { testDb } from '../support/db'
import { waitUntil } from '../support/wait'

const FILL_MAX = 'Method fill window, upper end'

const waitForCapture = (subject: string) => waitUntil(`the test mail server to receive "${subject}"`, async () =>
  (await testDb().query('select 1 from captured_mail where subject = $1', [subject])).rows.length > 0)

describe('lab policy, audit trail and mail pages in Chromium', () => {
  it('the admin changes the fill window maximum with a reason, and the audit trail shows it', async () => {
    const page = await openPage()
    await signInAs(page, 'admin@emberline.test')
    await page.goto('/admin/policy')
    await page.locator('main h1', { hasText: 'Admin' }).waitFor()
    await expect(page.getByText('local regulations, the vessel maker\'s instructions and the lab\'s own procedures come first').isVisible()).resolves.toBe(true)
    // Every group of the policy is on the page.
    for (const g of ['Servicing', 'Charge checks', 'Oxygen', 'Energetic screening', 'Results', 'Sessions & sizes']) {
      await expect(page.getByRole('heading', { name: g, exact: true }).isVisible()).resolves.toBe(true)
    }
    const row = page.getByTestId('policy-fillPressureWindowMaxMPa')
    await expect(row.getByTestId('differs').count()).resolves.toBe(0)

    // Without a reason the server refuses, and the page says which field.
    await page.getByLabel(FILL_MAX).fill('3.3')
    await page.getByRole('button', { name: 'Save changes' }).click()
    await expect(page.locator('#main [role=alert]').first().textContent()).resolves.toMatch(/say why|reason|correcting/i)

    // A maximum below the minimum is refused by the server, and the page marks the fields it names.
    const reason = `Procedure QP-07 rev. 3 widens the window (${unique('t')})`
    await page.getByLabel('Reason for the change').fill(reason)
    await page.getByLabel(FILL_MAX).fill('2.5')
    await page.getByRole('button', { name: 'Save changes' }).click()
    await page.getByTestId('policy-fillPressureWindowMinMPa').getByText('must not exceed its maximum').waitFor()
    await expect(page.getByText('Not saved:').textContent()).resolves.toMatch(/values need correcting/)

    await page.getByLabel(FILL_MAX).fill('3.3')
    await page.getByRole('button', { name: 'Save changes' }).click()
    await page.getByText('Saved 1 change').waitFor()
    await expect(page.getByLabel(FILL_MAX).inputValue()).resolves.toBe('3.3')
    await row.getByTestId('differs').waitFor()
    await page.evaluate(() => window.scrollTo(0, 0))
    await shot(page, 'admin-policy')

    await page.goto('/audit?entity=lab-settings')
    await page.locator('main h1', { hasText: 'Audit trail' }).waitFor()
    await expect(page.getByText('nobody — admins included — can edit or delete an entry').isVisible()).resolves.toBe(true)
    const entry = page.locator('tr', { hasText: reason })
    await entry.waitFor()
    // Actions and fields in the words the pages use; the raw key is one click away.
    await expect(entry.textContent()).resolves.toContain('Settings: update')
    await expect(entry.textContent()).resolves.toContain('Priya Natarajan')
    await entry.getByText(/\d+ changes?/).click()
    const changes = entry.getByTestId('audit-changes')
    await expect(changes.textContent()).resolves.toMatch(/Lab policy, method fill window, upper end \(MPa gauge\)\s*from\s*3\.2\s*→\s*to\s*3\.3/)
    await expect(entry.getByTestId('audit-raw').textContent()).resolves.toContain('policy.fillPressureWindowMaxMPa')
    // The CSV link carries the filters in force.
    await expect(page.getByTestId('audit-csv').getAttribute('href')).resolves.toBe('/api/audit/export.csv?entity=lab-settings')
    // Filters typed into the bar go to the address and to the CSV link.
    await page.getByLabel('Person (name or user id)').fill('natarajan')
    await page.getByRole('button', { name: 'Apply filters' }).click()
    await page.waitForURL(/actor=natarajan/)
    await expect(page.getByTestId('audit-csv').getAttribute('href')).resolves.toBe('/api/audit/export.csv?entity=lab-settings&actor=natarajan')
    await entry.waitFor()
    await entry.locator('details').first().evaluate((d) => { (d as HTMLDetailsElement).open = true })
    await shot(page, 'audit')

    // Put the default back through the page, so later tests meet the lab as loaded.
    await page.goto('/admin/policy')
    await row.getByRole('button', { name: 'use default' }).click()
    await expect(page.getByLabel(FILL_MAX).inputValue()).resolves.toBe('3.2')
    await page.getByLabel('Reason for the change').fill('Back to the method\'s window after the browser test')
    await page.getByRole('button', { name: 'Save changes' }).click()
    await page.getByText('Saved 1 change').waitFor()
    await expect(row.getByTestId('differs').count()).resolves.toBe(0)
    await page.close()
  })

  it('the supervisor reaches the lab policy from the navigation, without the admin-only tabs', async () => {
    const page = await openPage()
    await signInAs(page, 'supervisor@emberline.test')
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Lab policy' }).click()
    await page.waitForURL(/\/admin\/policy$/)
    await page.locator('main h1', { hasText: 'Lab policy' }).waitFor()
    await expect(page.getByRole('navigation', { name: 'Admin' }).count()).resolves.toBe(0)
    await expect(page.getByLabel(FILL_MAX).isEditable()).resolves.toBe(true)
    await expect(page.getByText('come first').first().isVisible()).resolves.toBe(true)
    await shot(page, 'policy-supervisor')
    await page.close()
  })

  it('the admin reads a message the test mail server caught', async () => {
    const subject = unique('Approval needed: run KR-1')
    await testDb().query(
      `insert into mail_outbox ("to", subject, text) values ($1, $2, $3)`,
      [['supervisor@emberline.test'], subject, 'A charge on vessel KR-1 Aster needs your signature before it is fired.\n\nOpen Emberline → Approvals.'],
    )
    await waitForCapture(subject)
    const page = await openPage()
    await signInAs(page, 'admin@emberline.test')
    await page.goto('/admin/mail')
    await page.getByRole('navigation', { name: 'Admin' }).getByRole('link', { name: 'Mail' }).waitFor()
    await page.getByRole('button', { name: new RegExp(subject) }).click()
    const reading = page.getByTestId('mail-reading')
    await expect(reading.textContent()).resolves.toContain('needs your signature')
    await expect(reading.textContent()).resolves.toContain('supervisor@emberline.test')
    await page.getByTestId('outbox-sent').first().waitFor()
    await shot(page, 'admin-mail')
    await page.close()
  })

  it('the analyst cannot open the policy, audit or mail pages', async () => {
    const page = await openPage()
    await signInAs(page, 'analyst@emberline.test')
    // Each page says which role it needs (a 403 page), instead of a silent redirect to Today.
    for (const [path, role] of [['/admin/policy', 'Admin or Supervisor'], ['/audit', 'Supervisor or Admin'], ['/admin/mail', 'Admin']] as const) {
      await page.goto(path)
      await page.waitForURL(url => url.pathname === '/forbidden')
      await expect(page.getByTestId('forbidden').textContent()).resolves.toContain(`needs the ${role} role`)
    }
    const nav = page.getByRole('navigation', { name: 'Main' })
    await expect(nav.getByRole('link', { name: 'Audit' }).count()).resolves.toBe(0)
    await expect(nav.getByRole('link', { name: 'Lab policy' }).count()).resolves.toBe(0)
    await page.close()
  })
})
