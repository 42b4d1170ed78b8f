// Chromium through playwright-core (Debian's /usr/bin/chromium; never a downloaded browser).
import { mkdirSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { chromium } from 'playwright-core'
import type { Browser, Page } from 'playwright-core'
import { afterAll, inject } from 'vitest'

export const SCREENSHOT_DIR = fileURLToPath(new URL('../.artifacts/screenshots', import.meta.url))
mkdirSync(SCREENSHOT_DIR, { recursive: true })

let browser: Browser | undefined

export async function openPage(viewport = { width: 1280, height: 900 }): Promise<Page> {
  browser ??= await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  })
  const context = await browser.newContext({ viewport, baseURL: inject('baseURL') })
  const page = await context.newPage()
  page.setDefaultTimeout(20_000)
  return page
}

afterAll(async () => {
  await browser?.close()
  browser = undefined
})

export async function signInAs(page: Page, email: string, password = 'ember-demo-2026') {
  await page.goto('/login')
  await page.getByLabel('E-mail').fill(email)
  await page.getByLabel('Password').fill(password)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await page.waitForURL(url => !url.pathname.startsWith('/login'))
}

export async function shot(page: Page, name: string) {
  await page.screenshot({ path: `${SCREENSHOT_DIR}/${name}.png`, fullPage: true })
}
