// Beef cattle requirements checked against NRC 2000, the extension tables and the equations' own worked values.
import { describe, expect, it } from 'vitest'
import { cattleDmi, cattleRequirements, feedEnergy, gainFromNeg, LB_KG, maintenanceNemBase, milkYieldKg, pregnancyMp, pregnancyNem } from '../../../shared/engine/index'
import type { CattleAnimal } from '../../../shared/engine/index'

const lb = (kg: number) => kg / LB_KG
const cow = (weightLb: number, extra: Partial<CattleAnimal> = {}): CattleAnimal => ({
  class: 'cow',
  bodyWeightKg: weightLb * LB_KG,
  matureWeightKg: weightLb * LB_KG,
  bcs: 5,
  ...extra,
})
// CSU Fact Sheet 1.615 (read): table values vary ±10 % for energy and ±15 % for organic constituents, ±30 % for minerals.
const within = (value: number, lo: number, hi: number, tol: number) => {
  expect(value).toBeGreaterThanOrEqual(lo * (1 - tol))
  expect(value).toBeLessThanOrEqual(hi * (1 + tol))
}

describe('pregnancy (NRC, Nutrient Requirements of Beef Cattle, 7th rev. ed., Update 2000, Table 4-2, read)', () => {
  it.each([
    [130, 0.327],
    [190, 1.166],
    [250, 3.333],
    [280, 5.174],
  ])('day %d with a 38.5-kg calf needs %d Mcal NEm/d (km 0.576), within ±0.002', (day, nem) => {
    expect(Math.abs(pregnancyNem(day, 38.5) - nem)).toBeLessThanOrEqual(0.002)
    const r = cattleRequirements(cow(1200, { pregnancyDay: day }))
    expect(Math.abs(r.components!.pregnancyNemMcal - nem)).toBeLessThanOrEqual(0.002)
  })
  it('scales with expected calf birth weight (NRC 2000 p. 43, read): a 45-kg calf needs 45/38.5 of the table value', () => {
    expect(pregnancyNem(250, 45) / pregnancyNem(250, 38.5)).toBeCloseTo(45 / 38.5, 12)
  })
  it('MP for pregnancy at day 280 with a 38.5-kg calf is 241 g/d (NRC 1996 equation, from memory; value derived)', () => {
    expect(pregnancyMp(280, 38.5)).toBeCloseTo(241, 0)
  })
})

