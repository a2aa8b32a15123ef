// Behaviour of balanceRation: status, least cost, ties, shortfalls in words, legume share, warnings, the solver guard.
import { readFileSync } from 'node:fs'
import { beforeAll, describe, expect, it } from 'vitest'
import {
  balanceRation,
  balanceRations,
  cattleRequirements,
  LB_KG,
  rationLinearProgram,
  sheepRequirements,
  solveLp,
  type LinearProgram,
  type RationProblem,
  type Requirements,
} from '../../../shared/engine/index'
import { cattleMineral, cowpea, dicalcium, problemOf, rangeCube, sorghumGrain, sorghumStover } from './helpers/feeds'
import { independentLp, loadIndependentSolvers, solveWithGlpk, verifyDiet } from './helpers/independentLp'

beforeAll(async () => {
  await loadIndependentSolvers()
})

const lateGestationCow = cattleRequirements({ class: 'cow', bodyWeightKg: 1200 * LB_KG, matureWeightKg: 1200 * LB_KG, bcs: 5, pregnancyDay: 250, grazing: true })
const kgOf = (r: Awaited<ReturnType<typeof balanceRation>>, id: string) => r.intakes.find((i) => i.feedId === id)!.kgDm
const withReq = (r: Requirements, o: Partial<Requirements>): Requirements => ({ ...r, ...o })
const dietOf = (p: RationProblem, r: Awaited<ReturnType<typeof balanceRation>>) => p.feeds.map((f) => kgOf(r, f.id))

