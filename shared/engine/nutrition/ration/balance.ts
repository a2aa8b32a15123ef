// The ration balance: least-cost supplement for a group on its field, with the field-alone deficiencies and conflicts in words.
import { checkLpSolution, dot, type LinearProgram, type LpOutcome, type SolverName } from '../lp/program'
import { loadHighs } from '../lp/adapter'
import { solveLp, solveLpSync, type LpAnswer } from '../lp/solve'
import { pearsonFractions } from '../pearson'
import { warningsOfDiet } from '../warnings'
import type { NutritionWarning } from '../warning'
import { buildRationLp, feedIntakes, limitText, needSupply, NUTRIENT_UNIT, rationContext, type RationContext, type RationLp } from './model'
import {
  balanceOptionsSchema,
  rationProblemSchema,
  type BalanceOptions,
  type BalanceResult,
  type Nutrient,
  type ParsedRationProblem,
  type RationProblem,
} from './schema'

type FallbackReason = NonNullable<BalanceResult['solverRuns'][number]['fallbackReason']>
type Answer = { outcome: LpOutcome; solver: SolverName; fallbackReason?: FallbackReason; checkFailed?: boolean; implied?: boolean; certified?: boolean }
type SolverChoice = 'auto' | 'highs'

interface Prepared {
  ctx: RationContext
  fieldOnly: RationLp
  main: RationLp
  /** Columns of the least-cost LP that are bought feeds: when all are zero, the field alone covers every need. */
  bought: number[]
}

function prepare(problem: RationProblem): Prepared {
  return prepareParsed(rationProblemSchema.parse(problem))
}
function prepareParsed(p: ParsedRationProblem): Prepared {
  const ctx = rationContext(p)
  const fieldOnly = buildRationLp(ctx, p.feeds.map((f) => f.role === 'field'), 'shortfall')
  const main = buildRationLp(ctx, p.feeds.map(() => true), 'cost')
  return { ctx, fieldOnly, main, bought: boughtColumns(main, p) }
}

/**
 * An LP answer as the balance keeps it. Only an answer that failed the certificate can still be primally infeasible (HiGHS's,
 * after the in-thread one failed): that is flagged so the result warns.
 */
function answerOf(lp: LinearProgram, a: LpAnswer): Answer {
  const checkFailed = a.status === 'optimal' && !a.certified && checkLpSolution(lp, a.x).length > 0
  return { outcome: a, solver: a.solver, certified: a.certified, ...(a.fallbackReason ? { fallbackReason: a.fallbackReason } : {}), ...(checkFailed ? { checkFailed } : {}) }
}

function boughtColumns(main: RationLp, p: ParsedRationProblem): number[] {
  const cols: number[] = []
  main.colFeed.forEach((i, j) => i >= 0 && p.feeds[i].role !== 'field' && cols.push(j))
  return cols
}

/**
 * Solves the least-cost and the field-only LP of one problem in the calling thread (`solveLp`: certified, HiGHS on doubt). When
 * the least-cost diet buys nothing it is itself a field-only diet meeting every need, so the field-only LP is not solved.
 */
async function settle(q: Prepared, solver: SolverChoice): Promise<[Answer, Answer]> {
  const mainAns = answerOf(q.main.lp, await solveLp(q.main.lp, { solver }))
  const m = mainAns.outcome
  if (m.status === 'optimal' && !mainAns.checkFailed && q.bought.every((j) => m.x[j] <= 1e-8)) {
    const zero = new Array<number>(q.fieldOnly.lp.colNames.length).fill(0)
    return [{ outcome: { status: 'optimal', x: zero, objective: 0 }, solver: mainAns.solver, implied: true }, mainAns]
  }
  const fieldAns = answerOf(q.fieldOnly.lp, await solveLp(q.fieldOnly.lp, { solver }))
  return [fieldAns, mainAns]
}

const round = (v: number) => (Math.abs(v) < 1e-12 ? 0 : v)

