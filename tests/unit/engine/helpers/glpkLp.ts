// GLPK (glpk.js 5.0.0, simplex without presolve) on the engine's own LinearProgram, for its row duals: an independent dual solver.
import type GLPK from 'glpk.js/node'
import type { LinearProgram } from '../../../../shared/engine/index'

type Glpk = Awaited<ReturnType<typeof GLPK>>

/** Row duals of the LP's optimum by GLPK, in row order (GLPK's sign: ∂objective/∂bound, as HiGHS's for minimisation). */
export function glpkRowDuals(g: Glpk, lp: LinearProgram): number[] {
  const bnd = (lo: number, hi: number) => {
    if (Number.isFinite(lo) && Number.isFinite(hi)) return lo === hi ? { type: g.GLP_FX, lb: lo, ub: hi } : { type: g.GLP_DB, lb: lo, ub: hi }
    if (Number.isFinite(lo)) return { type: g.GLP_LO, lb: lo, ub: 0 }
    if (Number.isFinite(hi)) return { type: g.GLP_UP, lb: 0, ub: hi }
    return { type: g.GLP_FR, lb: 0, ub: 0 }
  }
  const name = (i: number) => `r${i}`
  const res = g.solve(
    {
      name: 'lp',
      objective: { direction: g.GLP_MIN, name: 'obj', vars: lp.colNames.map((_, j) => ({ name: `c${j}`, coef: lp.cost[j] })) },
      subjectTo: lp.rows.map((r, i) => ({ name: name(i), vars: r.coefs.flatMap((coef, j) => (coef ? [{ name: `c${j}`, coef }] : [])), bnds: bnd(r.lower, r.upper) })),
      bounds: lp.colNames.map((_, j) => ({ name: `c${j}`, ...bnd(lp.colLower[j], lp.colUpper[j]) })),
    },
    { msglev: g.GLP_MSG_OFF, presol: false },
  )
  if (res.result.status !== g.GLP_OPT || !res.result.dual) throw new Error(`GLPK status ${res.result.status}`)
  const dual = res.result.dual
  return lp.rows.map((_, i) => dual[name(i)] ?? 0)
}
