import { describe, expect, it } from 'vitest'
import { as, call, unique } from '../support/api'
import { SCREENSHOT_DIR, openPage, signInAs } from '../support/browser'
import { BA_J_PER_G, FUSE_10CM_J, benzoicAcidId, fire, readyRuns, standardisedVessel } from '../unit/bench/bench-api'

// The analyst sees the result before saving it, and the saved result shows the same figures; a capsule at a typical
// value (18 500 J/g typed without its uncertainty, the midpoint of the library's 17 500–19 500 J/g, from memory) makes it
// provisional on the form and on the result page; the budget with its shares and bars stays readable at 1280 px and on a tablet (820 px).
const figure = (text: string) => Number(/([\d,]+(?:\.\d+)?)\s*J\/g/.exec(text)![1]!.replace(/,/g, ''))

describe('result form preview and the result page', () => {
  it('previews gross and net values with U before saving, stores the same, and flags a typical aid value', async () => {
    const { vessel } = await standardisedVessel([10_000, 10_005, 9_995, 10_002, 9_998]) // ε = 10 000.0 J/K
    const mats = await call('GET', '/api/materials?q=Gelatin%20capsule&limit=50&derived=0', { cookie: await as('analyst') })
    const capsuleId = mats.body.rows.find((m: { name: string }) => m.name === 'Gelatin capsule (combustion aid)').id
    const code = unique('PVW')
    const [run] = await readyRuns(vessel.id, [{ sampleCode: code, materialId: await benzoicAcidId(), massG: 0.8, aidMassG: 0.1, aidMaterialId: capsuleId }])
    expect((await fire(run!.id, { weighedMassG: 0.8, aidMassG: 0.1 })).status).toBe(201)
    // θ = (m·q + e_fuse + m_aid·q_aid)/ε (ASTM D5865 rearranged) brings benzoic acid back at 26 454 J/g (NIST SRM 39j, in air).
    const theta = (0.8 * BA_J_PER_G + FUSE_10CM_J + 0.1 * 18_500) / 10_000

    const page = await openPage({ width: 1280, height: 900 })
    await signInAs(page, 'analyst@emberline.test')
    await page.goto('/bench')
    await page.getByTestId(`enter-result-${code}`).click()
    const form = page.getByTestId(`result-form-${code}`)
    await form.getByRole('radio', { name: 'Type θ' }).click()
    const preview = form.getByTestId('result-preview')
    await expect.poll(() => preview.textContent()).toContain('The preview needs')
    await form.getByTestId('theta-entered').fill(theta.toFixed(6))
    // The capsule's value typed without its uncertainty: a typical value, whatever the lab has determined meanwhile.
    await form.getByTestId('aid-value').fill('18500 J/g')
    await form.getByTestId('moisture-ad').fill('1.2')
    await form.getByTestId('hydrogen-dry').fill('4.5')
    await expect.poll(() => preview.getByTestId('preview-gross').textContent()).toMatch(/J\/g/)
    const previewed = figure((await preview.getByTestId('preview-gross').textContent())!)
    expect(Math.abs(previewed - BA_J_PER_G)).toBeLessThanOrEqual(1)
    expect(await preview.textContent()).toMatch(/\(U, k = 2\)/)
    expect(await preview.getByTestId('preview-provisional').textContent()).toContain('typical value')
    expect(await preview.getByTestId('preview-convention').textContent()).toContain('ISO 1928')
    await form.screenshot({ path: `${SCREENSHOT_DIR}/result-form-preview-1280.png` })

    await form.getByTestId('result-submit').click()
    await expect.poll(() => page.getByTestId('bench-notice').textContent()).toContain('result saved')
    await page.getByTestId(`open-result-${code}`).click()
    await page.waitForURL(/\/results\//)
    const saved = figure((await page.getByTestId('result-values').locator('td[data-basis="air-dried"]').first().textContent())!)
    expect(saved).toBe(previewed)
    expect(await page.getByTestId('provisional').textContent()).toContain('Provisional')

    // The budget: one row per input with its share and a bar; the shares add to 100 % (JCGM 100:2008, variance shares).
    const budget = page.getByTestId('uncertainty-budget')
    const shares = (await budget.getByTestId('budget-share').allTextContents()).map(s => Number(s.replace(/[^\d.]/g, '')))
    expect(shares.length).toBeGreaterThanOrEqual(6)
    expect(Math.abs(shares.reduce((a, b) => a + b, 0) - 100)).toBeLessThan(0.5)
    expect(await budget.locator('svg[role="img"]').count()).toBe(shares.length)
    await budget.screenshot({ path: `${SCREENSHOT_DIR}/result-budget-1280.png` })
    // Nothing of the budget runs off the page at 1280 px.
    expect(await budget.evaluate(el => el.scrollWidth <= el.clientWidth + 1)).toBe(true)

    // A supervisor on a tablet: the same page at 820 px.
    const tablet = await openPage({ width: 820, height: 1180 })
    await signInAs(tablet, 'supervisor@emberline.test')
    await tablet.goto(page.url())
    const tabletBudget = tablet.getByTestId('uncertainty-budget')
    await expect.poll(() => tabletBudget.isVisible()).toBe(true)
    expect(await tabletBudget.evaluate(el => el.scrollWidth <= el.clientWidth + 1)).toBe(true)
    await tabletBudget.screenshot({ path: `${SCREENSHOT_DIR}/result-budget-820.png` })
    await tablet.screenshot({ path: `${SCREENSHOT_DIR}/result-page-820.png`, fullPage: true })
    await page.screenshot({ path: `${SCREENSHOT_DIR}/result-page-1280.png`, fullPage: true })
  })
})