describe('maintenance and its adjustment factors', () => {
  it('0.077 × SBW^0.75 (Lofgreen & Garrett 1968 via Zinn et al., J. Anim. Sci. 86:2680, 2008, read): 8.685 Mcal at 545 kg, 9.335 at 600 kg', () => {
    expect(maintenanceNemBase(545)).toBeCloseTo(8.685, 3)
    expect(maintenanceNemBase(600)).toBeCloseTo(9.335, 3)
  })
  it('a 1,200-lb cow (SBW = 0.96 × BW, NRC 1996, from memory) needs 8.416 Mcal NEm for maintenance; with pregnancy day 190 / 250 / 270, 9.581 / 11.748 / 12.912 (derived)', () => {
    // The derived 8.416 rounds SBW to 522.5 kg before the power, hence ±0.001.
    expect(Math.abs(cattleRequirements(cow(1200)).components!.maintenanceNemMcal - 8.416)).toBeLessThan(0.001)
    const at = (d: number) => cattleRequirements(cow(1200, { pregnancyDay: d })).nemMcal!
    expect(Math.abs(at(190) - 9.581)).toBeLessThan(0.003)
    expect(Math.abs(at(250) - 11.748)).toBeLessThan(0.003)
    expect(Math.abs(at(270) - 12.912)).toBeLessThan(0.003)
  })
  it('bulls need 15 % more than steers or heifers of the same genotype (NRC 2000 p. 8, read)', () => {
    const base = { bodyWeightKg: 700, matureWeightKg: 900, bcs: 5 }
    const bull = cattleRequirements({ class: 'bull', ...base }).components!.maintenanceNemMcal
    const steer = cattleRequirements({ class: 'growing', ...base }).components!.maintenanceNemMcal
    expect(bull / steer).toBeCloseTo(1.15, 12)
  })
  it('lactation raises maintenance by 20 % (Hersom, UF/IFAS AN190, read; coefficient 1.2 of NRC 1996, from memory)', () => {
    const dry = cattleRequirements(cow(1200)).components!.maintenanceNemMcal
    const wet = cattleRequirements(cow(1200, { daysInMilk: 60, peakMilkKg: 8 })).components!.maintenanceNemMcal
    expect(wet / dry).toBeCloseTo(1.2, 12)
  })
  it('breed multipliers 0.90 indicus, 0.95 indicus cross, 1.00 British and continental, 1.20 dairy cross (NRC 1996 breed table, from memory)', () => {
    const m = (breed: CattleAnimal['breed']) => cattleRequirements(cow(1200, { breed })).components!.maintenanceNemMcal
    const british = m('british')
    expect(m('indicus') / british).toBeCloseTo(0.9, 12)
    expect(m('indicus-cross') / british).toBeCloseTo(0.95, 12)
    expect(m('continental') / british).toBeCloseTo(1, 12)
    expect(m('dairy-cross') / british).toBeCloseTo(1.2, 12)
  })
  it('body condition COMP = 0.8 + 0.05 × (BCS − 1): 0.80 at BCS 1 and 1.20 at BCS 9 (NRC 1996, from memory)', () => {
    const m = (bcs: number) => cattleRequirements(cow(1200, { bcs })).components!.maintenanceNemMcal
    expect(m(1) / m(5)).toBeCloseTo(0.8, 12)
    expect(m(9) / m(5)).toBeCloseTo(1.2, 12)
  })
  it('grazing raises maintenance by the default ×1.10 setting, inside the ×1.08–1.30 measured by Di Marco & Aello (2001, read), and by any setting in that range', () => {
    const m = (grazing: boolean, f?: number) =>
      cattleRequirements(cow(1200, { grazing }), f === undefined ? undefined : { grazingActivityFactor: f }).components!.maintenanceNemMcal
    expect(m(true) / m(false)).toBeCloseTo(1.1, 12)
    expect(m(true, 1.3) / m(false)).toBeCloseTo(1.3, 12)
  })
})

