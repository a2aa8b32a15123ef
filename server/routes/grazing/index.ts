// Operation-scoped routes for fields, strip plans, the season and the crew's Today records.
import type { ScopedRouter } from '../scoped'

export const grazingRoutes: Array<(r: ScopedRouter) => void> = []
