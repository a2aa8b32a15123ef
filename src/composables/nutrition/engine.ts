// The browser's entry to the nutrition engine: the balance the server stores runs with, HiGHS' WebAssembly served with the app.
import highsWasmUrl from 'highs/runtime?url'
import { configureHighs } from '@shared/engine/nutrition/lp/adapter'
import { balanceRation } from '@shared/engine/nutrition/ration/balance'
import type { BalanceResult, RationProblem } from '@shared/engine/nutrition/ration/schema'

let configured = false

/**
 * Balances with the engine's default path, as the server does: the simplex runs in this thread and every answer is certified.
 * HiGHS (from the app's own files; no CDN) is fetched only if an answer ever needs it.
 */
export async function balanceInBrowser(problem: RationProblem): Promise<BalanceResult> {
  if (!configured) {
    configureHighs({ locateFile: () => highsWasmUrl })
    configured = true
  }
  return balanceRation(problem)
}