describe('cold stress (coat table and the 1 %-per-°F rule)', () => {
  const coldShare = (a: CattleAnimal) => {
    const r = cattleRequirements(a)
    const c = r.components!
    return c.coldStressNemMcal / (c.maintenanceNemMcal + c.pregnancyNemMcal + c.lactationNemMcal)
  }
  it('lower critical temperatures 59 / 45 / 32 / 18 °F for wet-or-summer / dry fall / dry winter / heavy winter coats ("Are your cows prepared for the winter cold?"; NDSU, read)', () => {
    const fToC = (f: number) => ((f - 32) * 5) / 9
    for (const [coat, lct] of [['summer-or-wet', 59], ['dry-fall', 45], ['dry-winter', 32], ['heavy-winter', 18]] as const) {
      expect(coldShare(cow(1200, { environment: { tempC: fToC(lct), coat } }))).toBeCloseTo(0, 9)
      expect(coldShare(cow(1200, { environment: { tempC: fToC(lct - 10), coat } }))).toBeCloseTo(0.1, 9)
    }
  })
  it('at an effective 17 °F a dry winter coat needs +15 % energy and a wet coat +42 % (same article: ≈ +15 % and ≈ +40 %, 1 %/°F, read)', () => {
    const t = ((17 - 32) * 5) / 9
    expect(coldShare(cow(1200, { environment: { tempC: t, coat: 'dry-winter' } }))).toBeCloseTo(0.15, 9)
    expect(coldShare(cow(1200, { environment: { tempC: t, coat: 'dry-winter', mud: 'wet' } }))).toBeCloseTo(0.42, 9)
  })
  it('NDSU "Lower Critical Temperature for Beef Cattle" (read): a 1,300-lb late-gestation cow in a heavy winter coat at an effective 4 °F needs 1.14 × her TDN; her base need is within ±10 % (CSU 1.615) of the 12.7 lb the example uses (late gestation taken as day 260)', () => {
    const base = cattleRequirements(cow(1300, { pregnancyDay: 260 }))
    const cold = cattleRequirements(cow(1300, { pregnancyDay: 260, environment: { tempC: ((4 - 32) * 5) / 9, coat: 'heavy-winter' } }))
    expect(cold.tdnKg / base.tdnKg).toBeCloseTo(1.14, 9)
    within(lb(base.tdnKg), 12.7, 12.7, 0.1)
    expect(12.7 * 1.14).toBeCloseTo(14.48, 2)
  })
  it('wind: effective temperature = °F − mph (Meteer, OSU Extension, rule of thumb, read): 25 °F with 20 mph is 5 °F (NDSU\'s chart reads 4 °F)', () => {
    const r = cattleRequirements(cow(1300, { pregnancyDay: 260, environment: { tempC: ((25 - 32) * 5) / 9, windKph: 20 * 1.609344, coat: 'heavy-winter' } }))
    const c = r.components!
    expect(c.coldStressNemMcal / (c.maintenanceNemMcal + c.pregnancyNemMcal)).toBeCloseTo(0.13, 9)
  })
})

describe('lactation, growth and intake equations', () => {
  it('milk curve Y = n/(a·e^(kn)), peak 8 kg at week 8.5 (NRC 2000 p. 45, read): weeks 1, 4, 8.5, 12, 20, 30 give 2.27, 6.39, 8.00, 7.48, 4.87, 2.25 kg/d (derived)', () => {
    const expected = [[1, 2.27], [4, 6.39], [8.5, 8.0], [12, 7.48], [20, 4.87], [30, 2.25]]
    for (const [w, y] of expected) expect(milkYieldKg(w, 8)).toBeCloseTo(y, 2)
  })
  it('a lactating 1,200-lb cow at peak (8 kg milk) needs 10.10 Mcal maintenance (× 1.2) + 5.74 for milk at 0.718 Mcal/kg (NRC dairy NEl form, from memory) = 15.84 Mcal NEm', () => {
    const r = cattleRequirements(cow(1200, { daysInMilk: 8.5 * 7, peakMilkKg: 8 }))
    expect(r.components!.maintenanceNemMcal).toBeCloseTo(10.1, 2)
    expect(r.components!.lactationNemMcal).toBeCloseTo(5.74, 2)
    expect(r.nemMcal!).toBeCloseTo(15.84, 2)
  })
  it('a 300-kg SBW steer (FSBW 600, SRW 478) gaining 1.0 kg/d: EQSBW 239, NEm 5.55, NEg 3.37 Mcal; the read inverse SWG = 13.91 × RE^0.9116 × EQSBW^−0.6837 gives back 0.996 kg/d', () => {
    const r = cattleRequirements({ class: 'growing', bodyWeightKg: 300 / 0.96, matureWeightKg: 600 / 0.96, bcs: 5, adgKg: 1 })
    expect(r.components!.maintenanceNemMcal).toBeCloseTo(5.55, 2)
    expect(r.negMcal!).toBeCloseTo(3.37, 2)
    expect(gainFromNeg(r.negMcal!, 239)).toBeCloseTo(0.996, 2)
  })
  it('pregnant-cow DMI at SBW 522.5 kg on 50 / 55 / 60 % TDN diets is 9.62 / 9.91 / 10.36 kg DM/d (NRC 1996 equation, from memory; values derived)', () => {
    const dmi = (tdn: number) => cattleDmi('cow-pregnant', 522.5, feedEnergy({ tdnPctDm: tdn }).nemMcalPerKg)
    expect(dmi(50)).toBeCloseTo(9.62, 2)
    expect(dmi(55)).toBeCloseTo(9.91, 2)
    expect(dmi(60)).toBeCloseTo(10.36, 2)
  })
  it('a dry 1,200-lb cow on a 50 % TDN forage eats about 1.8 % of BW (Hibberd & Thrift 1992 via OSU, read), within ±10 %', () => {
    const dmi = cattleDmi('cow-open', 0.96 * 1200 * LB_KG, feedEnergy({ tdnPctDm: 50 }).nemMcalPerKg)
    within(dmi / (1200 * LB_KG), 0.018, 0.018, 0.1)
  })
})

