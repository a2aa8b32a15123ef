// Reference tests for the yield worksheets: row lengths, head counts, hand harvest, stover rules, clipped frames.
import { describe, expect, it } from 'vitest'
import { convertArea, FT_M, IN_M, LB_KG, kgPerHaToLbPerAcre } from '../../../shared/engine/units'
import {
  SORGHUM_GRAIN_DM_FRACTION,
  clipPlotDm,
  gPerM2ToKgPerHa,
  grainYieldFromHeadWeight,
  grainYieldFromHeads,
  handHarvestYield,
  harvestIndexFromStoverRule,
  lbPerAcrePerDryGram,
  perAcreToPerHa,
  rowLengthForThousandthAcreFt,
  sampleSpread,
  sampledRowAcres,
  sampledRowAreaHa,
  sorghumBuPerAcreToKgPerHa,
  stoverFromGrain,
  summarizeClipPlots,
} from '../../../shared/engine/grazing/index'
import { expectZodErrorAt } from './builders'

describe('rowLengthForThousandthAcreFt', () => {
  // Derived from the international acre (43,560 ft², NIST SP 811 App. B): L = 522.72 ÷ spacing in inches.
  it.each([
    [20, 26.136],
    [22, 23.76],
    [30, 17.424],
    [36, 14.52],
    [38, 13.756],
    [40, 13.068],
    [60, 8.712],
  ])('when rows are %i in apart, then 1/1000 acre is %f ft of row (derived from the NIST SP 811 acre; 30 in matches K-State eUpdate 461)', (w, ft) => {
    expect(rowLengthForThousandthAcreFt(w)).toBeCloseTo(ft, 3)
  })

  it('when rows are 30 in, then the length rounds to the 17.4 ft of K-State Agronomy eUpdate 461/608 (Ciampitti et al.)', () => {
    expect(Number(rowLengthForThousandthAcreFt(30).toFixed(1))).toBe(17.4)
  })

  it.each([
    [20, 26, 1.6],
    [30, 17, 5.1],
    [40, 13, 0.8],
    [60, 8, 8.5],
  ])('when rows are %i in, then the length is %i ft %f in (derived from the NIST SP 811 acre)', (w, ft, inch) => {
    const L = rowLengthForThousandthAcreFt(w)
    expect(Math.floor(L)).toBe(ft)
    expect((L - Math.floor(L)) * 12).toBeCloseTo(inch, 1)
  })

  it('for any spacing from 20 to 60 in, length × spacing is 1/1000 acre by mathjs unit conversion (NIST definitions)', () => {
    for (let w = 20; w <= 60; w += 0.5) {
      const m2 = rowLengthForThousandthAcreFt(w) * FT_M * (w * IN_M)
      expect(convertArea(m2, 'm2', 'acre')).toBeCloseTo(0.001, 12)
    }
  })

  it('K-State eUpdate 461: two 15-in rows or four 7.5-in rows of 17.42 ft each make 1/1000 acre', () => {
    expect(sampledRowAcres({ rowSpacingIn: 15, rowLengthFt: 17.424, rows: 2 })).toBeCloseTo(0.001, 9)
    expect(sampledRowAcres({ rowSpacingIn: 7.5, rowLengthFt: 17.424, rows: 4 })).toBeCloseTo(0.001, 9)
  })

  it('when the spacing is not positive, then a ZodError names rowSpacingIn', () => {
    expectZodErrorAt(() => rowLengthForThousandthAcreFt(0), ['rowSpacingIn'])
    expectZodErrorAt(() => rowLengthForThousandthAcreFt(Number.NaN), ['rowSpacingIn'])
  })
})

describe('sampledRowAcres', () => {
  it('Mustang Seeds "Calculations" page: 100 ft × 60 in × 1 row = 0.011478 ac (= 100×60/522,720)', () => {
    expect(sampledRowAcres({ rowSpacingIn: 60, rowLengthFt: 100, rows: 1 })).toBeCloseTo(0.011478, 6)
  })
  it('the same stretch in hectares agrees with mathjs acre → ha conversion (NIST)', () => {
    const ha = sampledRowAreaHa({ rowSpacingIn: 60, rowLengthFt: 100, rows: 1 })
    expect(ha).toBeCloseTo(convertArea(100 * 5, 'ft2', 'ha'), 12)
  })
})