function shortfalls(r: RationLp, x: readonly number[], ctx: RationContext) {
  const list: { nutrient: Nutrient; shortBy: number; unit: 'kg' | 'Mcal' | 'g' }[] = []
  for (const n of ctx.needs) {
    const j = r.shortCol[n.nutrient]
    const s = j === undefined ? 0 : x[j]
    if (s > 1e-7 * Math.max(1, n.need)) list.push({ nutrient: n.nutrient, shortBy: s, unit: NUTRIENT_UNIT[n.nutrient] })
  }
  return list
}

const NAME: Record<Nutrient, string> = { tdn: 'TDN', nem: 'NEm', neg: 'NEg', cp: 'CP', ca: 'Ca', p: 'P' }

/** Which needs and limits collide, read from the duals of the least-shortfall LP (the limits that hold the shortfall up). */
function conflictsInWords(r: RationLp, o: LpOutcome & { status: 'optimal' }, ctx: RationContext): string[] {
  const short = shortfalls(r, o.x, ctx)
  if (short.length === 0) return []
  const needs = short.map((s) => NAME[s.nutrient])
  const limits: string[] = []
  let capacityBinds = false
  const seen = new Set<string>()
  const addLimit = (text: string) => {
    if (!seen.has(text)) {
      seen.add(text)
      limits.push(text)
    }
  }
  r.rowLimit.forEach((label, i) => {
    if (!label || !o.rowDual) return
    if (Math.abs(o.rowDual[i]) > 1e-9) {
      addLimit(limitText(label, ctx))
      if (label.kind === 'intake') capacityBinds = true
    }
  })
  r.colLimit.forEach((label, j) => {
    if (!label || !o.colDual) return
    if (Math.abs(o.colDual[j]) > 1e-9) addLimit(limitText(label, ctx))
  })
  // Upper caps on a need row (Ca, P maxima) show as a dual of the "wrong" sign on that row.
  for (const s of ['ca', 'p'] as const) {
    const row = r.needRow[s]
    const cap = s === 'ca' ? ctx.limits.maxCaG : ctx.limits.maxPG
    if (row !== undefined && cap !== undefined && o.rowDual && o.rowDual[row] < -1e-9) addLimit(`${NAME[s]} at most ${cap} g/day`)
  }
  const list = (xs: string[]) => (xs.length <= 1 ? xs.join('') : `${xs.slice(0, -1).join(', ')} and ${xs[xs.length - 1]}`)
  const out: string[] = []
  if (limits.length === 0) {
    out.push(`${list(needs)} cannot be met: the feeds offered do not contain enough of ${needs.length > 1 ? 'them' : 'it'} in any amount.`)
  } else {
    out.push(`${list(needs)} cannot ${needs.length > 1 ? 'all ' : ''}be met within ${list(limits)}.`)
  }
  if (capacityBinds) {
    for (const s of short) {
      const need = ctx.needs.find((n) => n.nutrient === s.nutrient)!.need
      const best = Math.max(0, ...ctx.p.feeds.map((_, i) => (ctx.allowed[i] ? densityOf(ctx, i, s.nutrient) : 0)))
      const unit = NUTRIENT_UNIT[s.nutrient]
      out.push(
        `Intake capacity against ${s.nutrient === 'cp' ? 'protein' : s.nutrient === 'ca' || s.nutrient === 'p' ? 'mineral' : 'energy'} density: ${NAME[s.nutrient]} needs ${(need / ctx.capacity).toFixed(3)} ${unit} per kg DM on average; the densest feed offered has ${best.toFixed(3)}.`,
      )
    }
  }
  return out
}

/**
 * When even the least-shortfall LP has no solution, only hard limits and feed minimums are to blame: a deletion filter (drop each
 * labelled limit in turn, keep it dropped if the LP stays infeasible) leaves an irreducible set, named in words. HiGHS answers.
 */
