// Grazing display pieces: unit conversions of the screens (NIST definitions), the field map's strips and fence, and the caution list with rule, source and who comes first.
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { unitsFor, type Quantity } from '../../../src/composables/grazing/useUnits'
import FieldMap from '../../../src/components/grazing/FieldMap.vue'
import HazardList from '../../../src/components/grazing/HazardList.vue'
import { mountWithApp } from '../../helpers/mount'
import { hazards, CONSULT_FIRST } from '../../../shared/engine/grazing/index'

const us = unitsFor('us')
const metric = unitsFor('metric')

describe('display units', () => {
  it('NIST SP 811 (2008) App. B exact definitions: 1 ac = 0.40468564224 ha, 1 ft = 0.3048 m, 1 in = 2.54 cm, 1 lb = 0.45359237 kg', () => {
    expect(us.show('area', 0.40468564224)).toBeCloseTo(1, 12)
    expect(us.show('length', 0.3048)).toBeCloseTo(1, 12)
    expect(us.show('rowSpacing', 1.524)).toBeCloseTo(60, 10)
    expect(metric.show('rowSpacing', 1.524)).toBeCloseTo(152.4, 10)
    expect(us.show('mass', 0.45359237)).toBeCloseTo(1, 12)
  })

  it('conversion 1 g/m² → lb/ac = 8.922 (derived from NIST SP 811 definitions): 10 kg DM/ha reads 8.92 lb DM/ac; a short ton is 2,000 lb (NIST Handbook 44)', () => {
    expect(us.show('dmPerArea', 10)).toBeCloseTo(8.922, 3)
    expect(us.fmt('dmPerArea', 10, 2)).toBe('8.92 lb DM/ac')
    expect(us.show('pricePerMass', 0.1)).toBeCloseTo(90.718474, 6)
    expect(metric.show('pricePerMass', 0.1)).toBeCloseTo(100, 9)
  })

  it('when any figure goes to the screen and back, in either system, then it round-trips (property)', () => {
    const quantities: Quantity[] = ['area', 'length', 'rowSpacing', 'dmPerArea', 'nPerArea', 'mass', 'frameArea', 'pricePerMass', 'pricePerArea', 'pricePerN']
    fc.assert(
      fc.property(fc.constantFrom(...quantities), fc.constantFrom(us, metric), fc.double({ min: 1e-6, max: 1e7, noNaN: true }), (q, u, si) => {
        expect(u.toSi(q, u.show(q, si))).toBeCloseTo(si, Math.max(0, 6 - Math.ceil(Math.log10(si + 1))))
      }),
      { numRuns: 400 },
    )
  })

  it('when standing grain is shown, then US reads 56-lb bushels per acre and metric kg per hectare (100 bu/ac = 6,277 kg/ha)', () => {
    const kgHa = (100 * 56 * 0.45359237) / 0.40468564224
    expect(us.grain(kgHa)).toBe('100 bu/ac')
    expect(metric.grain(kgHa)).toBe('6,277 kg/ha')
  })
})

describe('FieldMap', () => {
  it('when a plan is on day 3, then the grazed ground, today’s strip and the front fence stand in proportion along the field', () => {
    const { wrapper } = mountWithApp(FieldMap, {
      props: {
        lengthM: 800,
        widthM: 200,
        legumeShare: 0.5,
        strips: [
          { fromM: 0, toM: 200, state: 'grazed' },
          { fromM: 200, toM: 300, state: 'today' },
        ],
        fenceAtM: 300,
      },
    })
    const today = wrapper.get('[data-test=map-today-strip]')
    expect(Number(today.attributes('x'))).toBeCloseTo(150, 6)
    expect(Number(today.attributes('width'))).toBeCloseTo(75, 6)
    expect(Number(wrapper.get('[data-test=map-fence]').attributes('x1'))).toBeCloseTo(225, 6)
    expect(wrapper.get('svg').attributes('aria-label')).toContain('legume on 50 % of the width')
  })

  it('when the group has the whole field, then no fence is drawn', () => {
    const { wrapper } = mountWithApp(FieldMap, { props: { lengthM: 800, widthM: 200, legumeShare: 0, fenceAtM: 100, wholeField: true } })
    expect(wrapper.find('[data-test=map-fence]').exists()).toBe(false)
  })
})

describe('HazardList', () => {
  it('UNL BeefWatch 2024 frost wait: the caution shows its message, and on opening its rule, source and that a veterinarian comes first', async () => {
    const list = hazards(
      { id: 'f', name: 'Test field', areaHa: 10, fenceLengthM: 200, rowSpacingM: 0.762, legume: 'none', components: [{ kind: 'sorghum-stover', kgDmPerHa: 5000, measuredOn: '2025-10-01', method: 'visual' }], killingFrostDates: ['2025-11-10'] },
      { id: 'g', name: 'Test cows', species: 'cattle', headCount: 10, bodyWeightKg: 550, intakeKgDmPerHead: 12 },
      '2025-11-12',
    )
    const { wrapper } = mountWithApp(HazardList, { props: { hazards: list } })
    const frost = wrapper.get('[data-test=hazard-frost-wait]')
    expect(frost.text()).toContain('Danger')
    expect(frost.text()).toContain('2025-11-17')
    await frost.get('button').trigger('click')
    await new Promise((r) => setTimeout(r, 50))
    expect(frost.text()).toContain('UNL BeefWatch 2024')
    expect(frost.text()).toContain('7 days after a killing frost')
    expect(frost.text()).toContain(CONSULT_FIRST)
  })

  it('when a limit is set (the crew phone view), then the most severe cautions show first and the rest wait behind one tap', async () => {
    const base = { measuredOn: '2025-10-01', method: 'visual' as const }
    const list = hazards(
      { id: 'f', name: 'Test field', areaHa: 10, fenceLengthM: 200, rowSpacingM: 0.762, legume: 'none', components: [{ kind: 'sorghum-grain', kgDmPerHa: 4000, ...base }, { kind: 'sorghum-stover', kgDmPerHa: 5000, ...base }], killingFrostDates: ['2025-11-10'], nitrate: { value: 3000, unit: 'ppm-NO3-N', sampledOn: '2025-10-01' } },
      { id: 'g', name: 'Test ewes', species: 'sheep', headCount: 10, bodyWeightKg: 70, intakeKgDmPerHead: 2, pregnant: true },
      '2025-11-12',
    )
    expect(list.length).toBeGreaterThan(2)
    const { wrapper } = mountWithApp(HazardList, { props: { hazards: list, limit: 2 } })
    expect(wrapper.findAll('[data-test^=hazard-]').length).toBe(2)
    expect(wrapper.get('[data-test=hazard-frost-wait]').text()).toContain('Danger')
    const more = wrapper.get('[data-test=hazards-more]')
    expect(more.text()).toContain(`Show ${list.length - 2} more`)
    await more.trigger('click')
    expect(wrapper.findAll('[data-test^=hazard-]').length).toBe(list.length)
    expect(wrapper.find('[data-test=hazards-more]').exists()).toBe(false)
  })
})
