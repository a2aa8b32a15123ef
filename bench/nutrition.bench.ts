// Benchmark of the ration balance: the whole guarded call, raw solves per LP library on the same LPs, and 10,000 balances.
import { afterAll, beforeAll, bench, describe } from 'vitest'
import GLPK from 'glpk.js/node'
import {
  balanceRation,
  balanceRations,
  cattleRequirements,
  LB_KG,
  loadHighs,
  rationLinearProgram,
  sheepRequirements,
  type Feed,
  type LinearProgram,
  type RationProblem,
} from '../shared/engine/index'
import { solveWithHighs, solveWithJsLp } from '../shared/engine/nutrition/lp/adapter'
import { closeServerLpRunner, registerServerLpRunner } from '../server/engine/lpRunner'

// Invented demo groups and fields: published book feed values, prices invented for timing only.
const field = (cp: number, tdn: number, legumeCp: number): Feed[] => [
  { id: 'grain', name: 'Sorghum grain', role: 'field', dmPct: 89, cpPctDm: 11.5, tdnPctDm: 82, caPctDm: 0.04, pPctDm: 0.35, isGrain: true },
  { id: 'stover', name: 'Sorghum stover', role: 'field', dmPct: 85, cpPctDm: cp, tdnPctDm: tdn, caPctDm: 0.49, pPctDm: 0.12 },
  { id: 'legume', name: 'Cowpea forage', role: 'field', dmPct: 30, cpPctDm: legumeCp, tdnPctDm: 57, caPctDm: 1.3, pPctDm: 0.27, isLegume: true },
]
const supplements: Feed[] = [
  { id: 'cube', name: 'Range cube 38 % CP', role: 'supplement', dmPct: 90, cpPctDm: 38, tdnPctDm: 72, caPctDm: 1, pPctDm: 1, costPerKgDm: 0.55, maxKgDm: 2 },
  { id: 'hulls', name: 'Soybean hulls', role: 'supplement', dmPct: 90, cpPctDm: 12, tdnPctDm: 78, caPctDm: 0.55, pPctDm: 0.2, costPerKgDm: 0.2 },
  { id: 'dcp', name: 'Dicalcium phosphate', role: 'mineral', dmPct: 97, cpPctDm: 0, tdnPctDm: 0, caPctDm: 22, pPctDm: 18.5, costPerKgDm: 0.9, maxKgDm: 0.1 },
]
/** One season day for one group: 60 groups × ~167 days is the 10,000-balance season. */
function problemFor(k: number): RationProblem {
  const weathering = (k % 167) / 167
  const feeds = field(6 - 2 * weathering, 56 - 6 * weathering, 18 - 4 * weathering)
  const offer = [
    { feedId: 'grain', shareOfDm: 0.25 },
    { feedId: 'stover', shareOfDm: 0.6 },
    { feedId: 'legume', shareOfDm: 0.15 },
  ]
  const group = Math.floor(k / 167) % 4
  if (group === 3) {
    const r = sheepRequirements({ class: 'ewe', bodyWeightKg: 60 + (k % 30), stage: k % 2 ? 'late-gestation' : 'early-lactation', litterSize: k % 3 ? 1 : 2 })
    return { species: 'sheep', requirements: r, feeds: [...feeds, supplements[0], supplements[1]], fieldOffer: offer, limits: { maxGrainShareOfDm: 0.3 } }
  }
  const r = cattleRequirements({
    class: group === 2 ? 'growing' : 'cow',
    bodyWeightKg: (group === 2 ? 550 : 1100 + (k % 300)) * LB_KG,
    matureWeightKg: 1250 * LB_KG,
    bcs: 5,
    ...(group === 0 ? { pregnancyDay: 180 + (k % 100) } : group === 1 ? { daysInMilk: 20 + (k % 100), peakMilkKg: 8 } : { adgKg: 0.7 }),
    grazing: true,
  })
  return { species: 'cattle', requirements: r, feeds: [...feeds, ...supplements], fieldOffer: offer, limits: { maxGrainShareOfDm: 0.3 } }
}

const SEASON = Array.from({ length: 10_000 }, (_, k) => problemFor(k))
const SAMPLE = SEASON.filter((_, k) => k % 157 === 0)
/** The least-cost LP of each sample ration, as one solve (no tie-break stage), for the raw solver comparison. */
const LPS: LinearProgram[] = SAMPLE.map((p) => ({ ...rationLinearProgram(p), secondary: undefined }))

