// Herd groups: the one schema for a group's fields (SI units), its create/update/response shapes, and the stage it is in on a given date.
import { addDays, daysBetween } from '../../engine/grazing/dates'
import { z } from 'zod'
import { isoDay, num, optNum, optText, versionSchema } from './common'

export const herdSpecies = ['cattle', 'sheep'] as const
export const cattleClasses = ['cow', 'bred-heifer', 'growing', 'bull'] as const
export const sheepClasses = ['ewe', 'ewe-lamb', 'growing-lamb', 'ram'] as const
export const cattleBreeds = ['british', 'continental', 'indicus-cross', 'indicus', 'dairy-cross'] as const
export const coats = ['summer-or-wet', 'dry-fall', 'dry-winter', 'heavy-winter'] as const
export const muds = ['none', 'some', 'wet', 'caked'] as const
/** Sheep stages a user can set when the group is neither pregnant nor nursing on the date (the calendar gives the others). */
export const sheepRestStages = ['maintenance', 'flushing'] as const

export const classLabels: Record<(typeof cattleClasses)[number] | (typeof sheepClasses)[number], string> = {
  cow: 'Cows',
  'bred-heifer': 'Bred heifers',
  growing: 'Growing cattle',
  bull: 'Bulls',
  ewe: 'Ewes',
  'ewe-lamb': 'Ewe lambs',
  'growing-lamb': 'Growing lambs',
  ram: 'Rams',
}
export const breedLabels: Record<(typeof cattleBreeds)[number], string> = {
  british: 'British beef',
  continental: 'Continental beef',
  'indicus-cross': 'Bos indicus cross',
  indicus: 'Bos indicus',
  'dairy-cross': 'Dairy or dual-purpose cross',
}
export const coatLabels: Record<(typeof coats)[number], string> = {
  'summer-or-wet': 'Wet or summer coat',
  'dry-fall': 'Dry fall coat',
  'dry-winter': 'Dry winter coat',
  'heavy-winter': 'Dry heavy winter coat',
}
export const mudLabels: Record<(typeof muds)[number], string> = { none: 'Dry and clean', some: 'Some mud', wet: 'Wet and matted', caked: 'Covered in wet snow or mud' }

export const environmentSchema = z.object({
  tempC: num(-60, 50, 'temperature', '°C'),
  windKph: optNum(0, 150, 'wind speed', 'km/h'),
  coat: z.enum(coats, { error: 'Choose the coat condition.' }),
  mud: z.enum(muds).nullable().optional(),
})

/** Every field a user edits, in SI (kg, °C, km/h); the screens convert from lb, °F and mph. */
export const herdFields = z.object({
  name: z.string({ error: 'Enter a name.' }).trim().min(1, 'Enter a name.').max(80, 'Use at most 80 characters.'),
  species: z.enum(herdSpecies, { error: 'Choose cattle or sheep.' }),
  class: z.enum([...cattleClasses, ...sheepClasses], { error: 'Choose the class of animal.' }),
  headCount: z.number({ error: 'Enter the head count.' }).int('Use a whole number of head.').min(1, 'At least 1 head.').max(100_000, 'At most 100,000 head.'),
  bodyWeightKg: num(10, 1500, 'body weight', 'kg'),
  matureWeightKg: optNum(30, 1500, 'mature weight', 'kg'),
  bcs: num(1, 9, 'body condition score'),
  breed: z.enum(cattleBreeds).nullable().optional(),
  /** Expected calving or lambing date: the pregnancy day follows from it on any date. */
  expectedBirthDate: isoDay.nullable().optional(),
  /** Date the group calved or lambed: days in milk follow from it. */
  lastBirthDate: isoDay.nullable().optional(),
  restStage: z.enum(sheepRestStages).nullable().optional(),
  litterSize: z.number().int('Use 1, 2 or 3.').min(1, 'Use 1, 2 or 3.').max(3, 'Use 1, 2 or 3.').nullable().optional(),
  peakMilkKg: optNum(0, 30, 'peak milk', 'kg/day'),
  calfBirthWeightKg: optNum(10, 80, 'calf birth weight', 'kg'),
  targetGainKg: optNum(0, 2.5, 'target gain', 'kg/day'),
  grazing: z.boolean().default(true),
  environment: environmentSchema.nullable().optional(),
  notes: optText(2000),
})

