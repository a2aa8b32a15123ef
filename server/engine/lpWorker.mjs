// Worker thread of the server's LP guard: runs javascript-lp-solver through the shared adapter, where the server can stop it.
import { workerData, receiveMessageOnPort } from 'node:worker_threads'
import { register } from 'tsx/esm/api'

// The TypeScript loader is needed only to import the adapter; left registered, its port would slow every wake-up.
const unregister = register()
const { solveJobsWithJsLp } = await import('../../shared/engine/nutrition/lp/adapter.ts')
const { decodeJobs, encodeOutcomes } = await import('../../shared/engine/nutrition/lp/wire.ts')
await unregister()

const { port, sab } = workerData
const flag = new Int32Array(sab)
// flag[0]: last request number posted by the server; flag[1]: last request answered; flag[2]: 1 once ready;
// flag[3]: generation of the data buffer (a larger one arrives on the port when a request outgrows the current one);
// flag[4]: 1 when the last request failed in the worker (its answer is then not in the buffer).
// Requests and answers travel in the shared data buffer as flat doubles (lp/wire.ts); nothing is cloned.
let data = new Float64Array(workerData.data)
let generation = 0
Atomics.store(flag, 2, 1)
Atomics.notify(flag, 2)
let seen = 0
for (;;) {
  // Blocking here (rather than on the event loop) wakes the worker within microseconds of a request.
  Atomics.wait(flag, 0, seen)
  seen = Atomics.load(flag, 0)
  while (Atomics.load(flag, 3) !== generation) {
    const m = receiveMessageOnPort(port)
    if (!m) break
    data = new Float64Array(m.message.data)
    generation = m.message.generation
  }
  let failed = 0
  try {
    if (generation !== Atomics.load(flag, 3)) throw new Error('LP worker has no data buffer for this request')
    encodeOutcomes(solveJobsWithJsLp(decodeJobs(data)), data)
  } catch {
    failed = 1
  }
  Atomics.store(flag, 4, failed)
  Atomics.store(flag, 1, seen)
  Atomics.notify(flag, 1)
}