describe('grainYieldFromHeads', () => {
  const input = { rowSpacingIn: 30, rowLengthFt: 17.424, rows: 1, heads: 50, seedsPerHead: 2000, seedsPerLb: 15000 }

  it('K-State Agronomy eUpdate 461/608 formula with 56-lb bushel: 50 heads per 1/1000 ac, 2,000 seeds/head, 15,000 seeds/lb → 6,667 lb = 119.05 bu/ac (inputs illustrative)', () => {
    const r = grainYieldFromHeads(input)
    expect(r.headsPerAcre).toBeCloseTo(50_000, 6)
    expect(r.lbPerAcre).toBeCloseTo(6666.67, 2)
    expect(r.buPerAcre).toBeCloseTo(119.05, 2)
  })

  it('the 56-lb bushel: bu × 56 gives back the pounds (USDA test weight, K-State eUpdate 461)', () => {
    const r = grainYieldFromHeads(input)
    expect(r.buPerAcre * 56).toBeCloseTo(r.lbPerAcre, 9)
  })

  it('the same 1/1000 acre counted on 60-in rows (8.712 ft) gives the same yield (derived)', () => {
    const r = grainYieldFromHeads({ ...input, rowSpacingIn: 60, rowLengthFt: 8.712 })
    expect(r.buPerAcre).toBeCloseTo(119.05, 2)
  })

  it('SI outputs agree with NIST pound and acre: kg/ha = lb/ac × 0.45359237 ÷ 0.40468564224; grain DM at the 14 % moisture basis (from memory)', () => {
    const r = grainYieldFromHeads(input)
    expect(r.kgPerHa).toBeCloseTo((r.lbPerAcre * LB_KG) / 0.40468564224, 8)
    expect(r.kgDmPerHa).toBeCloseTo(r.kgPerHa * 0.86, 8)
  })

  it('when heads is not a whole number, then a ZodError names heads', () => {
    expectZodErrorAt(() => grainYieldFromHeads({ ...input, heads: 2.5 }), ['heads'])
    expectZodErrorAt(() => grainYieldFromHeads({ ...input, seedsPerLb: 0 }), ['seedsPerLb'])
  })
})

describe('grainYieldFromHeadWeight', () => {
  it('Bean, High Plains Journal 2020 (≈0.1 lb grain per head): 50,000 heads/ac → 5,000 lb/ac = 89.3 bu/ac', () => {
    const r = grainYieldFromHeadWeight({ headsPerHa: perAcreToPerHa(50_000) })
    expect(kgPerHaToLbPerAcre(r.kgPerHa)).toBeCloseTo(5000, 6)
    expect(r.buPerAcre).toBeCloseTo(89.3, 1)
  })
})

describe('handHarvestYield', () => {
  it('Mustang Seeds "Calculations" hand-harvest formula: 10 lb at 20 % moisture from 100 ft of one 30-in row → 1,620.8 lb/ac at 14 % = 28.9 bu/ac', () => {
    const r = handHarvestYield({ rowSpacingIn: 30, rowLengthFt: 100, rows: 1, grainG: 10 * LB_KG * 1000, moisturePct: 20 })
    expect(r.lbPerAcre).toBeCloseTo(1620.8, 1)
    expect(r.buPerAcre).toBeCloseTo(28.9, 1)
  })
})

describe('stoverFromGrain', () => {
  const grainKgPerHa = sorghumBuPerAcreToKgPerHa(80)
  it('Bean, "Utilizing sorghum stalks for grazing" (MAFG): 80 bu → 4,800 lb stover DM/ac by the ×60 rule', () => {
    expect(kgPerHaToLbPerAcre(stoverFromGrain({ grainKgPerHa }).kgDmPerHa)).toBeCloseTo(4800, 6)
  })
  it('Bean, Sorghum Checkoff Nov 2020: conservative grazeable stover 80 bu × 10 = 800 lb/ac', () => {
    expect(kgPerHaToLbPerAcre(stoverFromGrain({ grainKgPerHa, rule: 'palatable' }).kgDmPerHa)).toBeCloseTo(800, 6)
  })
  it('harvest index implied by the ×60 rule is 0.445 (derived: 48.16 ÷ 108.16)', () => {
    expect(harvestIndexFromStoverRule()).toBeCloseTo(0.4453, 4)
  })
  it('sorghum grain DM per 56-lb bushel at 14 % moisture is 48.16 lb (derived; 14 % basis from memory)', () => {
    expect(56 * SORGHUM_GRAIN_DM_FRACTION).toBeCloseTo(48.16, 10)
  })
})

