// Accessibility: axe-core in Chromium on every page each role can reach — the header's links and the detail
// pages linked from them — with no serious or critical violation of WCAG 2.1 A/AA (axe-core's rule tags); forms that
// work by keyboard alone with a visible focus (WCAG 2.1 SC 2.1.1 Keyboard, 2.4.7 Focus Visible). While walking, no
// page may trip the Content-Security-Policy or throw.
import { createHash } from 'node:crypto'
import AxeBuilder from '@axe-core/playwright'
import type { Page } from 'playwright-core'
import { beforeAll, describe, expect, it } from 'vitest'
import { as, call } from '../support/api'
import { addRun, newPlan, newVessel, sampleRun } from '../support/factories'
import { openPage, shot, signInAs } from '../support/browser'

// The supervisor first: they reach the most pages, so later roles re-check only what differs for them.
const ROLES = ['supervisor', 'analyst', 'technician', 'admin'] as const
const ID = /[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/g
// A walk visits each kind of page once (/vessels/<id> stands for every vessel) and stops at this many.
const MAX_PAGES = 40

interface Problem { page: string, what: string }

/** Records what the browser reports against the page: CSP refusals, uncaught errors. */
function watch(page: Page, problems: Problem[]) {
  page.on('console', (msg) => {
    if (msg.type() === 'error' && /Content Security Policy|Refused to (execute|load|apply|connect)/i.test(msg.text())) problems.push({ page: page.url(), what: `CSP: ${msg.text()}` })
  })
  page.on('pageerror', err => problems.push({ page: page.url(), what: `uncaught: ${err.message}` }))
}

async function settle(page: Page) {
  await page.waitForLoadState('networkidle')
  // Hydration done: Nuxt removes nothing visible, so wait for the app root and a short quiet spell.
  await page.locator('#__nuxt').waitFor()
  await page.waitForTimeout(150)
}

/** axe on the current page: serious and critical violations, one line each. */
async function axe(page: Page, label: string): Promise<string[]> {
  const result = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'best-practice']).analyze()
  return result.violations
    .filter(v => v.impact === 'serious' || v.impact === 'critical')
    .map(v => `${label}: ${v.id} (${v.impact}) ${v.help} — ${v.nodes.slice(0, 4).map(n => n.target.join(' ')).join(' | ')}`)
}

/** Internal page links on the current page (no API downloads, no files). */
async function pageLinks(page: Page): Promise<string[]> {
  const hrefs = await page.$$eval('a[href^="/"]', as => as.map(a => a.getAttribute('href') ?? ''))
  return hrefs.map(h => h.split('#')[0]!.split('?')[0]!).filter(h => h && !h.startsWith('/api/') && !/\.\w{2,4}$/.test(h))
}

/**
 * The structure of the page's main content (elements, roles, types, classes; no text). A page whose structure was
 * already checked — the same list for another role, with the same buttons — is not checked again.
 */
async function structure(page: Page): Promise<string> {
  const parts = await page.evaluate(() => {
    const main = document.querySelector('main') ?? document.body
    return Array.from(main.querySelectorAll('*'), el => [el.tagName, el.getAttribute('role'), el.getAttribute('type'), el.getAttribute('class'), el.hasAttribute('disabled')].join(' ')).join('|')
  })
  return createHash('sha256').update(parts).digest('hex')
}

const checkedStructures = new Set<string>()

/**
 * Walks every page reachable from the header and the pages it links to, once per kind of page (/vessels/<id> stands
 * for every vessel). axe checks the first page in full (the role's own header) and every page whose main content
 * differs from all the pages checked so far, for this role or an earlier one.
 */
async function walk(page: Page, start: string[]): Promise<{ visited: string[], checked: string[], violations: string[] }> {
  const seen = new Set<string>()
  const queue = [...start]
  const visited: string[] = []
  const checked: string[] = []
  const violations: string[] = []
  while (queue.length && visited.length < MAX_PAGES) {
    const path = queue.shift()!
    const kind = path.replace(ID, ':id')
    if (seen.has(kind)) continue
    seen.add(kind)
    await page.goto(path)
    await settle(page)
    if (new URL(page.url()).pathname === '/login') continue
    visited.push(kind)
    const shape = await structure(page)
    if (!checked.length || !checkedStructures.has(shape)) {
      checkedStructures.add(shape)
      checked.push(kind)
      violations.push(...await axe(page, kind))
    }
    for (const link of await pageLinks(page)) if (!seen.has(link.replace(ID, ':id'))) queue.push(link)
  }
  return { visited, checked, violations }
}

