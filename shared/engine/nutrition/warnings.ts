// Safety and sanity warnings on a diet: nitrate, grain, urea, copper, cattle products for sheep, intake, NEg range, Ca:P.
import { z } from 'zod'
import { CAUTION, SOURCES } from './sources'
import { NO3_PER_NO3N, no3FromNo3N } from './conversions'
import { feedSchema, limitsSchema } from './ration/schema'
import { requirementsSchema } from './requirements'
import { DEFAULT_LIMITS } from './ration/model'
import { energyOfTdn } from './energy'
import type { NutritionWarning } from './warning'

export const rationWarningsInputSchema = z
  .object({
    species: z.enum(['cattle', 'sheep']),
    feeds: z.array(feedSchema).min(1),
    intakes: z.array(z.object({ feedId: z.string(), kgDm: z.number().finite().min(0) }).strip()),
    requirements: requirementsSchema.optional(),
    limits: limitsSchema.optional(),
    context: z.object({ pregnant: z.boolean().optional() }).strict().optional(),
  })
  .strict()
export type RationWarningsInput = z.input<typeof rationWarningsInputSchema>

/** Nitrate-N bands, mg/kg DM (Clemson Agricultural Service Laboratory guide — read): the largest share of ration DM for each. */
export const NITRATE_N_BANDS = [
  { fromPpm: 0, toPpm: 1000, maxShare: 1, pregnantOk: true, pregnantMaxShare: 1, text: 'safe' },
  { fromPpm: 1000, toPpm: 1500, maxShare: 1, pregnantOk: true, pregnantMaxShare: 0.5, text: 'safe for non-pregnant animals; at most 50 % of ration DM for pregnant ones' },
  { fromPpm: 1500, toPpm: 2000, maxShare: 0.5, pregnantOk: true, pregnantMaxShare: 0.5, text: 'at most 50 % of ration DM' },
  { fromPpm: 2000, toPpm: 3500, maxShare: 0.35, pregnantOk: false, pregnantMaxShare: 0, text: 'at most 35–40 % of ration DM, not for pregnant animals' },
  { fromPpm: 3500, toPpm: 4000, maxShare: 0.25, pregnantOk: false, pregnantMaxShare: 0, text: 'at most 25 % of ration DM, not for pregnant animals' },
  { fromPpm: 4000, toPpm: Infinity, maxShare: 0, pregnantOk: false, pregnantMaxShare: 0, text: 'potentially toxic — do not feed' },
] as const

/** Nitrate (NO3) bands of the whole diet, mg/kg DM (K-State — read): ≤ 3,000 virtually safe; 3,000–6,000 moderately safe; > 6,000 potentially toxic. */
export const NITRATE_NO3_DIET = { safePpm: 3000, toxicPpm: 6000 } as const
/** Maximum tolerable dietary Cu for beef cattle, mg/kg DM (NASEM 2016 via Merck — read). */
export const CATTLE_MAX_CU = 40

const pctText = (v: number) => `${(v * 100).toFixed(1)} %`

/**
 * Warnings on a diet, each with a code, plain words and its source: nitrate by the Clemson NO3-N guide per feed and the K-State NO3
 * guide for the diet (read); grain share against the limit (common practice); urea — at most 1/3 of dietary N (Univ. of Kentucky, read)
 * and ≈ 1 % of DM (common practice); copper above ≈ 10 mg/kg for sheep (Berger; Duncan 1997 — read) or 40 mg/kg for cattle (NASEM 2016
 * via Merck — read); cattle-only products in a sheep ration; intake above capacity; NEg outside its equation's range; Ca:P below 1:1.
 */
export function rationWarnings(input: RationWarningsInput): NutritionWarning[] {
  return warningsOfDiet(rationWarningsInputSchema.parse(input))
}

