// Animal units, intake rules of thumb, utilization defaults by species and access, and stocking-day arithmetic.
import { z } from 'zod'
import { LB_KG } from '../units'
import type { Cited } from './common'
import { positive, positiveFraction } from './common'
import { grazingSpeciesSchema, type GrazingSpecies } from './field'

/** Animal unit: one mature ≈1,000-lb cow, dry or with a calf up to 6 months (SRM, Glossary of Terms Used in Range Management, 4th ed., 1998) [read]. */
export const AU_BODY_WEIGHT_KG = 1000 * LB_KG
/** AU forage intake, 26 lb DM/day (SRM Glossary, 4th ed., 1998) [read]. */
export const AU_INTAKE_KG_DM_SRM = 26 * LB_KG
/** AU intake used for paddock sizing, 25 lb DM/day for a 1,000-lb dry cow (Penn State Agronomy Guide, Table 1.8-9 footnote) [read]. */
export const AU_INTAKE_KG_DM_PSU = 25 * LB_KG
/** An animal-unit month is 30 AU-days (Arterburn, Progressive Cattle 2019) [read]; NRCS-style 30.4 d is from memory. */
export const AUM_DAYS = 30
/** Five ewes to one AU, the conventional federal-grazing equivalence (Agproud, "How many sheep does it take to make a cow?") [read]. */
export const SHEEP_PER_AU_CONVENTIONAL = 5

/** AU class factors (Vallentine 1990, via Rangelands Gateway) [read]. */
export const AU_CLASS_FACTORS = {
  'mature-cow-dry': { value: 1.0, source: 'Vallentine 1990, via Rangelands Gateway', evidence: 'read' },
  'cow-calf-pair': { value: 1.35, source: 'Vallentine 1990, via Rangelands Gateway', evidence: 'read' },
  'calf-weaning-to-12-months': { value: 0.6, source: 'Vallentine 1990, via Rangelands Gateway', evidence: 'read' },
} as const satisfies Record<string, Cited<number>>

export const animalUnitInputSchema = z.object({
  bodyWeightKg: positive(),
  /** 'linear': +0.1 AU per 100 lb (Arterburn 2019) [read]; 'metabolic': (BW ÷ 1,000 lb)^0.75 (Manske 1998, NDSU Dickinson) [read]. */
  method: z.enum(['linear', 'metabolic']).default('linear'),
})
/** Animal-unit equivalent of one animal by body weight (SRM 1998 AU definition; Arterburn 2019; Manske 1998). */
export function animalUnitEquivalent(input: z.input<typeof animalUnitInputSchema>): number {
  const p = animalUnitInputSchema.parse(input)
  const ratio = p.bodyWeightKg / AU_BODY_WEIGHT_KG
  return p.method === 'linear' ? ratio : Math.pow(ratio, 0.75)
}

/** Animal-unit equivalent by intake: intake ÷ AU intake (Texas Animal Unit Equivalent chart: 130-lb ewe at 3.5 % BW ≈ 0.18 AU) [read]. */
export function intakeAnimalUnits(intakeKgDmPerHead: number, auIntakeKgDm: number = AU_INTAKE_KG_DM_SRM): number {
  const p = z.object({ intakeKgDmPerHead: positive(), auIntakeKgDm: positive() }).parse({ intakeKgDmPerHead, auIntakeKgDm })
  return p.intakeKgDmPerHead / p.auIntakeKgDm
}

/** Forage dry matter in one animal-unit month: AU intake × 30 d = 780 lb at 26 lb/day (Arterburn 2019) [read]. */
export function animalUnitMonthKgDm(auIntakeKgDm: number = AU_INTAKE_KG_DM_SRM, days: number = AUM_DAYS): number {
  const p = z.object({ auIntakeKgDm: positive(), days: positive() }).parse({ auIntakeKgDm, days })
  return p.auIntakeKgDm * p.days
}

