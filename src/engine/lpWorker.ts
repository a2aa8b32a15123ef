// Web Worker of the browser's LP guard: runs javascript-lp-solver through the shared adapter, where the page can stop it.
import { solveJobsWithJsLp } from '@shared/engine/nutrition/lp/adapter'
import { decodeJobs, encodedOutcomesLength, encodeOutcomes } from '@shared/engine/nutrition/lp/wire'

// Requests and answers are flat doubles (lp/wire.ts) in transferred buffers.
self.onmessage = (e: MessageEvent<{ seq: number; data: Float64Array }>) => {
  const { seq, data } = e.data
  try {
    const outcomes = solveJobsWithJsLp(decodeJobs(data))
    const out = new Float64Array(encodedOutcomesLength(outcomes))
    encodeOutcomes(outcomes, out)
    self.postMessage({ seq, data: out }, { transfer: [out.buffer] })
  } catch (err) {
    self.postMessage({ seq, error: String(err) })
  }
}