function explainHardConflict(r: RationLp, ctx: RationContext): string[] {
  const lp = r.lp
  const active = {
    rows: r.rowLimit.map((l) => l !== null),
    cols: r.colLimit.map((l, j) => l !== null && lp.colLower[j] > 0),
  }
  const withRelaxed = (): LinearProgram => ({
    ...lp,
    secondary: undefined,
    rows: lp.rows.map((row, i) => (r.rowLimit[i] && !active.rows[i] ? { ...row, lower: -Infinity, upper: Infinity } : row)),
    colLower: lp.colLower.map((v, j) => (r.colLimit[j] && !active.cols[j] ? 0 : v)),
  })
  const feasible = () => solveLpSync(withRelaxed()).status === 'optimal'
  for (let i = 0; i < active.rows.length; i++) {
    if (!active.rows[i]) continue
    active.rows[i] = false
    if (feasible()) active.rows[i] = true
  }
  for (let j = 0; j < active.cols.length; j++) {
    if (!active.cols[j]) continue
    active.cols[j] = false
    if (feasible()) active.cols[j] = true
  }
  const texts = new Set<string>()
  r.rowLimit.forEach((l, i) => l && active.rows[i] && texts.add(limitText(l, ctx)))
  r.colLimit.forEach((l, j) => l && active.cols[j] && texts.add(limitText(l, ctx)))
  return [...texts]
}

const listWords = (xs: string[]) => (xs.length <= 1 ? xs.join('') : `${xs.slice(0, -1).join(', ')} and ${xs[xs.length - 1]}`)

function densityOf(ctx: RationContext, i: number, n: Nutrient): number {
  return ctx.density[i][n]
}

/**
 * Smallest legume share of diet DM at which field feeds alone cover CP at full intake capacity: the Pearson square
 * (Montana State Univ. Extension, "Pearson Square Examples") between the legume and the rest of the field, each in its offered
 * proportions (equal shares when no offer is given). 0 when the rest already covers CP; null when even the legume cannot.
 */
export function minLegumeShareForProtein(ctx: RationContext): number | null {
  const { p } = ctx
  const field = p.feeds.map((f, i) => ({ f, i })).filter(({ f, i }) => f.role === 'field' && ctx.allowed[i])
  const legumes = field.filter(({ f }) => f.isLegume)
  const rest = field.filter(({ f }) => !f.isLegume)
  if (legumes.length === 0 || p.requirements.cpKg <= 0) return null
  const offer = new Map((p.fieldOffer ?? []).map((o) => [o.feedId, o.shareOfDm]))
  const blendCp = (xs: typeof field) => {
    const w = xs.map(({ f }) => (p.fieldOffer ? (offer.get(f.id) ?? 0) : 1))
    const sw = w.reduce((a, b) => a + b, 0)
    const weights = sw > 0 ? w.map((v) => v / sw) : xs.map(() => 1 / xs.length)
    return xs.reduce((s, { f }, k) => s + weights[k] * f.cpPctDm, 0)
  }
  const targetCp = (100 * p.requirements.cpKg) / ctx.capacity
  const legumeCp = blendCp(legumes)
  if (rest.length === 0) return legumeCp >= targetCp ? 1 : null
  const restCp = blendCp(rest)
  if (restCp >= targetCp) return 0
  if (legumeCp < targetCp) return null
  return pearsonFractions(legumeCp, restCp, targetCp).fracA
}

