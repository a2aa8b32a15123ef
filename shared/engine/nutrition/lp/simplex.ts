// A small dense bounded-variable simplex (primal and dual) that returns its basis; it runs in the calling thread and always stops.
import type { LinearProgram } from './program'

/**
 * Status of a variable in a basis, as in HiGHS's basis statuses: at its lower bound, basic, at its upper bound, or nonbasic at
 * zero (a free variable). A fixed variable (lower = upper) that is nonbasic is `lower`.
 */
export const LOWER = 0
export const BASIC = 1
export const UPPER = 2
export const ZERO = 3
export type VarStatus = typeof LOWER | typeof BASIC | typeof UPPER | typeof ZERO

/** Which column and which row activity is basic, and at which bound each nonbasic one sits. */
export interface LpBasis {
  colStatus: VarStatus[]
  rowStatus: VarStatus[]
}

export type SimplexStatus = 'optimal' | 'infeasible' | 'unbounded' | 'iteration-limit' | 'singular'

export interface SimplexResult {
  status: SimplexStatus
  basis: LpBasis
  iterations: number
  /** When infeasible: row multipliers y whose combination yᵀ(Ax − s) = 0 cannot hold within the bounds (a Farkas ray). */
  ray?: number[]
}

export interface SimplexOptions {
  /** Pivot budget; past it the solve stops with `iteration-limit`. Default 40·(rows + columns) + 200. */
  maxIterations?: number
  /** A starting basis (e.g. the parent's in a branch and bound); ignored when it does not fit or is singular. */
  basis?: LpBasis
  /**
   * Work in the one module-level set of arrays instead of allocating (less garbage per solve). Only for a solve whose every
   * call finishes before another solver is made, as in `solveLp`; two such solvers alive at once would overwrite each other.
   */
  scratch?: boolean
}

/** Primal feasibility tolerance (relative to max(1, |bound|)), dual feasibility tolerance and the smallest acceptable pivot. */
const TOL_P = 1e-9
const TOL_D = 1e-9
const TOL_PIV = 1e-9
/** Degenerate pivots in a row before the rule turns to Bland's smallest-index rule, which cannot cycle. */
const DEGENERATE_RUN = 30

/**
 * The working state: T = B⁻¹[A −I] (m × (n+m), dense, row-major) for the basis B, the value of every variable, the reduced
 * costs d = c − c_Bᵀ T. Variables 0..n−1 are the columns, n+i is the activity s_i = A_i x of row i, so A x − s = 0 always holds,
 * and a basic variable in tableau row r equals −Σ_{j nonbasic} T_rj x_j.
 */
/** An array of `n` doubles, all 0, stored unboxed (filled with a non-integer first so it starts out as a double array). */
function doubles(n: number): number[] {
  return new Array<number>(n).fill(0.5).fill(0)
}

/** The arrays a tableau works in, at least m·w and w (and m) long; plain arrays, as allocating typed ones costs more than a solve. */
class Workspace {
  T: number[] = []
  lo: number[] = []
  up: number[] = []
  cost: number[] = []
  d: number[] = []
  x: number[] = []
  status: number[] = []
  head: number[] = []

  fit(m: number, w: number): this {
    if (this.T.length < m * w) this.T = doubles(m * w)
    if (this.lo.length < w) {
      this.lo = doubles(w)
      this.up = doubles(w)
      this.cost = doubles(w)
      this.d = doubles(w)
      this.x = doubles(w)
      this.status = new Array<number>(w).fill(0)
    }
    if (this.head.length < m) this.head = new Array<number>(m).fill(0)
    return this
  }
}
const scratch = new Workspace()

class Tableau {
  readonly n: number
  readonly m: number
  readonly w: number
  readonly T: number[]
  readonly lo: number[]
  readonly up: number[]
  readonly cost: number[]
  readonly d: number[]
  readonly x: number[]
  readonly status: number[]
  readonly head: number[]
  iterations = 0
  maxIterations: number

