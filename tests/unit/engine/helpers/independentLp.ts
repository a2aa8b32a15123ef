// An independent statement of the ration LP, written from the documented rules (not the engine's code), for HiGHS and glpk.js.
import highsLoader from 'highs'
import GLPK from 'glpk.js/node'
import type { RationProblem } from '../../../../shared/engine/index'

type Row = { name: string; terms: Map<string, number>; lo: number; hi: number }
export interface IndependentLp {
  vars: string[]
  cost: Map<string, number>
  bounds: Map<string, { lo: number; hi: number }>
  rows: Row[]
  /** per feed, the variable names carrying it (one, or maintenance and gain portions) */
  feedVars: string[][]
}

/** NEm and NEg per kg DM by the NRC cubic equations from ME = TDN% × 0.04409 × 0.82, floored at 0 — re-typed here on purpose. */
export function netEnergy(tdnPct: number): { nem: number; neg: number } {
  const me = tdnPct * 0.04409 * 0.82
  const nem = 1.37 * me - 0.138 * me * me + 0.0105 * me * me * me - 1.12
  const neg = 1.42 * me - 0.174 * me * me + 0.0122 * me * me * me - 1.65
  return { nem: Math.max(0, nem), neg: Math.max(0, neg) }
}

export function independentLp(p: RationProblem): IndependentLp {
  const r = p.requirements
  const L = p.limits ?? {}
  const feeds = p.feeds
  const allowed = feeds.map((f) => !(p.species === 'sheep' && f.cattleOnly))
  const hasCa = feeds.some((f) => f.caPctDm !== undefined)
  const hasP = feeds.some((f) => f.pPctDm !== undefined)
  const split = p.species === 'cattle' && r.nemMcal !== undefined && (r.negMcal ?? 0) > 0
  const vars: string[] = []
  const feedVars: string[][] = []
  feeds.forEach((_, i) => {
    const names = !allowed[i] ? [] : split ? [`m${i}`, `g${i}`] : [`x${i}`]
    vars.push(...names)
    feedVars.push(names)
  })
  const rows: Row[] = []
  const row = (name: string, coef: (i: number, v: string) => number, lo: number, hi: number) => {
    const terms = new Map<string, number>()
    feeds.forEach((_, i) => feedVars[i].forEach((v) => { const c = coef(i, v); if (c !== 0) terms.set(v, c) }))
    rows.push({ name, terms, lo, hi })
  }
  const cap = L.maxDmiKg ?? r.dmiKg
  row('dmi', () => 1, -Infinity, cap)
  const E = feeds.map((f) => netEnergy(f.tdnPctDm))
  if (r.tdnKg > 0) row('tdn', (i) => feeds[i].tdnPctDm / 100, r.tdnKg, Infinity)
  if (p.species === 'cattle' && (r.nemMcal ?? 0) > 0) row('nem', (i, v) => (v.startsWith('g') ? 0 : E[i].nem), r.nemMcal!, Infinity)
  if (split) row('neg', (i, v) => (v.startsWith('m') ? 0 : E[i].neg), r.negMcal!, Infinity)
  if (r.cpKg > 0) row('cp', (i) => feeds[i].cpPctDm / 100, r.cpKg, Infinity)
  const ca = (i: number) => (feeds[i].caPctDm ?? 0) * 10
  const ph = (i: number) => (feeds[i].pPctDm ?? 0) * 10
  if (hasCa && (r.caG > 0 || L.maxCaG !== undefined)) row('ca', ca, r.caG > 0 ? r.caG : -Infinity, L.maxCaG ?? Infinity)
  if (hasP && (r.pG > 0 || L.maxPG !== undefined)) row('p', ph, r.pG > 0 ? r.pG : -Infinity, L.maxPG ?? Infinity)
  if (hasCa && hasP) {
    const lo = L.minCaToP ?? 1
    if (lo > 0) row('camin', (i) => ca(i) - lo * ph(i), 0, Infinity)
    if (L.maxCaToP !== undefined) row('camax', (i) => ca(i) - L.maxCaToP! * ph(i), -Infinity, 0)
  }
  if (L.maxGrainShareOfDm !== undefined && feeds.some((f, i) => allowed[i] && f.isGrain)) row('grain', (i) => (feeds[i].isGrain ? 1 : 0) - L.maxGrainShareOfDm!, -Infinity, 0)
  if (feeds.some((f, i) => allowed[i] && f.isUrea)) row('urea', (i) => (feeds[i].isUrea ? 1 : 0) - (L.maxUreaShareOfDm ?? 0.01), -Infinity, 0)
  const cuLimit = L.maxCuMgPerKgDm ?? (p.species === 'sheep' ? 10 : undefined)
  if (cuLimit !== undefined && feeds.some((f, i) => allowed[i] && f.cuMgPerKgDm !== undefined)) row('cu', (i) => (feeds[i].cuMgPerKgDm ?? 0) - cuLimit, -Infinity, 0)
  if (p.fieldOffer) {
    const tol = L.selectionTolerance ?? 0.1
    feeds.forEach((f, k) => {
      if (f.role !== 'field' || !allowed[k]) return
      const o = p.fieldOffer!.find((x) => x.feedId === f.id)?.shareOfDm ?? 0
      const isField = (i: number) => (feeds[i].role === 'field' ? 1 : 0)
      if (o + tol < 1) row(`omax${k}`, (i) => (i === k ? 1 : 0) - (o + tol) * isField(i), -Infinity, 0)
      if (o - tol > 0) row(`omin${k}`, (i) => (i === k ? 1 : 0) - (o - tol) * isField(i), 0, Infinity)
    })
  }
  const bounds = new Map<string, { lo: number; hi: number }>()
  feeds.forEach((f, i) => {
    if (!allowed[i]) return
    if (split) {
      if (f.maxKgDm !== undefined || f.minKgDm) row(`b${i}`, (k) => (k === i ? 1 : 0), f.minKgDm ?? 0, f.maxKgDm ?? Infinity)
    } else bounds.set(`x${i}`, { lo: f.minKgDm ?? 0, hi: f.maxKgDm ?? Infinity })
  })
  const cost = new Map<string, number>()
  feeds.forEach((f, i) => feedVars[i].forEach((v) => cost.set(v, f.costPerKgDm ?? 0)))
  return { vars, cost, bounds, rows, feedVars }
}