/** Dry-matter intake as % of body weight by class, DM basis, for planning when no intake equation is at hand. */
export const INTAKE_PCT_BODY_WEIGHT = {
  'cow-low-quality-forage': { value: 1.5, source: 'Mullenix (Auburn Univ.), Progressive Cattle 2022', evidence: 'read' },
  'cow-average-forage': { value: 2.0, source: 'Mullenix (Auburn Univ.), Progressive Cattle 2022', evidence: 'read' },
  'beef-planning': { value: 2.5, source: 'NCAT ATTRA "Grazier\'s Math" (Rinehart): 2.5–3.0 %', evidence: 'read' },
  'growing-cattle': { value: 3.0, source: 'Mullenix 2022; NCAT ATTRA "Grazier\'s Math"', evidence: 'read' },
  'ewe-dry': { value: 2.5, source: 'NCAT ATTRA "Grazier\'s Math"', evidence: 'read' },
  'ewe-average': { value: 3.5, source: 'Texas Animal Unit Equivalent chart (130-lb ewe)', evidence: 'read' },
  'ewe-lactating': { value: 4.5, source: 'NCAT ATTRA "Grazier\'s Math"', evidence: 'read' },
} as const satisfies Record<string, Cited<number>>

/** Daily DM intake from a %-of-body-weight rule (NCAT ATTRA "Grazier's Math": 1,050-lb cow at 3 % eats 31.5 lb) [read]. */
export function intakeFromBodyWeight(bodyWeightKg: number, pctOfBodyWeight: number): number {
  const p = z.object({ bodyWeightKg: positive(), pctOfBodyWeight: positive().max(10) }).parse({ bodyWeightKg, pctOfBodyWeight })
  return (p.bodyWeightKg * p.pctOfBodyWeight) / 100
}

/**
 * Forage to allot per head so that it eats its intake at a given harvest efficiency: intake ÷ utilization
 * (UGA SARE "Management-intensive grazing: forage allotment": 19.2 lb at 30 % needs 64 lb) [read].
 */
export function allotmentPerHead(intakeKgDmPerHead: number, utilization: number): number {
  const p = z.object({ intakeKgDmPerHead: positive(), utilization: positiveFraction() }).parse({ intakeKgDmPerHead, utilization })
  return p.intakeKgDmPerHead / p.utilization
}

export const stockingDaysInputSchema = z.object({
  availableKgDmPerHa: z.number().nonnegative(),
  utilization: positiveFraction(),
  intakeKgDmPerHead: positive(),
})
/**
 * Animal-days one hectare gives: available DM × utilization ÷ daily intake (stocking arithmetic of the trade;
 * checked against ≈400 cow-days/ac on standing milo, R. Lee, Univ. of Missouri Ext., farmtalknews [read]).
 * For grain-basis allocation pass grain as-is per hectare and the grain allowance as the intake.
 */
export function stockingDaysPerHa(input: z.input<typeof stockingDaysInputSchema>): number {
  const p = stockingDaysInputSchema.parse(input)
  return (p.availableKgDmPerHa * p.utilization) / p.intakeKgDmPerHead
}

/**
 * Harvest efficiency by length of grazing period, Penn State Agronomy Guide Table 1.8-9 [read]:
 * 1 d 80 %; 2–3 d 75 %; 4 d 70 %; 5 d 65 %; 6–7 d 60 %.
 */
export const PENN_STATE_UTILIZATION_BY_PERIOD: readonly { maxDays: number; utilization: number }[] = [
  { maxDays: 1, utilization: 0.8 },
  { maxDays: 3, utilization: 0.75 },
  { maxDays: 4, utilization: 0.7 },
  { maxDays: 5, utilization: 0.65 },
  { maxDays: 7, utilization: 0.6 },
]

/** Penn State's utilization for a grazing period; beyond the table's 7 days the 6–7-day value is held and flagged. */
export function pennStateUtilization(grazingDays: number): { utilization: number; extrapolated: boolean } {
  const d = z.object({ grazingDays: z.number().int().min(1) }).parse({ grazingDays }).grazingDays
  const row = PENN_STATE_UTILIZATION_BY_PERIOD.find((r) => d <= r.maxDays)
  if (row) return { utilization: row.utilization, extrapolated: false }
  return { utilization: PENN_STATE_UTILIZATION_BY_PERIOD[PENN_STATE_UTILIZATION_BY_PERIOD.length - 1].utilization, extrapolated: true }
}

