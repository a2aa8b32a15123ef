// The LP solve of the engine: certificate of optimality and infeasibility, duals against HiGHS and GLPK, pivot budget, warm starts.
import { beforeAll, describe, expect, it } from 'vitest'
import fc from 'fast-check'
import {
  basisSolution,
  certifyInfeasible,
  certifyLp,
  checkLpSolution,
  loadHighs,
  rationLinearProgram,
  rationProblemSchema,
  simplex,
  solveLpSync,
  type LinearProgram,
  type LpBasis,
  type RationProblem,
} from '../../../shared/engine/index'
import { solveWithHighs } from '../../../shared/engine/nutrition/lp/adapter'
import { BASIC } from '../../../shared/engine/nutrition/lp/simplex'
import { buildRationLp, rationContext } from '../../../shared/engine/nutrition/ration/model'
import { loadIndependentSolvers } from './helpers/independentLp'
import { glpkRowDuals } from './helpers/glpkLp'
import { cowpea, dicalcium, problemOf, rangeCube, sorghumGrain, sorghumStover } from './helpers/feeds'
import { edgeRationProblemArb, rationProblemArb } from './helpers/rationArb'
import { cattleRequirements, LB_KG } from '../../../shared/engine/index'

let glpk: Awaited<ReturnType<typeof loadIndependentSolvers>>['glpk']
beforeAll(async () => {
  await loadHighs()
  glpk = (await loadIndependentSolvers()).glpk
})

const dot = (a: readonly number[], b: readonly number[]) => a.reduce((s, v, i) => s + v * b[i], 0)

const cow = cattleRequirements({ class: 'cow', bodyWeightKg: 1200 * LB_KG, matureWeightKg: 1200 * LB_KG, bcs: 5, pregnancyDay: 250, grazing: true })
/** A ration whose least-cost diet buys two supplements, so the optimum is a vertex with several rows binding. */
const rationLp = (): LinearProgram => ({
  ...rationLinearProgram(
    problemOf({ ...cow, cpKg: cow.cpKg * 1.15 }, [sorghumGrain(), sorghumStover({ cpPctDm: 4, tdnPctDm: 50 }), cowpea({ cpPctDm: 14 }), rangeCube({ maxKgDm: 0.4 }), rangeCube({ id: 'meal', name: 'Protein meal 44 %', cpPctDm: 44, tdnPctDm: 75, costPerKgDm: 0.7 }), dicalcium()], {
      fieldOffer: [
        { feedId: 'grain', shareOfDm: 0.25 },
        { feedId: 'stover', shareOfDm: 0.6 },
        { feedId: 'cowpea', shareOfDm: 0.15 },
      ],
      limits: { maxGrainShareOfDm: 0.3 },
    }),
  ),
  secondary: undefined,
})

const RATIONS: RationProblem[] = [...fc.sample(rationProblemArb, { numRuns: 250, seed: 20261210 }), ...fc.sample(edgeRationProblemArb, { numRuns: 150, seed: 20261211 })]

