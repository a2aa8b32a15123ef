// fast-check generators of ration problems: wide-ranging feeds, needs and limits, feasible and not, grain-share rows included.
import fc from 'fast-check'
import type { Feed, RationProblem } from '../../../../shared/engine/index'
import { netEnergy } from './independentLp'

const r2 = (v: number) => Math.round(v * 1e4) / 1e4
const num = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true }).map(r2)

const feedArb = (i: number, role: Feed['role'], withMinerals: boolean, withCu: boolean, dmi: number): fc.Arbitrary<Feed> =>
  fc
    .record({
      dmPct: num(15, 99),
      cpPctDm: role === 'mineral' ? fc.constant(0) : num(2, 50),
      tdnPctDm: role === 'mineral' ? fc.constant(0) : role === 'supplement' ? num(50, 95) : num(35, 90),
      caPctDm: role === 'mineral' ? num(5, 30) : num(0.1, 1.6),
      pPctDm: role === 'mineral' ? num(2, 20) : num(0.05, 0.7),
      cu: num(1, 20),
      isGrain: role === 'field' || role === 'supplement' ? fc.double({ min: 0, max: 1, noNaN: true }).map((v) => v < 0.3) : fc.constant(false),
      isUrea: role === 'supplement' ? fc.double({ min: 0, max: 1, noNaN: true }).map((v) => v < 0.08) : fc.constant(false),
      isLegume: role === 'field' ? fc.boolean() : fc.constant(false),
      cattleOnly: role === 'mineral' ? fc.boolean() : fc.constant(false),
      cost: num(0.02, 2.5),
      maxKgDm: fc.option(num(role === 'field' ? 0.3 : 0.02, role === 'field' ? 2 : 0.5).map((f) => r2(f * dmi)), { nil: undefined, freq: 3 }),
      minKgDm: fc.option(num(0, 0.05).map((f) => r2(f * dmi)), { nil: undefined, freq: 10 }),
    })
    .map((v) => {
      const f: Feed = {
        id: `f${i}`,
        name: `Feed ${i}`,
        role,
        dmPct: v.dmPct,
        cpPctDm: v.isUrea ? 281 : v.cpPctDm,
        tdnPctDm: v.isUrea ? 0 : v.tdnPctDm,
        ...(withMinerals ? { caPctDm: v.caPctDm, pPctDm: v.pPctDm } : {}),
        ...(withCu ? { cuMgPerKgDm: v.cu } : {}),
        ...(v.isGrain ? { isGrain: true } : {}),
        ...(v.isUrea ? { isUrea: true } : {}),
        ...(v.isLegume ? { isLegume: true } : {}),
        ...(v.cattleOnly ? { cattleOnly: true } : {}),
        ...(role !== 'field' ? { costPerKgDm: v.cost } : {}),
        ...(v.maxKgDm !== undefined ? { maxKgDm: v.maxKgDm } : {}),
      }
      if (v.minKgDm !== undefined && (f.maxKgDm === undefined || v.minKgDm <= f.maxKgDm)) f.minKgDm = v.minKgDm
      return f
    })

const dmiOf = (s: { species: 'cattle' | 'sheep'; size: number }) => r2((s.species === 'cattle' ? 12 : 2) * s.size)

