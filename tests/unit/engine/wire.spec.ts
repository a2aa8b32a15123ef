// The flat-array hand-over of LPs and answers to the LP worker: exact round trips, malformed input, requests that outgrow the buffer.
import { MessageChannel, Worker } from 'node:worker_threads'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { cattleRequirements, LB_KG, rationLinearProgram, registeredLpRunner, type LinearProgram, type LpOutcome } from '../../../shared/engine/index'
import { solveJobsWithJsLp } from '../../../shared/engine/nutrition/lp/adapter'
import { decodeJobs, decodeOutcomes, encodedJobsLength, encodedOutcomesLength, encodeJobs, encodeOutcomes } from '../../../shared/engine/nutrition/lp/wire'
import { closeServerLpRunner, LP_WORKER_BUFFER_DOUBLES, registerServerLpRunner } from '../../../server/engine/lpRunner'
import { cowpea, problemOf, rangeCube, sorghumGrain, sorghumStover } from './helpers/feeds'

beforeAll(() => registerServerLpRunner({ warm: true }))
afterAll(closeServerLpRunner)

const cow = cattleRequirements({ class: 'cow', bodyWeightKg: 1200 * LB_KG, matureWeightKg: 1200 * LB_KG, bcs: 5, pregnancyDay: 250, grazing: true })
const rationLp = () =>
  rationLinearProgram(
    problemOf(cow, [sorghumGrain(), sorghumStover(), cowpea(), rangeCube({ maxKgDm: 1 })], {
      fieldOffer: [
        { feedId: 'grain', shareOfDm: 0.25 },
        { feedId: 'stover', shareOfDm: 0.6 },
        { feedId: 'cowpea', shareOfDm: 0.15 },
      ],
      limits: { maxGrainShareOfDm: 0.3 },
    }),
  )
/** A hand-made LP with every optional field and every kind of bound. */
const odd: LinearProgram = {
  colNames: ['a', 'b', 'c'],
  cost: [1, -0.5, 1e-300],
  colLower: [0, -Infinity, 2],
  colUpper: [Infinity, 7, 2.5],
  rows: [
    { name: 'r0', coefs: [1, 1, 0], lower: -Infinity, upper: 10 },
    { name: 'r1', coefs: [0, -3.25, 1], lower: 1, upper: Infinity },
  ],
  secondary: [0, -1, 0],
  secondaryFloor: -12.5,
  secondaryBindingRow: 0,
  skipIfPreviousZero: [2, 0],
}
const numbersOf = (lp: LinearProgram) => ({ ...lp, colNames: lp.colNames.length, rows: lp.rows.map(({ coefs, lower, upper }) => ({ coefs, lower, upper })) })

describe('LP hand-over as flat doubles', () => {
  it('when LPs are encoded and decoded, then every number, bound, option and the column count come back exactly', () => {
    const jobs = [rationLp(), odd, { ...odd, secondary: undefined, secondaryFloor: undefined, secondaryBindingRow: undefined, skipIfPreviousZero: undefined }]
    const buf = new Float64Array(encodedJobsLength(jobs))
    expect(encodeJobs(jobs, buf)).toBe(buf.length)
    const back = decodeJobs(buf)
    expect(back.map(numbersOf)).toEqual(jobs.map(numbersOf))
    expect(back[2].secondary).toBeUndefined()
    expect(back[2].skipIfPreviousZero).toBeUndefined()
    expect(back[1].colLower[1]).toBe(-Infinity)
    expect(back[1].secondaryFloor).toBe(-12.5)
  })
  it('when outcomes are encoded and decoded, then statuses, objectives and answers come back exactly, and fit in the request', () => {
    const outcomes: LpOutcome[] = [
      { status: 'optimal', x: [0.1, 2 / 3, 1e-12], objective: 1.25 },
      { status: 'infeasible' },
      { status: 'unbounded' },
      { status: 'error', message: 'boom' },
      { status: 'skipped' },
    ]
    const buf = new Float64Array(encodedOutcomesLength(outcomes))
    expect(encodeOutcomes(outcomes, buf)).toBe(buf.length)
    const back = decodeOutcomes(buf)
    expect(back.map((o) => o.status)).toEqual(['optimal', 'infeasible', 'unbounded', 'error', 'skipped'])
    expect(back[0]).toEqual(outcomes[0])
    const five = [odd, odd, odd, odd, odd]
    expect(encodedOutcomesLength(outcomes)).toBeLessThanOrEqual(encodedJobsLength(five))
  })
  it('when the arrays are malformed, then decoding throws rather than inventing an LP or an answer', () => {
    expect(() => decodeJobs(new Float64Array([1.5]))).toThrow(/malformed/)
    expect(() => decodeJobs(new Float64Array([1, 3, 1, 0, 0, 0, 0]))).toThrow(/malformed/)
    expect(() => decodeOutcomes(new Float64Array([1, 9, 0, 0]))).toThrow(/malformed/)
    expect(() => decodeOutcomes(new Float64Array([1, 0, 1, 4, 0.5]))).toThrow(/malformed/)
  })
  it('when a request outgrows the worker\'s shared buffer, then a larger one is sent and the answers equal in-process solves, then and after', async () => {
    const runner = registeredLpRunner()!
    const lp = rationLp()
    const many = Array.from({ length: Math.ceil((2 * LP_WORKER_BUFFER_DOUBLES) / encodedJobsLength([lp])) }, () => lp)
    expect(encodedJobsLength(many)).toBeGreaterThan(LP_WORKER_BUFFER_DOUBLES)
    const expected = solveJobsWithJsLp([lp])[0]
    expect(expected.status).toBe('optimal')
    const strip = (o: LpOutcome) => (o.status === 'optimal' ? { status: o.status, x: o.x, objective: o.objective } : o)
    const big = await runner.run(many, 5000)
    expect(big).toHaveLength(many.length)
    for (const o of big) expect(strip(o)).toEqual(strip(expected))
    const small = await runner.run([lp, odd], 1000)
    expect(strip(small[0])).toEqual(strip(expected))
    expect(small[1]).toEqual(solveJobsWithJsLp([lp, odd])[1])
  })
})