describe('balanceRation: a cow in late gestation on a sorghum field', () => {
  it('when stover, grain and cowpea cover every need, then the status is covered, nothing is bought and she eats to capacity (ties go to the most field feed)', async () => {
    const p = problemOf(lateGestationCow, [sorghumGrain(), sorghumStover(), cowpea(), rangeCube()], {
      fieldOffer: [{ feedId: 'grain', shareOfDm: 0.3 }, { feedId: 'stover', shareOfDm: 0.55 }, { feedId: 'cowpea', shareOfDm: 0.15 }],
      limits: { maxGrainShareOfDm: 0.35 },
    })
    const r = await balanceRation(p)
    expect(r.status).toBe('covered')
    expect(r.supplements).toEqual([])
    expect(r.costPerHeadDay).toBe(0)
    expect(r.deficiencies).toEqual([])
    expect(r.intakes.reduce((s, i) => s + i.kgDm, 0)).toBeCloseTo(r.intakeCapacityKg, 6)
    expect(verifyDiet(p, dietOf(p, r))).toEqual([])
    expect(r.solver).toBe('engine-simplex')
    // The least-cost diet buys nothing, so it is itself the field-only diet: that LP is not solved again.
    expect(r.solverRuns.find((x) => x.lp === 'field-only')!.impliedByMain).toBe(true)
  })

  it('when stover alone is short of CP, then the field-alone deficiency is reported and the cheapest cube closes it, at the cost glpk.js finds', async () => {
    const p = problemOf(lateGestationCow, [sorghumStover(), rangeCube()])
    const r = await balanceRation(p)
    expect(r.status).toBe('covered-with-supplement')
    expect(r.deficiencies.map((d) => d.nutrient)).toContain('cp')
    expect(r.supplements).toHaveLength(1)
    expect(r.supplements[0].feedId).toBe('cube')
    expect(r.supplements[0].kgAsFed).toBeCloseTo(r.supplements[0].kgDm / 0.9, 12)
    const g = solveWithGlpk(independentLp(p))
    expect(g.feasible && Math.abs(g.objective - r.costPerHeadDay)).toBeLessThan(1e-7)
    expect(r.supply.find((s) => s.nutrient === 'cp')!.pctCovered).toBeGreaterThanOrEqual(100 - 1e-6)
  })

  it('when balanced by the default call, then every need carries a shadow price from the certified duals, and each binding need\'s price equals the cost of one more unit of it by finite difference', async () => {
    const feeds = [sorghumStover(), rangeCube()]
    const r = await balanceRation(problemOf(lateGestationCow, feeds))
    expect(r.solver).toBe('engine-simplex')
    expect(r.solverRuns.find((x) => x.lp === 'main')!.certified).toBe(true)
    for (const s of r.supply) expect(Number.isFinite(s.shadowPrice)).toBe(true)
    const binding = r.supply.filter((s) => (s.shadowPrice ?? 0) > 1e-9)
    expect(binding.length).toBeGreaterThan(0)
    const field: Record<string, keyof Requirements> = { tdn: 'tdnKg', nem: 'nemMcal', neg: 'negMcal', cp: 'cpKg', ca: 'caG', p: 'pG' }
    for (const s of binding) {
      const d = 1e-4 * s.need
      const key = field[s.nutrient]
      const bumped = withReq(lateGestationCow, { [key]: (lateGestationCow[key] as number) + d })
      const r2 = await balanceRation(problemOf(bumped, feeds))
      expect((r2.costPerHeadDay - r.costPerHeadDay) / d).toBeCloseTo(s.shadowPrice!, 4)
    }
    for (const s of r.supply) if (s.pctCovered > 100 + 1e-6) expect(s.shadowPrice).toBeCloseTo(0, 9)
  })

  it('when a low-quality forage cannot meet energy within intake, then the status is short, with what is still missing and the conflict named in words, never NaN', async () => {
    const straw = sorghumStover({ id: 'straw', name: 'Weathered stalks', tdnPctDm: 42, cpPctDm: 3.5 })
    const cube = rangeCube({ maxKgDm: 0.5 })
    const p = problemOf(lateGestationCow, [straw, cube])
    const r = await balanceRation(p)
    expect(r.status).toBe('short')
    expect(r.stillShort.map((s) => s.nutrient)).toContain('tdn')
    expect(r.conflicts[0]).toMatch(/intake capacity/)
    expect(r.conflicts[0]).toMatch(/Range cube 38 % CP \(at most 0\.5 kg DM\/day\)/)
    expect(r.conflicts.join(' ')).toMatch(/energy density/)
    expect(JSON.stringify(r)).not.toMatch(/NaN|Infinity|null,"conflicts":\[\]/)
    expect(verifyDiet({ ...p, requirements: withReq(p.requirements, { tdnKg: 0, nemMcal: 0, cpKg: 0, caG: 0, pG: 0 }) }, dietOf(p, r))).toEqual([])
  })

  it('when the limits themselves collide (grain share 0 but a grain minimum), then the conflict names both', async () => {
    const p = problemOf(lateGestationCow, [sorghumGrain({ minKgDm: 1 }), sorghumStover()], { limits: { maxGrainShareOfDm: 0 } })
    const r = await balanceRation(p)
    expect(r.status).toBe('short')
    expect(r.conflicts.join(' ')).toMatch(/grain at most 0 % of diet DM/)
    expect(r.conflicts.join(' ')).toMatch(/the minimum of Sorghum grain/)
  })
})

describe('minLegumeShareForProtein (Pearson square between legume and the rest of the field, at intake capacity)', () => {
  const req = withReq(lateGestationCow, { dmiKg: 10, cpKg: 0.9 })
  it('when stover has 5 % CP and cowpea 17 %, then 9 % CP needs (9 − 5)/(17 − 5) = 1/3 cowpea', async () => {
    const r = await balanceRation(problemOf(req, [sorghumStover({ cpPctDm: 5 }), cowpea()]))
    expect(r.minLegumeShareForProtein).toBeCloseTo(1 / 3, 12)
  })
  it('when even the legume is below 9 % CP, then null; when the rest covers CP, then 0', async () => {
    expect((await balanceRation(problemOf(req, [sorghumStover({ cpPctDm: 5 }), cowpea({ cpPctDm: 8 })]))).minLegumeShareForProtein).toBeNull()
    expect((await balanceRation(problemOf(req, [sorghumStover({ cpPctDm: 10 }), cowpea()]))).minLegumeShareForProtein).toBe(0)
  })
})

