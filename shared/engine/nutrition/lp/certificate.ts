// The optimality certificate of an LP answer: values and duals from a basis, then primal feasibility, dual feasibility and complementary slackness.
import { checkLpSolution, type LinearProgram } from './program'
import { BASIC, LOWER, UPPER, type LpBasis } from './simplex'

/** A primal answer with its duals: rowDual[i] = y_i (the cost of one more unit of row i's bound), colDual = c − Aᵀy. */
export interface PrimalDual {
  x: number[]
  rowDual: number[]
  colDual: number[]
}

/**
 * Solves M z = b in place for a small dense k × k matrix (row-major), Gaussian elimination with partial pivoting
 * (Golub & Van Loan, Matrix Computations, 3rd ed., §3.4 — from memory). Returns false when M is singular to working precision.
 */
function solveDense(M: number[], k: number, b: number[]): boolean {
  let scale = 0
  for (let i = 0; i < k * k; i++) scale = Math.max(scale, Math.abs(M[i]))
  const tiny = 1e-13 * Math.max(1, scale)
  for (let c = 0; c < k; c++) {
    let p = c
    for (let i = c + 1; i < k; i++) if (Math.abs(M[i * k + c]) > Math.abs(M[p * k + c])) p = i
    if (Math.abs(M[p * k + c]) <= tiny) return false
    if (p !== c) {
      for (let j = 0; j < k; j++) {
        const t = M[c * k + j]
        M[c * k + j] = M[p * k + j]
        M[p * k + j] = t
      }
      const t = b[c]
      b[c] = b[p]
      b[p] = t
    }
    const piv = M[c * k + c]
    for (let i = c + 1; i < k; i++) {
      const f = M[i * k + c] / piv
      if (f === 0) continue
      for (let j = c; j < k; j++) M[i * k + j] -= f * M[c * k + j]
      b[i] -= f * b[c]
    }
  }
  for (let i = k - 1; i >= 0; i--) {
    let s = b[i]
    for (let j = i + 1; j < k; j++) s -= M[i * k + j] * b[j]
    b[i] = s / M[i * k + i]
  }
  return true
}

/** Scratch for the k × k systems (plain arrays of doubles, reused: allocating even typed ones costs more than the solve). */
const square = {
  M: [] as number[],
  Mt: [] as number[],
  rhs: [] as number[],
  cs: [] as number[],
  fit(k: number) {
    if (this.rhs.length < k) {
      this.M = new Array<number>(k * k).fill(0.5)
      this.Mt = new Array<number>(k * k).fill(0.5)
      this.rhs = new Array<number>(k).fill(0.5)
      this.cs = new Array<number>(k).fill(0.5)
    }
    return this
  },
}

function boundValue(lower: number, upper: number, s: number): number {
  return s === LOWER ? (Number.isFinite(lower) ? lower : upper) : s === UPPER ? upper : 0
}

/**
 * The answer a basis stands for, computed afresh from the LP's own numbers (not from the solver's working arrays): nonbasic
 * variables at their bounds, the basic columns from the rows whose activity is nonbasic (a k × k system A[R,S] x_S = rhs),
 * the row duals from its transpose (A[R,S]ᵀ y_R = c_S, y = 0 on rows whose activity is basic) and the column duals
 * d = c − Aᵀy — the textbook basic solution (Chvátal, Linear Programming, 1983, ch. 7–8 — from memory). Null when the basis
 * does not fit the LP or is singular.
 */
export function basisSolution(lp: LinearProgram, cost: readonly number[], basis: LpBasis): PrimalDual | null {
  const n = lp.colNames.length
  const m = lp.rows.length
  if (basis.colStatus.length !== n || basis.rowStatus.length !== m) return null
  const S: number[] = []
  const R: number[] = []
  for (let j = 0; j < n; j++) if (basis.colStatus[j] === BASIC) S.push(j)
  for (let i = 0; i < m; i++) if (basis.rowStatus[i] !== BASIC) R.push(i)
  const k = S.length
  if (R.length !== k) return null
  const x = new Array<number>(n)
  for (let j = 0; j < n; j++) x[j] = basis.colStatus[j] === BASIC ? 0 : boundValue(lp.colLower[j], lp.colUpper[j], basis.colStatus[j])
  const rowDual = new Array<number>(m).fill(0)
  if (k > 0) {
    const { M, Mt, rhs, cs } = square.fit(k)
    for (let a = 0; a < k; a++) {
      const row = lp.rows[R[a]]
      let v = boundValue(row.lower, row.upper, basis.rowStatus[R[a]])
      for (let j = 0; j < n; j++) if (basis.colStatus[j] !== BASIC) v -= row.coefs[j] * x[j]
      rhs[a] = v
      for (let b = 0; b < k; b++) {
        M[a * k + b] = row.coefs[S[b]]
        Mt[b * k + a] = row.coefs[S[b]]
      }
      cs[a] = cost[S[a]]
    }
    if (!solveDense(M, k, rhs) || !solveDense(Mt, k, cs)) return null
    for (let b = 0; b < k; b++) x[S[b]] = rhs[b]
    for (let a = 0; a < k; a++) rowDual[R[a]] = cs[a]
  }
  const colDual = new Array<number>(n)
  for (let j = 0; j < n; j++) {
    let s = cost[j]
    for (let i = 0; i < m; i++) if (rowDual[i] !== 0) s -= lp.rows[i].coefs[j] * rowDual[i]
    colDual[j] = basis.colStatus[j] === BASIC ? 0 : s
  }
  return { x, rowDual, colDual }
}