/** Random ration problems of the shape a balance meets, from easy to impossible; fast-check's bias pushes values to their edges. */
export const edgeRationProblemArb: fc.Arbitrary<RationProblem> = fc
  .record({
    species: fc.constantFrom('cattle' as const, 'sheep' as const),
    nField: fc.integer({ min: 1, max: 4 }),
    nSupp: fc.integer({ min: 0, max: 4 }),
    nMineral: fc.integer({ min: 0, max: 1 }),
    withMinerals: fc.boolean(),
    withCu: fc.double({ min: 0, max: 1, noNaN: true }).map((v) => v < 0.15),
    size: num(0.05, 1.2),
    density: num(0.35, 0.72),
    cpDensity: num(0.04, 0.16),
    withNeg: fc.boolean(),
    maintShare: num(0.55, 0.95),
    needScale: num(0.7, 1.15),
    grain: fc.option(fc.constantFrom(0, 0.05, 0.1, 0.2, 0.3, 0.45, 0.6), { nil: undefined, freq: 1 }),
    offer: fc.boolean(),
    offerWeights: fc.array(num(0.05, 1), { minLength: 4, maxLength: 4 }),
    tolerance: fc.option(num(0, 0.3), { nil: undefined }),
    minCaToP: fc.option(fc.constantFrom(0, 1, 1.5), { nil: undefined }),
    maxCaToP: fc.option(fc.constantFrom(4, 7), { nil: undefined }),
    maxDmiFactor: fc.option(num(0.6, 2), { nil: undefined, freq: 4 }),
  })
  .chain((s) =>
    fc
      .tuple(
        ...Array.from({ length: s.nField }, (_, i) => feedArb(i, 'field', s.withMinerals, s.withCu, dmiOf(s))),
        ...Array.from({ length: s.nSupp }, (_, i) => feedArb(s.nField + i, 'supplement', s.withMinerals, s.withCu, dmiOf(s))),
        ...Array.from({ length: s.nMineral }, (_, i) => feedArb(s.nField + s.nSupp + i, 'mineral', s.withMinerals, s.withCu, dmiOf(s))),
      )
      .map((feeds) => {
        const dmi = dmiOf(s)
        const tdnKg = r2(dmi * s.density * s.needScale)
        // Net energy needs consistent with a diet of the same density: a share of intake for maintenance, the rest for gain.
        const e = netEnergy(100 * s.density)
        const mShare = s.withNeg ? s.maintShare : 1
        const requirements = {
          dmiKg: dmi,
          tdnKg,
          meMcal: r2(tdnKg * 3.615),
          ...(s.species === 'cattle' ? { nemMcal: r2(dmi * mShare * e.nem * s.needScale), negMcal: s.withNeg ? r2(dmi * (1 - mShare) * e.neg * s.needScale) : 0 } : {}),
          cpKg: r2(dmi * s.cpDensity * s.needScale),
          caG: r2(dmi * 3),
          pG: r2(dmi * 2.2),
          notes: [],
          sources: [],
        }
        const fieldFeeds = feeds.filter((f) => f.role === 'field')
        const w = fieldFeeds.map((_, i) => s.offerWeights[i])
        const sw = w.reduce((a, b) => a + b, 0)
        let shares = w.map((v) => Math.round((v / sw) * 1e6) / 1e6)
        shares = shares.map((v, i) => (i === shares.length - 1 ? Math.round((1 - shares.slice(0, -1).reduce((a, b) => a + b, 0)) * 1e6) / 1e6 : v))
        const limits = {
          ...(s.grain !== undefined ? { maxGrainShareOfDm: s.grain } : {}),
          ...(s.tolerance !== undefined ? { selectionTolerance: s.tolerance } : {}),
          ...(s.minCaToP !== undefined ? { minCaToP: s.minCaToP } : {}),
          ...(s.maxCaToP !== undefined ? { maxCaToP: s.maxCaToP } : {}),
          ...(s.maxDmiFactor !== undefined ? { maxDmiKg: r2(dmi * s.maxDmiFactor) } : {}),
        }
        const problem: RationProblem = {
          species: s.species,
          requirements,
          feeds,
          ...(s.offer ? { fieldOffer: fieldFeeds.map((f, i) => ({ feedId: f.id, shareOfDm: Math.max(0, shares[i]) })) } : {}),
          limits,
        }
        return problem
      }),
  )

/** The same problems with values spread evenly over their ranges (no bias to the edges), so most are ordinary rations. */
export const rationProblemArb: fc.Arbitrary<RationProblem> = fc.noBias(edgeRationProblemArb)
