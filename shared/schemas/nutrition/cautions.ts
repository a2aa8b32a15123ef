// The usual cautions where harm is possible, chosen for a balance from what it contains; each names its rule and source.
import type { BalanceResult, Feed as EngineFeed } from '../../engine/nutrition/ration/schema'

export const FIRST_COME = 'A veterinarian, a licensed nutritionist and local regulations come first.'

export type Caution = { code: string; title: string; text: string; source: string }

const C = {
  copper: {
    code: 'copper-sheep',
    title: 'Copper and sheep',
    text: 'Sheep are the farm species most sensitive to copper: toxicity has been seen from about 10 mg/kg of diet DM, against a tolerable 40 mg/kg for beef cattle. Never feed a cattle mineral, cattle supplement or poultry litter to sheep; StandGraze leaves any feed labelled for cattle only out of a sheep balance.',
    source: 'Duncan, In Practice 19:503 (1997); Berger, Univ. of Illinois (citing Church & Pond 1988); NASEM 2016 via Merck Veterinary Manual',
  },
  urea: {
    code: 'urea',
    title: 'Urea and other non-protein nitrogen',
    text: 'At most one third of dietary N from urea, with readily fermentable energy, for ruminants only and never for calves with an undeveloped rumen; a common formulation cap is about 1 % of diet DM. Mix evenly and introduce gradually.',
    source: 'Univ. of Kentucky; Univ. of Nebraska–Lincoln Beef FAQ "Urea toxicity" (2010); 1 % cap common practice',
  },
  grain: {
    code: 'grain',
    title: 'Grain overload',
    text: 'Standing sorghum grain and grain supplements can cause acidosis or founder. Allocate one day’s strip at a time, adapt stock gradually and scout for more than 8–10 bu/acre of grain on the ground.',
    source: 'K-State (via Farms.com); Univ. of Missouri (Lee); UNL CropWatch; adaptation common practice',
  },
  nitrate: {
    code: 'nitrate',
    title: 'Nitrate',
    text: 'Above 1,000 ppm NO3-N (DM) limit the feed for pregnant animals; above 4,000 ppm it is potentially toxic. Drought, frost or hail raise nitrate and it collects in lower stalks; count water nitrate too.',
    source: 'Clemson Agricultural Service Laboratory nitrate guide; K-State; UNL CropWatch',
  },
  prussic: {
    code: 'prussic-acid',
    title: 'Prussic acid after frost',
    text: 'Grain sorghum is high in cyanide potential after frost. Wait at least 7 days after a killing freeze (many advise 10–14) before turning in, keep stock off regrowth, and do not graze on nights when frost is forecast.',
    source: 'UNL CropWatch; OSU Extension; Univ. of Arkansas; Univ. of Tennessee',
  },
  bloat: {
    code: 'bloat',
    title: 'Legume bloat',
    text: 'Lush cowpea or soybean regrowth can cause frothy bloat: introduce the legume gradually and turn in animals that are already full.',
    source: 'Common practice',
  },
  toxaemia: {
    code: 'pregnancy-toxaemia',
    title: 'Pregnancy toxaemia',
    text: 'Energy is the nutrient most likely to be short in late gestation; ewes carrying twins and thin ewes are at risk of pregnancy toxaemia. Separate singles and twins and feed them to their needs.',
    source: 'Univ. of Maryland (sheepandgoat.com); NMSU sheep nutrition',
  },
} satisfies Record<string, Caution>

/** Cautions for a balance: by species, what the diet contains and whether the animals graze standing sorghum. */
export function cautionsFor(input: {
  species: 'cattle' | 'sheep'
  feeds: Pick<EngineFeed, 'id' | 'isGrain' | 'isUrea' | 'isLegume' | 'nitrateNPpmDm' | 'role' | 'name'>[]
  result?: Pick<BalanceResult, 'intakes'> | null
  onSorghumField?: boolean
  lateGestationMultiples?: boolean
}): Caution[] {
  const eaten = new Set((input.result?.intakes ?? []).filter((i) => i.kgDm > 1e-6).map((i) => i.feedId))
  const inDiet = (f: { id: string }) => (input.result ? eaten.has(f.id) : true)
  const out: Caution[] = []
  if (input.species === 'sheep') out.push(C.copper)
  if (input.lateGestationMultiples) out.push(C.toxaemia)
  if (input.feeds.some((f) => f.isUrea && inDiet(f))) out.push(C.urea)
  if (input.feeds.some((f) => f.isGrain && inDiet(f))) out.push(C.grain)
  if (input.feeds.some((f) => (f.nitrateNPpmDm ?? 0) > 0 && inDiet(f))) out.push(C.nitrate)
  if (input.onSorghumField) out.push(C.prussic)
  if (input.feeds.some((f) => f.isLegume && inDiet(f))) out.push(C.bloat)
  return out
}