export type CertificateFailure = 'primal-infeasible' | 'dual-residual' | 'dual-infeasible' | 'complementary-slackness' | 'duality-gap' | 'not-finite'

export interface Certificate {
  ok: boolean
  failure?: CertificateFailure
  /** What failed, in words (first failing constraint or dual). */
  detail?: string
  /** Primal objective minus the dual bound: how far the answer can be from the optimum at most (≥ 0 up to round-off). */
  gap: number
  objective: number
}

/** Relative tolerances of the certificate: primal as `checkLpSolution` (1e-7), duals and the gap 1e-9 of their scale. */
const DUAL_TOL = 1e-9
const GAP_TOL = 1e-9

/**
 * Certifies that `x` minimises `cost`·x over the LP, by LP duality (Chvátal, Linear Programming, 1983, ch. 5 — from memory):
 * x is feasible (every bound and row, `checkLpSolution`); the duals explain the cost (c − Aᵀy − d = 0); each dual has the sign
 * its bound allows (y_i > 0 only on a finite lower row bound, < 0 only on a finite upper one; likewise d_j on column bounds);
 * complementary slackness (a nonzero dual only where its bound holds with equality); and so the duality gap
 * c·x − (Σ y_i·bound_i + Σ d_j·bound_j) is zero to 1e-9 of the objective's scale. A feasible answer above the optimum by more
 * than that cannot pass, whatever duals come with it.
 */
export function certifyLp(lp: LinearProgram, cost: readonly number[], a: PrimalDual): Certificate {
  const n = lp.colNames.length
  const m = lp.rows.length
  const { x, rowDual: y, colDual: d } = a
  let objective = 0
  for (let j = 0; j < n; j++) objective += cost[j] * x[j]
  const fail = (failure: CertificateFailure, detail: string, gap = NaN): Certificate => ({ ok: false, failure, detail, gap, objective })
  if (x.length !== n || y.length !== m || d.length !== n) return fail('not-finite', 'lengths do not match the LP')
  for (const v of x) if (!Number.isFinite(v)) return fail('not-finite', 'a value is not finite')
  for (const v of y) if (!Number.isFinite(v)) return fail('not-finite', 'a row dual is not finite')
  for (const v of d) if (!Number.isFinite(v)) return fail('not-finite', 'a column dual is not finite')
  const violations = checkLpSolution(lp, x)
  if (violations.length) return fail('primal-infeasible', `${violations[0].what} by ${violations[0].by}`)

  let costScale = 1
  for (let j = 0; j < n; j++) costScale = Math.max(costScale, Math.abs(cost[j]))
  const dualTol = DUAL_TOL * costScale
  // Dual residual: c_j − Σ_i A_ij y_i − d_j = 0, relative to the terms involved.
  for (let j = 0; j < n; j++) {
    let s = cost[j] - d[j]
    let mag = Math.abs(cost[j]) + Math.abs(d[j])
    for (let i = 0; i < m; i++) {
      const t = lp.rows[i].coefs[j] * y[i]
      s -= t
      mag += Math.abs(t)
    }
    if (Math.abs(s) > DUAL_TOL * Math.max(1, mag)) return fail('dual-residual', `column ${lp.colNames[j]}: c − Aᵀy − d = ${s}`)
  }
  // Dual signs, and each dual's contribution to the dual bound (at the bound it prices, or at the activity when it is ~0).
  let dualBound = 0
  let scale = Math.abs(objective)
  const activity = new Array<number>(m)
  for (let i = 0; i < m; i++) {
    const r = lp.rows[i]
    let act = 0
    for (let j = 0; j < n; j++) act += r.coefs[j] * x[j]
    activity[i] = act
    const v = y[i]
    const bound = v > 0 ? r.lower : v < 0 ? r.upper : 0
    if (v !== 0 && !Number.isFinite(bound)) {
      if (Math.abs(v) > dualTol) return fail('dual-infeasible', `row ${r.name}: dual ${v} prices a bound it does not have`)
      dualBound += v * act
    } else dualBound += v * bound
    scale += Math.abs(v * act)
  }
  for (let j = 0; j < n; j++) {
    const v = d[j]
    const bound = v > 0 ? lp.colLower[j] : v < 0 ? lp.colUpper[j] : 0
    if (v !== 0 && !Number.isFinite(bound)) {
      if (Math.abs(v) > dualTol) return fail('dual-infeasible', `column ${lp.colNames[j]}: reduced cost ${v} prices a bound it does not have`)
      dualBound += v * x[j]
    } else dualBound += v * bound
    scale += Math.abs(v * x[j])
  }
  const gapTol = GAP_TOL * Math.max(1, scale)
  // Complementary slackness, term by term: y_i·(activity − priced bound) and d_j·(x_j − priced bound) are each ≥ 0 and ~0.
  for (let i = 0; i < m; i++) {
    const v = y[i]
    if (v === 0) continue
    const b = v > 0 ? lp.rows[i].lower : lp.rows[i].upper
    if (!Number.isFinite(b)) continue
    const term = v * (activity[i] - b)
    if (term > gapTol) return fail('complementary-slackness', `row ${lp.rows[i].name}: dual ${v} on a bound that does not hold (slack ${activity[i] - b})`)
  }
  for (let j = 0; j < n; j++) {
    const v = d[j]
    if (v === 0) continue
    const b = v > 0 ? lp.colLower[j] : lp.colUpper[j]
    if (!Number.isFinite(b)) continue
    const term = v * (x[j] - b)
    if (term > gapTol) return fail('complementary-slackness', `column ${lp.colNames[j]}: reduced cost ${v} on a bound that does not hold (slack ${x[j] - b})`)
  }
  const gap = objective - dualBound
  // A negative gap is round-off of a point feasible within tolerance (checked above); only a positive one means above the optimum.
  if (gap > gapTol) return fail('duality-gap', `c·x − dual bound = ${gap}`, gap)
  return { ok: true, gap, objective }
}