  constructor(lp: LinearProgram, maxIterations: number | undefined, useScratch: boolean) {
    const n = lp.colNames.length
    const m = lp.rows.length
    const w = n + m
    this.n = n
    this.m = m
    this.w = w
    this.maxIterations = maxIterations ?? 40 * w + 200
    // The arrays may be longer than needed (reused): every loop below and after runs to m, w or m·w, never to a length.
    const ws = useScratch ? scratch.fit(m, w) : new Workspace().fit(m, w)
    this.T = ws.T
    this.lo = ws.lo
    this.up = ws.up
    this.cost = ws.cost
    this.d = ws.d
    this.x = ws.x
    this.status = ws.status
    this.head = ws.head
    for (let j = 0; j < n; j++) {
      this.lo[j] = lp.colLower[j]
      this.up[j] = lp.colUpper[j]
    }
    for (let i = 0; i < m; i++) {
      const r = lp.rows[i]
      this.lo[n + i] = r.lower
      this.up[n + i] = r.upper
      const coefs = r.coefs
      const base = i * w
      for (let j = 0; j < n; j++) this.T[base + j] = -coefs[j]
      for (let j = n; j < w; j++) this.T[base + j] = 0
      this.T[base + n + i] = 1
      this.head[i] = n + i
      this.status[n + i] = BASIC
    }
    for (let j = 0; j < n; j++) this.status[j] = this.restingStatus(j)
  }

  /** The bound a nonbasic variable rests at by default: its lower bound, else its upper bound, else zero. */
  restingStatus(j: number): VarStatus {
    return Number.isFinite(this.lo[j]) ? LOWER : Number.isFinite(this.up[j]) ? UPPER : ZERO
  }

  nonbasicValue(j: number): number {
    const s = this.status[j]
    return s === LOWER ? this.lo[j] : s === UPPER ? this.up[j] : 0
  }

  /** Values of the nonbasic variables from their statuses, of the basic ones from the tableau. */
  computeValues(): void {
    const { T, w, m, x, status } = this
    for (let j = 0; j < w; j++) x[j] = status[j] === BASIC ? 0 : this.nonbasicValue(j)
    for (let r = 0; r < m; r++) {
      const base = r * w
      let v = 0
      for (let j = 0; j < w; j++) if (status[j] !== BASIC && x[j] !== 0) v -= T[base + j] * x[j]
      x[this.head[r]] = v
    }
  }

  setCost(c: readonly number[]): void {
    const { cost, d, T, w, m, n, head } = this
    for (let j = 0; j < w; j++) cost[j] = j < n ? c[j] : 0
    for (let j = 0; j < w; j++) d[j] = cost[j]
    for (let r = 0; r < m; r++) {
      const cb = cost[head[r]]
      if (cb === 0) continue
      const base = r * w
      for (let j = 0; j < w; j++) d[j] -= cb * T[base + j]
    }
    for (let r = 0; r < m; r++) d[head[r]] = 0
  }

  pivot(r: number, q: number): void {
    const { T, w, m, d } = this
    const base = r * w
    const inv = 1 / T[base + q]
    for (let j = 0; j < w; j++) T[base + j] *= inv
    T[base + q] = 1
    for (let i = 0; i < m; i++) {
      if (i === r) continue
      const bi = i * w
      const f = T[bi + q]
      if (f === 0) continue
      for (let j = 0; j < w; j++) T[bi + j] -= f * T[base + j]
      T[bi + q] = 0
    }
    const f = d[q]
    if (f !== 0) {
      for (let j = 0; j < w; j++) d[j] -= f * T[base + j]
      d[q] = 0
    }
    const leaving = this.head[r]
    this.head[r] = q
    this.status[q] = BASIC
    // The caller sets the leaving variable's status (the bound it left at).
    this.status[leaving] = LOWER
  }

  /** Moves nonbasic q by `delta`, updating every basic value (a basic variable moves by −T_rq·delta). */
  shift(q: number, delta: number): void {
    if (delta === 0) return
    const { T, w, m, x, head } = this
    x[q] += delta
    for (let r = 0; r < m; r++) {
      const a = T[r * w + q]
      if (a !== 0) x[head[r]] -= a * delta
    }
  }

  ptol(bound: number): number {
    return TOL_P * Math.max(1, Math.abs(bound))
  }

  primalFeasible(): boolean {
    const { m, head, x, lo, up } = this
    for (let r = 0; r < m; r++) {
      const j = head[r]
      if (x[j] < lo[j] - this.ptol(lo[j]) || x[j] > up[j] + this.ptol(up[j])) return false
    }
    return true
  }

  /** Puts each nonbasic variable whose reduced cost has the wrong sign at its other bound, or shifts its cost to zero. */
  makeDualFeasible(): boolean {
    const { w, d, status, lo, up } = this
    let shifted = false
    for (let j = 0; j < w; j++) {
      const s = status[j]
      if (s === BASIC || lo[j] === up[j]) continue
      const dj = d[j]
      if (s === LOWER && dj < -TOL_D) {
        if (Number.isFinite(up[j])) {
          status[j] = UPPER
          this.shift(j, up[j] - lo[j])
        } else {
          d[j] = 0
          shifted = true
        }
      } else if (s === UPPER && dj > TOL_D) {
        if (Number.isFinite(lo[j])) {
          status[j] = LOWER
          this.shift(j, lo[j] - up[j])
        } else {
          d[j] = 0
          shifted = true
        }
      } else if (s === ZERO && Math.abs(dj) > TOL_D) {
        d[j] = 0
        shifted = true
      }
    }
    return shifted
  }