describe('warnings where harm is possible, each with its source and the usual caution', () => {
  const ewe = sheepRequirements({ class: 'ewe', bodyWeightKg: 70, stage: 'late-gestation', litterSize: 2 })
  it('when a cattle mineral is offered to ewes, then it is left out and flagged (Berger, Univ. of Illinois)', async () => {
    const p: RationProblem = { species: 'sheep', requirements: ewe, feeds: [sorghumStover(), cowpea(), cattleMineral(), dicalcium()] }
    const r = await balanceRation(p)
    expect(kgOf(r, 'tmsalt')).toBe(0)
    const w = r.warnings.find((x) => x.code === 'cattle-product-for-sheep')!
    expect(w.source).toMatch(/Berger/)
    expect(w.message).toMatch(/veterinarian, a licensed nutritionist and local regulations/)
  })
  it('when a sheep supplement carries copper, then the diet is held at 10 mg/kg Cu and a diet above it is flagged', async () => {
    const hiCu = rangeCube({ id: 'cu', name: 'Copper-rich pellet', cuMgPerKgDm: 40, costPerKgDm: 0.2 })
    const p: RationProblem = { species: 'sheep', requirements: ewe, feeds: [sorghumStover({ cuMgPerKgDm: 5 }), hiCu] }
    const r = await balanceRation(p)
    const total = r.intakes.reduce((s, i) => s + i.kgDm, 0)
    expect((kgOf(r, 'stover') * 5 + kgOf(r, 'cu') * 40) / total).toBeLessThanOrEqual(10 + 1e-6)
  })
  it('when a pregnant cow eats a feed of 2,500 mg/kg NO3-N, then the Clemson band forbids it and the message gives both units', async () => {
    const p = problemOf(lateGestationCow, [sorghumStover({ nitrateNPpmDm: 2500 }), rangeCube()], { context: { pregnant: true } })
    const r = await balanceRation(p)
    const w = r.warnings.find((x) => x.code === 'nitrate' && x.feedId === 'stover')!
    expect(w.message).toMatch(/2500 mg\/kg NO3-N \(11067 mg\/kg NO3\)/)
    expect(w.message).toMatch(/not for pregnant/)
    expect(w.source).toMatch(/Clemson/)
  })
  it('when urea is offered, then it stays at most 1 % of DM and the warning cites the 1/3-of-N rule (Univ. of Kentucky)', async () => {
    const urea = { id: 'urea', name: 'Feed-grade urea', role: 'supplement' as const, dmPct: 99, cpPctDm: 281, tdnPctDm: 0, isUrea: true, costPerKgDm: 0.5 }
    const p = problemOf(lateGestationCow, [sorghumStover(), sorghumGrain(), urea])
    const r = await balanceRation(p)
    const total = r.intakes.reduce((s, i) => s + i.kgDm, 0)
    expect(kgOf(r, 'urea')).toBeGreaterThan(0)
    expect(kgOf(r, 'urea') / total).toBeLessThanOrEqual(0.01 + 1e-9)
    expect(r.warnings.find((x) => x.code === 'urea')!.message).toMatch(/1\/3 of dietary N/)
  })
  it('when grain is in the diet without a grain-share limit, then a grain caution is given; with a limit, the grain share holds', async () => {
    const p = problemOf(lateGestationCow, [sorghumGrain(), sorghumStover(), rangeCube()])
    expect((await balanceRation(p)).warnings.map((w) => w.code)).toContain('grain-share-unset')
    const r = await balanceRation({ ...p, limits: { maxGrainShareOfDm: 0.2 } })
    const total = r.intakes.reduce((s, i) => s + i.kgDm, 0)
    expect(kgOf(r, 'grain') / total).toBeLessThanOrEqual(0.2 + 1e-9)
  })
})

