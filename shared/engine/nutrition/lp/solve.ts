// The one LP solve of the engine: the dense simplex in the calling thread, its answer certified, HiGHS only when that fails.
import { highsReady, loadHighs, solveWithHighs } from './adapter'
import { basisSolution, certifyInfeasible, certifyLp, type PrimalDual } from './certificate'
import { dot, secondaryAttained, type FallbackReason, type LinearProgram, type LpOutcome, type SolverName } from './program'
import { DenseSimplex, type LpBasis } from './simplex'

/** An LP answer with who gave it and whether it passed the certificate (optimality by duality, or infeasibility by a Farkas ray). */
export type LpAnswer = LpOutcome & {
  solver: SolverName
  /** True when the answer passed `certifyLp` (optimal) or `certifyInfeasible` (infeasible). */
  certified: boolean
  /** Set when HiGHS answered (or was needed): why the in-thread simplex's answer was not used. */
  fallbackReason?: FallbackReason
  /** What the certificate found wrong with the in-thread answer, in words. */
  certificateDetail?: string
  /** Pivots of the in-thread simplex. */
  iterations?: number
  /** The first-objective optimal basis of the in-thread simplex: a warm start for a neighbouring LP (same rows and columns). */
  basis?: LpBasis
}

export interface SolveLpOptions {
  /** 'auto' (default): the in-thread simplex, HiGHS on any doubt. 'highs': HiGHS only (comparisons, benchmarks). */
  solver?: 'auto' | 'highs'
  /** A starting basis, e.g. the parent's answer's `basis` in a branch and bound; ignored when it does not fit. */
  basis?: LpBasis
  /** Pivot budget of the in-thread simplex (default 40·(rows + columns) + 200): its bound in time, as it cannot hang. */
  maxIterations?: number
}

type InThread = { answer: LpAnswer } | { fallback: FallbackReason; detail?: string; iterations: number }

function optimal(x: number[], cost: readonly number[], duals: PrimalDual, iterations: number, basis: LpBasis): LpAnswer {
  return { status: 'optimal', x, objective: dot(cost, x), rowDual: duals.rowDual, colDual: duals.colDual, solver: 'engine-simplex', certified: true, iterations, basis }
}

/**
 * The in-thread path: dense simplex (`DenseSimplex`), then the certificate computed from its basis — values, row duals and
 * reduced costs from the LP's own numbers (`basisSolution`), checked for primal feasibility, dual feasibility, complementary
 * slackness and a zero duality gap (`certifyLp`); an infeasible claim must come with a Farkas ray (`certifyInfeasible`). With a
 * second objective, the tie-break runs over the optimal face and is certified twice: against the second objective on that face,
 * and against the first objective with the first stage's duals (so the tie-break cannot have cost anything).
 */
function solveInThread(lp: LinearProgram, options: SolveLpOptions): InThread {
  // Scratch arrays: this solver is used and dropped within this synchronous call.
  const s = new DenseSimplex(lp, { basis: options.basis, maxIterations: options.maxIterations, scratch: true })
  const first = s.minimise(lp.cost)
  const it = first.iterations
  if (first.status === 'iteration-limit') return { fallback: 'iteration-limit', iterations: it }
  if (first.status === 'infeasible') {
    if (first.ray && certifyInfeasible(lp, first.ray)) return { answer: { status: 'infeasible', solver: 'engine-simplex', certified: true, iterations: it, basis: first.basis } }
    return { fallback: 'not-certified', detail: 'infeasible, without a valid Farkas ray', iterations: it }
  }
  if (first.status !== 'optimal') return { fallback: 'not-certified', detail: first.status, iterations: it }
  const pd = basisSolution(lp, lp.cost, first.basis)
  if (!pd) return { fallback: 'not-certified', detail: 'singular basis', iterations: it }
  const c1 = certifyLp(lp, lp.cost, pd)
  if (!c1.ok) return { fallback: 'not-certified', detail: `${c1.failure}: ${c1.detail}`, iterations: it }
  if (!lp.secondary || secondaryAttained(lp, pd.x)) return { answer: optimal(pd.x, lp.cost, pd, it, first.basis) }

  const { result: second, faceLp } = s.minimiseOnOptimalFace(lp.secondary)
  const it2 = second.iterations
  if (second.status === 'iteration-limit') return { fallback: 'iteration-limit', iterations: it2 }
  if (second.status !== 'optimal') return { fallback: 'not-certified', detail: `tie-break ${second.status}`, iterations: it2 }
  const pd2 = basisSolution(faceLp, lp.secondary, second.basis)
  if (!pd2) return { fallback: 'not-certified', detail: 'tie-break: singular basis', iterations: it2 }
  const c2 = certifyLp(faceLp, lp.secondary, pd2)
  if (!c2.ok) return { fallback: 'not-certified', detail: `tie-break ${c2.failure}: ${c2.detail}`, iterations: it2 }
  const c3 = certifyLp(lp, lp.cost, { x: pd2.x, rowDual: pd.rowDual, colDual: pd.colDual })
  if (!c3.ok) return { fallback: 'not-certified', detail: `tie-break moved the cost: ${c3.failure}: ${c3.detail}`, iterations: it2 }
  return { answer: optimal(pd2.x, lp.cost, pd, it2, first.basis) }
}

function viaHighs(lp: LinearProgram, reason: FallbackReason, detail: string | undefined, iterations: number | undefined): LpAnswer {
  const o = solveWithHighs(lp)
  const certified =
    o.status === 'optimal' && o.rowDual !== undefined && o.colDual !== undefined && certifyLp(lp, lp.cost, { x: o.x, rowDual: o.rowDual, colDual: o.colDual }).ok
  return { ...o, solver: 'highs', certified, fallbackReason: reason, ...(detail ? { certificateDetail: detail } : {}), ...(iterations !== undefined ? { iterations } : {}) }
}

/**
 * Solves an LP in the calling thread and certifies the answer; only an answer that fails the certificate, or a simplex out of
 * its pivot budget, goes to HiGHS — which must already be loaded (`loadHighs`), else the answer is an error naming the reason.
 * Every optimal answer carries row duals (shadow prices: the cost of one more unit of each row's bound) and reduced costs.
 */
export function solveLpSync(lp: LinearProgram, options: SolveLpOptions = {}): LpAnswer {
  if (options.solver === 'highs') {
    if (!highsReady()) return { status: 'error', message: 'HiGHS is not loaded', solver: 'highs', certified: false, fallbackReason: 'requested' }
    return viaHighs(lp, 'requested', undefined, undefined)
  }
  let r: InThread
  try {
    r = solveInThread(lp, options)
  } catch (e) {
    r = { fallback: 'solver-error', detail: e instanceof Error ? e.message : String(e), iterations: 0 }
  }
  if ('answer' in r) return r.answer
  if (!highsReady()) return { status: 'error', message: 'HiGHS is not loaded', solver: 'highs', certified: false, fallbackReason: r.fallback, ...(r.detail ? { certificateDetail: r.detail } : {}) }
  return viaHighs(lp, r.fallback, r.detail, r.iterations)
}

/** `solveLpSync`, loading HiGHS first only when it is needed (the first load takes 50–70 ms; the browser fetches highs.wasm). */
export async function solveLp(lp: LinearProgram, options: SolveLpOptions = {}): Promise<LpAnswer> {
  const a = solveLpSync(lp, options)
  if (a.status !== 'error' || highsReady() || a.message !== 'HiGHS is not loaded') return a
  await loadHighs()
  return solveLpSync(lp, options)
}