  /**
   * Dual simplex from a dual-feasible basis: the most infeasible basic variable leaves (Bland: the lowest index), the entering one
   * keeps every reduced cost's sign (Harris's two-pass ratio test, largest pivot among near-ties). Returns 'optimal' at a
   * primal-feasible basis, or the row of an infeasible variable that no entering variable can repair (the LP is infeasible).
   */
  dual(): SimplexStatus | { infeasibleRow: number } {
    const { T, w, m, x, lo, up, d, status, head } = this
    let bland = false
    let degenerate = 0
    for (;;) {
      let r = -1
      let best = 0
      for (let i = 0; i < m; i++) {
        const j = head[i]
        const below = lo[j] - x[j]
        const above = x[j] - up[j]
        const inf = below > this.ptol(lo[j]) ? below : above > this.ptol(up[j]) ? above : 0
        if (inf <= 0) continue
        if (bland ? r < 0 || j < head[r] : inf > best) {
          best = inf
          r = i
        }
      }
      if (r < 0) return 'optimal'
      if (this.iterations >= this.maxIterations) return 'iteration-limit'
      const leaving = head[r]
      const increase = x[leaving] < lo[leaving]
      const target = increase ? lo[leaving] : up[leaving]
      const base = r * w
      // Entering candidates: moving x_j in its allowed direction moves x_leaving (by −T_rj·Δ) towards its bound.
      let bound = Infinity
      for (let j = 0; j < w; j++) {
        const s = status[j]
        if (s === BASIC || lo[j] === up[j]) continue
        const a = T[base + j]
        if (Math.abs(a) < TOL_PIV || !this.dualEligible(s, a, increase)) continue
        const ratio = (Math.abs(d[j]) + TOL_D) / Math.abs(a)
        if (ratio < bound) bound = ratio
      }
      if (bound === Infinity) return { infeasibleRow: r }
      let q = -1
      let qa = 0
      for (let j = 0; j < w; j++) {
        const s = status[j]
        if (s === BASIC || lo[j] === up[j]) continue
        const a = T[base + j]
        if (Math.abs(a) < TOL_PIV || !this.dualEligible(s, a, increase)) continue
        if (Math.abs(d[j]) / Math.abs(a) > bound) continue
        if (bland ? q < 0 || (Math.abs(d[j]) / Math.abs(a) < Math.abs(d[q]) / Math.abs(qa) - 1e-15) : Math.abs(a) > Math.abs(qa)) {
          q = j
          qa = a
        }
      }
      if (q < 0) return { infeasibleRow: r }
      if (Math.abs(d[q]) <= TOL_D) {
        if (++degenerate > DEGENERATE_RUN) bland = true
      } else degenerate = 0
      this.iterations++
      const delta = (x[leaving] - target) / qa
      this.shift(q, delta)
      x[leaving] = target
      this.pivot(r, q)
      status[leaving] = increase ? LOWER : UPPER
      if (lo[leaving] === up[leaving]) status[leaving] = LOWER
    }
  }

  private dualEligible(s: number, a: number, increase: boolean): boolean {
    // x_leaving changes by −a·Δ: to increase it, Δ > 0 needs a < 0 (from lower), Δ < 0 needs a > 0 (from upper).
    if (s === ZERO) return true
    const up = s === LOWER ? a < 0 : a > 0
    return increase ? up : !up
  }