const num = (v: number) => (Number.isInteger(v) ? v.toFixed(1) : v.toPrecision(17))

/** CPLEX LP text of the independent model: HiGHS reads it through its own parser, a different path from the engine's matrices. */
export function lpText(m: IndependentLp): string {
  const expr = (terms: Map<string, number>) => {
    const parts = [...terms].map(([v, c]) => `${c < 0 ? '-' : '+'} ${num(Math.abs(c))} ${v}`)
    return parts.length ? parts.join(' ') : `+ 0 ${m.vars[0] ?? 'dummy'}`
  }
  const lines = ['Minimize', ` obj: ${expr(new Map([...m.cost].filter(([, c]) => c !== 0))) || '0'}`, 'Subject To']
  for (const r of m.rows) {
    if (r.terms.size === 0) continue
    // Two one-sided rows rather than a range, which the LP-format reader does not take in this form.
    if (Number.isFinite(r.lo)) lines.push(` ${r.name}_lo: ${expr(r.terms)} >= ${num(r.lo)}`)
    if (Number.isFinite(r.hi)) lines.push(` ${r.name}_hi: ${expr(r.terms)} <= ${num(r.hi)}`)
  }
  lines.push('Bounds')
  for (const v of m.vars) {
    const b = m.bounds.get(v) ?? { lo: 0, hi: Infinity }
    lines.push(Number.isFinite(b.hi) ? ` ${num(b.lo)} <= ${v} <= ${num(b.hi)}` : ` ${v} >= ${num(b.lo)}`)
  }
  lines.push('End')
  return lines.join('\n')
}

