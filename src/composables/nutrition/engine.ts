// The browser's entry to the nutrition engine: HiGHS' WebAssembly served with the app, and the same balance options the server stores runs with.
import highsWasmUrl from 'highs/runtime?url'
import { configureHighs, loadHighs } from '@shared/engine/nutrition/lp/adapter'
import { balanceRation } from '@shared/engine/nutrition/ration/balance'
import type { BalanceResult, RationProblem } from '@shared/engine/nutrition/ration/schema'
import { BALANCE_ENGINE_OPTIONS } from '@shared/adapters/nutrition/problem'

let configured = false

/** Loads HiGHS once (from the app's own files; no CDN) and balances with the options the server uses. */
export async function balanceInBrowser(problem: RationProblem): Promise<BalanceResult> {
  if (!configured) {
    configureHighs({ locateFile: () => highsWasmUrl })
    configured = true
    await loadHighs()
  }
  return balanceRation(problem, BALANCE_ENGINE_OPTIONS)
}
