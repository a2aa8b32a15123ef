// Invalid input throws a ZodError naming the field; valid input never yields NaN or Infinity (fast-check).
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { ZodError } from 'zod'
import {
  asFedFromDm,
  balanceRation,
  cattleRequirements,
  feedEnergy,
  no3FromNo3N,
  pearsonSquare,
  rationWarnings,
  requirementsSchema,
  sheepRequirements,
  tdnFromAdf,
  type CattleAnimal,
  type SheepAnimal,
} from '../../../shared/engine/index'
import { cowpea, rangeCube, sorghumGrain, sorghumStover } from './helpers/feeds'

/** Runs f, expects a ZodError, and returns the paths and messages of its issues joined, so a test can look for the field. */
async function zodIssues(f: () => unknown): Promise<string> {
  try {
    await f()
  } catch (e) {
    expect(e).toBeInstanceOf(ZodError)
    return (e as ZodError).issues.map((i) => `${i.path.join('.')}: ${i.message} ${'keys' in i ? (i.keys as string[]).join(',') : ''}`).join(' | ')
  }
  throw new Error('no error thrown')
}

const goodCow: CattleAnimal = { class: 'cow', bodyWeightKg: 550, matureWeightKg: 550, bcs: 5, pregnancyDay: 200 }
const goodProblem = { species: 'cattle' as const, requirements: cattleRequirements(goodCow), feeds: [sorghumStover(), rangeCube()] }

describe('invalid input throws a ZodError that names the field', () => {
  it.each<[string, () => unknown, RegExp]>([
    ['feedEnergy: TDN below 0', () => feedEnergy({ tdnPctDm: -1 }), /^tdnPctDm/],
    ['feedEnergy: TDN not a number', () => feedEnergy({ tdnPctDm: Number.NaN }), /^tdnPctDm/],
    ['tdnFromAdf: ADF above 100', () => tdnFromAdf({ adfPctDm: 120 }), /^adfPctDm/],
    ['cattleRequirements: BCS 10 on the 1–9 scale', () => cattleRequirements({ ...goodCow, bcs: 10 }), /^bcs/],
    ['cattleRequirements: unknown class', () => cattleRequirements({ ...goodCow, class: 'ox' as never }), /^class/],
    ['cattleRequirements: temperature not finite', () => cattleRequirements({ ...goodCow, environment: { tempC: Infinity, coat: 'dry-winter' } }), /^environment\.tempC/],
    ['cattleRequirements: unknown key', () => cattleRequirements({ ...goodCow, colour: 'red' } as never), /colour/],
    ['cattleRequirements settings: intake factor 3', () => cattleRequirements(goodCow, { intakeFactor: 3 }), /^intakeFactor/],
    ['sheepRequirements: a ram in late gestation', () => sheepRequirements({ class: 'ram', bodyWeightKg: 90, stage: 'late-gestation' }), /^stage/],
    ['sheepRequirements: a 15-kg ewe', () => sheepRequirements({ class: 'ewe', bodyWeightKg: 15, stage: 'maintenance' }), /^bodyWeightKg/],
    ['sheepRequirements: litter of 4', () => sheepRequirements({ class: 'ewe', bodyWeightKg: 70, stage: 'late-gestation', litterSize: 4 as never }), /^litterSize/],
    ['pearsonSquare: target outside the two feeds', () => pearsonSquare({ a: { cpPct: 8 }, b: { cpPct: 12 }, targetCpPct: 14 }), /^targetCpPct/],
    ['pearsonSquare: negative CP', () => pearsonSquare({ a: { cpPct: -8 }, b: { cpPct: 12 }, targetCpPct: 10 }), /^a\.cpPct/],
    ['asFedFromDm: DM of 0 %', () => asFedFromDm(1, 0), /^dmPctAsFed/],
    ['no3FromNo3N: negative nitrate', () => no3FromNo3N(-5), /^no3N/],
    ['balanceRation: feed DM of 0 %', () => balanceRation({ ...goodProblem, feeds: [sorghumStover({ dmPct: 0 })] }), /^feeds\.0\.dmPct/],
    ['balanceRation: duplicate feed ids', () => balanceRation({ ...goodProblem, feeds: [sorghumStover(), sorghumStover()] }), /^feeds\.1\.id/],
    ['balanceRation: offered shares not adding up to 1', () => balanceRation({ ...goodProblem, fieldOffer: [{ feedId: 'stover', shareOfDm: 0.7 }] }), /^fieldOffer/],
    ['balanceRation: offer naming a supplement', () => balanceRation({ ...goodProblem, fieldOffer: [{ feedId: 'cube', shareOfDm: 1 }] }), /^fieldOffer\.0\.feedId/],
    ['balanceRation: grain share above 1', () => balanceRation({ ...goodProblem, limits: { maxGrainShareOfDm: 1.5 } }), /^limits\.maxGrainShareOfDm/],
    ['balanceRation: feed minimum above its maximum', () => balanceRation({ ...goodProblem, feeds: [rangeCube({ minKgDm: 2, maxKgDm: 1 })] }), /^feeds\.0\.maxKgDm/],
    ['balanceRation: requirement not finite', () => balanceRation({ ...goodProblem, requirements: { ...goodProblem.requirements, tdnKg: Number.NaN } }), /^requirements\.tdnKg/],
    ['balanceRation: unknown solver option', () => balanceRation(goodProblem, { solver: 'glpk' as never }), /^solver/],
    ['rationWarnings: negative intake', () => rationWarnings({ species: 'cattle', feeds: [sorghumStover()], intakes: [{ feedId: 'stover', kgDm: -1 }] }), /^intakes\.0\.kgDm/],
  ])('%s', async (_, f, field) => {
    expect(await zodIssues(f)).toMatch(field)
  })
})