describe('the browser LP worker', () => {
  it('when it receives a flat request, then it answers with flat outcomes equal to in-process solves, and with an error on a malformed one', async () => {
    const posted: { seq: number; data?: Float64Array; error?: string }[] = []
    const fakeSelf = { onmessage: null as ((e: { data: unknown }) => void) | null, postMessage: (m: (typeof posted)[number]) => posted.push(m) }
    const g = globalThis as { self?: unknown }
    const before = g.self
    g.self = fakeSelf
    try {
      await import('../../../src/engine/lpWorker')
      const jobs = [rationLp(), odd]
      const data = new Float64Array(encodedJobsLength(jobs))
      encodeJobs(jobs, data)
      fakeSelf.onmessage!({ data: { seq: 7, data } })
      fakeSelf.onmessage!({ data: { seq: 8, data: new Float64Array([2.5]) } })
    } finally {
      g.self = before
    }
    expect(posted[0].seq).toBe(7)
    expect(decodeOutcomes(posted[0].data!)).toEqual(solveJobsWithJsLp([rationLp(), odd]).map((o) => (o.status === 'optimal' ? { status: o.status, x: o.x, objective: o.objective } : o)))
    expect(posted[1]).toMatchObject({ seq: 8, error: expect.stringMatching(/malformed/) })
  })
})

describe('the server LP worker on its own', () => {
  it('when a request in its shared buffer is malformed, then it flags the failure and answers the next request normally', async () => {
    const sab = new SharedArrayBuffer(20)
    const flag = new Int32Array(sab)
    const data = new Float64Array(new SharedArrayBuffer(1024 * 8))
    const { port1, port2 } = new MessageChannel()
    const worker = new Worker(new URL('../../../server/engine/lpWorker.mjs', import.meta.url), { workerData: { port: port2, sab, data: data.buffer }, transferList: [port2 as never], execArgv: [] })
    try {
      const waitAsync = (Atomics as unknown as { waitAsync: (a: Int32Array, i: number, v: number, t: number) => { value: unknown } }).waitAsync
      const answered = async (seq: number) => {
        await waitAsync(flag, 1, seq - 1, 5000).value
        return Atomics.load(flag, 1)
      }
      await waitAsync(flag, 2, 0, 10_000).value
      expect(Atomics.load(flag, 2)).toBe(1)
      data.set([2.5])
      Atomics.store(flag, 0, 1)
      Atomics.notify(flag, 0)
      expect(await answered(1)).toBe(1)
      expect(Atomics.load(flag, 4)).toBe(1)
      const lp = rationLp()
      encodeJobs([lp], data)
      Atomics.store(flag, 0, 2)
      Atomics.notify(flag, 0)
      expect(await answered(2)).toBe(2)
      expect(Atomics.load(flag, 4)).toBe(0)
      const expected = solveJobsWithJsLp([lp])[0]
      expect(expected.status).toBe('optimal')
      expect(decodeOutcomes(data)).toEqual([{ status: 'optimal', x: (expected as { x: number[] }).x, objective: (expected as { objective: number }).objective }])
    } finally {
      port1.close()
      await worker.terminate()
    }
  }, 15_000)
})