export type IndependentAnswer = { feasible: false } | { feasible: true; objective: number }
type HighsT = Awaited<ReturnType<typeof highsLoader>>
type GlpkT = Awaited<ReturnType<typeof GLPK>>
let solvers: { highs: HighsT; glpk: GlpkT } | undefined
export async function loadIndependentSolvers() {
  solvers ??= { highs: await highsLoader(), glpk: await GLPK() }
  return solvers
}

/** Trivial rows (no variables) decide feasibility on their own; both solvers are spared them. */
function trivialRowsFeasible(m: IndependentLp): boolean {
  return m.rows.every((r) => r.terms.size > 0 || (r.lo <= 0 && r.hi >= 0))
}

export function solveWithIndependentHighs(m: IndependentLp): IndependentAnswer {
  if (!trivialRowsFeasible(m)) return { feasible: false }
  if (m.vars.length === 0) return { feasible: true, objective: 0 }
  const r = solvers!.highs.solve(lpText(m), { output_flag: false } as never)
  if (r.Status === 'Optimal') return { feasible: true, objective: r.ObjectiveValue }
  if (r.Status === 'Infeasible') return { feasible: false }
  throw new Error(`HiGHS status ${r.Status}`)
}

export function solveWithGlpk(m: IndependentLp): IndependentAnswer {
  if (!trivialRowsFeasible(m)) return { feasible: false }
  if (m.vars.length === 0) return { feasible: true, objective: 0 }
  const g = solvers!.glpk
  const bnd = (lo: number, hi: number) => {
    if (Number.isFinite(lo) && Number.isFinite(hi)) return lo === hi ? { type: g.GLP_FX, lb: lo, ub: hi } : { type: g.GLP_DB, lb: lo, ub: hi }
    if (Number.isFinite(lo)) return { type: g.GLP_LO, lb: lo, ub: 0 }
    if (Number.isFinite(hi)) return { type: g.GLP_UP, lb: 0, ub: hi }
    return { type: g.GLP_FR, lb: 0, ub: 0 }
  }
  const res = g.solve(
    {
      name: 'ration',
      objective: { direction: g.GLP_MIN, name: 'obj', vars: m.vars.map((v) => ({ name: v, coef: m.cost.get(v) ?? 0 })) },
      subjectTo: m.rows.filter((r) => r.terms.size > 0).map((r) => ({ name: r.name, vars: [...r.terms].map(([name, coef]) => ({ name, coef })), bnds: bnd(r.lo, r.hi) })),
      bounds: m.vars.map((v) => {
        const b = m.bounds.get(v) ?? { lo: 0, hi: Infinity }
        return { name: v, ...bnd(b.lo, b.hi) }
      }),
    },
    { msglev: g.GLP_MSG_OFF, presol: false },
  )
  if (res.result.status === g.GLP_OPT) return { feasible: true, objective: res.result.z }
  if (res.result.status === g.GLP_NOFEAS || res.result.status === g.GLP_INFEAS) return { feasible: false }
  throw new Error(`glpk status ${res.result.status}`)
}

/**
 * Checks a diet (kg DM per feed, in problem order) against every need and limit of the problem, independently: NEm and NEg are
 * checked by the best split of each feed between maintenance and gain (greedy by NEg per NEm, a fractional knapsack).
 */
