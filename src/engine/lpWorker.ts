// Web Worker of the browser's LP guard: runs javascript-lp-solver through the shared adapter, where the page can stop it.
import { solveJobsWithJsLp } from '@shared/engine/nutrition/lp/adapter'
import type { LinearProgram } from '@shared/engine/index'

self.onmessage = (e: MessageEvent<{ seq: number; jobs: LinearProgram[] }>) => {
  const { seq, jobs } = e.data
  try {
    self.postMessage({ seq, outcomes: solveJobsWithJsLp(jobs) })
  } catch (err) {
    self.postMessage({ seq, error: String(err) })
  }
}
