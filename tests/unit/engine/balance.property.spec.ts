// Property-based cross-check of the ration balance against HiGHS and glpk.js on an independent statement of the same LP.
import { readFileSync } from 'node:fs'
import { beforeAll, describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { balanceRation, balanceResultSchema, rationProblemSchema, type RationProblem } from '../../../shared/engine/index'
import { independentLp, loadIndependentSolvers, solveWithGlpk, solveWithIndependentHighs, verifyDiet } from './helpers/independentLp'
import { edgeRationProblemArb, rationProblemArb } from './helpers/rationArb'

beforeAll(async () => {
  await loadIndependentSolvers()
})

// 1e-6 relative; costs under 1 (currency per head per day) are compared to 1e-6 absolute.
const sameObjective = (a: number, b: number) => Math.abs(a - b) <= 1e-6 * Math.max(1, Math.abs(a), Math.abs(b))

/** Rations on which javascript-lp-solver 1.0.3 never returned (kept from when it was the engine's solver). */
const SAVED_HANG_MODELS = ['jslp-hang-1.json', 'jslp-hang-2.json'].map(
  (f) => JSON.parse(readFileSync(new URL(`./fixtures/${f}`, import.meta.url), 'utf8')) as RationProblem,
)

describe('balanceRation on 550 random rations (fast-check) and the saved hang models, cross-checked by HiGHS 1.15.3 (highs package) and GLPK (glpk.js 5.0.0)', () => {
  it('when solved by the engine, HiGHS and glpk.js, then feasibility agrees, the cost agrees to 1e-6 relative (absolute below 1), every constraint of the engine\'s diet holds, every LP answer is certified in the calling thread and every covered need carries a shadow price', async () => {
    const counts = { feasible: 0, infeasible: 0, slowest: 0, fallbacks: {} as Record<string, number>, uncertified: 0 }
    const check = async (problem: RationProblem) => {
      rationProblemSchema.parse(problem)
      const t0 = performance.now()
      const result = await balanceRation(problem)
      counts.slowest = Math.max(counts.slowest, performance.now() - t0)
      balanceResultSchema.parse(result)
      const m = independentLp(problem)
      const h = solveWithIndependentHighs(m)
      const g = solveWithGlpk(m)
      expect(h.feasible).toBe(g.feasible)
      expect(result.status === 'short').toBe(!h.feasible)
      for (const r of result.solverRuns) {
        if (r.fallbackReason) counts.fallbacks[r.fallbackReason] = (counts.fallbacks[r.fallbackReason] ?? 0) + 1
        if (!r.impliedByMain && r.certified !== true) counts.uncertified++
      }
      if (h.feasible && g.feasible) {
        counts.feasible++
        expect(sameObjective(h.objective, g.objective)).toBe(true)
        expect(sameObjective(result.costPerHeadDay, h.objective)).toBe(true)
        const kg = problem.feeds.map((f) => result.intakes.find((x) => x.feedId === f.id)!.kgDm)
        expect(verifyDiet(problem, kg)).toEqual([])
        for (const s of result.supply) expect(Number.isFinite(s.shadowPrice)).toBe(true)
      } else {
        counts.infeasible++
        expect(result.conflicts.length).toBeGreaterThan(0)
        expect(result.stillShort.length).toBeGreaterThan(0)
      }
    }
    // 300 ordinary rations with values spread over their ranges, then 250 pushed to the edges (zero grain share, tiny bounds).
    await fc.assert(fc.asyncProperty(rationProblemArb, check), { numRuns: 300, seed: 20261202 })
    await fc.assert(fc.asyncProperty(edgeRationProblemArb, check), { numRuns: 250, seed: 20261203 })
    for (const p of SAVED_HANG_MODELS) await check(p)
    // The sample must exercise both outcomes, or the agreement above says little.
    expect(counts.feasible).toBeGreaterThan(100)
    expect(counts.infeasible).toBeGreaterThan(100)
    // On this sample the in-thread simplex answers every LP and its certificate holds: HiGHS is never needed.
    expect(counts.fallbacks).toEqual({})
    expect(counts.uncertified).toBe(0)
    process.stdout.write(`random rations: ${JSON.stringify(counts)}\n`)
  })
})
