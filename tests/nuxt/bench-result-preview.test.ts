// The result form previews the result before it is saved, with the server's own computation on the parts the server
// answers; what it then sends computes, on the server's side, to the figures the preview showed.
import { mountSuspended, registerEndpoint } from '@nuxt/test-utils/runtime'
import { readBody, setResponseStatus } from 'h3'
import { afterEach, describe, expect, it } from 'vitest'
import BenchResultForm from '~/components/bench/BenchResultForm.vue'
import { DEFAULT_POLICY } from '#shared/domain/policy'
import { formatSpecificEnergy } from '#shared/domain/specific-energy'
import { previewResult } from '#shared/domain/results'
import type { ResultContextParts } from '#shared/domain/results'

// ε = 10 000 J/K from six runs with s = 6 J/K; a gelatin capsule at its typical 18 500 J/g (midpoint of 17 500–19 500 J/g,
// rectangular u = 2000/(2√3) = 577.35 J/g, JCGM 100:2008 §4.3.7); invented figures otherwise.
const parts: ResultContextParts = {
  kind: 'sample', weighedMassG: 1, components: [{ role: 'sample', massG: 1 }, { role: 'aid', massG: 0.1 }],
  energyEquivalent: { id: 'ee-1', valueJPerK: 10_000, standardDeviationJPerK: 6, runs: 6, acceptedAt: '2026-11-01T00:00:00.000Z' },
  aid: { valueJPerG: 18_500, standardUncertaintyJPerG: 2000 / (2 * Math.sqrt(3)), source: 'typical', label: 'Gelatin capsule, typical range 17500–19500 J/g' },
  cotton: null, labRepeatability: null,
}
const run = {
  id: 'run-1', planId: 'p-1', planName: 'Coal batch', seq: 1, sampleCode: 'C-1', kind: 'sample' as const, vesselId: 'v-1', sampleName: 'Coal', plannedSampleMassG: 1,
  aid: { name: 'Gelatin capsule', massG: 0.1 }, fuse: { wire: 'nichrome', lengthCm: 10, massG: null },
  firing: { id: 'f-1', outcome: 'complete', weighedMassG: 1, aidMassG: 0.1, observations: '', firedAt: '2026-12-01T10:00:00Z', firedByName: 'Ana Lyst' },
  result: null,
}
const unregister: (() => void)[] = []
afterEach(() => { while (unregister.length) unregister.pop()!() })

describe('BenchResultForm preview', () => {
  it('shows gross and net values with their units and U (k = 2), the ISO 1928 convention and "provisional" before saving; the saved body computes to the same figures', async () => {
    let sent: Record<string, unknown> | undefined
    unregister.push(registerEndpoint('/api/runs/run-1/result-context', () => parts))
    unregister.push(registerEndpoint('/api/runs/run-1/result', { method: 'POST', handler: async (event) => {
      sent = await readBody(event)
      const p = previewResult(sent, parts, DEFAULT_POLICY)
      return { result: { values: p.ok ? p.values : null }, check: null }
    } }))
    const w = await mountSuspended(BenchResultForm, { props: { run, policy: DEFAULT_POLICY } })
    await expect.poll(() => w.find('[data-testid="result-preview"]').text()).toContain('The preview needs')

    await w.findAll('button[role="radio"]').find(b => b.text() === 'Type θ')!.trigger('click')
    await w.find('[data-testid="theta-entered"]').setValue('2.8')
    await w.find('[data-testid="nitric-mol"]').setValue('0.0008')
    await w.find('[data-testid="sulfur-pct"]').setValue('3')
    await w.find('[data-testid="moisture-ad"]').setValue('1.5')
    await w.find('[data-testid="hydrogen-dry"]').setValue('5')

    // q = (ε·θ − e_fuse − e_N − e_S − e_aid)/m (ISO 1928): 10 000 × 2.8 − 10 cm × 9.6 J/cm − 0.0008 mol × 59 700 J/mol
    // − 94.2 × 3 × 1 (ISO 1928 sulfur, 302 kJ/mol) − 0.1 g × 18 500 J/g = 25 723.64 J/g.
    const gross = 28_000 - 96 - 47.76 - 282.6 - 1850
    expect(gross).toBeCloseTo(25_723.64, 9)
    await expect.poll(() => w.find('[data-testid="preview-gross"]').text(), { timeout: 10_000 }).toContain(formatSpecificEnergy(gross, 'J/g'))
    const preview = w.find('[data-testid="result-preview"]').text()
    expect(preview).toMatch(/± [\d,. ]+ J\/g \(U, k = 2\)/)
    expect(preview).toContain('94.2 J per (% S × g) (ISO 1928)')
    expect(w.find('[data-testid="preview-provisional"]').text()).toContain('Provisional')
    // Net at constant volume, as determined: [q_gr,d − 206.0·H_d](1 − 0.01·M) − 23.05·M with q_gr,d = q·100/(100 − M) (ISO 1928).
    const netAd = (gross * 100 / 98.5 - 206.0 * 5) * (1 - 0.015) - 23.05 * 1.5
    const netCell = w.findAll('[data-testid="result-preview"] tr').find(r => r.text().startsWith('Net, constant volume'))!.find('[data-basis="air-dried"]').text()
    expect(netCell).toContain(formatSpecificEnergy(netAd, 'J/g').split(' ')[0])
    expect(netCell).toMatch(/J\/g[\s\S]*± [\d,. ]+ J\/g \(k = 2\)/)

    await w.find('form').trigger('submit')
    await expect.poll(() => w.emitted('saved')?.length).toBe(1)
    const stored = (w.emitted('saved')![0]![0] as { result: { values: { grossJPerG: Record<string, number> } } }).result.values
    expect(stored.grossJPerG['air-dried']).toBeCloseTo(gross, 9)
    expect(sent).toMatchObject({ temperatureRiseK: 2.8, acid: { nitricAcidMol: 0.0008 }, sulfurPct: 3 })
  })

  it('says why there is no preview when the run cannot have a result yet', async () => {
    // The answer as the server's error plugin writes it: status and message.
    unregister.push(registerEndpoint('/api/runs/run-2/result-context', (event) => {
      setResponseStatus(event, 409)
      return { statusCode: 409, message: 'Vessel A has no accepted energy equivalent: standardise the vessel first.' }
    }))
    const w = await mountSuspended(BenchResultForm, { props: { run: { ...run, id: 'run-2' }, policy: DEFAULT_POLICY } })
    await expect.poll(() => w.find('[data-testid="result-preview"]').text()).toContain('No preview: Vessel A has no accepted energy equivalent')
  })
})