function assemble(prep: Prepared, fieldAns: Answer, mainAns: Answer, bestAns: Answer | null, bestLp: RationLp | null): BalanceResult {
  const { ctx, fieldOnly, main } = prep
  const p = ctx.p
  const nFeeds = p.feeds.length
  const runs: BalanceResult['solverRuns'] = [
    { lp: 'field-only', solver: fieldAns.solver, ...runFlags(fieldAns) },
    { lp: 'main', solver: mainAns.solver, ...runFlags(mainAns) },
  ]
  if (bestAns) runs.push({ lp: 'best-achievable', solver: bestAns.solver, ...runFlags(bestAns) })

  const warnings: NutritionWarning[] = []
  for (const a of [fieldAns, mainAns, bestAns]) {
    if (a?.checkFailed) warnings.push({ code: 'solver-check-failed', message: 'An LP answer did not pass the constraint check within tolerance; treat this balance with care.', source: 'LP answer check' })
  }

  // Deficiencies of the best diet from the field alone.
  let deficiencies: BalanceResult['deficiencies']
  const conflicts: string[] = []
  if (fieldAns.outcome.status === 'optimal') {
    deficiencies = shortfalls(fieldOnly, fieldAns.outcome.x, ctx)
  } else {
    deficiencies = ctx.needs.map((n) => ({ nutrient: n.nutrient, shortBy: n.need, unit: NUTRIENT_UNIT[n.nutrient] }))
    const why = explainHardConflict(fieldOnly, ctx)
    conflicts.push(`From the field alone no diet can be formed: ${why.length ? listWords(why) : 'the limits'} cannot all hold at once.`)
  }

  let status: BalanceResult['status']
  let used: RationLp
  let x: number[]
  let stillShort: BalanceResult['stillShort'] = []
  let duals: number[] | undefined
  if (mainAns.outcome.status === 'optimal') {
    used = main
    x = mainAns.outcome.x
    duals = mainAns.outcome.rowDual
    const { kgDm } = feedIntakes(main, x, nFeeds)
    status = p.feeds.some((f, i) => f.role !== 'field' && kgDm[i] > 0) ? 'covered-with-supplement' : 'covered'
  } else if (bestAns && bestLp && bestAns.outcome.status === 'optimal') {
    used = bestLp
    x = bestAns.outcome.x
    status = 'short'
    stillShort = shortfalls(bestLp, x, ctx)
    conflicts.push(...conflictsInWords(bestLp, bestAns.outcome, ctx))
  } else {
    used = main
    x = new Array<number>(main.lp.colNames.length).fill(0)
    status = 'short'
    stillShort = ctx.needs.map((n) => ({ nutrient: n.nutrient, shortBy: n.need, unit: NUTRIENT_UNIT[n.nutrient] }))
    const why = bestLp ? explainHardConflict(bestLp, ctx) : []
    conflicts.push(`No diet can be formed: ${why.length ? listWords(why) : 'the limits'} cannot all hold at once.`)
  }

  const { kgDm, kgDmForGain } = feedIntakes(used, x, nFeeds)
  const intakes = p.feeds.map((f, i) => ({
    feedId: f.id,
    kgDm: kgDm[i],
    kgAsFed: kgDm[i] / (f.dmPct / 100),
    ...(ctx.split ? { kgDmForGain: kgDmForGain[i] } : {}),
  }))
  const supply = ctx.needs.map((n) => {
    const supplied = round(needSupply(used, x, n.nutrient))
    const row = used.needRow[n.nutrient]
    return {
      nutrient: n.nutrient,
      unit: NUTRIENT_UNIT[n.nutrient],
      need: n.need,
      supplied,
      pctCovered: (100 * supplied) / n.need,
      // The least-cost LP's row duals (certified, from the solver's basis) are the cost of one more unit of each need.
      ...(duals && row !== undefined ? { shadowPrice: round(duals[row]) } : {}),
    }
  })
  const supplements = p.feeds
    .map((f, i) => ({ f, i }))
    .filter(({ f, i }) => f.role !== 'field' && kgDm[i] > 0)
    .map(({ f, i }) => ({ feedId: f.id, kgDm: kgDm[i], kgAsFed: kgDm[i] / (f.dmPct / 100), cost: kgDm[i] * (f.costPerKgDm ?? 0) }))
  const costPerHeadDay = p.feeds.reduce((s, f, i) => s + kgDm[i] * (f.costPerKgDm ?? 0), 0)

  warnings.push(
    ...warningsOfDiet({
      species: p.species,
      feeds: p.feeds,
      intakes: intakes.map((d) => ({ feedId: d.feedId, kgDm: d.kgDm })),
      requirements: p.requirements,
      limits: p.limits,
      context: p.context,
    }),
  )
  for (const r of runs) {
    if (r.fallbackReason && r.fallbackReason !== 'no-runner' && r.fallbackReason !== 'requested') {
      warnings.push({ code: 'solver-fallback', message: `The ${r.lp} LP was re-solved with HiGHS (${r.fallbackReason}).`, source: 'HiGHS (highs package)' })
    }
  }

  return {
    status,
    intakes,
    supply,
    deficiencies,
    stillShort,
    supplements,
    costPerHeadDay: round(costPerHeadDay),
    intakeCapacityKg: ctx.capacity,
    minLegumeShareForProtein: minLegumeShareForProtein(ctx),
    conflicts,
    warnings,
    solver: (bestAns && mainAns.outcome.status !== 'optimal' ? bestAns : mainAns).solver,
    solverRuns: runs,
  }
}