/** `rationWarnings` on input already validated (the balance passes its own parsed problem). */
export function warningsOfDiet(v: z.infer<typeof rationWarningsInputSchema>): NutritionWarning[] {
  const out: NutritionWarning[] = []
  const byId = new Map(v.feeds.map((f) => [f.id, f]))
  const diet = v.intakes.filter((d) => d.kgDm > 0 && byId.has(d.feedId)).map((d) => ({ feed: byId.get(d.feedId)!, kg: d.kgDm }))
  const total = diet.reduce((s, d) => s + d.kg, 0)
  const share = (kg: number) => (total > 0 ? kg / total : 0)
  const pregnant = v.context?.pregnant ?? false
  const sheep = v.species === 'sheep'

  // Nitrate, per feed and for the diet.
  let no3Weighted = 0
  let no3Known = false
  for (const d of diet) {
    const n = d.feed.nitrateNPpmDm
    if (n === undefined) continue
    no3Known = true
    no3Weighted += share(d.kg) * no3FromNo3N(n)
    const band = NITRATE_N_BANDS.find((b) => n >= b.fromPpm && n < b.toPpm)!
    const limit = pregnant ? Math.min(band.maxShare, band.pregnantMaxShare) : band.maxShare
    if (share(d.kg) > limit + 1e-9) {
      out.push({
        code: 'nitrate',
        feedId: d.feed.id,
        message: `${d.feed.name}: ${n.toFixed(0)} mg/kg NO3-N (${no3FromNo3N(n).toFixed(0)} mg/kg NO3) in DM — ${band.text}; it makes ${pctText(share(d.kg))} of this diet. Test the feed and the water, and introduce slowly. ${CAUTION}`,
        source: SOURCES.clemsonNitrate,
      })
    }
  }
  if (no3Known && no3Weighted > NITRATE_NO3_DIET.safePpm) {
    out.push({
      code: 'nitrate',
      message: `The diet averages ${no3Weighted.toFixed(0)} mg/kg NO3 in DM (${(no3Weighted / NO3_PER_NO3N).toFixed(0)} mg/kg NO3-N): ${no3Weighted > NITRATE_NO3_DIET.toxicPpm ? 'potentially toxic' : 'moderately safe; limit for stressed animals'}. ${CAUTION}`,
      source: SOURCES.kstateNitrate,
    })
  }

  // Grain share.
  const grainKg = diet.filter((d) => d.feed.isGrain).reduce((s, d) => s + d.kg, 0)
  const maxGrain = v.limits?.maxGrainShareOfDm
  if (grainKg > 0 && maxGrain !== undefined && share(grainKg) > maxGrain + 1e-9) {
    out.push({
      code: 'grain-share',
      message: `Grain makes ${pctText(share(grainKg))} of diet DM, above the ${pctText(maxGrain)} limit: risk of grain overload (acidosis, founder). Adapt animals gradually and move the fence once a day. ${CAUTION}`,
      source: SOURCES.grainCommon,
    })
  } else if (grainKg > 0 && maxGrain === undefined) {
    out.push({
      code: 'grain-share-unset',
      message: `Grain makes ${pctText(share(grainKg))} of diet DM and no grain-share limit is set. Adapt animals to grain gradually and scout for grain on the ground. ${CAUTION}`,
      source: SOURCES.grainCommon,
    })
  }

  // Urea.
  const urea = diet.filter((d) => d.feed.isUrea)
  if (urea.length > 0) {
    const ureaKg = urea.reduce((s, d) => s + d.kg, 0)
    const ureaCp = urea.reduce((s, d) => s + (d.kg * d.feed.cpPctDm) / 100, 0)
    const totalCp = diet.reduce((s, d) => s + (d.kg * d.feed.cpPctDm) / 100, 0)
    const maxUrea = v.limits?.maxUreaShareOfDm ?? DEFAULT_LIMITS.maxUreaShareOfDm
    out.push({
      code: 'urea',
      message: `Urea is in this diet (${pctText(share(ureaKg))} of DM, ${pctText(totalCp > 0 ? ureaCp / totalCp : 0)} of dietary N): ruminants only, never young calves; keep it under 1/3 of dietary N, mix well and supply fermentable energy${sheep ? '; take extra care with sheep' : ''}. ${CAUTION}`,
      source: SOURCES.kentuckyUrea,
    })
    if (share(ureaKg) > maxUrea + 1e-9 || (totalCp > 0 && ureaCp / totalCp > 1 / 3 + 1e-9)) {
      out.push({
        code: 'urea-share',
        message: `Urea exceeds its limit: ${pctText(share(ureaKg))} of DM (limit ${pctText(maxUrea)}) and ${pctText(totalCp > 0 ? ureaCp / totalCp : 0)} of dietary N (limit 33.3 %). Risk of ammonia toxicity. ${CAUTION}`,
        source: `${SOURCES.kentuckyUrea}; ${SOURCES.ureaShareCommon}`,
      })
    }
  }

  // Copper and cattle-only products.
  if (sheep) {
    for (const f of v.feeds) {
      if (f.cattleOnly) {
        out.push({
          code: 'cattle-product-for-sheep',
          feedId: f.id,
          message: `${f.name} is a cattle product and is left out of this sheep ration: cattle minerals carry 300–400 mg/kg Cu, and sheep are the farm species most sensitive to copper. ${CAUTION}`,
          source: SOURCES.berger,
        })
      }
    }
  }
  const cuDiet = diet.filter((d) => d.feed.cuMgPerKgDm !== undefined)
  if (cuDiet.length > 0 && total > 0) {
    const cu = cuDiet.reduce((s, d) => s + d.kg * d.feed.cuMgPerKgDm!, 0) / total
    const limit = sheep ? (v.limits?.maxCuMgPerKgDm ?? DEFAULT_LIMITS.sheepMaxCuMgPerKgDm) : (v.limits?.maxCuMgPerKgDm ?? CATTLE_MAX_CU)
    if (cu > limit + 1e-9) {
      out.push({
        code: sheep ? 'copper-sheep' : 'copper-cattle',
        message: sheep
          ? `Diet Cu ${cu.toFixed(1)} mg/kg DM exceeds ${limit} mg/kg: chronic copper poisoning in sheep has followed intakes as low as about 10 mg/kg (risk higher when Mo, S or Zn is low). ${CAUTION}`
          : `Diet Cu ${cu.toFixed(1)} mg/kg DM exceeds the ${limit} mg/kg maximum tolerable level for beef cattle. ${CAUTION}`,
        source: sheep ? `${SOURCES.berger}; ${SOURCES.duncan1997}` : SOURCES.mercknasem2016,
      })
    }
  }

  // Intake above capacity.
  const capacity = v.limits?.maxDmiKg ?? v.requirements?.dmiKg
  if (capacity !== undefined && total > capacity * (1 + 1e-7)) {
    out.push({
      code: 'dmi-above-capacity',
      message: `The diet is ${total.toFixed(2)} kg DM/day, above the predicted intake capacity of ${capacity.toFixed(2)} kg: the animals may not eat it all.`,
      source: SOURCES.nrcBeef1996Memory,
    })
  }

  // NEg outside its range for animals that must gain.
  if (v.species === 'cattle' && (v.requirements?.negMcal ?? 0) > 0) {
    for (const d of diet) {
      const e = energyOfTdn(d.feed.tdnPctDm)
      const w = e.warnings.find((x) => x.code === 'neg-out-of-range')
      if (w && d.feed.role !== 'mineral' && !d.feed.isUrea) out.push({ ...w, feedId: d.feed.id, message: `${d.feed.name}: ${w.message}` })
    }
  }

  // Minerals: missing values and the Ca:P ratio.
  const anyCa = v.feeds.some((f) => f.caPctDm !== undefined)
  const anyP = v.feeds.some((f) => f.pPctDm !== undefined)
  for (const d of diet) {
    const missing = [anyCa && d.feed.caPctDm === undefined ? 'Ca' : null, anyP && d.feed.pPctDm === undefined ? 'P' : null].filter(Boolean)
    if (missing.length > 0) {
      out.push({
        code: 'mineral-value-missing',
        feedId: d.feed.id,
        message: `${d.feed.name} has no ${missing.join(' or ')} value; it is counted as 0. Enter a lab or book value.`,
        source: SOURCES.csu1615,
      })
    }
  }
  if (anyCa && anyP && total > 0) {
    const ca = diet.reduce((s, d) => s + d.kg * (d.feed.caPctDm ?? 0), 0)
    const p = diet.reduce((s, d) => s + d.kg * (d.feed.pPctDm ?? 0), 0)
    if (p > 0 && ca / p < 1 - 1e-9) {
      out.push({ code: 'ca-p-ratio', message: `Ca:P is ${(ca / p).toFixed(2)}:1; keep it at least 1:1, preferably 1.5–2:1.`, source: SOURCES.caPCommon })
    }
  }

  for (const d of diet) {
    if (d.feed.role !== 'field' && d.feed.costPerKgDm === undefined) {
      out.push({ code: 'supplement-unpriced', feedId: d.feed.id, message: `${d.feed.name} has no price and is treated as free.`, source: 'StandGraze balance rule' })
    }
  }
  return out
}
