// Nutrition components in jsdom with real Vuetify: need-against-supply bars with their words, unit-aware number fields, and the herd's live needs.
import { describe, expect, it } from 'vitest'
import { nextTick } from 'vue'
import NeedSupplyBars from '../../../src/components/nutrition/NeedSupplyBars.vue'
import NutritionNumberField from '../../../src/components/nutrition/NutritionNumberField.vue'
import HerdRequirements from '../../../src/components/nutrition/HerdRequirements.vue'
import { useSessionStore } from '../../../src/stores/session'
import { mountWithApp } from '../../helpers/mount'
import type { Me } from '../../../shared/schemas/auth'
import type { BalanceResult } from '../../../shared/engine/nutrition/ration/schema'
import { pregnancyNem } from '../../../shared/engine/nutrition/cattle'

const me = (unitSystem: 'us' | 'metric'): Me => ({ id: 1, name: 'Test', email: 't@example.test', isAdmin: false, unitSystem, memberships: [{ operationId: 7, operationName: 'Test Op', role: 'owner', isDemo: false }] })

const result: BalanceResult = {
  status: 'short',
  intakes: [{ feedId: 'feed-1', kgDm: 10, kgAsFed: 12.5 }],
  supply: [
    { nutrient: 'tdn', unit: 'kg', need: 5, supplied: 5, pctCovered: 100 },
    { nutrient: 'cp', unit: 'kg', need: 1, supplied: 0.8, pctCovered: 80 },
    { nutrient: 'ca', unit: 'g', need: 20, supplied: 30, pctCovered: 150 },
  ],
  deficiencies: [],
  stillShort: [],
  supplements: [],
  costPerHeadDay: 0,
  intakeCapacityKg: 10,
  minLegumeShareForProtein: null,
  conflicts: [],
  warnings: [],
  solver: 'highs',
  solverRuns: [],
}

describe('NeedSupplyBars', () => {
  it('when CP is at 80 %, TDN at 100 % and Ca at 150 %, then the bars say short, covered and surplus with those percentages', () => {
    const { wrapper, pinia } = mountWithApp(NeedSupplyBars, { props: { result } })
    useSessionStore(pinia).accept(me('us'))
    const word = (k: string) => wrapper.find(`[data-test=bar-${k}] [data-test=bar-word]`).text()
    const pct = (k: string) => wrapper.find(`[data-test=bar-${k}] [data-test=bar-pct]`).text()
    expect([word('tdn'), word('cp'), word('ca')]).toEqual(['covered', 'short', 'surplus'])
    expect([pct('tdn'), pct('cp'), pct('ca')]).toEqual(['100 %', '80 %', '150 %'])
    expect(wrapper.find('[data-test=bar-dm] [data-test=bar-word]').text()).toBe('within capacity')
  })

  it('when the user switches to metric, then kg amounts show in kg and grams stay grams', async () => {
    const { wrapper, pinia } = mountWithApp(NeedSupplyBars, { props: { result } })
    const s = useSessionStore(pinia)
    s.accept(me('us'))
    await nextTick()
    expect(wrapper.find('[data-test=bar-cp] [data-test=bar-amounts]').text()).toBe('need 2.20 lb · supplied 1.76 lb')
    s.accept(me('metric'))
    await nextTick()
    expect(wrapper.find('[data-test=bar-cp] [data-test=bar-amounts]').text()).toBe('need 1.00 kg · supplied 0.80 kg')
    expect(wrapper.find('[data-test=bar-ca] [data-test=bar-amounts]').text()).toBe('need 20.0 g · supplied 30.0 g')
  })
})

describe('NeedSupplyBars shadow prices', () => {
  it('when CP is binding at $0.50 per kg (a HiGHS dual), then US shows $0.23 per lb (NIST pound 0.45359237 kg) and metric $0.50 per kg; non-binding needs show none', async () => {
    const priced: BalanceResult = { ...result, supply: result.supply.map((x) => (x.nutrient === 'cp' ? { ...x, shadowPrice: 0.5 } : { ...x, shadowPrice: 0 })) }
    const { wrapper, pinia } = mountWithApp(NeedSupplyBars, { props: { result: priced } })
    const s = useSessionStore(pinia)
    s.accept(me('us'))
    await nextTick()
    expect(wrapper.find('[data-test=bar-cp] [data-test=bar-marginal]').text()).toBe('Binding: one more lb a head would add $0.23 a day')
    expect(wrapper.find('[data-test=bar-tdn] [data-test=bar-marginal]').exists()).toBe(false)
    s.accept(me('metric'))
    await nextTick()
    expect(wrapper.find('[data-test=bar-cp] [data-test=bar-marginal]').text()).toBe('Binding: one more kg a head would add $0.50 a day')
  })
})

describe('NutritionNumberField', () => {
  it('when the model is 544.31 kg, then it shows 1200 lb; typing 1000 stores 453.59237 kg (NIST pound); metric shows 453.6', async () => {
    const { wrapper, pinia } = mountWithApp(NutritionNumberField, { props: { label: 'Body weight', kind: 'mass', digits: 1, modelValue: 544.310844 } })
    const s = useSessionStore(pinia)
    s.accept(me('us'))
    await nextTick()
    const input = wrapper.find('input')
    await wrapper.setProps({ modelValue: 544.310844 })
    expect((input.element as HTMLInputElement).value).toBe('1200')
    await input.setValue('1000')
    const emitted = wrapper.emitted('update:modelValue')!.at(-1)![0] as number
    expect(emitted).toBeCloseTo(453.59237, 9)
    await wrapper.setProps({ modelValue: emitted })
    s.accept(me('metric'))
    await nextTick()
    expect((input.element as HTMLInputElement).value).toBe('453.6')
  })
})

describe('HerdRequirements', () => {
  const cows = { name: 'Test cows', species: 'cattle' as const, class: 'cow' as const, headCount: 10, bodyWeightKg: 544, matureWeightKg: 544, bcs: 5, expectedBirthDate: '2027-03-10', grazing: false }
  it('when the form describes cows on day 190, then the pregnancy part equals NRC 2000 Table 4-2 (1.166 Mcal NEm/d) and it changes live when cold is added', async () => {
    const date = '2026-12-02'
    const { wrapper, pinia } = mountWithApp(HerdRequirements, { props: { herd: cows, date } })
    useSessionStore(pinia).accept(me('us'))
    await nextTick()
    expect(wrapper.find('[data-test=herd-stage]').text()).toContain('day 185')
    await wrapper.setProps({ date: '2026-12-07' })
    expect(wrapper.find('[data-test=herd-stage]').text()).toContain('day 190')
    expect(wrapper.find('[data-test=part-pregnancy]').text()).toContain(`${pregnancyNem(190).toFixed(2)} Mcal NEm`)
    expect(pregnancyNem(190)).toBeCloseTo(1.166, 2)
    expect(wrapper.find('[data-test=part-cold]').text()).toContain('0.00 Mcal')
    await wrapper.setProps({ herd: { ...cows, environment: { tempC: -15, windKph: 20, coat: 'dry-winter' } } })
    expect(wrapper.find('[data-test=part-cold]').text()).not.toContain('0.00 Mcal')
  })

  it('when the form is incomplete, then it says which fields to fix instead of showing numbers', async () => {
    const { wrapper, pinia } = mountWithApp(HerdRequirements, { props: { herd: { ...cows, headCount: 0 }, date: '2026-12-02' } })
    useSessionStore(pinia).accept(me('us'))
    await nextTick()
    expect(wrapper.find('[data-test=needs-waiting]').text()).toContain('headCount')
  })
})
