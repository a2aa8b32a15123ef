// Worker thread of the server's LP guard: runs javascript-lp-solver through the shared adapter, where the server can stop it.
import { workerData, receiveMessageOnPort } from 'node:worker_threads'
import { register } from 'tsx/esm/api'

// The TypeScript loader is needed only to import the adapter; left registered, its port would slow every wake-up.
const unregister = register()
const { solveJobsWithJsLp } = await import('../../shared/engine/nutrition/lp/adapter.ts')
await unregister()

const { port, sab } = workerData
const flag = new Int32Array(sab)
// flag[0]: last request number posted by the server; flag[1]: last request answered; flag[2]: 1 once ready.
Atomics.store(flag, 2, 1)
Atomics.notify(flag, 2)
let seen = 0
for (;;) {
  // Blocking here (rather than on the event loop) wakes the worker within microseconds of a request.
  Atomics.wait(flag, 0, seen)
  seen = Atomics.load(flag, 0)
  const m = receiveMessageOnPort(port)
  if (!m) continue
  let answer
  try {
    answer = { seq: m.message.seq, outcomes: solveJobsWithJsLp(m.message.jobs) }
  } catch (e) {
    answer = { seq: m.message.seq, error: String(e) }
  }
  port.postMessage(answer)
  Atomics.store(flag, 1, m.message.seq)
  Atomics.notify(flag, 1)
}