  /**
   * Primal simplex from a primal-feasible basis: Dantzig's largest reduced cost enters (Bland: the lowest index), Harris's
   * two-pass ratio test picks the leaving variable, and a variable may simply flip to its other bound.
   */
  primal(): SimplexStatus {
    const { T, w, m, x, lo, up, d, status, head } = this
    let bland = false
    let degenerate = 0
    for (;;) {
      let q = -1
      let best = 0
      for (let j = 0; j < w; j++) {
        const s = status[j]
        if (s === BASIC || lo[j] === up[j]) continue
        const dj = d[j]
        const gain = s === LOWER ? -dj : s === UPPER ? dj : Math.abs(dj)
        if (gain <= TOL_D) continue
        if (bland ? q < 0 : gain > best) {
          best = gain
          q = j
        }
      }
      if (q < 0) return 'optimal'
      if (this.iterations >= this.maxIterations) return 'iteration-limit'
      // Direction of the entering variable: up from its lower bound, down from its upper, against the reduced cost when free.
      const dir = status[q] === LOWER ? 1 : status[q] === UPPER ? -1 : d[q] < 0 ? 1 : -1
      // Basic i moves by −α_i·t with α_i = T_iq·dir, t ≥ 0.
      let bound = up[q] - lo[q]
      for (let i = 0; i < m; i++) {
        const a = T[i * w + q] * dir
        if (Math.abs(a) < TOL_PIV) continue
        const j = head[i]
        const room = a > 0 ? x[j] - lo[j] + this.ptol(lo[j]) : up[j] - x[j] + this.ptol(up[j])
        const ratio = room / Math.abs(a)
        if (ratio < bound) bound = ratio
      }
      if (bound === Infinity) return 'unbounded'
      let r = -1
      let ra = 0
      let step = Infinity
      for (let i = 0; i < m; i++) {
        const a = T[i * w + q] * dir
        if (Math.abs(a) < TOL_PIV) continue
        const j = head[i]
        const room = a > 0 ? x[j] - lo[j] : up[j] - x[j]
        const ratio = Math.max(0, room) / Math.abs(a)
        if (ratio > bound) continue
        const better = bland ? r < 0 || ratio < step - 1e-15 || (ratio <= step + 1e-15 && j < head[r]) : Math.abs(a) > Math.abs(ra)
        if (better) {
          r = i
          ra = a
          step = ratio
        }
      }
      this.iterations++
      if (up[q] - lo[q] <= step) {
        // Bound flip: the entering variable reaches its other bound before any basic variable blocks it.
        this.shift(q, dir * (up[q] - lo[q]))
        status[q] = status[q] === LOWER ? UPPER : LOWER
        degenerate = 0
        continue
      }
      if (r < 0) return 'unbounded'
      if (step <= 1e-12) {
        if (++degenerate > DEGENERATE_RUN) bland = true
      } else degenerate = 0
      const leaving = head[r]
      const toLower = ra > 0
      this.shift(q, dir * step)
      x[leaving] = toLower ? lo[leaving] : up[leaving]
      this.pivot(r, q)
      status[leaving] = toLower || lo[leaving] === up[leaving] ? LOWER : UPPER
    }
  }

  /** Row r of B⁻¹ (the multipliers of a Farkas ray when row r proved the LP infeasible): the logical columns of T, negated. */
  inverseRow(r: number): number[] {
    const { T, w, n, m } = this
    const y = new Array<number>(m)
    for (let i = 0; i < m; i++) y[i] = -T[r * w + n + i]
    return y
  }

  /** Replaces the slack basis by `basis`, pivoting each basic column in; false when it does not fit or is singular. */
  install(basis: LpBasis): boolean {
    const { n, m, w, T, status, head } = this
    if (basis.colStatus.length !== n || basis.rowStatus.length !== m) return false
    let basic = 0
    for (const s of basis.colStatus) if (s === BASIC) basic++
    for (const s of basis.rowStatus) if (s === BASIC) basic++
    if (basic !== m) return false
    for (let j = 0; j < n; j++) {
      if (basis.colStatus[j] !== BASIC) continue
      // Pivot column j in at a row whose logical is to leave, choosing the largest pivot.
      let r = -1
      let best = TOL_PIV
      for (let i = 0; i < m; i++) {
        const h = head[i]
        if (h < n || basis.rowStatus[h - n] === BASIC) continue
        const a = Math.abs(T[i * w + j])
        if (a > best) {
          best = a
          r = i
        }
      }
      if (r < 0) return false
      const leaving = head[r]
      this.pivot(r, j)
      status[leaving] = LOWER
    }
    for (let j = 0; j < w; j++) {
      if (status[j] === BASIC) continue
      const want = j < n ? basis.colStatus[j] : basis.rowStatus[j - n]
      status[j] = this.fits(j, want) ? want : this.restingStatus(j)
    }
    return true
  }

  private fits(j: number, s: VarStatus): boolean {
    if (s === LOWER) return Number.isFinite(this.lo[j])
    if (s === UPPER) return Number.isFinite(this.up[j])
    return s === ZERO
  }

