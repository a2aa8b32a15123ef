// A solver-neutral linear program (dense, small: a ration has a handful of feeds) and the independent check of any answer.

/** minimise cost·x subject to rowLower ≤ A x ≤ rowUpper and colLower ≤ x ≤ colUpper (±Infinity where unbounded). */
export interface LinearProgram {
  colNames: string[]
  cost: number[]
  colLower: number[]
  colUpper: number[]
  rows: LpRow[]
  /**
   * Lexicographic second objective: after the first optimum c*, minimise this over the answers optimal for the first (the
   * engine's simplex: its optimal face; HiGHS: cost·x ≤ c* + `lexicographicTolerance`). Ties of the first objective are then
   * broken by the second.
   */
  secondary?: number[]
  /**
   * A bound the second objective can never go below (e.g. minus the most field DM the animal could eat). When the first answer
   * already reaches it, that answer is also lexicographically optimal and the second solve is skipped.
   */
  secondaryFloor?: number
  /**
   * A row whose being at its upper bound settles the tie-break: when it binds and every column used that the second objective
   * ignores has a positive first-objective cost, the second solve is skipped (see `secondaryAttained`).
   */
  secondaryBindingRow?: number
}
export interface LpRow {
  name: string
  coefs: number[]
  lower: number
  upper: number
}

export type LpOutcome =
  | { status: 'optimal'; x: number[]; objective: number; rowDual?: number[]; colDual?: number[] }
  | { status: 'infeasible' }
  | { status: 'unbounded' }
  | { status: 'error'; message: string }

/** Which library answered: the engine's own dense simplex in the calling thread, or HiGHS. */
export type SolverName = 'engine-simplex' | 'highs'

/**
 * Why HiGHS answered instead of the in-thread simplex: it ran out of its pivot budget, its answer failed the certificate
 * (optimality, or infeasibility by a Farkas ray), it failed outright, or HiGHS was asked for.
 */
export type FallbackReason = 'iteration-limit' | 'not-certified' | 'solver-error' | 'requested'

/** Allowed slack of the first objective when the second breaks ties: 1e-10 relative, with an absolute floor of 1e-10. */
export function lexicographicTolerance(objective: number): number {
  return 1e-10 * Math.max(1, Math.abs(objective))
}

/** True when the first-stage answer already attains the second objective's floor, so no second solve can improve it. */
export function secondaryAttained(lp: LinearProgram, x: readonly number[]): boolean {
  const sec = lp.secondary
  if (!sec) return true
  if (lp.secondaryFloor !== undefined && dot(sec, x) <= lp.secondaryFloor + 1e-9 * Math.max(1, Math.abs(lp.secondaryFloor))) return true
  const r = lp.secondaryBindingRow === undefined ? undefined : lp.rows[lp.secondaryBindingRow]
  if (!r || !Number.isFinite(r.upper)) return false
  // In the ration LP this row is intake capacity and the ignored columns are bought feeds: with intake full, more field feed
  // means fewer kg bought at the same cost, which needs two purchase mixes of exactly equal cost — a tie left to the solver.
  if (dot(r.coefs, x) < r.upper - 1e-9 * Math.max(1, Math.abs(r.upper))) return false
  for (let j = 0; j < x.length; j++) if (sec[j] === 0 && x[j] > 1e-9 && !(lp.cost[j] > 0)) return false
  return true
}

/** Feasibility tolerance for checking an answer: 1e-7 relative to the size of the terms involved. */
const FEAS_TOL = 1e-7

export interface Violation {
  what: string
  by: number
}

/** Every bound and row of `lp` checked against `x`; an empty list means the answer is feasible. */
export function checkLpSolution(lp: LinearProgram, x: readonly number[]): Violation[] {
  const out: Violation[] = []
  if (x.length !== lp.colNames.length) return [{ what: 'length', by: Math.abs(x.length - lp.colNames.length) }]
  for (let j = 0; j < x.length; j++) {
    const v = x[j]
    if (!Number.isFinite(v)) {
      out.push({ what: `column ${lp.colNames[j]} not finite`, by: Infinity })
      continue
    }
    const tol = FEAS_TOL * Math.max(1, Math.abs(v))
    if (v < lp.colLower[j] - tol) out.push({ what: `column ${lp.colNames[j]} below its lower bound`, by: lp.colLower[j] - v })
    if (v > lp.colUpper[j] + tol) out.push({ what: `column ${lp.colNames[j]} above its upper bound`, by: v - lp.colUpper[j] })
  }
  for (const r of lp.rows) {
    let act = 0
    let mag = 0
    for (let j = 0; j < x.length; j++) {
      const t = r.coefs[j] * x[j]
      act += t
      mag += Math.abs(t)
    }
    const tol = FEAS_TOL * Math.max(1, mag, Number.isFinite(r.lower) ? Math.abs(r.lower) : 0, Number.isFinite(r.upper) ? Math.abs(r.upper) : 0)
    if (act < r.lower - tol) out.push({ what: `row ${r.name} below its lower bound`, by: r.lower - act })
    if (act > r.upper + tol) out.push({ what: `row ${r.name} above its upper bound`, by: act - r.upper })
  }
  return out
}

export function dot(a: readonly number[], b: readonly number[]): number {
  let s = 0
  for (let i = 0; i < a.length; i++) s += a[i] * b[i]
  return s
}

