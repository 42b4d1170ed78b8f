// The service form: the technician's figures reach the API in its units; the server's answer is shown beside the field.
import { mountSuspended, registerEndpoint } from '@nuxt/test-utils/runtime'
import { createError, readBody } from 'h3'
import { afterEach, describe, expect, it } from 'vitest'
import VesselServiceForm from '~/components/vessel/VesselServiceForm.vue'

const props = { vessel: { id: 'v-1', name: 'Vessel A', condition: 'in-service', conditionReason: null }, limits: { electrodeResistanceMaxOhm: 2, uploadMaxBytes: 10_485_760 } }
let unregister: (() => void) | undefined
afterEach(() => unregister?.())

async function fillRequalification(w: Awaited<ReturnType<typeof mountSuspended>>, pressure: string) {
  await w.find('select').setValue('requalification')
  const texts = w.findAll('fieldset input:not([type])')
  await texts[0]!.setValue('Outside test house')
  await texts[1]!.setValue('RQ-2026-001')
  await w.find('fieldset input[inputmode="decimal"]').setValue(pressure)
  await w.find('input[type="radio"]').setValue(true)
  await w.find('input[type="password"]').setValue('ember-demo-2026')
}

describe('VesselServiceForm', () => {
  it('sends a requalification with the test pressure typed in bar as MPa (NIST SP 811: 1 bar = 0.1 MPa)', async () => {
    let sent: Record<string, unknown> | undefined
    unregister = registerEndpoint('/api/vessels/v-1/services', { method: 'POST', handler: async (event) => {
      sent = await readBody(event)
      return { effect: { message: 'Requalified until 2027-12-02.' } }
    } })
    const w = await mountSuspended(VesselServiceForm, { props })
    await fillRequalification(w, '300 bar')
    await expect.poll(() => w.text(), { timeout: 15_000 }).toContain('= 30 MPa gauge')
    await w.find('form').trigger('submit')
    await expect.poll(() => w.emitted('saved')).toEqual([['Requalified until 2027-12-02.']])
    expect(sent).toMatchObject({ kind: 'requalification', testPressureMPa: 30, passed: true, certificateNumber: 'RQ-2026-001' })
  })

  it('shows the server\'s 422 beside the field it names, and keeps the form', async () => {
    unregister = registerEndpoint('/api/vessels/v-1/services', { method: 'POST', handler: () => {
      throw createError({ statusCode: 422, message: 'Check the marked fields.', data: { fields: [{ path: 'testPressureMPa', message: 'must be above the rated working pressure' }] } })
    } })
    const w = await mountSuspended(VesselServiceForm, { props })
    await fillRequalification(w, '1')
    await w.find('form').trigger('submit')
    await expect.poll(() => w.text()).toContain('must be above the rated working pressure')
    expect(w.emitted('saved')).toBeUndefined()
  })

  it('refuses to send before passed or failed is chosen', async () => {
    const w = await mountSuspended(VesselServiceForm, { props })
    await w.find('select').setValue('requalification')
    await w.find('form').trigger('submit')
    await expect.poll(() => w.text()).toContain('choose passed or failed')
  })
})
