// Diet by day within a multi-day strip: stock take grain and leaf first, so quality falls until the next move.
import { z } from 'zod'
import { fraction, isoDateOutSchema, isoDateSchema, percent, positive, positiveFraction, type Cited } from './common'
import { addDays } from './dates'
import { componentKindSchema } from './field'

export const DIET_POOLS = ['sorghum-grain', 'legume-seed', 'legume-forage', 'sorghum-leaf', 'sorghum-stalk'] as const
export type DietPool = (typeof DIET_POOLS)[number]

/**
 * Relative preference of each feed pool. The order follows what grazing stock are seen to do: cattle eat the milo
 * heads first, in about 30 minutes, then spend about 2 hours on the rest (R. Lee, Univ. of Missouri, Today's
 * Farmer) [read]; ewes on maize residue ate grain and fine leaf almost completely (van Pletzen et al. 1991) [read].
 * The weights themselves are defaults: no published selectivity coefficients were found.
 */
export const DEFAULT_PREFERENCE: Cited<Record<DietPool, number>> = {
  value: { 'sorghum-grain': 4, 'legume-seed': 4, 'legume-forage': 3, 'sorghum-leaf': 2, 'sorghum-stalk': 1 },
  source: 'default weights; order from R. Lee (Univ. of Missouri) and van Pletzen et al. 1991',
  evidence: 'default',
}

/**
 * Leaf share of sorghum stover DM: a default (no published leaf:stalk split for standing grain-sorghum stover was
 * found; 0.4 is from memory).
 */
export const DEFAULT_STOVER_LEAF_SHARE: Cited<number> = {
  value: 0.4,
  source: 'default (from memory): no published leaf share of standing grain-sorghum stover found',
  evidence: 'from memory',
}

/**
 * Leaf-to-stem quality ratios from the midpoints of K-State eUpdate "Crop residues: nutritive value and options for
 * grazing", Table 1 [read]: leaves CP 8.3–11.7 %, TDN 53–57 %; stems CP 4.9–5.3 %, TDN 49–52 % (ratios derived).
 */
export const LEAF_TO_STEM_RATIO = { cp: 10.0 / 5.1, tdn: 55 / 50.5 } as const

export const stripDietInputSchema = z
  .object({
    intakeKgDmPerHead: positive(),
    daysPerMove: z.number().int().min(1),
    /** Share of the strip's dry matter eaten by the time of the next move; the rest, mostly stalk, is left. */
    utilization: positiveFraction(),
    /** Components on the field's basis, e.g. fieldSupply(...).components. */
    components: z
      .array(
        z.object({
          kind: componentKindSchema,
          kgDmPerHa: z.number().nonnegative(),
          quality: z.object({ cpPctDm: percent(), tdnPctDm: percent() }),
        }),
      )
      .min(1),
    stoverLeafShare: fraction().default(DEFAULT_STOVER_LEAF_SHARE.value),
    preference: z.partialRecord(z.enum(DIET_POOLS), positive()).optional(),
    start: isoDateSchema.optional(),
  })
  .superRefine((v, ctx) => {
    if (!v.components.some((c) => c.kgDmPerHa > 0)) {
      ctx.addIssue({ code: 'custom', path: ['components'], message: 'the strip has no dry matter to eat' })
    }
  })
export type StripDietInput = z.input<typeof stripDietInputSchema>

export const stripDietDaySchema = z.object({
  day: z.number().int(),
  date: isoDateOutSchema.nullable(),
  intakeKgDm: z.number(),
  cpPctDm: z.number(),
  tdnPctDm: z.number(),
  /** Sorghum grain share of the day's DM. */
  grainSharePct: z.number(),
  /** Legume forage and seed share of the day's DM. */
  legumeSharePct: z.number(),
  byPoolKgDm: z.record(z.enum(DIET_POOLS), z.number()),
})
export const stripDietSchema = z.object({
  days: z.array(stripDietDaySchema),
  meanCpPctDm: z.number(),
  meanTdnPctDm: z.number(),
  cpDropPts: z.number(),
  tdnDropPts: z.number(),
  maxGrainSharePct: z.number(),
})
export type StripDiet = z.infer<typeof stripDietSchema>

interface Pool {
  id: DietPool
  remaining: number
  weight: number
  cp: number
  tdn: number
}

/**
 * Eat `need` from the pools in proportion to remaining × preference, each pool capped at what is left
 * (water-filling on the saturated pools).
 */
function eatOneDay(pools: Pool[], need: number): number[] {
  const total = pools.reduce((a, p) => a + p.remaining, 0)
  if (total <= need) return pools.map((p) => p.remaining)
  const order = pools.map((_, i) => i).sort((a, b) => pools[b].weight - pools[a].weight)
  for (let k = 0; k <= order.length; k++) {
    const sat = order.slice(0, k)
    const rest = order.slice(k)
    const satMass = sat.reduce((a, i) => a + pools[i].remaining, 0)
    const restWeight = rest.reduce((a, i) => a + pools[i].remaining * pools[i].weight, 0)
    if (restWeight <= 0) continue
    const lambda = (need - satMass) / restWeight
    const ok = rest.every((i) => lambda * pools[i].weight <= 1) && sat.every((i) => lambda * pools[i].weight >= 1)
    if (ok) return pools.map((p, i) => (sat.includes(i) ? p.remaining : p.remaining * lambda * p.weight))
  }
  // Unreachable with positive weights; eat proportionally as a safe fallback.
  return pools.map((p) => (p.remaining / total) * need)
}