describe('the solver guard: the in-thread simplex, its certificate and HiGHS behind it', () => {
  const p = problemOf(lateGestationCow, [sorghumStover(), rangeCube()])
  it('when the simplex runs out of its pivot budget, then HiGHS answers, certified, at the same cost, and the answer says why', async () => {
    const lp = rationLinearProgram(p)
    const capped = await solveLp(lp, { maxIterations: 1 })
    const normal = await solveLp(lp)
    expect(capped).toMatchObject({ status: 'optimal', solver: 'highs', fallbackReason: 'iteration-limit', certified: true })
    expect(normal).toMatchObject({ status: 'optimal', solver: 'engine-simplex', certified: true })
    expect(capped.fallbackReason && normal.status === 'optimal' && capped.status === 'optimal' && Math.abs(capped.objective - normal.objective)).toBeLessThan(1e-9)
  })
  it('when an LP is unbounded (no certificate of optimality can exist), then HiGHS is asked and agrees', async () => {
    const lp: LinearProgram = { colNames: ['a', 'b'], cost: [-1, 0], colLower: [0, 0], colUpper: [Infinity, 1], rows: [{ name: 'r', coefs: [1, -1], lower: -Infinity, upper: Infinity }] }
    const a = await solveLp(lp)
    expect(a).toMatchObject({ status: 'unbounded', solver: 'highs', fallbackReason: 'not-certified', certified: false })
  })
  it('when HiGHS is asked for, then it answers every LP of the balance, at the same cost and with the same shadow prices as the default call', async () => {
    const q = problemOf(lateGestationCow, [sorghumGrain(), sorghumStover(), cowpea(), rangeCube({ maxKgDm: 0.6 }), dicalcium()])
    const byHighs = await balanceRation(q, { solver: 'highs' })
    const byDefault = await balanceRation(q)
    expect(byHighs.solverRuns.every((x) => x.impliedByMain || (x.solver === 'highs' && x.fallbackReason === 'requested'))).toBe(true)
    expect(byDefault.solverRuns.every((x) => x.impliedByMain || (x.solver === 'engine-simplex' && x.certified && !x.fallbackReason))).toBe(true)
    expect(byDefault.costPerHeadDay).toBeCloseTo(byHighs.costPerHeadDay, 9)
    expect(byDefault.supply.map((s) => s.shadowPrice)).toEqual(byHighs.supply.map((s) => expect.closeTo(s.shadowPrice!, 7)))
  })
  it.each(['jslp-hang-1.json', 'jslp-hang-2.json'])(
    'when a saved ration on which javascript-lp-solver 1.0.3 never returned (%s) is balanced, then the in-thread simplex answers every LP, certified, within a few dozen pivots, at the cost glpk.js finds',
    async (file) => {
      const hang = JSON.parse(readFileSync(new URL(`./fixtures/${file}`, import.meta.url), 'utf8')) as RationProblem
      const r = await balanceRation(hang)
      expect(r.solverRuns.every((x) => x.impliedByMain || (x.solver === 'engine-simplex' && x.certified))).toBe(true)
      const lp = await solveLp(rationLinearProgram(hang))
      expect(lp.solver).toBe('engine-simplex')
      expect(lp.iterations).toBeLessThan(60)
      const g = solveWithGlpk(independentLp(hang))
      expect(g.feasible).toBe(r.status !== 'short')
      if (g.feasible) {
        expect(Math.abs(g.objective - r.costPerHeadDay)).toBeLessThan(1e-7)
        expect(verifyDiet(hang, dietOf(hang, r))).toEqual([])
      }
    },
  )
  it('balanceRations gives the same answers as one call per ration', async () => {
    const problems = [p, problemOf(lateGestationCow, [sorghumGrain(), sorghumStover(), cowpea(), rangeCube()]), problemOf(lateGestationCow, [sorghumStover({ tdnPctDm: 40 })])]
    const batch = await balanceRations(problems)
    for (let k = 0; k < problems.length; k++) {
      const one = await balanceRation(problems[k])
      expect(batch[k].status).toBe(one.status)
      expect(batch[k].costPerHeadDay).toBeCloseTo(one.costPerHeadDay, 9)
    }
  })
})