describe('certifyLp: optimality by LP duality (Chvátal, Linear Programming, 1983, ch. 5 — from memory), checked against HiGHS 1.15.3', () => {
  it('when the engine solves a ration LP, then its answer passes and its objective equals HiGHS\'s', () => {
    const lp = rationLp()
    const a = solveLpSync(lp)
    const h = solveWithHighs(lp)
    expect(a).toMatchObject({ status: 'optimal', solver: 'engine-simplex', certified: true })
    expect(h.status).toBe('optimal')
    if (a.status !== 'optimal' || h.status !== 'optimal') return
    expect(Math.abs(a.objective - h.objective)).toBeLessThan(1e-10)
    expect(certifyLp(lp, lp.cost, { x: a.x, rowDual: a.rowDual!, colDual: a.colDual! })).toMatchObject({ ok: true })
  })

  it('when a feasible answer is 7.7e-6 above the optimum, then the feasibility check alone accepts it but the certificate rejects it, with the optimal duals or any others', () => {
    const lp = rationLp()
    const a = solveLpSync(lp)
    if (a.status !== 'optimal') throw new Error('the ration LP must be feasible')
    // A second feasible vertex of higher cost: the most expensive diet (maximise cost), by HiGHS.
    const worst = solveWithHighs({ ...lp, cost: lp.cost.map((c) => -c) })
    if (worst.status !== 'optimal') throw new Error('the most expensive diet must exist')
    const rise = dot(lp.cost, worst.x) - a.objective
    expect(rise).toBeGreaterThan(1e-3)
    // On the segment between two feasible points every point is feasible; this one costs exactly 7.7e-6 more than the optimum.
    const t = 7.7e-6 / rise
    const x = a.x.map((v, j) => v + t * (worst.x[j] - v))
    expect(dot(lp.cost, x) - a.objective).toBeCloseTo(7.7e-6, 12)
    expect(checkLpSolution(lp, x)).toEqual([])
    const withOptimalDuals = certifyLp(lp, lp.cost, { x, rowDual: a.rowDual!, colDual: a.colDual! })
    expect(withOptimalDuals.ok).toBe(false)
    expect(withOptimalDuals.failure).toMatch(/complementary-slackness|duality-gap/)
    const h = solveWithHighs(lp)
    if (h.status !== 'optimal') throw new Error('HiGHS must solve it')
    expect(certifyLp(lp, lp.cost, { x, rowDual: h.rowDual!, colDual: h.colDual! }).ok).toBe(false)
    // No dual vector at all can certify it: the most favourable one is the optimum's, and weak duality bounds every other.
    const zeroDuals = certifyLp(lp, lp.cost, { x, rowDual: lp.rows.map(() => 0), colDual: [...lp.cost] })
    expect(zeroDuals.ok).toBe(false)
  })

  it('when the basis is feasible but not optimal (the most expensive vertex), then its duals, computed from that basis, are rejected as dual infeasible', () => {
    const lp = rationLp()
    const worst = simplex(lp, lp.cost.map((c) => -c))
    expect(worst.status).toBe('optimal')
    const pd = basisSolution(lp, lp.cost, worst.basis)!
    expect(checkLpSolution(lp, pd.x)).toEqual([])
    const c = certifyLp(lp, lp.cost, pd)
    expect(c.ok).toBe(false)
    expect(c.failure).toBe('dual-infeasible')
  })

  it('when an answer breaks a row by more than the tolerance, then it is rejected as primal infeasible whatever its duals', () => {
    const lp = rationLp()
    const a = solveLpSync(lp)
    if (a.status !== 'optimal') throw new Error('feasible')
    const c = certifyLp(lp, lp.cost, { x: a.x.map((v) => v * 0.9), rowDual: a.rowDual!, colDual: a.colDual! })
    expect(c).toMatchObject({ ok: false, failure: 'primal-infeasible' })
  })
})

describe('certifyInfeasible: a Farkas ray (Chvátal, Linear Programming, 1983, ch. 9 — from memory), checked against HiGHS 1.15.3', () => {
  it('when a need is beyond what the feeds can supply within intake, then the simplex returns a ray that certifies it, and HiGHS agrees there is no diet', () => {
    const lp = rationLinearProgram(problemOf({ ...cow, tdnKg: cow.dmiKg * 0.9 }, [sorghumStover(), rangeCube({ maxKgDm: 1 })]))
    const r = simplex(lp)
    expect(r.status).toBe('infeasible')
    expect(certifyInfeasible(lp, r.ray!)).toBe(true)
    expect(solveWithHighs(lp).status).toBe('infeasible')
    expect(solveLpSync(lp)).toMatchObject({ status: 'infeasible', solver: 'engine-simplex', certified: true })
  })
  it('when the LP is feasible, then no multiplier vector certifies infeasibility (the ray of an infeasible neighbour, random vectors)', () => {
    const good = rationLp()
    const tdn = good.rows.findIndex((r) => r.name === 'need:tdn')
    const bad: LinearProgram = { ...good, rows: good.rows.map((r, i) => (i === tdn ? { ...r, lower: r.lower * 3 } : r)) }
    expect(solveWithHighs(good).status).toBe('optimal')
    expect(solveWithHighs(bad).status).toBe('infeasible')
    const ray = simplex(bad).ray!
    expect(certifyInfeasible(bad, ray)).toBe(true)
    expect(certifyInfeasible(good, ray)).toBe(false)
    fc.assert(fc.property(fc.array(fc.double({ min: -10, max: 10, noNaN: true }), { minLength: good.rows.length, maxLength: good.rows.length }), (y) => !certifyInfeasible(good, y)), { seed: 20261212 })
  })
})

