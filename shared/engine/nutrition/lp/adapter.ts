// The one place the LP libraries are imported: javascript-lp-solver (fast, unbounded in time) and HiGHS (reliable, gives duals).
import jsLpSolver from 'javascript-lp-solver'
import highsLoader from 'highs'
import type { Highs } from 'highs'
import { dot, lexicographicTolerance, secondaryAttained, type LinearProgram, type LpOutcome } from './program'

type JsModel = Parameters<typeof jsLpSolver.Solve>[0]
type JsResult = { feasible: boolean; result: number; bounded?: boolean; [k: string]: number | boolean | undefined }

// Names reused across solves, so building a model allocates no strings (up to 256 columns and rows, far beyond a ration).
const KEYS = Array.from({ length: 256 }, (_, i) => ({ c: `c${i}`, r: `r${i}`, u: `u${i}`, l: `l${i}` }))
const key = (i: number) => KEYS[i] ?? { c: `c${i}`, r: `r${i}`, u: `u${i}`, l: `l${i}` }

function toJsModel(lp: LinearProgram, objective: readonly number[], extraRow?: { coefs: readonly number[]; upper: number }): JsModel {
  const constraints: Record<string, { min?: number; max?: number }> = {}
  const variables: Record<string, Record<string, number>> = {}
  const n = lp.colNames.length
  const vars: Record<string, number>[] = []
  for (let j = 0; j < n; j++) variables[key(j).c] = vars[j] = { _obj: objective[j] }
  for (let i = 0; i < lp.rows.length; i++) {
    const r = lp.rows[i]
    const k = key(i).r
    const c: { min?: number; max?: number } = {}
    if (Number.isFinite(r.lower)) c.min = r.lower
    if (Number.isFinite(r.upper)) c.max = r.upper
    constraints[k] = c
    for (let j = 0; j < n; j++) if (r.coefs[j] !== 0) vars[j][k] = r.coefs[j]
  }
  for (let j = 0; j < n; j++) {
    if (Number.isFinite(lp.colUpper[j])) {
      constraints[key(j).u] = { max: lp.colUpper[j] }
      vars[j][key(j).u] = 1
    }
    if (lp.colLower[j] > 0) {
      constraints[key(j).l] = { min: lp.colLower[j] }
      vars[j][key(j).l] = 1
    }
  }
  if (extraRow) {
    constraints.lex = { max: extraRow.upper }
    for (let j = 0; j < n; j++) if (extraRow.coefs[j] !== 0) vars[j].lex = extraRow.coefs[j]
  }
  return { optimize: '_obj', opType: 'min', constraints, variables } as JsModel
}

function jsSolveOnce(lp: LinearProgram, objective: readonly number[], extraRow?: { coefs: readonly number[]; upper: number }): LpOutcome {
  const r = jsLpSolver.Solve(toJsModel(lp, objective, extraRow)) as JsResult
  if (!r.feasible) return { status: 'infeasible' }
  if (r.bounded === false) return { status: 'unbounded' }
  const x = lp.colNames.map((_, j) => {
    const v = r[key(j).c]
    return typeof v === 'number' ? v : 0
  })
  return { status: 'optimal', x, objective: dot(objective, x) }
}

/**
 * Solves with javascript-lp-solver 1.0.3, lexicographically when `secondary` is set. It can run forever on some feasible
 * models and call some feasible ones infeasible, so it must only run where the caller can stop it and check its answer.
 */
export function solveWithJsLp(lp: LinearProgram): LpOutcome {
  try {
    const first = jsSolveOnce(lp, lp.cost)
    if (first.status !== 'optimal' || !lp.secondary || secondaryAttained(lp, first.x)) return first
    const second = jsSolveOnce(lp, lp.secondary, { coefs: lp.cost, upper: first.objective + lexicographicTolerance(first.objective) })
    if (second.status !== 'optimal') return first
    return { status: 'optimal', x: second.x, objective: dot(lp.cost, second.x) }
  } catch (e) {
    return { status: 'error', message: e instanceof Error ? e.message : String(e) }
  }
}

