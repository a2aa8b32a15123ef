// The browser's LP guard: one Web Worker running javascript-lp-solver, a time limit per call, the worker replaced when stopped.
import highsWasmUrl from 'highs/runtime?url'
import { configureHighs, registerLpRunner, type LinearProgram, type LpOutcome, type LpRunner } from '@shared/engine/index'
import { decodeOutcomes, encodedJobsLength, encodeJobs } from '@shared/engine/nutrition/lp/wire'

/** LPs go to the worker, and answers come back, as flat doubles (lp/wire.ts) in a transferred buffer: nothing is cloned. */
type Answer = { seq: number; data?: Float64Array; error?: string }

let worker: Worker | null = null
let seq = 0
let queue: Promise<unknown> = Promise.resolve()

function spawn(): Worker {
  return new Worker(new URL('./lpWorker.ts', import.meta.url), { type: 'module' })
}

function runNow(jobs: readonly LinearProgram[], deadline: number): Promise<LpOutcome[]> {
  worker ??= spawn()
  const w = worker
  const id = ++seq
  return new Promise<LpOutcome[]>((resolve, reject) => {
    const timer = setTimeout(() => {
      // javascript-lp-solver can loop for ever; terminating is the only way to stop it. A fresh worker takes its place.
      w.removeEventListener('message', onMessage)
      w.terminate()
      if (worker === w) worker = spawn()
      reject(Object.assign(new Error('LP solve timed out'), { name: 'AbortError' }))
    }, Math.max(0, deadline - performance.now()))
    function onMessage(e: MessageEvent<Answer>) {
      if (e.data.seq !== id) return
      clearTimeout(timer)
      w.removeEventListener('message', onMessage)
      try {
        if (!e.data.data) throw new Error(e.data.error ?? 'LP worker error')
        const outcomes = decodeOutcomes(e.data.data)
        if (outcomes.length !== jobs.length) throw new Error('LP worker answered a different number of LPs')
        resolve(outcomes)
      } catch (err) {
        reject(err instanceof Error ? err : new Error(String(err)))
      }
    }
    w.addEventListener('message', onMessage)
    const data = new Float64Array(encodedJobsLength(jobs))
    encodeJobs(jobs, data)
    w.postMessage({ seq: id, data }, [data.buffer])
  })
}

const runner: LpRunner = {
  name: 'browser-web-worker',
  run(jobs, timeoutMs) {
    const deadline = performance.now() + timeoutMs
    // One request at a time per worker; time spent queued counts against the limit.
    const result = queue.then(() => runNow(jobs, deadline))
    queue = result.catch(() => undefined)
    return result
  },
}

/** Registers the Web Worker runner for every balanceRation on this page, and tells HiGHS where its WebAssembly file is served. */
export function registerBrowserLpRunner(): void {
  configureHighs({ locateFile: () => highsWasmUrl })
  registerLpRunner(runner)
}