/**
 * Certifies that the LP has no feasible answer, by Farkas's lemma (Chvátal, Linear Programming, 1983, ch. 9 — from memory): for
 * row multipliers y, every feasible x has yᵀ(Ax) = yᵀs with s within the row bounds; if the range of zᵀx (z = Aᵀy) over the
 * column bounds and the range of yᵀs over the row bounds do not meet, by more than 1e-9 of their scale, nothing is feasible.
 */
export function certifyInfeasible(lp: LinearProgram, ray: readonly number[]): boolean {
  const n = lp.colNames.length
  const m = lp.rows.length
  if (ray.length !== m || ray.some((v) => !Number.isFinite(v))) return false
  // Entries at round-off level of the largest are dropped: any y is a valid multiplier, so the cleaned one is checked as it is.
  const big = ray.reduce((a, v) => Math.max(a, Math.abs(v)), 0)
  const y = ray.map((v) => (Math.abs(v) <= 1e-12 * big ? 0 : v))
  let zLo = 0
  let zHi = 0
  let sLo = 0
  let sHi = 0
  let scale = 0
  for (let j = 0; j < n; j++) {
    let z = 0
    let mag = 0
    for (let i = 0; i < m; i++) {
      const t = lp.rows[i].coefs[j] * y[i]
      z += t
      mag += Math.abs(t)
    }
    // Round-off of the sum itself is no evidence: a z_j within it of zero counts as zero.
    if (Math.abs(z) <= 1e-12 * mag) z = 0
    if (z === 0) continue
    const lo = lp.colLower[j]
    const hi = lp.colUpper[j]
    zLo += z > 0 ? z * lo : z * hi
    zHi += z > 0 ? z * hi : z * lo
    scale += Math.abs(z) * Math.max(Number.isFinite(lo) ? Math.abs(lo) : 0, Number.isFinite(hi) ? Math.abs(hi) : 0)
  }
  for (let i = 0; i < m; i++) {
    const v = y[i]
    if (v === 0) continue
    const { lower, upper } = lp.rows[i]
    sLo += v > 0 ? v * lower : v * upper
    sHi += v > 0 ? v * upper : v * lower
    scale += Math.abs(v) * Math.max(Number.isFinite(lower) ? Math.abs(lower) : 0, Number.isFinite(upper) ? Math.abs(upper) : 0)
  }
  const tol = 1e-9 * Math.max(1, scale)
  // NaN (∞ − ∞) compares false, so an undecidable sum never certifies.
  return zHi < sLo - tol || sHi < zLo - tol
}
