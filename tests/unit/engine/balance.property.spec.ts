// Property-based cross-check of the ration balance against HiGHS and glpk.js on an independent statement of the same LP.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { balanceRation, balanceResultSchema, rationProblemSchema } from '../../../shared/engine/index'
import { closeServerLpRunner, registerServerLpRunner } from '../../../server/engine/lpRunner'
import { independentLp, loadIndependentSolvers, solveWithGlpk, solveWithIndependentHighs, verifyDiet } from './helpers/independentLp'
import { edgeRationProblemArb, rationProblemArb } from './helpers/rationArb'

beforeAll(async () => {
  await registerServerLpRunner({ warm: true })
  await loadIndependentSolvers()
})
afterAll(closeServerLpRunner)

// 1e-6 relative; costs under 1 (currency per head per day) are compared to 1e-6 absolute.
const sameObjective = (a: number, b: number) => Math.abs(a - b) <= 1e-6 * Math.max(1, Math.abs(a), Math.abs(b))

describe('balanceRation on 550 random rations (fast-check), cross-checked by HiGHS and glpk.js', () => {
  it('when solved by the engine, HiGHS and glpk.js, then feasibility agrees, the cost agrees to 1e-6 relative (absolute below 1), every constraint of the engine\'s diet holds and no balance takes over 1 s', async () => {
    const counts = { feasible: 0, infeasible: 0, slowest: 0, fallbacks: {} as Record<string, number> }
    const property = (arb: typeof rationProblemArb) =>
      fc.asyncProperty(arb, async (problem) => {
        rationProblemSchema.parse(problem)
        const t0 = performance.now()
        const result = await balanceRation(problem)
        const ms = performance.now() - t0
        counts.slowest = Math.max(counts.slowest, ms)
        expect(ms).toBeLessThan(1000)
        balanceResultSchema.parse(result)
        const m = independentLp(problem)
        const h = solveWithIndependentHighs(m)
        const g = solveWithGlpk(m)
        expect(h.feasible).toBe(g.feasible)
        expect(result.status === 'short').toBe(!h.feasible)
        for (const r of result.solverRuns) if (r.fallbackReason) counts.fallbacks[r.fallbackReason] = (counts.fallbacks[r.fallbackReason] ?? 0) + 1
        if (h.feasible && g.feasible) {
          counts.feasible++
          expect(sameObjective(h.objective, g.objective)).toBe(true)
          expect(sameObjective(result.costPerHeadDay, h.objective)).toBe(true)
          const kg = problem.feeds.map((f) => result.intakes.find((x) => x.feedId === f.id)!.kgDm)
          expect(verifyDiet(problem, kg)).toEqual([])
        } else {
          counts.infeasible++
          expect(result.conflicts.length).toBeGreaterThan(0)
          expect(result.stillShort.length).toBeGreaterThan(0)
        }
      })
    // 300 ordinary rations with values spread over their ranges, then 250 pushed to the edges (zero grain share, tiny bounds).
    await fc.assert(property(rationProblemArb), { numRuns: 300, seed: 20261202 })
    await fc.assert(property(edgeRationProblemArb), { numRuns: 250, seed: 20261203 })
    // The sample must exercise both outcomes, or the agreement above says little.
    expect(counts.feasible).toBeGreaterThan(100)
    expect(counts.infeasible).toBeGreaterThan(100)
    process.stdout.write(`random rations: ${JSON.stringify(counts)}\n`)
  })
})
