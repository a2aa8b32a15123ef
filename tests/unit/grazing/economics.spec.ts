// Tests of field economics: nitrogen credit value, harvested-feed cost per head-day, grazing against harvesting.
import { describe, expect, it } from 'vitest'
import { LB_KG, lbPerAcreToKgPerHa } from '../../../shared/engine/units'
import {
  HA_PER_ACRE,
  LEGUME_NITROGEN_PUBLISHED,
  grazeVsHarvest,
  grazeVsHarvestSchema,
  harvestedFeedCostPerHeadPerDay,
  legumeNitrogenCredit,
  nitrogenFigureKgPerHa,
  pricePerKgNitrogen,
  stockingDaysPerHa,
} from '../../../shared/engine/grazing/index'
import { expectZodErrorAt } from './builders'

describe('legume nitrogen', () => {
  it('every published figure names its source and is labelled read; lb/ac figures convert with NIST units (SARE MCCP 3rd ed.: 100–150 lb N/ac = 112–168 kg N/ha)', () => {
    expect(LEGUME_NITROGEN_PUBLISHED.length).toBeGreaterThanOrEqual(8)
    for (const f of LEGUME_NITROGEN_PUBLISHED) {
      expect(f.source.length).toBeGreaterThan(0)
      expect(f.evidence).toBe('read')
      expect(f.low).toBeLessThanOrEqual(f.high)
    }
    const sare = LEGUME_NITROGEN_PUBLISHED.find((f) => f.source.startsWith('SARE'))!
    const kg = nitrogenFigureKgPerHa(sare)!
    expect(kg.low).toBeCloseTo(112.1, 1)
    expect(kg.high).toBeCloseTo(168.1, 1)
    const vest = LEGUME_NITROGEN_PUBLISHED.find((f) => f.unit === 'kg N/ha' && f.low === 70)!
    expect(nitrogenFigureKgPerHa(vest)).toEqual({ low: 70, high: 70 })
    expect(nitrogenFigureKgPerHa(LEGUME_NITROGEN_PUBLISHED.find((f) => f.unit === '%')!)).toBeNull()
  })

  it('a 40 lb N/ac credit (the UGA cowpea figure) at $0.60 per lb N is worth $24 per acre, whatever units it passes through', () => {
    const r = legumeNitrogenCredit({ creditKgNPerHa: lbPerAcreToKgPerHa(40), fertilizerPricePerKgN: 0.6 / LB_KG, areaHa: 10 * HA_PER_ACRE })
    expect(r.valuePerHa * HA_PER_ACRE).toBeCloseTo(24, 9)
    expect(r.valueForField).toBeCloseTo(240, 9)
  })

  it('fertilizer price per kg N is product price ÷ N content: urea at 46 % N (from memory) and $0.50/kg → $1.087/kg N', () => {
    expect(pricePerKgNitrogen(0.5, 0.46)).toBeCloseTo(1.087, 3)
    expectZodErrorAt(() => pricePerKgNitrogen(0.5, 0), ['nFraction'])
  })
})

describe('harvestedFeedCostPerHeadPerDay', () => {
  it('R. Lee (MAFG): bought hay at $35, $45, $55 a bale costs $1.26, $1.62, $1.98 per cow-day — with the hay rate implied at $45 the other two follow', () => {
    const baleKg = 545
    const balesPerDay = 1.62 / 45
    const intake = balesPerDay * baleKg * 0.88
    const at = (price: number) => harvestedFeedCostPerHeadPerDay({ intakeKgDmPerHead: intake, dmFraction: 0.88, pricePerKgAsFed: price / baleKg })
    expect(at(35)).toBeCloseTo(1.26, 2)
    expect(at(45)).toBeCloseTo(1.62, 10)
    expect(at(55)).toBeCloseTo(1.98, 2)
  })
  it('Drovers "Figuring out the forage" (Univ. of Missouri) assumed 20 % hay waste: cost rises by 1 ÷ 0.8', () => {
    const base = { intakeKgDmPerHead: 12, dmFraction: 0.88, pricePerKgAsFed: 0.12 }
    expect(harvestedFeedCostPerHeadPerDay({ ...base, wasteFraction: 0.2 })).toBeCloseTo(harvestedFeedCostPerHeadPerDay(base) / 0.8, 12)
  })
})

describe('grazeVsHarvest', () => {
  // Illustrative inputs: 100-bu milo (6,270 kg/ha as-is), stocking by grain at 13 lb a cow a day and 75 % use.
  const grainKgPerHa = 100 * 56 * LB_KG / HA_PER_ACRE
  const headDaysPerHa = stockingDaysPerHa({ availableKgDmPerHa: grainKgPerHa, utilization: 0.75, intakeKgDmPerHead: 13 * LB_KG })
  const input = {
    headDaysPerHa,
    headCount: 60,
    intakeKgDmPerHead: 12,
    cropCostPerHa: 250,
    grazing: { fencePerHa: 20, laborMinutesPerDay: 20, laborPricePerHour: 18 },
    harvest: { combiningPerHa: 110, haulingPerKgGrain: 0.004, grainKgPerHa, feedingPerHeadDay: 0.15, feedPricePerKgDm: 0.16, feedWasteFraction: 0.2 },
  }

  it('costs per hectare add up item by item, and per head-day is per hectare ÷ head-days (illustrative inputs)', () => {
    const r = grazeVsHarvest(input)
    expect(() => grazeVsHarvestSchema.parse(r)).not.toThrow()
    const daysPerHa = headDaysPerHa / 60
    expect(r.grazing.perHa).toBeCloseTo(250 + 20 + (daysPerHa * 20 * 18) / 60, 9)
    const need = headDaysPerHa * 12
    const grainDm = grainKgPerHa * 0.86
    expect(r.harvest.grainFedKgDm).toBeCloseTo(Math.min(grainDm, need), 9)
    expect(r.harvest.otherFeedKgDm).toBeCloseTo((need - r.harvest.grainFedKgDm) / 0.8, 9)
    expect(r.harvest.perHa).toBeCloseTo(250 + 110 + 0.004 * grainKgPerHa + r.harvest.otherFeedKgDm * 0.16 + 0.15 * headDaysPerHa, 9)
    expect(r.grazing.perHeadDay).toBeCloseTo(r.grazing.perHa / headDaysPerHa, 12)
    expect(r.savingPerHa).toBeCloseTo(r.harvest.perHa - r.grazing.perHa, 9)
  })

  it('a dearer harvested feed raises only the harvest side', () => {
    const a = grazeVsHarvest(input)
    const b = grazeVsHarvest({ ...input, harvest: { ...input.harvest, feedPricePerKgDm: 0.25 } })
    expect(b.grazing.perHa).toBe(a.grazing.perHa)
    expect(b.harvest.perHa).toBeGreaterThan(a.harvest.perHa)
  })

  it('when head-days per hectare is zero, then a ZodError names headDaysPerHa', () => {
    expectZodErrorAt(() => grazeVsHarvest({ ...input, headDaysPerHa: 0 }), ['headDaysPerHa'])
    expectZodErrorAt(() => grazeVsHarvest({ ...input, harvest: { ...input.harvest, feedWasteFraction: 1 } }), ['harvest', 'feedWasteFraction'])
  })
})