export function verifyDiet(p: RationProblem, kgDm: readonly number[]): string[] {
  const out: string[] = []
  const r = p.requirements
  const L = p.limits ?? {}
  const feeds = p.feeds
  const tol = (scale: number) => 1e-6 * Math.max(1, Math.abs(scale))
  const sum = (f: (i: number) => number) => feeds.reduce((s, _, i) => s + f(i) * kgDm[i], 0)
  const total = sum(() => 1)
  feeds.forEach((f, i) => {
    if (!(kgDm[i] >= -1e-9)) out.push(`${f.id} negative`)
    if (f.maxKgDm !== undefined && kgDm[i] > f.maxKgDm + tol(f.maxKgDm)) out.push(`${f.id} above max`)
    // A cattle-only product is never fed to sheep, whatever minimum was set for it.
    if (p.species === 'sheep' && f.cattleOnly) {
      if (kgDm[i] > 0) out.push(`${f.id} cattle product fed to sheep`)
    } else if (f.minKgDm && kgDm[i] < f.minKgDm - tol(f.minKgDm)) out.push(`${f.id} below min`)
  })
  const cap = L.maxDmiKg ?? r.dmiKg
  if (total > cap + tol(cap)) out.push('intake above capacity')
  const E = feeds.map((f) => netEnergy(f.tdnPctDm))
  const tdn = sum((i) => feeds[i].tdnPctDm / 100)
  if (tdn < r.tdnKg - tol(r.tdnKg)) out.push('TDN short')
  if (r.cpKg > 0 && sum((i) => feeds[i].cpPctDm / 100) < r.cpKg - tol(r.cpKg)) out.push('CP short')
  if (p.species === 'cattle' && (r.nemMcal ?? 0) > 0) {
    const nemTotal = sum((i) => E[i].nem)
    if ((r.negMcal ?? 0) > 0) {
      let spare = nemTotal - r.nemMcal!
      if (spare < -tol(r.nemMcal!)) out.push('NEm short')
      const order = feeds.map((_, i) => i).filter((i) => kgDm[i] > 0).sort((a, b) => E[b].neg / (E[b].nem || 1e-300) - E[a].neg / (E[a].nem || 1e-300))
      let neg = 0
      for (const i of order) {
        const take = E[i].nem > 0 ? Math.min(kgDm[i], Math.max(0, spare) / E[i].nem) : kgDm[i]
        neg += take * E[i].neg
        spare -= take * E[i].nem
      }
      if (neg < r.negMcal! - tol(r.negMcal!)) out.push('NEg short')
    } else if (nemTotal < r.nemMcal! - tol(r.nemMcal!)) out.push('NEm short')
  }
  const hasCa = feeds.some((f) => f.caPctDm !== undefined)
  const hasP = feeds.some((f) => f.pPctDm !== undefined)
  const ca = sum((i) => (feeds[i].caPctDm ?? 0) * 10)
  const ph = sum((i) => (feeds[i].pPctDm ?? 0) * 10)
  if (hasCa && ca < r.caG - tol(r.caG)) out.push('Ca short')
  if (hasP && ph < r.pG - tol(r.pG)) out.push('P short')
  if (hasCa && L.maxCaG !== undefined && ca > L.maxCaG + tol(L.maxCaG)) out.push('Ca above max')
  if (hasP && L.maxPG !== undefined && ph > L.maxPG + tol(L.maxPG)) out.push('P above max')
  if (hasCa && hasP) {
    if (ca - (L.minCaToP ?? 1) * ph < -tol(ca)) out.push('Ca:P below min')
    if (L.maxCaToP !== undefined && ca - L.maxCaToP * ph > tol(ca)) out.push('Ca:P above max')
  }
  const grain = sum((i) => (feeds[i].isGrain ? 1 : 0))
  if (L.maxGrainShareOfDm !== undefined && grain > L.maxGrainShareOfDm * total + tol(total)) out.push('grain share above limit')
  const urea = sum((i) => (feeds[i].isUrea ? 1 : 0))
  if (urea > (L.maxUreaShareOfDm ?? 0.01) * total + tol(total)) out.push('urea share above limit')
  const cuLimit = L.maxCuMgPerKgDm ?? (p.species === 'sheep' ? 10 : undefined)
  if (cuLimit !== undefined && sum((i) => feeds[i].cuMgPerKgDm ?? 0) > cuLimit * total + tol(cuLimit * total)) out.push('Cu above limit')
  if (p.fieldOffer) {
    const t = L.selectionTolerance ?? 0.1
    const field = sum((i) => (feeds[i].role === 'field' ? 1 : 0))
    feeds.forEach((f, i) => {
      if (f.role !== 'field') return
      const o = p.fieldOffer!.find((x) => x.feedId === f.id)?.shareOfDm ?? 0
      if (kgDm[i] > (o + t) * field + tol(field)) out.push(`${f.id} above its offered share`)
      if (kgDm[i] < (o - t) * field - tol(field)) out.push(`${f.id} below its offered share`)
    })
  }
  return out
}