/**
 * Every basic variable strictly inside its bounds (a primal non-degenerate optimal basis): then the dual optimum is unique, so
 * any correct solver must return the same row duals and reduced costs (Chvátal, Linear Programming, 1983, ch. 5 — from memory).
 */
function nonDegenerate(lp: LinearProgram, basis: LpBasis, x: number[]): boolean {
  const inside = (v: number, lo: number, hi: number) => Math.min(v - lo, hi - v) > 1e-6 * Math.max(1, Math.abs(v))
  for (let j = 0; j < x.length; j++) if (basis.colStatus[j] === BASIC && !inside(x[j], lp.colLower[j], lp.colUpper[j])) return false
  for (let i = 0; i < lp.rows.length; i++) if (basis.rowStatus[i] === BASIC && !inside(dot(lp.rows[i].coefs, x), lp.rows[i].lower, lp.rows[i].upper)) return false
  return true
}

describe('the duals are the shadow prices: equal to HiGHS 1.15.3\'s (highs package) and GLPK\'s (glpk.js 5.0.0) on non-degenerate rations', () => {
  it('when 400 random rations are solved, then at every primal non-degenerate optimum each row dual equals HiGHS\'s and GLPK\'s, and each reduced cost equals HiGHS\'s, to 1e-7 of their scale', () => {
    let compared = 0
    for (const p of RATIONS) {
      for (const lp of [{ ...rationLinearProgram(p), secondary: undefined }]) {
        const a = solveLpSync(lp)
        if (a.status !== 'optimal' || !a.basis || !nonDegenerate(lp, a.basis, a.x)) continue
        const h = solveWithHighs(lp)
        if (h.status !== 'optimal') throw new Error('HiGHS disagrees on feasibility')
        const g = glpkRowDuals(glpk, lp)
        const near = (u: number, v: number) => Math.abs(u - v) <= 1e-7 * Math.max(1, Math.abs(u), Math.abs(v))
        a.rowDual!.forEach((y, i) => {
          expect(near(y, h.rowDual![i]), `row ${lp.rows[i].name}: engine ${y}, HiGHS ${h.rowDual![i]}`).toBe(true)
          expect(near(y, g[i]), `row ${lp.rows[i].name}: engine ${y}, GLPK ${g[i]}`).toBe(true)
        })
        a.colDual!.forEach((d, j) => expect(near(d, h.colDual![j]), `column ${lp.colNames[j]}: engine ${d}, HiGHS ${h.colDual![j]}`).toBe(true))
        compared++
      }
    }
    // Enough non-degenerate optima for the comparison to mean something.
    process.stdout.write(`duals compared at ${compared} non-degenerate optima\n`)
    expect(compared).toBeGreaterThan(40)
  })
})

describe('solveLpSync on the LPs of 400 random rations (least-cost with its tie-break, field-only, least-shortfall), cross-checked by HiGHS 1.15.3', () => {
  it('when each LP is solved, then the status agrees with HiGHS, the objective agrees to 1e-9 relative (the tie-break to HiGHS\'s 1e-10 cost slack), every answer is certified in the calling thread, and no solve needs over 100 pivots', () => {
    const counts = { optimal: 0, infeasible: 0, maxPivots: 0 }
    for (const p of RATIONS) {
      const main = rationLinearProgram(p)
      const ctx = rationContext(rationProblemSchema.parse(p))
      const fieldOnly = buildRationLp(ctx, ctx.p.feeds.map((f) => f.role === 'field'), 'shortfall').lp
      const best = buildRationLp(ctx, ctx.p.feeds.map(() => true), 'shortfall', true).lp
      const lps = [main, { ...main, secondary: undefined }, fieldOnly, best]
      for (const lp of lps) {
        const a = solveLpSync(lp)
        const h = solveWithHighs(lp)
        expect(a.status).toBe(h.status)
        expect(a).toMatchObject({ solver: 'engine-simplex', certified: true })
        counts.maxPivots = Math.max(counts.maxPivots, a.iterations ?? 0)
        if (a.status === 'optimal' && h.status === 'optimal') {
          counts.optimal++
          expect(Math.abs(a.objective - h.objective)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(h.objective)))
          if (lp.secondary) expect(dot(lp.secondary, a.x)).toBeLessThanOrEqual(dot(lp.secondary, h.x) + 1e-6)
        } else counts.infeasible++
      }
    }
    expect(counts.optimal).toBeGreaterThan(600)
    expect(counts.infeasible).toBeGreaterThan(100)
    expect(counts.maxPivots).toBeLessThanOrEqual(100)
  })
})

