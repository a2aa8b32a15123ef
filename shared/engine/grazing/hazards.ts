// Cautions for a group on a field on a date: frost wait, nitrate, grain, bloat and copper, each with its rule and source.
import { z } from 'zod'
import { evidenceLabelSchema, isoDateOutSchema, isoDateSchema, positiveFraction } from './common'
import { SORGHUM_BU_KG, HA_PER_ACRE } from './conversions'
import { frostWait } from './frost'
import { nitrateGuidance } from './nitrate'
import { grazingFieldSchema, grazingGroupSchema, isSorghum, type GrazingField, type GrazingFieldInput, type GrazingGroup, type GrazingGroupInput } from './field'
import { supplyOfParsedField } from './supply'
import { stripDietByDay } from './stripDiet'
import { SORGHUM_GRAIN_DM_FRACTION } from './yield'
import { defaultUtilization, grazingAccessSchema } from './animals'

/** Said with every caution: these rules are guides, and professional and legal advice comes first. */
export const CONSULT_FIRST =
  'A veterinarian, a licensed nutritionist and local regulations come first; this rule is a guide, not a diagnosis or a ration.'

export const cautionSeveritySchema = z.enum(['info', 'caution', 'warning', 'danger'])
export type CautionSeverity = z.infer<typeof cautionSeveritySchema>

export const cautionCodeSchema = z.enum([
  'frost-wait',
  'frost-not-yet',
  'nitrate',
  'grain-on-ground',
  'grain-share',
  'grain-overload',
  'grain-adaptation',
  'bloat',
  'copper-sheep',
  'copper-cattle-mineral',
  'copper-mixed-grazing',
])
export type CautionCode = z.infer<typeof cautionCodeSchema>

export const cautionSchema = z.object({
  code: cautionCodeSchema,
  severity: cautionSeveritySchema,
  message: z.string(),
  /** The rule applied, in numbers. */
  rule: z.string(),
  source: z.string(),
  evidence: evidenceLabelSchema,
  /** True when strips of this field should not be grazed on the date. */
  blocksGrazing: z.boolean(),
  /** Date the block or limit is expected to end, when known. */
  until: isoDateOutSchema.nullable(),
  consult: z.string(),
})
export type Caution = z.infer<typeof cautionSchema>

/** Downed grain above 8–10 bu/ac calls for care (K-State eUpdate "Crop residues: nutritive value and options for grazing") [read]. */
export const GRAIN_ON_GROUND_BU_PER_ACRE = { caution: 8, warning: 10 } as const
/** Unadapted cattle can die after about 10 kg of grain; adapted cattle may take 15–20 kg with moderate illness (Merck Veterinary Manual, "Grain overload in ruminants") [read]. */
export const GRAIN_OVERLOAD_KG = { unadapted: 10, adapted: 15 } as const
/**
 * Grain share of DM in the standing-milo system: 10–13 lb grain/cow/day (G2079) at ≈26 lb DMI for a 1,200-lb cow
 * is ≈33–42 % of DM (derived); above the top of that range the diet goes beyond the published system.
 */
export const GRAIN_SHARE_PCT_MAX = 42
/** Above half the diet as legume, bloat risk rises (Lehmkuhler, Univ. of Kentucky) [read]. */
export const LEGUME_SHARE_BLOAT_PCT = 50
/** Estimated maximum safe dietary copper, sheep ≈15 ppm vs cattle 100 ppm (Duncan, In Practice 19(9):503) [read]; toxicity in sheep reported from 10 ppm (Church & Pond 1988, via Berger, Univ. of Illinois) [read]. */
export const SHEEP_COPPER_PPM = { caution: 10, warning: 15 } as const

export const hazardContextSchema = z.object({
  access: grazingAccessSchema.default('strip'),
  daysPerMove: z.number().int().min(1).default(1),
  /** Overrides the species/access default of animals.ts. */
  utilization: positiveFraction().optional(),
  /** Grain offered per head per day (as-is) when strips are sized by grain (stripPlanByGrain); caps the grain eaten. */
  grainAllowanceKgPerHead: z.number().positive().optional(),
  /** Other groups sharing the field, for mixed cattle-and-sheep grazing. */
  groupsOnField: z.array(grazingGroupSchema).default([]),
  frostWaitDays: z.number().int().min(0).optional(),
  partialFrostWaitDays: z.number().int().min(0).optional(),
})
export type HazardContext = z.input<typeof hazardContextSchema>

const c = (x: Omit<Caution, 'consult' | 'until' | 'blocksGrazing'> & Partial<Pick<Caution, 'until' | 'blocksGrazing'>>): Caution => ({
  until: null,
  blocksGrazing: false,
  consult: CONSULT_FIRST,
  ...x,
})