describe('clipPlotDm', () => {
  it('Univ. of Maine pasture course, Lesson 1 App. E: 2.07 lb fresh per yd² at 25 % DM → 2,505 lb DM/ac (2,504.7)', () => {
    const wetG = 2.07 * LB_KG * 1000
    const r = clipPlotDm({ frameAreaFt2: 9, wetG, dryG: wetG * 0.25 })
    expect(r.lbDmPerAcre).toBeCloseTo(2504.7, 1)
    expect(r.dmPct).toBeCloseTo(25, 10)
  })

  it.each([
    [{ frameAreaFt2: 1 }, 9603],
    [{ frameAreaFt2: 2.4 }, 4001],
    [{ frameAreaM2: 1 }, 892],
  ])('when 100 dry g come from a %o frame, then the field has ≈%i lb DM/ac (derived from NIST SP 811 units)', (frame, lb) => {
    const r = clipPlotDm({ ...frame, wetG: 300, dryG: 100 })
    expect(Math.round(r.lbDmPerAcre)).toBe(lb)
  })

  it.each([
    [1, 96.03],
    [2, 48.02],
    [4, 24.01],
    [9, 10.67],
    [10.7639104, 8.922],
  ])('lb DM/ac per dry gram for a %f ft² frame is %f (derived from NIST units)', (ft2, factor) => {
    expect(lbPerAcrePerDryGram(ft2)).toBeCloseTo(factor, 2)
  })

  it('UNL Drought Center clip-and-weigh frame, 37 3/16 in square: grams × 10 = lb/ac (derived)', () => {
    const sideFt = 37.1875 / 12
    expect(lbPerAcrePerDryGram(sideFt * sideFt)).toBeCloseTo(10.0, 2)
  })

  it('1 g/m² = 10 kg/ha = 8.922 lb/ac (derived from SI and NIST units)', () => {
    expect(gPerM2ToKgPerHa(1)).toBe(10)
    expect(kgPerHaToLbPerAcre(gPerM2ToKgPerHa(1))).toBeCloseTo(8.922, 3)
  })

  it('FARM LLC microwave sheet: wet 100 g, dry 35 g → 35 % DM; a 50-g container is taken off both weights (UMaine formula)', () => {
    expect(clipPlotDm({ frameAreaM2: 1, wetG: 100, dryG: 35 }).dmPct).toBeCloseTo(35, 10)
    expect(clipPlotDm({ frameAreaM2: 1, wetG: 150, dryG: 85, containerG: 50 }).dmPct).toBeCloseTo(35, 10)
    expect(clipPlotDm({ frameAreaM2: 1, wetG: 150, dryG: 85, containerG: 50 }).kgDmPerHa).toBeCloseTo(350, 10)
  })

  it('when both or neither frame area is given, or dry exceeds wet, then a ZodError names the field', () => {
    expectZodErrorAt(() => clipPlotDm({ wetG: 100, dryG: 30 }), ['frameAreaM2'])
    expectZodErrorAt(() => clipPlotDm({ frameAreaM2: 1, frameAreaFt2: 1, wetG: 100, dryG: 30 }), ['frameAreaM2'])
    expectZodErrorAt(() => clipPlotDm({ frameAreaM2: 1, wetG: 100, dryG: 130 }), ['dryG'])
    expectZodErrorAt(() => clipPlotDm({ frameAreaM2: 1, wetG: 100, dryG: 30, containerG: 40 }), ['dryG'])
  })
})

describe('summarizeClipPlots and sampleSpread', () => {
  it('sample standard deviation uses n − 1 (definition): 2,4,4,4,5,5,7,9 → mean 5, sd √(32/7), CV 42.76 %', () => {
    const s = sampleSpread([2, 4, 4, 4, 5, 5, 7, 9])
    expect(s.mean).toBe(5)
    expect(s.sd).toBeCloseTo(Math.sqrt(32 / 7), 12)
    expect(s.cvPct).toBeCloseTo((Math.sqrt(32 / 7) / 5) * 100, 10)
    expect([s.min, s.max, s.n]).toEqual([2, 9, 8])
  })

  it('when several 1 m² frames are clipped, then the mean and spread are of their kg DM/ha (1 g/m² = 10 kg/ha)', () => {
    const s = summarizeClipPlots([180, 220, 200].map((dryG) => ({ frameAreaM2: 1, wetG: dryG * 4, dryG })))
    expect(s.kgDmPerHa.mean).toBeCloseTo(2000, 9)
    expect(s.kgDmPerHa.sd).toBeCloseTo(200, 9)
    expect(s.kgDmPerHa.cvPct).toBeCloseTo(10, 9)
    expect(s.dmPct.mean).toBeCloseTo(25, 9)
    expect(s.lbDmPerAcre.mean).toBeCloseTo(kgPerHaToLbPerAcre(2000), 6)
  })

  it('when one sample is given, then no spread is claimed (sd and CV are null)', () => {
    const s = sampleSpread([1234])
    expect(s.sd).toBeNull()
    expect(s.cvPct).toBeNull()
    expect(s.mean).toBe(1234)
  })

  it('when no samples are given, then a ZodError is thrown', () => {
    expectZodErrorAt(() => sampleSpread([]), [])
  })
})
