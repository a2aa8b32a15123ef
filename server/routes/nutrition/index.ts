// Operation-scoped routes for herds, feeds, lab results, balances and reports.
import type { ScopedRouter } from '../scoped'

export const nutritionRoutes: Array<(r: ScopedRouter) => void> = []