describe('extension cow tables, within the CSU Fact Sheet 1.615 tolerance (energy ±10 %, CP ±15 %, minerals ±30 %)', () => {
  it('a 1,200-lb cow needs 9–11 lb TDN/d in late gestation (Jenkins, UNL Extension, read), checked at the middle of the last trimester (day 237)', () => {
    within(lb(cattleRequirements(cow(1200, { pregnancyDay: 237 })).tdnKg), 9, 11, 0.1)
  })
  it('the same cow needs 14.5–16.5 lb TDN/d in lactation (Jenkins, UNL Extension, read), checked at an 8-kg (18-lb) peak', () => {
    within(lb(cattleRequirements(cow(1200, { daysInMilk: 8.5 * 7, peakMilkKg: 8 })).tdnKg), 14.5, 16.5, 0.1)
  })
  it.each([
    ['mid-pregnancy (day 150)', { pregnancyDay: 150 }, 1.4, 1.4],
    ['non-lactating, last trimester (day 250)', { pregnancyDay: 250 }, 1.6, 1.6],
    ['lactating, 10 lb milk', { daysInMilk: 8.5 * 7, peakMilkKg: 10 * LB_KG }, 2.0, 2.0],
    ['early lactation, 18 lb milk', { daysInMilk: 8.5 * 7, peakMilkKg: 18 * LB_KG }, 2.14, 2.24],
    ['late lactation, 7 lb milk', { daysInMilk: 8.5 * 7, peakMilkKg: 7 * LB_KG }, 1.8, 1.9],
  ] as const)('a 1,000-lb cow, %s, needs the CP of Sprinkle, Arizona Coop. Ext. AZ9523 (read) — CP by the NRC level-1 microbial logic (from memory)', (_, extra, lo, hi) => {
    within(lb(cattleRequirements(cow(1000, extra)).cpKg), lo, hi, 0.15)
  })
  it('a 1,000-lb cow needs 0.81 oz Ca and 0.63 oz P in the last trimester, 0.88 and 0.70 oz lactating (AZ9523, read)', () => {
    const oz = (g: number) => g / 28.349523125
    const dry = cattleRequirements(cow(1000, { pregnancyDay: 250 }))
    within(oz(dry.caG), 0.81, 0.81, 0.3)
    within(oz(dry.pG), 0.63, 0.63, 0.3)
    const wet = cattleRequirements(cow(1000, { daysInMilk: 8.5 * 7, peakMilkKg: 10 * LB_KG }))
    within(oz(wet.caG), 0.88, 0.88, 0.3)
    within(oz(wet.pG), 0.7, 0.7, 0.3)
  })
  it('a 1,020-lb heifer (1,400-lb mature, BCS 5) gaining 2 lb/d needs 9.8 % CP in her diet (Montana State Univ. Extension, Pearson square example 2, read)', () => {
    const r = cattleRequirements({ class: 'growing', bodyWeightKg: 1020 * LB_KG, matureWeightKg: 1400 * LB_KG, bcs: 5, adgKg: 2 * LB_KG })
    within((100 * r.cpKg) / r.dmiKg, 9.8, 9.8, 0.15)
  })
})