describe('warm start from a neighbour\'s basis (for a branch and bound over feed amounts)', () => {
  it('when a bought feed\'s upper bound is cut below its optimal amount, then starting from the parent\'s basis gives HiGHS\'s optimum in fewer pivots than a cold start', () => {
    const lp = rationLp()
    const parent = solveLpSync(lp)
    if (parent.status !== 'optimal') throw new Error('feasible')
    const j = lp.cost.findIndex((c, k) => c > 0 && parent.x[k] > 1e-3)
    expect(j).toBeGreaterThanOrEqual(0)
    const child: LinearProgram = { ...lp, colUpper: lp.colUpper.map((u, k) => (k === j ? parent.x[j] / 2 : u)) }
    const warm = solveLpSync(child, { basis: parent.basis })
    const cold = solveLpSync(child)
    const h = solveWithHighs(child)
    expect(warm).toMatchObject({ status: 'optimal', certified: true, solver: 'engine-simplex' })
    if (warm.status !== 'optimal' || h.status !== 'optimal') throw new Error('child feasible')
    expect(Math.abs(warm.objective - h.objective)).toBeLessThan(1e-10)
    expect(warm.iterations!).toBeLessThan(cold.iterations!)
  })
})

/** General small LPs: every kind of column and row bound (free, fixed, one-sided, ranged), negative costs, integer data. */
const generalLpArb: fc.Arbitrary<LinearProgram> = fc
  .record({
    n: fc.integer({ min: 1, max: 8 }),
    m: fc.integer({ min: 0, max: 8 }),
    data: fc.array(fc.integer({ min: -5, max: 5 }), { minLength: 120, maxLength: 120 }),
    kinds: fc.array(fc.integer({ min: 0, max: 5 }), { minLength: 16, maxLength: 16 }),
  })
  .map(({ n, m, data, kinds }) => {
    let k = 0
    const next = () => data[k++ % data.length]
    const bound = (kind: number): [number, number] => {
      const a = next()
      const b = next()
      return kind === 0 ? [0, Infinity] : kind === 1 ? [Math.min(a, b), Math.max(a, b)] : kind === 2 ? [-Infinity, a] : kind === 3 ? [a, Infinity] : kind === 4 ? [a, a] : [-Infinity, Infinity]
    }
    const cols = Array.from({ length: n }, (_, j) => bound(kinds[j]))
    const rows = Array.from({ length: m }, (_, i) => {
      const [lower, upper] = bound(kinds[8 + i])
      return { name: `r${i}`, coefs: Array.from({ length: n }, () => (next() % 3 === 0 ? 0 : next())), lower, upper }
    })
    return { colNames: cols.map((_, j) => `c${j}`), cost: cols.map(() => next()), colLower: cols.map((c) => c[0]), colUpper: cols.map((c) => c[1]), rows }
  })

describe('solveLpSync on 500 general small LPs (every kind of bound, negative costs), cross-checked by HiGHS 1.15.3', () => {
  it('when each is solved, then the status and the objective agree with HiGHS, optimal and infeasible answers are certified in the calling thread, and unbounded ones are left to HiGHS', () => {
    const counts: Record<string, number> = {}
    for (const lp of fc.sample(generalLpArb, { numRuns: 500, seed: 20261213 })) {
      const a = solveLpSync(lp)
      const h = solveWithHighs(lp)
      expect(a.status).toBe(h.status)
      counts[`${a.status}:${a.solver}`] = (counts[`${a.status}:${a.solver}`] ?? 0) + 1
      if (a.status === 'optimal' && h.status === 'optimal') {
        expect(a.solver).toBe('engine-simplex')
        expect(a.certified).toBe(true)
        expect(Math.abs(a.objective - h.objective)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(h.objective)))
      }
      if (a.status === 'unbounded') expect(a).toMatchObject({ solver: 'highs', fallbackReason: 'not-certified' })
    }
    expect(counts['optimal:engine-simplex']).toBeGreaterThan(60)
    expect(counts['infeasible:engine-simplex']).toBeGreaterThan(60)
  })
})
