// Benchmark of the ration balance: the default call against a fresh HiGHS solve side by side, raw LP solves, and 10,000 balances.
import { loadavg } from 'node:os'
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
  solveLpSync,
  type Feed,
  type LinearProgram,
  type RationProblem,
} from '../shared/engine/index'
import { solveWithHighs } from '../shared/engine/nutrition/lp/adapter'

// Invented demo groups and fields: published book feed values, prices invented for timing only.
const field = (cp: number, tdn: number, legumeCp: number): Feed[] => [
  { id: 'grain', name: 'Sorghum grain', role: 'field', dmPct: 89, cpPctDm: 11.5, tdnPctDm: 82, caPctDm: 0.04, pPctDm: 0.35, isGrain: true },
  { id: 'stover', name: 'Sorghum stover', role: 'field', dmPct: 85, cpPctDm: cp, tdnPctDm: tdn, caPctDm: 0.49, pPctDm: 0.12 },
  { id: 'legume', name: 'Cowpea forage', role: 'field', dmPct: 30, cpPctDm: legumeCp, tdnPctDm: 57, caPctDm: 1.3, pPctDm: 0.27, isLegume: true },
]
const supplements = (k: number): Feed[] => [
  { id: 'cube', name: 'Range cube 38 % CP', role: 'supplement', dmPct: 90, cpPctDm: 38, tdnPctDm: 72, caPctDm: 1, pPctDm: 1, costPerKgDm: 0.45 + 0.02 * (k % 11), maxKgDm: 0.5 + 0.25 * (k % 7) },
  { id: 'hulls', name: 'Soybean hulls', role: 'supplement', dmPct: 90, cpPctDm: 12, tdnPctDm: 78, caPctDm: 0.55, pPctDm: 0.2, costPerKgDm: 0.15 + 0.01 * (k % 13) },
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
    return { species: 'sheep', requirements: r, feeds: [...feeds, ...supplements(k).slice(0, 2)], fieldOffer: offer, limits: { maxGrainShareOfDm: 0.3 } }
  }
  const r = cattleRequirements({
    class: group === 2 ? 'growing' : 'cow',
    bodyWeightKg: (group === 2 ? 550 : 1100 + (k % 300)) * LB_KG,
    matureWeightKg: 1250 * LB_KG,
    bcs: 5,
    ...(group === 0 ? { pregnancyDay: 180 + (k % 100) } : group === 1 ? { daysInMilk: 20 + (k % 100), peakMilkKg: 8 } : { adgKg: 0.7 }),
    grazing: true,
  })
  return { species: 'cattle', requirements: r, feeds: [...feeds, ...supplements(k)], fieldOffer: offer, limits: { maxGrainShareOfDm: 0.3 } }
}
/** Every ninth varied ration is a late, weathered field with little cube allowed: no diet meets every need (status short). */
function variedProblem(i: number): RationProblem {
  const p = problemFor((i * 41) % 10_000)
  if (i % 9 !== 4) return p
  return { ...p, feeds: p.feeds.map((f) => (f.id === 'stover' ? { ...f, tdnPctDm: 40, cpPctDm: 3 } : f.id === 'cube' ? { ...f, maxKgDm: 0.2 } : f.id === 'hulls' ? { ...f, maxKgDm: 0.2 } : f)) }
}

const SEASON = Array.from({ length: 10_000 }, (_, k) => problemFor(k))
/** 240 varied rations: four groups over the season, varied prices and caps, one in nine short. */
const VARIED = Array.from({ length: 240 }, (_, i) => variedProblem(i))
/** Their least-cost LPs as the engine solves them (with the tie-break), and as one solve (no tie-break) for the raw solvers. */
const MAIN_LPS: LinearProgram[] = VARIED.map((p) => rationLinearProgram(p))
const ONE_SOLVE_LPS: LinearProgram[] = MAIN_LPS.map((lp) => ({ ...lp, secondary: undefined }))

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
const record = (name: string, ms: number) => (samples[name] ??= []).push(ms)
const quantile = (xs: number[], q: number) => {
  const s = [...xs].sort((a, b) => a - b)
  return s[Math.min(s.length - 1, Math.floor(q * s.length))]
}
const median = (xs: number[]) => quantile(xs, 0.5)
const us = (ms: number) => `${(ms * 1000).toFixed(1)} µs`.padStart(11)

const DEFAULT = 'balanceRation, default call'
const HIGHS_FRESH = 'HiGHS 1.15.3, fresh model, same least-cost LP'
const HIGHS_CALL = "balanceRation with solver: 'highs'"
const RAW_ENGINE = 'solveLpSync (engine simplex + certificate)'
const RAW_ENGINE_LEX = 'solveLpSync with the tie-break stage'
const RAW_GLPK = 'glpk.js 5.0.0'
const RAW_HIGHS = 'HiGHS 1.15.3, fresh model'