type Glpk = Awaited<ReturnType<typeof GLPK>>
let glpk: Glpk
function glpkSolve(lp: LinearProgram) {
  const g = glpk
  const bnd = (lo: number, hi: number) =>
    Number.isFinite(lo) && Number.isFinite(hi) ? { type: g.GLP_DB, lb: lo, ub: hi } : Number.isFinite(lo) ? { type: g.GLP_LO, lb: lo, ub: 0 } : Number.isFinite(hi) ? { type: g.GLP_UP, lb: 0, ub: hi } : { type: g.GLP_FR, lb: 0, ub: 0 }
  return g.solve(
    {
      name: 'ration',
      objective: { direction: g.GLP_MIN, name: 'cost', vars: lp.colNames.map((name, j) => ({ name, coef: lp.cost[j] })) },
      subjectTo: lp.rows.map((r) => ({ name: r.name, vars: r.coefs.flatMap((coef, j) => (coef ? [{ name: lp.colNames[j], coef }] : [])), bnds: bnd(r.lower, r.upper) })),
      bounds: lp.colNames.map((name, j) => ({ name, ...bnd(lp.colLower[j], lp.colUpper[j]) })),
    },
    { msglev: g.GLP_MSG_OFF },
  )
}

const samples: Record<string, number[]> = {}
const timed = <T>(name: string, f: () => T): T => {
  const t = performance.now()
  const out = f()
  ;(samples[name] ??= []).push(performance.now() - t)
  return out
}
const timedAsync = async <T>(name: string, f: () => Promise<T>): Promise<T> => {
  const t = performance.now()
  const out = await f()
  ;(samples[name] ??= []).push(performance.now() - t)
  return out
}
const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b)
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2
}

let k = 0
const next = <T>(xs: T[]) => xs[k++ % xs.length]

beforeAll(async () => {
  await registerServerLpRunner({ warm: true })
  await loadHighs()
  glpk = await GLPK()
})
afterAll(async () => {
  await closeServerLpRunner()
  const rows = Object.entries(samples).map(([name, xs]) =>
    name.startsWith('10,000')
      ? `${name.padEnd(52)} ${(median(xs) / 1000).toFixed(3).padStart(9)} s    (${xs.length} runs)`
      : `${name.padEnd(52)} ${(median(xs) * 1000).toFixed(1).padStart(9)} µs   (${xs.length} samples)`,
  )
  const load = typeof process.getActiveResourcesInfo === 'function' ? (await import('node:os')).loadavg()[0].toFixed(2) : '?'
  process.stdout.write(['', `Median wall time per call (same ration LPs for the raw solvers); 1-minute load average ${load}:`, ...rows, ''].join('\n') + '\n')
})

describe('ration balance', () => {
  bench('balanceRation — whole call, worker guard included', async () => {
    await timedAsync('balanceRation (guarded, whole call)', () => balanceRation(next(SAMPLE)))
  }, { time: 3000, warmupTime: 500 })
  bench('balanceRation — HiGHS only (solver: highs), no worker', async () => {
    await timedAsync('balanceRation (HiGHS only, for comparison)', () => balanceRation(next(SAMPLE), { solver: 'highs' }))
  }, { time: 1500, warmupTime: 300 })
  bench('javascript-lp-solver 1.0.3 — raw solve, in process', () => {
    timed('javascript-lp-solver raw solve', () => solveWithJsLp(next(LPS)))
  }, { time: 2000, warmupTime: 300 })
  bench('glpk.js 5.0.0 — raw solve', () => {
    timed('glpk.js raw solve', () => glpkSolve(next(LPS)))
  }, { time: 2000, warmupTime: 300 })
  bench('HiGHS 1.15.3 — fresh model per solve', () => {
    timed('HiGHS raw solve (fresh model)', () => solveWithHighs(next(LPS)))
  }, { time: 2000, warmupTime: 300 })
  bench('10,000 balances — balanceRations, one shared worker', async () => {
    // CPU time of the whole process (this thread and the worker together) says what one core would need, whatever else runs.
    const cpu = process.cpuUsage()
    await timedAsync('10,000 balances (balanceRations, one worker)', () => balanceRations(SEASON))
    const used = process.cpuUsage(cpu)
    ;(samples['10,000 balances, CPU time of both threads'] ??= []).push((used.user + used.system) / 1000)
  }, { iterations: 3, time: 0, warmupIterations: 1, warmupTime: 0 })
})
