// The quick check's result panel: the verdict in words, and the unit switch handing the choice back to the page.
import { mountSuspended } from '@nuxt/test-utils/runtime'
import { describe, expect, it } from 'vitest'
import CheckResult from '~/components/check/CheckResult.vue'
import { assessCharge } from '#shared/domain/assessment'
import { DEFAULT_POLICY } from '#shared/domain/policy'
import { benzoicAcid, makeCharge, makeVessel, nichromeFuse } from '../unit/assessment/factories'

function mountFor(massG: number) {
  const input = makeCharge([benzoicAcid(massG), nichromeFuse()])
  const assessment = assessCharge(input, DEFAULT_POLICY)
  return mountSuspended(CheckResult, {
    props: { assessment, vessel: makeVessel(), fillPressureMPa: input.fillPressureMPa, policy: DEFAULT_POLICY, components: input.components, server: { kind: 'agree' }, unit: 'J/g' },
  })
}

describe('CheckResult', () => {
  it('says a 1 g benzoic acid charge (26 454 J/g, NIST SRM 39j certificate) is within a 33 kJ vessel', async () => {
    const w = await mountFor(1)
    expect(w.find('[data-testid="verdict"]').text()).toContain('Within this vessel\'s ratings')
  })

  it('tells the analyst not to fire 1.5 g (about 39.7 kJ) in a 33 kJ vessel', async () => {
    const w = await mountFor(1.5)
    expect(w.find('[data-testid="verdict"]').text()).toContain('Do not fire this charge in this vessel')
  })

  it('hands the chosen display unit back to the page', async () => {
    const w = await mountFor(1)
    await w.find('button[role="radio"]:not([aria-checked="true"])').trigger('click')
    expect(w.emitted('update:unit')?.[0]).toEqual(['MJ/kg'])
  })
})