export const paddockAreaInputSchema = z.object({
  grazingDays: z.number().int().min(1),
  availableKgDmPerHa: positive(),
  /** Defaults to Penn State's value for the grazing period. */
  utilization: positiveFraction().optional(),
  auIntakeKgDm: positive().default(AU_INTAKE_KG_DM_PSU),
})
/**
 * Paddock area per animal unit: AU intake × days ÷ (utilization × available DM)
 * (Penn State Agronomy Guide, Table 1.8-9: 1 d, 80 %, 1,000 lb DM/ac → 0.031 ac/AU) [read].
 */
export function paddockAreaPerAnimalUnitHa(input: z.input<typeof paddockAreaInputSchema>): number {
  const p = paddockAreaInputSchema.parse(input)
  const u = p.utilization ?? pennStateUtilization(p.grazingDays).utilization
  return (p.auIntakeKgDm * p.grazingDays) / (u * p.availableKgDmPerHa)
}

export const grazingAccessSchema = z.enum(['strip', 'whole-field'])
export type GrazingAccess = z.infer<typeof grazingAccessSchema>

/**
 * Utilization defaults for standing sorghum with a corridor legume. Cattle on daily strips: up to 75 % of total
 * milo biomass (Univ. of Missouri Ext. G2079, Lee, Kientzy & Bailey) [read]; strip grazing 70–80 % (Corriher,
 * Texas AgriLife) [read]. Cattle with the whole field: 30–35 % (common practice, from continuous stocking 30–40 %,
 * Corriher; 30–35 %, Kennedy, NRCS Missouri; ≈35 % eaten of free-access stockpile, Davis, Univ. of Missouri) [read].
 * No published sheep figure on standing sorghum exists: sheep select leaf and grain and trample less, so sheep
 * defaults sit higher (common practice).
 */
export const UTILIZATION_DEFAULTS: Record<GrazingSpecies, Record<GrazingAccess, Cited<number>>> = {
  cattle: {
    strip: { value: 0.75, source: 'Univ. of Missouri Ext. G2079 (Lee, Kientzy & Bailey): up to 75 % on daily strips', evidence: 'read' },
    'whole-field': { value: 0.325, source: 'common practice 30–35 % (Corriher; Kennedy; Davis)', evidence: 'common practice' },
  },
  sheep: {
    strip: { value: 0.775, source: 'common practice 75–80 %; no published sheep figure on standing sorghum', evidence: 'common practice' },
    'whole-field': { value: 0.5, source: 'common practice ≈50 %; no published sheep figure on standing sorghum', evidence: 'common practice' },
  },
}

export const defaultUtilizationInputSchema = z.object({
  species: grazingSpeciesSchema,
  access: grazingAccessSchema,
  daysPerMove: z.number().int().min(1).default(1),
})
/**
 * Default utilization for a species, access system and strip length. Longer strips lose utilization in the
 * proportions of Penn State Table 1.8-9 relative to its 1-day figure (derived), never below the whole-field value.
 */
export function defaultUtilization(input: z.input<typeof defaultUtilizationInputSchema>): Cited<number> & { extrapolated: boolean } {
  const p = defaultUtilizationInputSchema.parse(input)
  const whole = UTILIZATION_DEFAULTS[p.species]['whole-field']
  if (p.access === 'whole-field') return { ...whole, extrapolated: false }
  const strip = UTILIZATION_DEFAULTS[p.species].strip
  if (p.daysPerMove === 1) return { ...strip, extrapolated: false }
  const psu = pennStateUtilization(p.daysPerMove)
  const scaled = (strip.value * psu.utilization) / PENN_STATE_UTILIZATION_BY_PERIOD[0].utilization
  return {
    value: Math.max(whole.value, scaled),
    source: `${strip.source}, scaled by Penn State Agronomy Guide Table 1.8-9 for ${p.daysPerMove}-day strips`,
    evidence: 'derived',
    extrapolated: psu.extrapolated,
  }
}
