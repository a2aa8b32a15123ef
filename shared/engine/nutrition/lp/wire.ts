// LPs and their answers as flat arrays of doubles, so a worker hand-over is a copy of numbers rather than a clone of objects.
import type { LinearProgram, LpOutcome } from './program'

/*
 * Request:  [nJobs, then per job: n, m, flags, secondaryFloor, secondaryBindingRow, nSkip, skip…, cost[n], colLower[n],
 *            colUpper[n], per row (lower, upper, coefs[n]), secondary[n] when flags & 1]
 * Answer:   [nJobs, then per job: status, objective, n, x[n]]  (status: see STATUS)
 * Column and row names do not travel: the solver needs only the numbers, and the caller keeps its own LP to check the answer.
 * ±Infinity and NaN are doubles like any other, so bounds travel unchanged.
 */

const HAS_SECONDARY = 1
const HAS_FLOOR = 2
const HAS_BINDING_ROW = 4

const STATUS = ['optimal', 'infeasible', 'unbounded', 'error', 'skipped'] as const
const STATUS_CODE: Record<LpOutcome['status'], number> = { optimal: 0, infeasible: 1, unbounded: 2, error: 3, skipped: 4 }

/** Doubles needed to encode `jobs`. */
export function encodedJobsLength(jobs: readonly LinearProgram[]): number {
  let len = 1
  for (const lp of jobs) {
    const n = lp.colNames.length
    len += 6 + (lp.skipIfPreviousZero?.length ?? 0) + 3 * n + lp.rows.length * (2 + n) + (lp.secondary ? n : 0)
  }
  return len
}

/** Writes `jobs` into `out` from index 0 (it must hold `encodedJobsLength(jobs)` doubles); returns the length written. */
export function encodeJobs(jobs: readonly LinearProgram[], out: Float64Array): number {
  let k = 0
  out[k++] = jobs.length
  for (const lp of jobs) {
    const n = lp.colNames.length
    const skip = lp.skipIfPreviousZero ?? []
    out[k++] = n
    out[k++] = lp.rows.length
    out[k++] = (lp.secondary ? HAS_SECONDARY : 0) | (lp.secondaryFloor !== undefined ? HAS_FLOOR : 0) | (lp.secondaryBindingRow !== undefined ? HAS_BINDING_ROW : 0)
    out[k++] = lp.secondaryFloor ?? 0
    out[k++] = lp.secondaryBindingRow ?? 0
    out[k++] = skip.length
    for (let i = 0; i < skip.length; i++) out[k++] = skip[i]
    for (let j = 0; j < n; j++) out[k++] = lp.cost[j]
    for (let j = 0; j < n; j++) out[k++] = lp.colLower[j]
    for (let j = 0; j < n; j++) out[k++] = lp.colUpper[j]
    for (const r of lp.rows) {
      out[k++] = r.lower
      out[k++] = r.upper
      for (let j = 0; j < n; j++) out[k++] = r.coefs[j]
    }
    if (lp.secondary) for (let j = 0; j < n; j++) out[k++] = lp.secondary[j]
  }
  return k
}

const slice = (a: Float64Array, from: number, n: number): number[] => {
  const xs = new Array<number>(n)
  for (let j = 0; j < n; j++) xs[j] = a[from + j]
  return xs
}

/** The LPs written by `encodeJobs` (names left empty). Throws on a malformed array. */
export function decodeJobs(a: Float64Array): LinearProgram[] {
  let k = 0
  const count = a[k++]
  if (!Number.isInteger(count) || count < 0) throw new Error('malformed LP request')
  const jobs: LinearProgram[] = []
  for (let q = 0; q < count; q++) {
    const n = a[k++]
    const m = a[k++]
    const flags = a[k++]
    const floor = a[k++]
    const bindingRow = a[k++]
    const nSkip = a[k++]
    if (!Number.isInteger(n) || !Number.isInteger(m) || !Number.isInteger(nSkip) || n < 0 || m < 0 || nSkip < 0) throw new Error('malformed LP request')
    const skip = nSkip > 0 ? slice(a, k, nSkip) : undefined
    k += nSkip
    const cost = slice(a, k, n)
    const colLower = slice(a, k + n, n)
    const colUpper = slice(a, k + 2 * n, n)
    k += 3 * n
    const rows: LinearProgram['rows'] = new Array(m)
    for (let i = 0; i < m; i++) {
      rows[i] = { name: '', lower: a[k], upper: a[k + 1], coefs: slice(a, k + 2, n) }
      k += 2 + n
    }
    const lp: LinearProgram = { colNames: new Array<string>(n).fill(''), cost, colLower, colUpper, rows }
    if (flags & HAS_SECONDARY) {
      lp.secondary = slice(a, k, n)
      k += n
    }
    if (flags & HAS_FLOOR) lp.secondaryFloor = floor
    if (flags & HAS_BINDING_ROW) lp.secondaryBindingRow = bindingRow
    if (skip) lp.skipIfPreviousZero = skip
    if (k > a.length) throw new Error('malformed LP request')
    jobs.push(lp)
  }
  return jobs
}

/** Doubles needed to encode `outcomes`; never more than the request that produced them. */
export function encodedOutcomesLength(outcomes: readonly LpOutcome[]): number {
  let len = 1
  for (const o of outcomes) len += 3 + (o.status === 'optimal' ? o.x.length : 0)
  return len
}

/** Writes `outcomes` into `out` from index 0; returns the length written. Error messages do not travel. */
export function encodeOutcomes(outcomes: readonly LpOutcome[], out: Float64Array): number {
  let k = 0
  out[k++] = outcomes.length
  for (const o of outcomes) {
    out[k++] = STATUS_CODE[o.status]
    if (o.status === 'optimal') {
      out[k++] = o.objective
      out[k++] = o.x.length
      for (let j = 0; j < o.x.length; j++) out[k++] = o.x[j]
    } else {
      out[k++] = 0
      out[k++] = 0
    }
  }
  return k
}

/** The outcomes written by `encodeOutcomes`. Throws on a malformed array. */
export function decodeOutcomes(a: Float64Array): LpOutcome[] {
  let k = 0
  const count = a[k++]
  if (!Number.isInteger(count) || count < 0) throw new Error('malformed LP answer')
  const out: LpOutcome[] = []
  for (let q = 0; q < count; q++) {
    const status = STATUS[a[k]]
    const objective = a[k + 1]
    const n = a[k + 2]
    k += 3
    if (status === undefined || !Number.isInteger(n) || n < 0 || k + n > a.length) throw new Error('malformed LP answer')
    if (status === 'optimal') {
      out.push({ status, objective, x: slice(a, k, n) })
      k += n
    } else if (status === 'error') out.push({ status, message: 'javascript-lp-solver failed in the worker' })
    else out.push({ status })
  }
  return out
}
