import { describe, expect, it } from 'vitest'
import { openPage, shot, signInAs } from '../support/browser'

// Each demo role signs in and lands on its own starting page.
const ROLES = [
  { email: 'analyst@emberline.test', landing: '/', heading: 'Today', roles: 'Analyst' },
  { email: 'supervisor@emberline.test', landing: '/', heading: 'Today', roles: 'Supervisor' },
  { email: 'technician@emberline.test', landing: '/', heading: 'Today', roles: 'Technician' },
  { email: 'admin@emberline.test', landing: '/admin/users', heading: 'Admin', roles: 'Admin' },
]

describe('sign-in in Chromium', () => {
  it('sends a visitor without a session to the sign-in page', async () => {
    const page = await openPage()
    await page.goto('/admin/users')
    await page.waitForURL(/\/login/)
    await expect(page.getByRole('heading', { name: 'Sign in' }).isVisible()).resolves.toBe(true)
    await shot(page, 'sign-in')
    await page.close()
  })

  it('shows a wrong password as a message, not a crash', async () => {
    const page = await openPage()
    await page.goto('/login')
    await page.getByLabel('E-mail').fill('analyst2@emberline.test')
    await page.getByLabel('Password').fill('definitely wrong')
    await page.getByRole('button', { name: 'Sign in' }).click()
    await expect(page.getByRole('alert').textContent()).resolves.toContain('E-mail or password is wrong')
    await page.close()
  })

  for (const r of ROLES) {
    it(`${r.email} lands on ${r.landing}`, async () => {
      const page = await openPage()
      await signInAs(page, r.email)
      expect(new URL(page.url()).pathname).toBe(r.landing)
      await page.locator('main h1', { hasText: r.heading }).waitFor()
      await expect(page.getByTestId('user-roles').textContent()).resolves.toContain(r.roles)
      await expect(page.getByText('local regulations').isVisible()).resolves.toBe(true)
      await shot(page, `landing-${r.email.split('@')[0]}`)
      await page.close()
    })
  }
})