function frostCautions(field: GrazingField, date: string, ctx: z.infer<typeof hazardContextSchema>): Caution[] {
  if (!field.components.some((k) => isSorghum(k.kind))) return []
  const w = frostWait({
    killingFrostDates: field.killingFrostDates,
    partialFrostDates: field.partialFrostDates,
    date,
    waitDays: ctx.frostWaitDays,
    partialWaitDays: ctx.partialFrostWaitDays,
  })
  const out: Caution[] = []
  const days = ctx.frostWaitDays ?? 7
  if (w.blocked && w.governingFrost) {
    out.push(
      c({
        code: 'frost-wait',
        severity: 'danger',
        message: `Keep stock off the sorghum until ${w.firstGrazingDate}: prussic acid can build after the ${w.governingFrost.killing ? 'killing' : 'partial'} frost of ${w.governingFrost.date}.`,
        rule: `no sorghum grazing for ${days} days after a killing frost; every later frost restarts the wait`,
        source: 'UNL BeefWatch 2024 (Drewnoski & Redfearn); UNL CropWatch 2023/2024',
        evidence: 'read',
        blocksGrazing: true,
        until: w.firstGrazingDate,
      }),
    )
  }
  if (!w.killed) {
    out.push(
      c({
        code: 'frost-not-yet',
        severity: 'info',
        message: 'No killing frost recorded yet: take stock off sorghum before a forecast frost, and keep them off regrowth under about 24 in.',
        rule: 'remove stock before a forecast frost; no grazing of sorghum regrowth below ~24 in',
        source: 'OMAFRA ONforage 2024; UNL BeefWatch 2024; G. Bates, Univ. of Tennessee',
        evidence: 'read',
      }),
    )
  }
  return out
}

function nitrateCautions(field: GrazingField, group: GrazingGroup): Caution[] {
  if (!field.nitrate) return []
  const g = nitrateGuidance({ value: field.nitrate.value, unit: field.nitrate.unit, pregnant: group.pregnant })
  if (g.severity === 'none') return []
  const limit =
    g.doNotFeed || g.maxDietSharePct === 0
      ? 'do not graze this field with this group'
      : g.maxDietSharePct === null
        ? 'no limit for this group'
        : `keep this field to at most ${g.maxDietSharePct} % of the diet DM, the rest from low-nitrate feed, adapting over 1–2 weeks`
  return [
    c({
      code: 'nitrate',
      severity: g.severity,
      message: `Nitrate ${Math.round(g.ppmNo3N)} ppm NO3-N (${Math.round(g.ppmNo3)} ppm NO3) on a DM basis: ${g.guidance}; ${limit}. Do not force stock onto the lower stalks of drought-stressed sorghum, where nitrate collects.`,
      rule: 'Clemson bands in ppm NO3-N: <1,000 safe; 1,000–1,500 pregnant ≤50 %; 1,500–2,000 ≤50 %; 2,000–3,500 ≤35–40 %, not pregnant; 3,500–4,000 ≤25 %, not pregnant; >4,000 do not feed',
      source: 'Clemson Agricultural Service Laboratory; NO3 = 4.43 × NO3-N (UNL via Dairy Herd); UNL CropWatch 2023/2024; Manitoba Agriculture',
      evidence: 'read',
      blocksGrazing: g.doNotFeed || g.maxDietSharePct === 0,
    }),
  ]
}