/** Presses Tab until each target has had the focus (in this order), checking that the focus can be seen there. */
async function tabThrough(page: Page, targets: { name: string, test: string }[], maxTabs = 120) {
  const reached: string[] = []
  let next = 0
  for (let i = 0; i < maxTabs && next < targets.length; i++) {
    await page.keyboard.press('Tab')
    const hit = await page.evaluate((test) => {
      const el = document.activeElement as HTMLElement | null
      if (!el || !el.matches(test)) return null
      const style = getComputedStyle(el)
      return { focusVisible: el.matches(':focus-visible'), outline: style.outlineStyle !== 'none' && style.outlineWidth !== '0px', ring: style.boxShadow !== 'none' }
    }, targets[next]!.test)
    if (hit) {
      expect(hit.focusVisible, `${targets[next]!.name} matches :focus-visible`).toBe(true)
      expect(hit.outline || hit.ring, `${targets[next]!.name} shows an outline or a ring while focused`).toBe(true)
      reached.push(targets[next]!.name)
      next++
    }
  }
  expect(reached).toEqual(targets.map(t => t.name))
}

describe('accessibility', () => {
  let draftPlanId = ''

  beforeAll(async () => {
    // Pages with something on them: a draft plan (its entry row), a run waiting for a signature (the approvals form).
    const vessel = await newVessel()
    const draft = await newPlan(vessel.id)
    draftPlanId = draft.id
    expect((await addRun(draft.id, sampleRun(0.8))).status).toBe(201)
    const waiting = await newPlan(vessel.id)
    // 1.2 g at 26,454 J/g = 31.7 kJ: above 90 % of a 33 kJ rating, so it needs a signature (policy).
    expect((await addRun(waiting.id, sampleRun(1.2))).status).toBe(201)
    expect((await call('POST', `/api/plans/${waiting.id}/submit`, { cookie: await as('analyst'), body: {} })).status).toBe(200)
  })

  it('the sign-in page has no serious or critical violation, works by keyboard and shows the focus', async () => {
    const page = await openPage()
    const problems: Problem[] = []
    watch(page, problems)
    await page.goto('/login')
    await settle(page)
    expect(await axe(page, '/login')).toEqual([])
    await tabThrough(page, [
      { name: 'e-mail', test: 'input[name="email"]' },
      { name: 'password', test: 'input[name="password"]' },
      { name: 'sign in', test: 'button[type="submit"]' },
    ])
    await shot(page, 'a11y-login-focus')
    // Typing and Enter sign in, no mouse needed.
    await page.locator('input[name="email"]').focus()
    await page.keyboard.type('analyst@emberline.test')
    await page.keyboard.press('Tab')
    await page.keyboard.type('ember-demo-2026')
    await page.keyboard.press('Enter')
    await page.waitForURL(url => !url.pathname.startsWith('/login'))
    expect(problems).toEqual([])
    await page.close()
  })

  for (const role of ROLES) {
    it(`every page the ${role} can reach has no serious or critical violation`, { timeout: 600_000 }, async () => {
      const page = await openPage()
      const problems: Problem[] = []
      watch(page, problems)
      await signInAs(page, `${role}@emberline.test`)
      await settle(page)
      const nav = await page.$$eval('nav[aria-label="Main"] a[href]', as => as.map(a => a.getAttribute('href') ?? ''))
      expect(nav.length).toBeGreaterThan(2)
      const { visited, checked, violations } = await walk(page, nav)
      console.info(`${role}: visited ${visited.join(' ')}; axe checked ${checked.join(' ')}`)
      // The header's pages and, from the lists, at least one detail page are covered.
      for (const link of nav) expect(visited, link).toContain(link.replace(ID, ':id'))
      expect(visited.some(p => p.includes(':id'))).toBe(true)
      expect(violations).toEqual([])
      expect(problems).toEqual([])
      await page.close()
    })
  }

  it('the plan entry row works by keyboard alone', async () => {
    const page = await openPage()
    await signInAs(page, 'analyst@emberline.test')
    await page.goto(`/plans/${draftPlanId}`)
    await settle(page)
    await page.locator('body').focus()
    await tabThrough(page, [
      { name: 'sample code', test: '[data-testid="entry-code"]' },
      { name: 'mass', test: '[data-testid="entry-mass"]' },
      { name: 'heating value', test: '[data-testid="entry-hv"]' },
      { name: 'fill pressure', test: '[data-testid="entry-fill"]' },
      { name: 'add run', test: '[data-testid="entry-save"]' },
    ])
    await shot(page, 'a11y-plan-entry-focus')
    await page.close()
  })

  it('the approvals form works by keyboard alone', async () => {
    const page = await openPage()
    await signInAs(page, 'supervisor@emberline.test')
    await page.goto('/approvals')
    await settle(page)
    await page.locator('body').focus()
    await tabThrough(page, [
      { name: 'reason', test: 'form textarea' },
      { name: 'password', test: 'form input[type="password"]' },
      { name: 'approve', test: 'form button.btn-primary' },
      { name: 'reject', test: 'form button.btn-danger' },
    ])
    await shot(page, 'a11y-approvals-focus')
    await page.close()
  })
})