function runFlags(a: Answer) {
  return {
    ...(a.fallbackReason ? { fallbackReason: a.fallbackReason } : {}),
    ...(a.implied ? { impliedByMain: true } : {}),
    ...(a.certified !== undefined ? { certified: a.certified } : {}),
  }
}

async function finish(prep: Prepared, fieldAns: Answer, mainAns: Answer, solver: SolverChoice): Promise<BalanceResult> {
  let bestAns: Answer | null = null
  let bestLp: RationLp | null = null
  if (mainAns.outcome.status !== 'optimal') {
    // No diet meets every need: the closest one over all feeds, cheapest among equals; its duals name the limits that hold it up.
    bestLp = buildRationLp(prep.ctx, prep.ctx.p.feeds.map(() => true), 'shortfall', true)
    bestAns = answerOf(bestLp.lp, await solveLp(bestLp.lp, { solver }))
  }
  // Limits that collide outright are named by re-solving relaxed LPs synchronously; HiGHS is loaded first in case one needs it.
  if (fieldAns.outcome.status !== 'optimal' || (bestAns && bestAns.outcome.status !== 'optimal')) await loadHighs()
  return assemble(prep, fieldAns, mainAns, bestAns, bestLp)
}

const DEFAULT_OPTIONS = balanceOptionsSchema.parse({})

/**
 * Balances one ration: meets energy (TDN, and NEm/NEg for cattle), CP, Ca and P at least at need, within intake capacity, the
 * Ca:P ratio, grain, urea and Cu limits, what the field offers and each feed's availability, at least supplement cost, ties going
 * to the diet with the most field feed. The LP is the classic least-cost ration formulation (Waugh, "The minimum-cost dairy feed",
 * J. Farm Econ. 33:299, 1951 — from memory); NEm and NEg are met from separate portions of each feed as in NRC, Nutrient
 * Requirements of Beef Cattle, 7th rev. ed. (1996/2000). Each LP is solved in the calling thread by the engine's dense simplex and
 * its answer certified optimal by LP duality (or infeasible by a Farkas ray) from the solver's basis; only an answer that fails the
 * certificate, or a simplex out of its pivot budget, is re-solved by HiGHS. The certified row duals are the shadow prices.
 */
export async function balanceRation(problem: RationProblem, options?: BalanceOptions): Promise<BalanceResult> {
  const prep = prepare(problem)
  const opt = options === undefined ? DEFAULT_OPTIONS : balanceOptionsSchema.parse(options)
  const [fieldAns, mainAns] = await settle(prep, opt.solver)
  return finish(prep, fieldAns, mainAns, opt.solver)
}

/** Balances many rations one after another in the calling thread; every problem is validated before any is solved. Same method and sources as `balanceRation`. */
export async function balanceRations(problems: readonly RationProblem[], options?: BalanceOptions): Promise<BalanceResult[]> {
  const opt = balanceOptionsSchema.parse(options ?? {})
  const parsed = problems.map((p) => rationProblemSchema.parse(p))
  const out: BalanceResult[] = []
  for (const p of parsed) {
    const q = prepareParsed(p)
    const [fieldAns, mainAns] = await settle(q, opt.solver)
    out.push(await finish(q, fieldAns, mainAns, opt.solver))
  }
  return out
}

/** The least-cost LP of a problem, exactly as the engine solves it (for cross-checks and benchmarks). */
export function rationLinearProgram(problem: RationProblem): LinearProgram {
  return prepare(problem).main.lp
}
/** Cost of an intake vector (kg DM per feed, in problem order) at the problem's prices. */
export function dietCost(problem: RationProblem, kgDm: readonly number[]): number {
  const p = rationProblemSchema.parse(problem)
  return dot(
    p.feeds.map((f) => f.costPerKgDm ?? 0),
    kgDm,
  )
}