const finiteDeep = (v: unknown): boolean =>
  typeof v === 'number' ? Number.isFinite(v) : Array.isArray(v) ? v.every(finiteDeep) : v && typeof v === 'object' ? Object.values(v).every(finiteDeep) : true

const cattleArb: fc.Arbitrary<CattleAnimal> = fc.record(
  {
    class: fc.constantFrom('cow', 'bred-heifer', 'growing', 'bull'),
    bodyWeightKg: fc.double({ min: 50, max: 1500, noNaN: true }),
    matureWeightKg: fc.double({ min: 200, max: 1500, noNaN: true }),
    bcs: fc.double({ min: 1, max: 9, noNaN: true }),
    breed: fc.constantFrom('british', 'continental', 'indicus-cross', 'indicus', 'dairy-cross'),
    pregnancyDay: fc.double({ min: 0, max: 300, noNaN: true }),
    calfBirthWeightKg: fc.double({ min: 10, max: 80, noNaN: true }),
    daysInMilk: fc.double({ min: 0, max: 400, noNaN: true }),
    peakMilkKg: fc.double({ min: 0, max: 30, noNaN: true }),
    adgKg: fc.double({ min: 0, max: 2.5, noNaN: true }),
    grazing: fc.boolean(),
    environment: fc.record(
      {
        tempC: fc.double({ min: -60, max: 50, noNaN: true }),
        windKph: fc.double({ min: 0, max: 150, noNaN: true }),
        coat: fc.constantFrom('summer-or-wet', 'dry-fall', 'dry-winter', 'heavy-winter'),
        mud: fc.constantFrom('none', 'some', 'wet', 'caked'),
      },
      { requiredKeys: ['tempC', 'coat'] },
    ),
  },
  { requiredKeys: ['class', 'bodyWeightKg', 'matureWeightKg', 'bcs'] },
) as fc.Arbitrary<CattleAnimal>

const sheepArb: fc.Arbitrary<SheepAnimal> = fc
  .record(
    {
      class: fc.constantFrom('ewe', 'ewe-lamb', 'growing-lamb', 'ram'),
      bodyWeightKg: fc.double({ min: 10, max: 160, noNaN: true }),
      bcs: fc.double({ min: 1, max: 5, noNaN: true }),
      stage: fc.constantFrom('maintenance', 'flushing', 'early-gestation', 'late-gestation', 'early-lactation', 'late-lactation'),
      litterSize: fc.constantFrom(1, 2, 3),
      adgG: fc.double({ min: 0, max: 500, noNaN: true }),
    },
    { requiredKeys: ['class', 'bodyWeightKg', 'stage'] },
  )
  .map((a) => (a.class === 'ram' && a.stage !== 'maintenance' && a.stage !== 'flushing' ? { ...a, stage: 'flushing' as const } : a))
  .map((a) => ({ ...a, bodyWeightKg: Math.max(a.bodyWeightKg, a.class === 'growing-lamb' ? 10 : a.class === 'ewe-lamb' ? 20 : 30) })) as fc.Arbitrary<SheepAnimal>

describe('no valid input yields NaN or Infinity (fast-check)', () => {
  it('feedEnergy over 0–200 % TDN', () => {
    fc.assert(fc.property(fc.double({ min: 0, max: 200, noNaN: true }), (t) => finiteDeep(feedEnergy({ tdnPctDm: t }))))
  })
  it('cattleRequirements over the whole valid range of every field, and its output passes the Requirements schema', () => {
    fc.assert(
      fc.property(cattleArb, (a) => {
        const r = cattleRequirements(a)
        requirementsSchema.parse(r)
        return finiteDeep(r)
      }),
      { numRuns: 500 },
    )
  })
  it('sheepRequirements over the whole valid range of every field', () => {
    fc.assert(fc.property(sheepArb, (a) => finiteDeep(requirementsSchema.parse(sheepRequirements(a)))), { numRuns: 500 })
  })
  it('balanceRation of any valid cattle or sheep group on a sorghum field with a cube', async () => {
    await fc.assert(
      fc.asyncProperty(fc.oneof(cattleArb.map((a) => ({ species: 'cattle' as const, r: cattleRequirements(a) })), sheepArb.map((a) => ({ species: 'sheep' as const, r: sheepRequirements(a) }))), async ({ species, r }) => {
        const res = await balanceRation({ species, requirements: r, feeds: [sorghumGrain(), sorghumStover(), cowpea(), rangeCube({ maxKgDm: 2 })], limits: { maxGrainShareOfDm: 0.4 } })
        return finiteDeep(res)
      }),
      { numRuns: 200 },
    )
  })
})
