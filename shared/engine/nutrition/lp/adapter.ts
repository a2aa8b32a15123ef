// The one place the HiGHS library (the `highs` package, WebAssembly) is imported: the fallback and cross-check of the engine's simplex.
import highsLoader from 'highs'
import type { Highs } from 'highs'
import { dot, lexicographicTolerance, secondaryAttained, type LinearProgram, type LpOutcome } from './program'

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
