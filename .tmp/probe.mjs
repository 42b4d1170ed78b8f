import { chromium } from 'playwright-core'
const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'] })
const ctx = await browser.newContext({ viewport: { width: Number(process.argv[3] ?? 820), height: 1180 }, baseURL: 'http://127.0.0.1:3306' })
const page = await ctx.newPage()
await page.goto('/login')
await page.getByLabel('E-mail').fill(process.argv[4] ?? 'analyst@emberline.test')
await page.getByLabel('Password').fill('ember-demo-2026')
await page.getByRole('button', { name: 'Sign in' }).click()
await page.waitForURL(url => !url.pathname.startsWith('/login'))
await page.goto(process.argv[2])
await page.waitForTimeout(1500)
const out = await page.evaluate(() => {
  const w = document.documentElement.clientWidth
  const res = [document.documentElement.scrollWidth - w]
  for (const el of document.querySelectorAll('body *')) {
    const r = el.getBoundingClientRect()
    if (r.right > w + 1 && r.width > 0) {
      let p = el.parentElement, clipped = false
      while (p) { const s = getComputedStyle(p); if (s.overflowX !== 'visible') { clipped = true; break } p = p.parentElement }
      if (!clipped) res.push(`${el.tagName}.${String(el.className).slice(0, 60)} right=${Math.round(r.right)}`)
    }
  }
  return res.slice(0, 15)
})
console.log(out.join('\n'))
await page.screenshot({ path: process.argv[5] ?? '/tmp/probe.png', fullPage: true })
await browser.close()