/** Species-dependent rules, reported on the field at fault. */
function herdRules(h: z.infer<typeof herdFields>, ctx: z.RefinementCtx) {
  const sheep = h.species === 'sheep'
  const allowed: readonly string[] = sheep ? sheepClasses : cattleClasses
  if (!allowed.includes(h.class)) ctx.addIssue({ code: 'custom', path: ['class'], message: `Choose a ${h.species} class.` })
  if (sheep) {
    if (h.bodyWeightKg > 160) ctx.addIssue({ code: 'custom', path: ['bodyWeightKg'], message: 'A sheep body weight must be between 10 and 160 kg.' })
    if (h.bcs > 5) ctx.addIssue({ code: 'custom', path: ['bcs'], message: 'Sheep body condition is scored 1 to 5.' })
    if (h.targetGainKg != null && h.targetGainKg > 0.5) ctx.addIssue({ code: 'custom', path: ['targetGainKg'], message: 'A lamb target gain must be between 0 and 0.5 kg/day.' })
    if (h.class === 'ram' && (h.expectedBirthDate || h.lastBirthDate)) ctx.addIssue({ code: 'custom', path: ['expectedBirthDate'], message: 'Rams have no lambing date.' })
  } else {
    if (h.bodyWeightKg < 50) ctx.addIssue({ code: 'custom', path: ['bodyWeightKg'], message: 'A cattle body weight must be between 50 and 1500 kg.' })
    if (h.matureWeightKg == null) ctx.addIssue({ code: 'custom', path: ['matureWeightKg'], message: 'Enter the mature weight: growth and intake depend on it.' })
    else if (h.matureWeightKg < 200) ctx.addIssue({ code: 'custom', path: ['matureWeightKg'], message: 'A cattle mature weight must be between 200 and 1500 kg.' })
    if (h.litterSize != null && h.litterSize > 1) ctx.addIssue({ code: 'custom', path: ['litterSize'], message: 'Litter size applies to sheep.' })
    if ((h.class === 'growing' || h.class === 'bull') && h.expectedBirthDate) ctx.addIssue({ code: 'custom', path: ['expectedBirthDate'], message: 'Only cows and bred heifers have a calving date.' })
    if (h.class !== 'cow' && h.lastBirthDate) ctx.addIssue({ code: 'custom', path: ['lastBirthDate'], message: 'Only cows are counted as nursing.' })
  }
}

export const herdCreateSchema = herdFields.superRefine(herdRules)
export type HerdInput = z.input<typeof herdCreateSchema>
export type HerdValues = z.output<typeof herdCreateSchema>

/** An update sends the fields that change and the version it started from (a stale version gets 409). */
export const herdUpdateSchema = herdFields.partial().extend({ version: versionSchema })
export type HerdUpdate = z.input<typeof herdUpdateSchema>

export const herdSchema = herdFields.extend({
  id: z.number(),
  operationId: z.number(),
  version: z.number(),
  createdAt: z.string(),
  updatedAt: z.string(),
})
export type Herd = z.infer<typeof herdSchema>

// ── Stage on a date ──────────────────────────────────────────────────────────────────────────────────────────────

/** Gestation length, days: cattle 283 (the Merck Veterinary Manual's worked cow — read); sheep 147 (common practice, from memory). */
export const GESTATION_DAYS = { cattle: 283, sheep: 147 } as const
/** Nursing period counted as lactation: calves weaned at about 205 days, lambs at about 90 (common practice) — settings, not data. */
export const LACTATION_DAYS = { cattle: 205, sheep: 90 } as const
/** Sheep: last 4 weeks of gestation and first 6–8 weeks of lactation, the NRC 1985 Table 1 stage boundaries (read). */
export const SHEEP_LATE_GESTATION_DAYS = 28
export const SHEEP_EARLY_LACTATION_DAYS = 56

