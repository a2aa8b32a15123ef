// Feed prices per kg DM, the balance's input builder (sheep never offered cattle-only feeds), and the reference feed library's provenance.
import { describe, expect, it } from 'vitest'
import { costPerKgDm, costPerKgAsFed, type EffectiveValues } from '../../../shared/schemas/nutrition/feeds'
import { buildBalanceProblem, CATTLE_ONLY_REASON, type BalanceFeed } from '../../../shared/adapters/nutrition/problem'
import { readReferenceFeeds } from '../../../server/seed/reference'
import { fmtMass, massValue } from '../../../shared/schemas/nutrition/format'

const eff = (v: Partial<EffectiveValues>): EffectiveValues => ({ dmPct: 90, cpPctDm: 10, tdnPctDm: 60, ndfPctDm: null, adfPctDm: null, caPctDm: null, pPctDm: null, cuMgPerKgDm: null, nitrateNPpmDm: null, labResultId: null, labResultVersion: null, labSampleDate: null, fromLab: [], ...v })
const feed = (id: number, over: Partial<BalanceFeed> = {}): BalanceFeed => ({ id, name: `Feed ${id}`, kind: 'supplement', effective: eff({}), isGrain: false, isUrea: false, isLegume: false, cattleOnly: false, available: true, ...over })

describe('prices', () => {
  it('when soybean hulls (90 % DM, 75 % TDN) cost $180 a ton, then TDN costs $0.13 a lb (Alabama ACES by-product guide worked example, read)', () => {
    const perKgDm = costPerKgDm({ priceAmount: 180, priceUnit: 'ton' }, 90)!
    const perLbTdn = (perKgDm * 0.45359237) / 0.75
    expect(perLbTdn).toBeCloseTo(0.1333, 4)
    expect(Math.round(perLbTdn * 100) / 100).toBe(0.13)
  })

  it('when a 50-lb bag costs $25, then a kg as fed costs 25 / (50 × 0.45359237) (NIST SP 811 pound)', () => {
    expect(costPerKgAsFed({ priceAmount: 25, priceUnit: 'bag', bagWeightKg: 50 * 0.45359237 })).toBeCloseTo(25 / 22.6796185, 12)
    expect(costPerKgAsFed({ priceAmount: 25, priceUnit: 'bag', bagWeightKg: null })).toBeNull()
  })
})

describe('buildBalanceProblem', () => {
  const ewes = { species: 'sheep' as const, class: 'ewe' as 'ewe' | 'cow', bodyWeightKg: 70, matureWeightKg: null, bcs: 3, breed: null, expectedBirthDate: '2027-02-20', lastBirthDate: null, restStage: null, litterSize: 2, peakMilkKg: null, calfBirthWeightKg: null, targetGainKg: null, grazing: true, environment: null }

  it('when a sheep group is offered a cattle-only mineral, then it is left out with the copper reason and the problem never contains it', () => {
    const forage = feed(1, { kind: 'forage', effective: eff({ dmPct: 80, cpPctDm: 9, tdnPctDm: 55 }) })
    const mineral = feed(2, { kind: 'mineral', cattleOnly: true, effective: eff({ cpPctDm: 0, tdnPctDm: 0, cuMgPerKgDm: 1200 }) })
    const built = buildBalanceProblem({ herd: ewes, date: '2027-02-01', baseFeeds: [{ feed: forage }], supplements: [mineral, feed(3, { available: false })] })
    expect(built.excluded.map((x) => [x.feedId, x.reason])).toEqual([[2, CATTLE_ONLY_REASON], [3, 'Marked as not on hand.']])
    expect(built.problem.feeds.map((f) => f.id)).toEqual(['feed-1'])
    expect(built.needs.stage.sheepStage).toBe('late-gestation')
  })

  it('when base feeds have shares, then the offer adds to exactly 1 and a $/ton price becomes $/kg DM', () => {
    const cows = { ...ewes, species: 'cattle' as const, class: 'cow' as const, bodyWeightKg: 544, matureWeightKg: 544, bcs: 5, litterSize: null, expectedBirthDate: '2027-03-10' }
    const a = feed(1, { kind: 'forage' })
    const b = feed(2, { kind: 'forage' })
    const c = feed(3, { kind: 'forage' })
    const cube = feed(4, { priceAmount: 400, priceUnit: 'ton' })
    const built = buildBalanceProblem({ herd: cows, date: '2027-01-20', baseFeeds: [{ feed: a, sharePct: 33.3 }, { feed: b, sharePct: 33.3 }, { feed: c, sharePct: 33.4 }], supplements: [cube] })
    const sum = built.problem.fieldOffer!.reduce((s, o) => s + o.shareOfDm, 0)
    expect(Math.abs(sum - 1)).toBeLessThan(1e-12)
    expect(built.problem.feeds.find((f) => f.id === 'feed-4')!.costPerKgDm).toBeCloseTo(400 / (2000 * 0.45359237) / 0.9, 12)
  })
})

describe('reference-data/feeds.csv', () => {
  const rows = readReferenceFeeds()
  it('when the library is read, then every row names its source and every value it gives is labelled read, derived, from memory or common practice exactly once', () => {
    expect(rows.length).toBeGreaterThanOrEqual(20)
    const keyOf: Record<string, string> = { dm: 'dmPct', cp: 'cpPctDm', tdn: 'tdnPctDm', ndf: 'ndfPctDm', adf: 'adfPctDm', ca: 'caPctDm', p: 'pPctDm', cu: 'cuMgPerKgDm' }
    for (const r of rows) {
      expect(r.values.sourceTitle, r.key).toBeTruthy()
      const labels = [...r.provenance.read, ...r.provenance.derived, ...r.provenance.fromMemory, ...r.provenance.commonPractice]
      expect(new Set(labels).size, `${r.key}: a value labelled twice`).toBe(labels.length)
      for (const l of labels) expect(Object.keys(keyOf), `${r.key}: unknown key ${l}`).toContain(l)
      for (const [k, field] of Object.entries(keyOf)) {
        const given = (r.values as Record<string, unknown>)[field] != null
        expect(labels.includes(k), `${r.key}.${k}`).toBe(given)
      }
    }
  })

  it('when rows are compared with the Alabama ACES by-product guide, then the values read from it match (DDGS 90 / 28 / 95, Ca 0.05, P 0.88)', () => {
    const ddgs = rows.find((r) => r.key === 'ddgs')!
    expect(ddgs.values).toMatchObject({ dmPct: 90, cpPctDm: 28, tdnPctDm: 95, caPctDm: 0.05, pPctDm: 0.88 })
    expect(ddgs.provenance.read).toEqual(['dm', 'cp', 'tdn', 'ca', 'p'])
    const salt = rows.find((r) => r.key === 'tm-salt-cattle')!
    expect(salt.values).toMatchObject({ cattleOnly: true, cuMgPerKgDm: 350 })
  })
})

describe('format', () => {
  it('when a mass is shown in US units, then it uses 1 lb = 0.45359237 kg exactly (NIST SP 811)', () => {
    expect(massValue(0.45359237, 'us')).toBe(1)
    expect(fmtMass(544.31084, 'us', 0)).toBe('1,200 lb')
    expect(fmtMass(544.31084, 'metric', 1)).toBe('544.3 kg')
  })
})