/**
 * Day-by-day diet within one strip. The strip offers daysPerMove days of intake ÷ utilization, in the proportions
 * standing on the field; each day stock eat each feed in proportion to what is left of it times its preference
 * weight, so the preferred grain and leaf go first, the refusals are mostly stalk, and quality falls to the last
 * day. A daily move gives day 1 every day. Model: derived (selective depletion, with utilization by access from
 * Univ. of Missouri G2079 and Penn State Table 1.8-9); weights and the stover leaf share are defaults.
 */
export function stripDietByDay(input: StripDietInput): StripDiet {
  const p = stripDietInputSchema.parse(input)
  const pref = { ...DEFAULT_PREFERENCE.value, ...(p.preference ?? {}) }
  const s = p.stoverLeafShare
  const mass: Record<DietPool, { kg: number; cp: number; tdn: number }> = {
    'sorghum-grain': { kg: 0, cp: 0, tdn: 0 },
    'legume-seed': { kg: 0, cp: 0, tdn: 0 },
    'legume-forage': { kg: 0, cp: 0, tdn: 0 },
    'sorghum-leaf': { kg: 0, cp: 0, tdn: 0 },
    'sorghum-stalk': { kg: 0, cp: 0, tdn: 0 },
  }
  const add = (id: DietPool, kg: number, cp: number, tdn: number) => {
    mass[id].kg += kg
    mass[id].cp += kg * cp
    mass[id].tdn += kg * tdn
  }
  for (const c of p.components) {
    if (c.kind === 'sorghum-stover') {
      // Split the stover's measured quality into leaf and stalk so that their weighted mean is the measured value.
      const stalkCp = c.quality.cpPctDm / (s * LEAF_TO_STEM_RATIO.cp + 1 - s)
      const stalkTdn = c.quality.tdnPctDm / (s * LEAF_TO_STEM_RATIO.tdn + 1 - s)
      add('sorghum-leaf', c.kgDmPerHa * s, stalkCp * LEAF_TO_STEM_RATIO.cp, stalkTdn * LEAF_TO_STEM_RATIO.tdn)
      add('sorghum-stalk', c.kgDmPerHa * (1 - s), stalkCp, stalkTdn)
    } else {
      add(c.kind, c.kgDmPerHa, c.quality.cpPctDm, c.quality.tdnPctDm)
    }
  }
  const totalKg = DIET_POOLS.reduce((a, id) => a + mass[id].kg, 0)
  const stripIntake = p.intakeKgDmPerHead * p.daysPerMove
  // The strip is sized so that the utilized share of what it holds is the intake until the next move.
  const offered = stripIntake / p.utilization
  const pools: Pool[] = DIET_POOLS.filter((id) => mass[id].kg > 0).map((id) => ({
    id,
    remaining: (mass[id].kg / totalKg) * offered,
    weight: pref[id],
    cp: mass[id].cp / mass[id].kg,
    tdn: mass[id].tdn / mass[id].kg,
  }))

  const days: StripDiet['days'] = []
  for (let d = 1; d <= p.daysPerMove; d++) {
    const eaten = eatOneDay(pools, p.intakeKgDmPerHead)
    const byPoolKgDm = Object.fromEntries(DIET_POOLS.map((id) => [id, 0])) as Record<DietPool, number>
    let kg = 0
    let cp = 0
    let tdn = 0
    pools.forEach((pool, i) => {
      const e = Math.min(eaten[i], pool.remaining)
      pool.remaining -= e
      byPoolKgDm[pool.id] = e
      kg += e
      cp += e * pool.cp
      tdn += e * pool.tdn
    })
    const safe = kg > 0 ? kg : 1
    days.push({
      day: d,
      date: p.start ? addDays(p.start, d - 1) : null,
      intakeKgDm: kg,
      cpPctDm: cp / safe,
      tdnPctDm: tdn / safe,
      grainSharePct: (byPoolKgDm['sorghum-grain'] / safe) * 100,
      legumeSharePct: ((byPoolKgDm['legume-forage'] + byPoolKgDm['legume-seed']) / safe) * 100,
      byPoolKgDm,
    })
  }
  const meanCp = days.reduce((a, x) => a + x.cpPctDm * x.intakeKgDm, 0) / stripIntake
  const meanTdn = days.reduce((a, x) => a + x.tdnPctDm * x.intakeKgDm, 0) / stripIntake
  return {
    days,
    meanCpPctDm: meanCp,
    meanTdnPctDm: meanTdn,
    cpDropPts: days[0].cpPctDm - days[days.length - 1].cpPctDm,
    tdnDropPts: days[0].tdnPctDm - days[days.length - 1].tdnPctDm,
    maxGrainSharePct: Math.max(...days.map((x) => x.grainSharePct)),
  }
}