function copperCautions(group: GrazingGroup, ctx: z.infer<typeof hazardContextSchema>): Caution[] {
  if (group.species !== 'sheep') return []
  const out: Caution[] = [
    c({
      code: 'copper-sheep',
      severity: 'info',
      message: 'Sheep tolerate far less copper than cattle: offer a mineral made for sheep, never a cattle, pig or poultry product.',
      rule: 'maximum safe diet copper ≈15 ppm for sheep vs 100 ppm for cattle; Mo, S and Fe change the risk',
      source: 'Duncan, In Practice 19(9):503; Berger, Univ. of Illinois; Lane, dvm360',
      evidence: 'read',
    }),
  ]
  if (group.mineral?.intendedFor === 'cattle') {
    out.push(
      c({
        code: 'copper-cattle-mineral',
        severity: 'danger',
        message: `A cattle mineral${group.mineral.label ? ` (${group.mineral.label})` : ''} is set for this sheep group: replace it with a sheep mineral.`,
        rule: 'never a cattle mineral for sheep; trace-mineral salts for other species carry 300–400 ppm Cu',
        source: 'Berger, Univ. of Illinois; Duncan, In Practice 19(9):503',
        evidence: 'read',
      }),
    )
  }
  if (group.dietCopperPpmDm !== undefined && group.dietCopperPpmDm >= SHEEP_COPPER_PPM.caution) {
    const over = group.dietCopperPpmDm > SHEEP_COPPER_PPM.warning
    out.push(
      c({
        code: 'copper-sheep',
        severity: over ? 'warning' : 'caution',
        message: `Diet copper ${group.dietCopperPpmDm} ppm DM is ${over ? 'above the ≈15 ppm estimated maximum for sheep' : 'in the range where sheep poisoning has been reported'}.`,
        rule: 'sheep: caution from 10 ppm Cu (Church & Pond 1988); above ≈15 ppm exceeds the estimated safe maximum (Duncan)',
        source: 'Duncan, In Practice 19(9):503; Church & Pond 1988, via Berger, Univ. of Illinois',
        evidence: 'read',
      }),
    )
  }
  const cattleMineral = ctx.groupsOnField.find((g) => g.species === 'cattle' && g.mineral && g.mineral.intendedFor === 'cattle')
  if (cattleMineral) {
    out.push(
      c({
        code: 'copper-mixed-grazing',
        severity: 'warning',
        message: `Cattle on this field (${cattleMineral.name}) get a cattle mineral: keep it where the sheep cannot reach it.`,
        rule: 'flag mixed cattle-and-sheep grazing where a cattle mineral is offered',
        source: 'derived from Duncan, In Practice 19(9):503 and Berger, Univ. of Illinois',
        evidence: 'derived',
      }),
    )
  }
  return out
}

/**
 * Cautions that apply to a group on a field on a date, each with a code, severity, the rule in numbers, its
 * source and evidence label: prussic-acid frost wait (UNL BeefWatch 2024), nitrate (Clemson ASL bands), grain on
 * the ground (K-State), grain share and grain overload (Univ. of Missouri G2079; Merck Veterinary Manual), grain
 * adaptation (NFACC Beef Code §3.3.3; Morrical & Rook for ewes), bloat on lush legume (Alberta Agriculture;
 * Lehmkuhler, Univ. of Kentucky; NSW LLS), copper for sheep (Duncan; Berger). The day-1 diet of the group's strip
 * (stripDietByDay) gives the grain and legume shares; whole-field access is taken as a strip of many days.
 */
