// Operation-scoped routes for fields, strip plans, the season and the crew's Today records.
import type { ScopedRouter } from '../scoped'
import { fieldRoutes } from './fields'
import { planRoutes } from './plans'

export const grazingRoutes: Array<(r: ScopedRouter) => void> = [fieldRoutes, planRoutes]
