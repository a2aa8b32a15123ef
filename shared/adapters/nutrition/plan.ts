// The supplement plan of a balance result for a whole group: per head, per group per day and per week, with cost — shared by screen, print and PDF.
import type { BalanceResult } from '../../engine/nutrition/ration/schema'
import type { FeedRef } from './problem'

export type PlanRow = {
  feedId: string
  name: string
  role: string
  kgDmPerHead: number
  kgAsFedPerHead: number
  kgAsFedPerGroupDay: number
  kgAsFedPerGroupWeek: number
  costPerHeadDay: number
  costPerGroupDay: number
  costPerGroupWeek: number
  priced: boolean
}

export type SupplementPlan = { rows: PlanRow[]; costPerHeadDay: number; costPerGroupDay: number; costPerGroupWeek: number; headCount: number }

/** Per group = per head × head count; per week = per day × 7 (derived). Cost is the engine's, per kg DM at the feed's price. */
export function supplementPlan(result: Pick<BalanceResult, 'supplements' | 'costPerHeadDay'>, refs: FeedRef[], headCount: number): SupplementPlan {
  const byId = new Map(refs.map((r) => [r.engineId, r]))
  const rows = result.supplements
    .filter((s) => s.kgDm > 1e-6)
    .map((s) => {
      const ref = byId.get(s.feedId)
      return {
        feedId: s.feedId,
        name: ref?.name ?? s.feedId,
        role: ref?.role ?? 'supplement',
        kgDmPerHead: s.kgDm,
        kgAsFedPerHead: s.kgAsFed,
        kgAsFedPerGroupDay: s.kgAsFed * headCount,
        kgAsFedPerGroupWeek: s.kgAsFed * headCount * 7,
        costPerHeadDay: s.cost,
        costPerGroupDay: s.cost * headCount,
        costPerGroupWeek: s.cost * headCount * 7,
        priced: ref?.costPerKgDm != null,
      }
    })
  return {
    rows,
    costPerHeadDay: result.costPerHeadDay,
    costPerGroupDay: result.costPerHeadDay * headCount,
    costPerGroupWeek: result.costPerHeadDay * headCount * 7,
    headCount,
  }
}