let load: number[] = []
beforeAll(async () => {
  await loadHighs()
  glpk = await GLPK()
  load = loadavg()
})
afterAll(() => {
  const end = loadavg()
  const line = (name: string) => {
    const xs = samples[name]
    return xs ? `  ${name.padEnd(50)} median ${us(median(xs))}   p99 ${us(quantile(xs, 0.99))}   (${xs.length} samples)` : ''
  }
  const ratio = (a: string, b: string, q: number) => (quantile(samples[a], q) / quantile(samples[b], q)).toFixed(3)
  const out = [
    '',
    `1-minute load average: ${load[0].toFixed(2)} at the start, ${end[0].toFixed(2)} at the end (2 cores).`,
    `Side by side, interleaved ration by ration over ${VARIED.length} varied rations:`,
    line(DEFAULT),
    line(HIGHS_FRESH),
    `  ratio default call / fresh HiGHS solve, wall time: median ${ratio(DEFAULT, HIGHS_FRESH, 0.5)}, p99 ${ratio(DEFAULT, HIGHS_FRESH, 0.99)}   (target: both below 1)`,
    `CPU time of the same calls (the process's, per call):`,
    line(`${DEFAULT} (CPU)`),
    line(`${HIGHS_FRESH} (CPU)`),
    `  ratio default call / fresh HiGHS solve, CPU time: median ${ratio(`${DEFAULT} (CPU)`, `${HIGHS_FRESH} (CPU)`, 0.5)}, p99 ${ratio(`${DEFAULT} (CPU)`, `${HIGHS_FRESH} (CPU)`, 0.99)}`,
    `Measured apart, on the same rations:`,
    line(HIGHS_CALL),
    line(`${HIGHS_CALL} (CPU)`),
    `Raw LP solves of the same least-cost LPs, interleaved:`,
    line(RAW_ENGINE),
    line(RAW_ENGINE_LEX),
    line(RAW_GLPK),
    line(RAW_HIGHS),
    `  ratio engine / HiGHS: median ${ratio(RAW_ENGINE, RAW_HIGHS, 0.5)}, p99 ${ratio(RAW_ENGINE, RAW_HIGHS, 0.99)}`,
  ]
  for (const name of ['10,000 balances, default call one by one', '10,000 balances, balanceRations']) {
    const wall = samples[`${name} (wall)`]
    const cpu = samples[`${name} (cpu)`]
    if (wall) out.push(`  ${name.padEnd(50)} wall ${(median(wall) / 1000).toFixed(3)} s, CPU ${(median(cpu) / 1000).toFixed(3)} s (median of ${wall.length}; one thread, so one core; target under 2 s)`)
  }
  process.stdout.write(out.join('\n') + '\n')
})

/** Lets pending callbacks (the runner's messages, timers) run between measured calls rather than inside them. */
const yieldToLoop = () => new Promise<void>((resolve) => setImmediate(resolve))

/** Wall time, and CPU time of the process: on a loaded machine the wall-time tail is the scheduler's, not the call's. */
async function measure(name: string, f: () => unknown) {
  await yieldToLoop()
  const c = process.cpuUsage()
  const t = performance.now()
  await f()
  record(name, performance.now() - t)
  const u = process.cpuUsage(c)
  record(`${name} (CPU)`, (u.user + u.system) / 1000)
}

let i = 0
let j = 0
let h = 0
describe('ration balance', () => {
  bench(
    'default balanceRation vs a fresh HiGHS solve of the same LP, interleaved',
    async () => {
      const k = i++ % VARIED.length
      // Alternate the order so neither side always runs first after the other's garbage.
      const runs: [string, () => unknown][] = [
        [DEFAULT, () => balanceRation(VARIED[k])],
        [HIGHS_FRESH, () => solveWithHighs(ONE_SOLVE_LPS[k])],
      ]
      if (i % 2) runs.reverse()
      for (const [name, f] of runs) await measure(name, f)
    },
    { iterations: 8 * VARIED.length, time: 0, warmupIterations: VARIED.length, warmupTime: 0 },
  )
  bench(
    "balanceRation with solver: 'highs' (every LP by HiGHS, for comparison)",
    async () => {
      await measure(HIGHS_CALL, () => balanceRation(VARIED[h++ % VARIED.length], { solver: 'highs' }))
    },
    { iterations: 2 * VARIED.length, time: 0, warmupIterations: 20, warmupTime: 0 },
  )
  bench(
    'raw LP solves: engine simplex (certified), glpk.js, HiGHS, interleaved',
    () => {
      const k = j++ % VARIED.length
      const runs: [string, () => unknown][] = [
        [RAW_ENGINE, () => solveLpSync(ONE_SOLVE_LPS[k])],
        [RAW_ENGINE_LEX, () => solveLpSync(MAIN_LPS[k])],
        [RAW_GLPK, () => glpkSolve(ONE_SOLVE_LPS[k])],
        [RAW_HIGHS, () => solveWithHighs(ONE_SOLVE_LPS[k])],
      ]
      if (j % 2) runs.reverse()
      for (const [name, f] of runs) {
        const t = performance.now()
        f()
        record(name, performance.now() - t)
      }
    },
    { iterations: 8 * VARIED.length, time: 0, warmupIterations: VARIED.length, warmupTime: 0 },
  )
  bench(
    '10,000 balances, the default call one by one (a season re-balanced daily for 60 groups)',
    async () => {
      // One thread does all the work, so its CPU time is what one core needs, whatever else the machine runs.
      const cpu = process.cpuUsage()
      const t = performance.now()
      for (const p of SEASON) await balanceRation(p)
      record('10,000 balances, default call one by one (wall)', performance.now() - t)
      const used = process.cpuUsage(cpu)
      record('10,000 balances, default call one by one (cpu)', (used.user + used.system) / 1000)
    },
    { iterations: 3, time: 0, warmupIterations: 1, warmupTime: 0 },
  )
  bench(
    '10,000 balances through balanceRations',
    async () => {
      const cpu = process.cpuUsage()
      const t = performance.now()
      await balanceRations(SEASON)
      record('10,000 balances, balanceRations (wall)', performance.now() - t)
      const used = process.cpuUsage(cpu)
      record('10,000 balances, balanceRations (cpu)', (used.user + used.system) / 1000)
    },
    { iterations: 3, time: 0, warmupIterations: 1, warmupTime: 0 },
  )
})
