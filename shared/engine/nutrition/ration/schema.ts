// zod schemas of the ration balance: feeds, the problem, options and the result.
import { z } from 'zod'
import { requirementsSchema } from '../requirements'
import { warningSchema } from '../warning'

const pct = (max: number) => z.number().finite().min(0).max(max)
const kg = z.number().finite().min(0).max(100)

export const feedSchema = z
  .object({
    id: z.string().min(1).max(100),
    name: z.string().min(1).max(200),
    role: z.enum(['field', 'supplement', 'mineral']),
    dmPct: z.number().finite().gt(0).max(100),
    cpPctDm: pct(300),
    tdnPctDm: pct(200),
    caPctDm: pct(40).optional(),
    pPctDm: pct(25).optional(),
    cuMgPerKgDm: z.number().finite().min(0).max(10_000).optional(),
    nitrateNPpmDm: z.number().finite().min(0).max(100_000).optional(),
    isGrain: z.boolean().optional(),
    isUrea: z.boolean().optional(),
    /** A legume forage of the field (cowpea, forage soybean): used for the smallest legume share that covers CP. */
    isLegume: z.boolean().optional(),
    /** Labelled for cattle only (cattle minerals carry 300–400 mg/kg Cu): never offered to sheep. */
    cattleOnly: z.boolean().optional(),
    costPerKgDm: z.number().finite().min(0).max(1000).optional(),
    minKgDm: kg.optional(),
    maxKgDm: kg.optional(),
  })
  .strict()
  .superRefine((f, ctx) => {
    if (f.minKgDm !== undefined && f.maxKgDm !== undefined && f.minKgDm > f.maxKgDm) {
      ctx.addIssue({ code: 'custom', path: ['maxKgDm'], message: 'maxKgDm must not be below minKgDm' })
    }
  })
export type Feed = z.infer<typeof feedSchema>

export const limitsSchema = z
  .object({
    maxDmiKg: z.number().finite().gt(0).max(100).optional(),
    maxGrainShareOfDm: z.number().finite().min(0).max(1).optional(),
    minCaToP: z.number().finite().min(0).max(20).optional(),
    maxCaToP: z.number().finite().min(0).max(20).optional(),
    maxUreaShareOfDm: z.number().finite().min(0).max(1).optional(),
    maxCaG: z.number().finite().min(0).max(1000).optional(),
    maxPG: z.number().finite().min(0).max(1000).optional(),
    maxCuMgPerKgDm: z.number().finite().min(0).max(10_000).optional(),
    /** How far (± share of field DM) the animals' selection may depart from what the field offers. */
    selectionTolerance: z.number().finite().min(0).max(1).optional(),
  })
  .strict()
  .superRefine((l, ctx) => {
    if (l.minCaToP !== undefined && l.maxCaToP !== undefined && l.minCaToP > l.maxCaToP) {
      ctx.addIssue({ code: 'custom', path: ['maxCaToP'], message: 'maxCaToP must not be below minCaToP' })
    }
  })
export type RationLimits = z.infer<typeof limitsSchema>

export const rationProblemSchema = z
  .object({
    species: z.enum(['cattle', 'sheep']),
    requirements: requirementsSchema,
    feeds: z.array(feedSchema).min(1).max(40),
    fieldOffer: z.array(z.object({ feedId: z.string().min(1), shareOfDm: z.number().finite().min(0).max(1) }).strict()).optional(),
    limits: limitsSchema.optional(),
    context: z.object({ pregnant: z.boolean().optional() }).strict().optional(),
  })
  .strict()
  .superRefine((p, ctx) => {
    const seen = new Map<string, number>()
    p.feeds.forEach((f, i) => {
      if (seen.has(f.id)) ctx.addIssue({ code: 'custom', path: ['feeds', i, 'id'], message: `Duplicate feed id "${f.id}"` })
      seen.set(f.id, i)
    })
    if (p.fieldOffer) {
      let sum = 0
      p.fieldOffer.forEach((o, i) => {
        const idx = seen.get(o.feedId)
        if (idx === undefined || p.feeds[idx].role !== 'field') {
          ctx.addIssue({ code: 'custom', path: ['fieldOffer', i, 'feedId'], message: `"${o.feedId}" is not a field feed of this problem` })
        }
        sum += o.shareOfDm
      })
      if (Math.abs(sum - 1) > 1e-6) ctx.addIssue({ code: 'custom', path: ['fieldOffer'], message: `Offered shares must add up to 1 (got ${sum})` })
    }
  })
export type RationProblem = z.input<typeof rationProblemSchema>
export type ParsedRationProblem = z.infer<typeof rationProblemSchema>

export const balanceOptionsSchema = z
  .object({
    /**
     * 'auto' (the default, what the screens and the API use): the engine's simplex in the calling thread, each answer certified,
     * HiGHS only on doubt. 'highs': HiGHS only, for comparisons.
     */
    solver: z.enum(['auto', 'highs']).default('auto'),
  })
  .strict()
export type BalanceOptions = z.input<typeof balanceOptionsSchema>

export const nutrientNames = ['tdn', 'nem', 'neg', 'cp', 'ca', 'p'] as const
export type Nutrient = (typeof nutrientNames)[number]

const num = z.number().finite()
/** 'engine-simplex' or 'highs'; 'javascript-lp-solver' appears only in results stored before the in-thread simplex. */
const solverNameSchema = z.enum(['engine-simplex', 'highs', 'javascript-lp-solver'])
/** Why HiGHS answered (see `FallbackReason` in lp/program.ts); the last four appear only in results stored by the older worker guard. */
const fallbackReasonSchema = z.enum(['iteration-limit', 'not-certified', 'solver-error', 'requested', 'no-runner', 'timeout', 'runner-error', 'failed-check', 'infeasible-claim'])
export const balanceResultSchema = z.object({
  status: z.enum(['covered', 'covered-with-supplement', 'short']),
  intakes: z.array(z.object({ feedId: z.string(), kgDm: num, kgAsFed: num, kgDmForGain: num.optional() })),
  supply: z.array(
    z.object({ nutrient: z.enum(nutrientNames), unit: z.enum(['kg', 'Mcal', 'g']), need: num, supplied: num, pctCovered: num, shadowPrice: num.optional() }),
  ),
  deficiencies: z.array(z.object({ nutrient: z.enum(nutrientNames), shortBy: num, unit: z.enum(['kg', 'Mcal', 'g']) })),
  stillShort: z.array(z.object({ nutrient: z.enum(nutrientNames), shortBy: num, unit: z.enum(['kg', 'Mcal', 'g']) })),
  supplements: z.array(z.object({ feedId: z.string(), kgDm: num, kgAsFed: num, cost: num })),
  costPerHeadDay: num,
  intakeCapacityKg: num,
  minLegumeShareForProtein: num.nullable(),
  conflicts: z.array(z.string()),
  warnings: z.array(warningSchema),
  solver: solverNameSchema,
  solverRuns: z.array(
    z.object({
      lp: z.enum(['main', 'field-only', 'best-achievable']),
      solver: solverNameSchema,
      fallbackReason: fallbackReasonSchema.optional(),
      /** The answer passed the certificate: optimal by LP duality, or infeasible by a Farkas ray. */
      certified: z.boolean().optional(),
      /** Not solved: the least-cost diet bought nothing, so it is itself a field-only diet that meets every need. */
      impliedByMain: z.boolean().optional(),
    }),
  ),
})
export type BalanceResult = z.infer<typeof balanceResultSchema>
