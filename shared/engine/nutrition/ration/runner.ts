// The injectable guard: a platform registers a runner that solves LPs off the calling thread and gives up after a time limit.
import type { LinearProgram, LpOutcome } from '../lp/program'

/**
 * Runs javascript-lp-solver (through `solveJobsWithJsLp` in the LP adapter) where it can be stopped: a worker thread on the
 * server, a Web Worker in the browser. `run` must settle within `timeoutMs` — rejecting on timeout and stopping the worker —
 * because shared code has no timers of its own.
 */
export interface LpRunner {
  readonly name: string
  /**
   * `background: true` asks the runner not to block the calling thread while it waits (a batch overlaps its own work with the
   * solve); otherwise a runner may wait synchronously for a short while, which is the fastest way to get a quick answer.
   */
  run(jobs: readonly LinearProgram[], timeoutMs: number, options?: { background?: boolean }): Promise<LpOutcome[]>
}

let current: LpRunner | null = null

/** Registers (or with null, removes) the runner used by `balanceRation`; with none, every solve goes straight to HiGHS. */
export function registerLpRunner(runner: LpRunner | null): void {
  current = runner
}
export function registeredLpRunner(): LpRunner | null {
  return current
}