  basis(): LpBasis {
    const { n, m, status } = this
    const colStatus = new Array<VarStatus>(n)
    const rowStatus = new Array<VarStatus>(m)
    for (let j = 0; j < n; j++) colStatus[j] = status[j] as VarStatus
    for (let i = 0; i < m; i++) rowStatus[i] = status[n + i] as VarStatus
    return { colStatus, rowStatus }
  }

  /**
   * Fixes every nonbasic variable whose reduced cost is not zero at its current value: what is left is the face of optimal
   * answers (complementary slackness), over which a second objective can then be minimised without moving the first.
   */
  fixOptimalFace(): void {
    const { w, d, status, lo, up, x } = this
    for (let j = 0; j < w; j++) {
      if (status[j] === BASIC || Math.abs(d[j]) <= TOL_D) continue
      lo[j] = up[j] = x[j]
      status[j] = LOWER
    }
  }

  /** Runs to optimality from the current basis: primal simplex if it is feasible, else dual simplex (shifting costs if need be). */
  run(c: readonly number[]): SimplexStatus | { infeasibleRow: number } {
    this.setCost(c)
    this.computeValues()
    if (!this.primalFeasible()) {
      const shifted = this.makeDualFeasible()
      const r = this.dual()
      if (r !== 'optimal') return r
      // Back to the true costs (when shifted); a primal pass then removes any dual infeasibility left (none, usually).
      if (shifted) this.setCost(c)
    }
    return this.primal()
  }
}

function result(t: Tableau, s: SimplexStatus | { infeasibleRow: number }): SimplexResult {
  if (typeof s === 'object') return { status: 'infeasible', basis: t.basis(), iterations: t.iterations, ray: t.inverseRow(s.infeasibleRow) }
  return { status: s, basis: t.basis(), iterations: t.iterations }
}

/**
 * Minimises a linear objective over an LP with the bounded-variable simplex method (Dantzig; the bounded and dual forms as in
 * Chvátal, Linear Programming, Freeman 1983, ch. 8 and 10 — from memory), Harris's two-pass ratio test (Harris, Math.
 * Programming 5:1–28, 1973 — from memory) and Bland's smallest-index rule after a run of degenerate pivots (Bland, Math. Oper.
 * Res. 2:103–107, 1977 — from memory), under a pivot budget, so it always returns. Dense: for LPs of tens of rows and columns,
 * like a ration. Its answer is a basis; `basisSolution` and `certifyLp` (certificate.ts) turn it into values and duals computed
 * afresh from the LP and check them.
 */
export class DenseSimplex {
  private t: Tableau
  private readonly lp: LinearProgram

  constructor(lp: LinearProgram, options: SimplexOptions = {}) {
    this.lp = lp
    const useScratch = options.scratch === true
    this.t = new Tableau(lp, options.maxIterations, useScratch)
    if (options.basis && !this.t.install(options.basis)) this.t = new Tableau(lp, options.maxIterations, useScratch)
  }

  /** Minimises cost·x from the current basis (the slack basis, or the one given). */
  minimise(cost: readonly number[] = this.lp.cost): SimplexResult {
    return result(this.t, this.t.run(cost))
  }

  /**
   * After an optimal `minimise`: minimises `secondary` over the face of answers optimal for the first objective (every nonbasic
   * variable with a nonzero reduced cost held where it is), continuing from the optimal basis with primal simplex. Returns
   * the result and that face as an LP (the first LP with those bounds pinned), which its certificate is checked against.
   */
  minimiseOnOptimalFace(secondary: readonly number[]): { result: SimplexResult; faceLp: LinearProgram } {
    const t = this.t
    t.fixOptimalFace()
    const faceLp = faceOf(this.lp, t)
    t.setCost(secondary)
    return { result: result(t, t.primal()), faceLp }
  }
}

/** One solve: `new DenseSimplex(lp, options).minimise(cost)`. */
export function simplex(lp: LinearProgram, cost: readonly number[] = lp.cost, options: SimplexOptions = {}): SimplexResult {
  return new DenseSimplex(lp, options).minimise(cost)
}

/** The LP restricted to the optimal face the tableau fixed (bounds of the fixed variables pinned), for certifying stage two. */
function faceOf(lp: LinearProgram, t: Tableau): LinearProgram {
  const n = t.n
  return {
    ...lp,
    colLower: Array.from({ length: n }, (_, j) => t.lo[j]),
    colUpper: Array.from({ length: n }, (_, j) => t.up[j]),
    rows: lp.rows.map((r, i) => (t.lo[n + i] === r.lower && t.up[n + i] === r.upper ? r : { ...r, lower: t.lo[n + i], upper: t.up[n + i] })),
  }
}