export type SheepStage = 'maintenance' | 'flushing' | 'early-gestation' | 'late-gestation' | 'early-lactation' | 'late-lactation'
export type HerdStage = {
  date: string
  pregnancyDay: number | null
  daysToBirth: number | null
  daysInMilk: number | null
  sheepStage: SheepStage | null
  label: string
}

// Calendar arithmetic is the engine's (UTC day numbers); re-exported for the herd form.
export { addDays, daysBetween }

type StageInput = Pick<HerdValues, 'species' | 'class' | 'expectedBirthDate' | 'lastBirthDate' | 'restStage' | 'litterSize'>

/**
 * Where the group is on `dateIso`: pregnancy day from the expected birth date, days in milk from the last birth date
 * (or from the expected date once it has passed), so a group entered as "calving on 10 March" is right on any date.
 */
export function herdStageOn(h: StageInput, dateIso: string): HerdStage {
  const species = h.species
  const gestation = GESTATION_DAYS[species]
  const lactation = LACTATION_DAYS[species]
  let pregnancyDay: number | null = null
  let daysToBirth: number | null = null
  let daysInMilk: number | null = null
  if (h.expectedBirthDate) {
    const until = daysBetween(dateIso, h.expectedBirthDate)
    if (until > 0 && until <= gestation) {
      daysToBirth = until
      pregnancyDay = gestation - until
    } else if (until <= 0 && -until < lactation) {
      daysInMilk = -until
    }
  }
  if (h.lastBirthDate && daysInMilk === null) {
    const since = daysBetween(h.lastBirthDate, dateIso)
    if (since >= 0 && since < lactation) daysInMilk = since
  }
  const nursing = species === 'sheep' ? h.class !== 'ram' && h.class !== 'growing-lamb' : h.class === 'cow'
  if (!nursing) daysInMilk = null

  let sheepStage: SheepStage | null = null
  let label: string
  const birth = species === 'cattle' ? 'calving' : 'lambing'
  if (species === 'sheep') {
    if (daysInMilk !== null) sheepStage = daysInMilk < SHEEP_EARLY_LACTATION_DAYS ? 'early-lactation' : 'late-lactation'
    else if (daysToBirth !== null) sheepStage = daysToBirth <= SHEEP_LATE_GESTATION_DAYS ? 'late-gestation' : 'early-gestation'
    else sheepStage = h.restStage ?? 'maintenance'
  }
  const litter = h.litterSize ?? 1
  const young = species === 'sheep' ? (litter === 1 ? 'single' : litter === 2 ? 'twins' : 'triplets') : ''
  if (daysInMilk !== null) {
    label = `Nursing, day ${daysInMilk} after ${birth}${young ? ` (${young})` : ''}`
    if (species === 'sheep') label = `${sheepStage === 'early-lactation' ? 'Early' : 'Late'} lactation, day ${daysInMilk}${young ? ` (${young})` : ''}`
    if (pregnancyDay !== null) label += `; pregnant, day ${pregnancyDay}`
  } else if (pregnancyDay !== null) {
    const phase = species === 'sheep' ? (sheepStage === 'late-gestation' ? 'Late gestation' : 'Early gestation') : pregnancyDay >= gestation - 90 ? 'Late gestation' : pregnancyDay >= 95 ? 'Mid gestation' : 'Early gestation'
    label = `${phase}, day ${pregnancyDay} (${daysToBirth} days to ${birth})${young ? `, ${young}` : ''}`
  } else {
    label = species === 'sheep' ? (sheepStage === 'flushing' ? 'Flushing' : 'Maintenance') : 'Not pregnant or nursing'
  }
  return { date: dateIso, pregnancyDay, daysToBirth, daysInMilk, sheepStage, label }
}
