import { describe, expect, it } from 'vitest'
import { openPage, shot, signInAs } from '../support/browser'

// An analyst at the bench checks a charge on the Quick check page and reads the verdict.
describe('Quick check in Chromium', () => {
  it('clears 1.0 g of benzoic acid, blocks 1.5 g with the fix, and takes the suggested mass', async () => {
    const page = await openPage()
    await signInAs(page, 'analyst@emberline.test')
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Quick check' }).click()
    await page.locator('main h1', { hasText: 'Quick check' }).waitFor()
    // The cautions are on the page before anything is typed.
    await expect(page.getByTestId('check-cautions').textContent()).resolves.toContain('never go into a standard vessel')
    await expect(page.getByTestId('check-cautions').textContent()).resolves.toContain('local regulations')

    // KR-1 Aster: in service, 33 kJ, 1.5 g, 4.05 MPa gauge, 300 mL (data/demo-lab.ts).
    await page.getByTestId('pick-vessel-KR-1 Aster').click()
    const sample = page.getByTestId('component-sample-1')
    await sample.getByLabel('Mass (g)').fill('1.0')
    await sample.getByLabel('Unit of the heating value').selectOption('J/g')
    // Benzoic acid weighed in air, 26,454 J/g (NIST SRM 39j certificate).
    await sample.getByLabel('Heating value, if known').fill('26454')
    // Its structure, so the energetic screen can clear it (no group of UN Appendix 6, Table A6.1).
    await sample.getByRole('radio', { name: 'structure' }).check()
    await sample.getByLabel('Structure as SMILES').fill('OC(=O)c1ccccc1')
    const wire = page.getByTestId('component-fuse-1')
    await wire.getByLabel('Fuse type').selectOption('nichrome')
    await wire.getByLabel('Burnt length (cm)').fill('10')
    await page.getByTestId('fill-pressure').fill('3.0')

    const verdict = page.getByTestId('verdict')
    await verdict.getByText('Checked by the server').waitFor()
    await expect(verdict.textContent()).resolves.toContain('Clear')
    // 26,454 J + 10 cm × 9.6 J/cm (from memory) = 26,550 J → 26.6 kJ.
    await expect(page.getByTestId('figure-heat').textContent()).resolves.toContain('26.6kJ')
    await shot(page, 'quick-check-clear')

    // 1.5 g × 26,454 J/g = 39.7 kJ > 33 kJ: the largest passing sample is (33,000 − 96) J / 26,454 J/g = 1.24 g.
    await sample.getByLabel('Mass (g)').fill('1.5')
    await verdict.getByText('Blocked').waitFor()
    await verdict.getByText('Checked by the server').waitFor()
    const over = page.locator('[data-code="energy-over-rating"]')
    await expect(over.textContent()).resolves.toContain('reduce the sample to ≤ 1.24 g')
    await shot(page, 'quick-check-blocked')

    // Heating values follow the unit switch: 26,454 J/g = 26.454 MJ/kg (NIST SP 811).
    await page.getByRole('radio', { name: 'MJ/kg' }).click()
    await expect(page.getByTestId('check-result').textContent()).resolves.toContain('26.454 MJ/kg')

    // One answer first: the mass for the 26 kJ target (policy), (26,000 − 96) J / 26,454 J/g = 0.979 g, rounded down to 0.97 g.
    await expect(page.getByTestId('apply-advice').textContent()).resolves.toContain('Use 0.97 g')
    await page.getByTestId('apply-advice').click()
    await expect(sample.getByLabel('Mass (g)').inputValue()).resolves.toBe('0.97')
    await verdict.getByText('Clear').waitFor()
    await verdict.getByText('Checked by the server').waitFor()
    await page.close()
  })

  it('shows why a locked-out vessel blocks every charge', async () => {
    const page = await openPage()
    await signInAs(page, 'analyst@emberline.test')
    await page.goto('/check')
    const elder = page.getByTestId('pick-vessel-KR-5 Elder')
    // KR-5 is locked out: the picker says it in the one wording the bench and the e-mails use.
    await expect(elder.textContent()).resolves.toContain('No run may be fired in this vessel')
    await elder.click()
    await page.getByTestId('component-sample-1').getByLabel('Mass (g)').fill('0.5')
    await page.getByTestId('component-sample-1').getByLabel('Heating value, if known').fill('26454')
    await page.getByTestId('component-fuse-1').getByLabel('Burnt length (cm)').fill('10')
    const verdict = page.getByTestId('verdict')
    await verdict.getByText('Checked by the server').waitFor()
    await expect(verdict.textContent()).resolves.toContain('Blocked')
    await expect(page.locator('[data-code="vessel-locked-out"]').textContent()).resolves.toContain('locked out')
    await shot(page, 'quick-check-locked-out')
    await page.close()
  })
})