export function hazards(field: GrazingFieldInput, group: GrazingGroupInput, date: string, context: HazardContext = {}): Caution[] {
  const f = grazingFieldSchema.parse(field)
  const g = grazingGroupSchema.parse(group)
  const d = isoDateSchema.parse(date)
  const ctx = hazardContextSchema.parse(context)
  const out: Caution[] = [...frostCautions(f, d, ctx), ...nitrateCautions(f, g)]

  if (f.grainOnGround) {
    const bu = (f.grainOnGround.kgPerHa * HA_PER_ACRE) / SORGHUM_BU_KG
    if (bu >= GRAIN_ON_GROUND_BU_PER_ACRE.caution) {
      out.push(
        c({
          code: 'grain-on-ground',
          severity: bu >= GRAIN_ON_GROUND_BU_PER_ACRE.warning ? 'warning' : 'caution',
          message: `About ${bu.toFixed(1)} bu/ac of grain is on the ground (seen ${f.grainOnGround.observedOn}): loose grain is far riskier than grain on the head; limit access and watch for founder.`,
          rule: 'care above 8–10 bu/ac of grain on the ground',
          source: 'K-State eUpdate "Crop residues: nutritive value and options for grazing"; Warner, K-State Beef Tips Nov 2025',
          evidence: 'read',
        }),
      )
    }
  }

  const supply = supplyOfParsedField(f, d)
  if (supply.totalKgDmPerHa > 0) {
    // Whole-field access behaves like a very long strip: the first day's choice is unconstrained.
    const days = ctx.access === 'whole-field' ? 60 : ctx.daysPerMove
    const diet = stripDietByDay({
      intakeKgDmPerHead: g.intakeKgDmPerHead,
      daysPerMove: days,
      utilization: ctx.utilization ?? defaultUtilization({ species: g.species, access: ctx.access, daysPerMove: ctx.daysPerMove }).value,
      components: supply.components.map((x) => ({ kind: x.kind, kgDmPerHa: x.kgDmPerHa, quality: x.quality })),
    })
    const day1 = diet.days[0]
    const modelGrain = ((day1.grainSharePct / 100) * day1.intakeKgDm) / SORGHUM_GRAIN_DM_FRACTION
    const grainKgAsIs = ctx.grainAllowanceKgPerHead === undefined ? modelGrain : Math.min(modelGrain, ctx.grainAllowanceKgPerHead)
    const grainSharePct = ((grainKgAsIs * SORGHUM_GRAIN_DM_FRACTION) / day1.intakeKgDm) * 100
    if (grainKgAsIs > 0) {
      if (grainSharePct > GRAIN_SHARE_PCT_MAX) {
        const fix =
          ctx.access === 'whole-field'
            ? 'strips sized by a grain allowance, or more roughage, bring it down'
            : ctx.grainAllowanceKgPerHead === undefined
              ? 'size the strips by a grain allowance (10–13 lb a cow a day in G2079) and offer roughage'
              : 'a smaller grain allowance or more roughage brings it down'
        out.push(
          c({
            code: 'grain-share',
            severity: g.grainAdapted ? 'caution' : 'warning',
            message: `${ctx.access === 'whole-field' ? 'With the whole field open, on the first day' : 'On the first day of each strip'} grain is about ${Math.round(grainSharePct)} % of the diet DM (${grainKgAsIs.toFixed(1)} kg as-is per head): ${fix}.`,
            rule: `grain above ${GRAIN_SHARE_PCT_MAX} % of diet DM (10–13 lb/cow/day at ≈26 lb DMI is 33–42 %)`,
            source: `Univ. of Missouri Ext. G2079 (Lee, Kientzy & Bailey), share derived${g.species === 'sheep' ? '; a cattle figure, used for sheep as a guide' : ''}`,
            evidence: 'derived',
          }),
        )
      }
      const overload = g.grainAdapted ? GRAIN_OVERLOAD_KG.adapted : GRAIN_OVERLOAD_KG.unadapted
      if (g.species === 'cattle' && grainKgAsIs >= overload) {
        out.push(
          c({
            code: 'grain-overload',
            severity: 'danger',
            message: `Each animal could take about ${grainKgAsIs.toFixed(1)} kg of grain on the first day, at or above the ${overload} kg reported to harm ${g.grainAdapted ? 'adapted' : 'unadapted'} cattle.`,
            rule: 'unadapted cattle can die after ≈10 kg grain; adapted cattle may fall ill at 15–20 kg',
            source: 'Merck Veterinary Manual, "Grain overload in ruminants"',
            evidence: 'read',
          }),
        )
      }
      if (!g.grainAdapted) {
        out.push(
          c({
            code: 'grain-adaptation',
            severity: 'caution',
            message:
              g.species === 'sheep'
                ? 'Ewes not yet on grain: give 1–2 h a day of access at first, about 0.5 lb of corn a day for 3–7 days beforehand, and vaccinate against enterotoxemia 4–6 weeks ahead unless boostered this year.'
                : 'Cattle not yet on grain: step them onto the standing grain gradually with small daily strips.',
            rule: g.species === 'sheep' ? '1–2 h/day access at first; 0.5 lb corn/day for 3–7 days; C. perfringens type D vaccine 4–6 weeks before' : 'transition onto grain gradually',
            source: g.species === 'sheep' ? 'Morrical (Iowa State) & Rook (Michigan State), "Grazing corn stalks with the ewe flock"' : 'NFACC Code of Practice for Beef Cattle §3.3.3; Univ. of Missouri Ext. G2079',
            evidence: 'read',
          }),
        )
      }
    }

    const legumeForage = supply.byKind['legume-forage']
    if (legumeForage > 0) {
      const lush = !f.killingFrostDates.some((k) => k <= d)
      const heavy = day1.legumeSharePct > LEGUME_SHARE_BLOAT_PCT
      if (lush || heavy) {
        const ladder: CautionSeverity[] = ['info', 'caution', 'warning']
        let level = g.species === 'cattle' ? 1 : 0
        if (!lush) level -= 1
        if (heavy) level += 1
        out.push(
          c({
            code: 'bloat',
            severity: ladder[Math.max(0, Math.min(2, level))],
            message: `${lush ? 'The legume is still green' : 'The legume is frost-killed'}${heavy ? ` and about ${Math.round(day1.legumeSharePct)} % of the first day's diet` : ''}: do not turn hungry stock onto it, avoid wet forage and offer dry roughage.`,
            rule: 'vegetative legume is the highest bloat risk and grain-legume crops are listed as possible bloaters (no cowpea- or soybean-specific data found); risk rises above 50 % legume in the diet; cattle are more prone than sheep',
            source: 'Alberta Agriculture "Grazing legumes and bloat" FAQ; Lehmkuhler, Univ. of Kentucky; NSW Local Land Services',
            evidence: 'read',
          }),
        )
      }
    }
  }

  out.push(...copperCautions(g, ctx))
  return out
}