/** The worker's task: several LPs in one round trip. */
export function solveJobsWithJsLp(jobs: readonly LinearProgram[]): LpOutcome[] {
  const out: LpOutcome[] = []
  for (let k = 0; k < jobs.length; k++) {
    const skip = jobs[k].skipIfPreviousZero
    const prev = k > 0 ? out[k - 1] : undefined
    if (skip && prev?.status === 'optimal' && skip.every((j) => prev.x[j] <= 1e-8)) out.push({ status: 'skipped' })
    else out.push(solveWithJsLp(jobs[k]))
  }
  return out
}

type HighsInit = Parameters<typeof highsLoader>[0]
let highsOptions: HighsInit | undefined
let highsPromise: Promise<Highs> | undefined
let highs: Highs | undefined

/** Where the browser finds highs.wasm; call before the first solve. */
export function configureHighs(options: HighsInit): void {
  highsOptions = options
}
/** Loads the HiGHS WebAssembly module once (50–70 ms the first time). */
export function loadHighs(): Promise<Highs> {
  highsPromise ??= highsLoader(highsOptions).then((h) => (highs = h))
  return highsPromise
}
export function highsReady(): boolean {
  return highs !== undefined
}

function toModelData(h: Highs, lp: LinearProgram, objective: readonly number[], extraRow?: { coefs: readonly number[]; upper: number }) {
  const rows = extraRow ? [...lp.rows, { name: 'lex', coefs: [...extraRow.coefs], lower: -Infinity, upper: extraRow.upper }] : lp.rows
  const n = lp.colNames.length
  const starts = new Int32Array(n + 1)
  const indices: number[] = []
  const values: number[] = []
  for (let j = 0; j < n; j++) {
    starts[j] = indices.length
    for (let i = 0; i < rows.length; i++) {
      const v = rows[i].coefs[j]
      if (v !== 0) {
        indices.push(i)
        values.push(v)
      }
    }
  }
  starts[n] = indices.length
  const inf = h.infinity
  const clip = (v: number) => (v === Infinity ? inf : v === -Infinity ? -inf : v)
  return {
    numCols: n,
    numRows: rows.length,
    colCost: Float64Array.from(objective),
    colLower: Float64Array.from(lp.colLower, clip),
    colUpper: Float64Array.from(lp.colUpper, clip),
    rowLower: Float64Array.from(rows, (r) => clip(r.lower)),
    rowUpper: Float64Array.from(rows, (r) => clip(r.upper)),
    matrix: { format: 'csc' as const, numRows: rows.length, numCols: n, starts, indices: Int32Array.from(indices), values: Float64Array.from(values) },
  }
}

function highsSolveOnce(h: Highs, lp: LinearProgram, objective: readonly number[], extraRow?: { coefs: readonly number[]; upper: number }): LpOutcome {
  const model = h.createModel(toModelData(h, lp, objective, extraRow))
  try {
    model.options.set({ output_flag: false })
    model.run()
    const status = model.getModelStatus()
    const S = h.constants.modelStatus
    if (status === S.optimal) {
      const sol = model.getSolution()
      const x = Array.from(sol.colValue)
      return { status: 'optimal', x, objective: dot(objective, x), rowDual: Array.from(sol.rowDual).slice(0, lp.rows.length), colDual: Array.from(sol.colDual) }
    }
    if (status === S.infeasible) return { status: 'infeasible' }
    if (status === S.unbounded || status === S.unboundedOrInfeasible) return { status: 'unbounded' }
    return { status: 'error', message: `HiGHS model status ${status}` }
  } finally {
    model.dispose()
  }
}

/**
 * Solves with HiGHS (the `highs` package), lexicographically when `secondary` is set; the duals returned are those of the
 * first objective (the cost of one more unit of each row's bound). `loadHighs()` must have resolved first.
 */
export function solveWithHighs(lp: LinearProgram): LpOutcome {
  if (!highs) return { status: 'error', message: 'HiGHS is not loaded' }
  const h = highs
  try {
    const first = highsSolveOnce(h, lp, lp.cost)
    if (first.status !== 'optimal' || !lp.secondary || secondaryAttained(lp, first.x)) return first
    const second = highsSolveOnce(h, lp, lp.secondary, { coefs: lp.cost, upper: first.objective + lexicographicTolerance(first.objective) })
    if (second.status !== 'optimal') return first
    return { status: 'optimal', x: second.x, objective: dot(lp.cost, second.x), rowDual: first.rowDual, colDual: first.colDual }
  } catch (e) {
    return { status: 'error', message: e instanceof Error ? e.message : String(e) }
  }
}
