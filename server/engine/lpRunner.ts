// The server's LP guard: one worker thread running javascript-lp-solver, a time limit per call, the worker replaced when stopped.
import { MessageChannel, Worker, type MessagePort } from 'node:worker_threads'
import { registerLpRunner, type LinearProgram, type LpOutcome, type LpRunner } from '../../shared/engine/index'
import { decodeOutcomes, encodedJobsLength, encodeJobs } from '../../shared/engine/nutrition/lp/wire'

/** Longest the caller's thread blocks waiting synchronously; past it the wait goes on asynchronously until the time limit. */
const SYNC_WAIT_MS = 10
/**
 * Before sleeping, a blocking caller polls for the answer for up to this long: a solve takes tens of microseconds, and on an
 * otherwise idle virtual machine waking a sleeping thread costs about as much again.
 */
const SPIN_MS = 0.3
/** Doubles in a worker's first data buffer (1 MiB): a chunk of rations fits; a larger request gets a larger buffer. */
export const LP_WORKER_BUFFER_DOUBLES = 1 << 17

class TimeoutError extends Error {
  override name = 'AbortError'
  readonly code = 'TIMEOUT'
}

interface Slot {
  worker: Worker
  port: MessagePort
  flag: Int32Array
  data: Float64Array
  generation: number
  seq: number
}

type WaitAsync = (a: Int32Array, i: number, v: number, t: number) => { async: boolean; value: 'ok' | 'not-equal' | 'timed-out' | Promise<'ok' | 'timed-out'> }
const waitAsync = (Atomics as unknown as { waitAsync: WaitAsync }).waitAsync

let slot: Slot | null = null
let queue: Promise<unknown> = Promise.resolve()

function spawn(): Slot {
  const sab = new SharedArrayBuffer(20)
  const data = new SharedArrayBuffer(LP_WORKER_BUFFER_DOUBLES * 8)
  const { port1, port2 } = new MessageChannel()
  const worker = new Worker(new URL('./lpWorker.mjs', import.meta.url), {
    workerData: { port: port2, sab, data },
    transferList: [port2],
    // Inherited flags (a test runner's hooks, an inspector) would only slow the worker.
    execArgv: [],
  })
  worker.unref()
  port1.unref()
  worker.on('error', () => {
    if (slot?.worker === worker) slot = null
  })
  return { worker, port: port1, flag: new Int32Array(sab), data: new Float64Array(data), generation: 0, seq: 0 }
}

async function waitFor(flag: Int32Array, index: number, notValue: number, deadline: number, block = true, spin = false): Promise<boolean> {
  if (spin) {
    const until = Math.min(deadline, performance.now() + SPIN_MS)
    while (Atomics.load(flag, index) === notValue && performance.now() < until);
  }
  const first = block ? Math.min(SYNC_WAIT_MS, Math.max(0, deadline - performance.now())) : 0
  if (Atomics.wait(flag, index, notValue, first) !== 'timed-out') return true
  const rest = deadline - performance.now()
  if (rest <= 0) return Atomics.load(flag, index) !== notValue
  const w = waitAsync(flag, index, notValue, rest)
  if (!w.async) return w.value !== 'timed-out'
  // An asynchronous atomic wait does not keep Node's event loop alive by itself; a timer does, for as long as the wait lasts.
  const keepAlive = setTimeout(() => undefined, rest + 50)
  try {
    return (await w.value) !== 'timed-out'
  } finally {
    clearTimeout(keepAlive)
  }
}

async function runNow(jobs: readonly LinearProgram[], deadline: number, block: boolean): Promise<LpOutcome[]> {
  slot ??= spawn()
  const s = slot
  if (Atomics.load(s.flag, 2) !== 1 && !(await waitFor(s.flag, 2, 0, deadline))) throw new TimeoutError('LP worker not ready in time')
  const need = encodedJobsLength(jobs)
  if (need > s.data.length) {
    // A request larger than the buffer: a new shared buffer, sent to the worker before the request is posted.
    s.data = new Float64Array(new SharedArrayBuffer(2 ** Math.ceil(Math.log2(need)) * 8))
    s.generation++
    s.port.postMessage({ data: s.data.buffer, generation: s.generation })
    Atomics.store(s.flag, 3, s.generation)
  }
  encodeJobs(jobs, s.data)
  const seq = ++s.seq
  Atomics.store(s.flag, 0, seq)
  Atomics.notify(s.flag, 0)
  if (!(await waitFor(s.flag, 1, seq - 1, deadline, block, block))) {
    // javascript-lp-solver can loop for ever; terminate stops even a busy loop. The replacement starts now, ready in ~0.2 s.
    if (slot === s) slot = spawn()
    void s.worker.terminate()
    throw new TimeoutError('LP solve timed out')
  }
  if (Atomics.load(s.flag, 1) !== seq) throw new Error('LP worker answered out of turn')
  if (Atomics.load(s.flag, 4) !== 0) throw new Error('LP worker failed on the request')
  const outcomes = decodeOutcomes(s.data)
  if (outcomes.length !== jobs.length) throw new Error('LP worker answered a different number of LPs')
  return outcomes
}

const runner: LpRunner = {
  name: 'server-worker-thread',
  run(jobs, timeoutMs, options) {
    const deadline = performance.now() + timeoutMs
    // One request at a time per worker; time spent queued counts against the limit.
    const result = queue.then(() => runNow(jobs, deadline, !options?.background))
    queue = result.catch(() => undefined)
    return result
  },
}

/** Registers the worker-thread runner for every balanceRation in this process; `warm` starts the worker now rather than on first use. */
export async function registerServerLpRunner(options: { warm?: boolean } = {}): Promise<void> {
  registerLpRunner(runner)
  if (options.warm) await runner.run([], 10_000)
}

/** Resolves once the current (or a fresh) worker has loaded and waits for work. */
export async function whenServerLpRunnerReady(timeoutMs = 10_000): Promise<void> {
  slot ??= spawn()
  if (!(await waitFor(slot.flag, 2, 0, performance.now() + timeoutMs))) throw new TimeoutError('LP worker did not start')
}

/** Stops the worker (tests call it in afterAll so the process can exit). */
export async function closeServerLpRunner(): Promise<void> {
  registerLpRunner(null)
  const s = slot
  slot = null
  if (s) await s.worker.terminate()
}
