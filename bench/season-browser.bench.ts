// Benchmark: the Season screen's computation (computeSeason, the code the browser runs on every settings change) on the main demo operation's data; the target is well under 200 ms.
import { bench, describe } from 'vitest'
import { computeSeason, buildSeasonInput } from '../shared/adapters/grazing/seasonInput'
import { seasonBudget } from '../shared/engine/grazing/index'
import { demoSeasonData } from '../server/seed/demoGrazing'

const demo = demoSeasonData('2026-11-15')
const input = buildSeasonInput(demo.settings, demo.fields, demo.plans).input

describe(`Season of the demo: ${demo.fields.length} fields, ${demo.plans.length} groups, 135 days (target < 200 ms in the browser)`, () => {
  bench('computeSeason: build the engine plan from fields and plans, then seasonBudget', () => {
    computeSeason(demo.settings, demo.fields, demo.plans)
  })
  bench('seasonBudget alone on the built plan', () => {
    seasonBudget(input)
  })
})
