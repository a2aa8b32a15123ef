// Operation-scoped routes for herds, feeds, lab results, balances and reports.
import type { ScopedRouter } from '../scoped'
import { herdRoutes } from './herds'
import { feedRoutes } from './feeds'
import { labResultRoutes } from './labResults'
import { balanceRoutes } from './balances'
import { reportRoutes } from './reports'

export const nutritionRoutes: Array<(r: ScopedRouter) => void> = [herdRoutes, feedRoutes, labResultRoutes, balanceRoutes, reportRoutes]
