// Nitrate limits for forage by lab result, in whichever unit the lab reports.
import { z } from 'zod'
import { nonNegative } from './common'
import { NITRATE_REPORT_UNITS, NO3_PER_NO3N_MOLAR, nitrateToPpmNo3N, type NitrateReportUnit } from './conversions'

export interface NitrateBand {
  fromPpmNo3N: number
  /** Upper bound (exclusive); null for the open top band. */
  toPpmNo3N: number | null
  guidance: string
  /** Largest share of ration DM this forage may be; null when there is no limit. */
  maxDietSharePct: number | null
  pregnantMaxDietSharePct: number | null
  notForPregnant: boolean
  doNotFeed: boolean
}

/**
 * Clemson University Agricultural Service Laboratory nitrate guidelines, ppm NO3-N on a DM basis [read]. Where the
 * source gives a range (35–40 %), the lower, safer figure is the limit.
 */
export const CLEMSON_NITRATE_BANDS: readonly NitrateBand[] = [
  { fromPpmNo3N: 0, toPpmNo3N: 1000, guidance: 'safe under all conditions', maxDietSharePct: null, pregnantMaxDietSharePct: null, notForPregnant: false, doNotFeed: false },
  { fromPpmNo3N: 1000, toPpmNo3N: 1500, guidance: 'safe for non-pregnant stock; pregnant stock at most 50 % of ration DM', maxDietSharePct: null, pregnantMaxDietSharePct: 50, notForPregnant: false, doNotFeed: false },
  { fromPpmNo3N: 1500, toPpmNo3N: 2000, guidance: 'at most 50 % of ration DM', maxDietSharePct: 50, pregnantMaxDietSharePct: 50, notForPregnant: false, doNotFeed: false },
  { fromPpmNo3N: 2000, toPpmNo3N: 3500, guidance: 'at most 35–40 % of ration DM; not for pregnant stock', maxDietSharePct: 35, pregnantMaxDietSharePct: 0, notForPregnant: true, doNotFeed: false },
  { fromPpmNo3N: 3500, toPpmNo3N: 4000, guidance: 'at most 25 % of ration DM; not for pregnant stock', maxDietSharePct: 25, pregnantMaxDietSharePct: 0, notForPregnant: true, doNotFeed: false },
  { fromPpmNo3N: 4000, toPpmNo3N: null, guidance: 'potentially toxic: do not feed', maxDietSharePct: 0, pregnantMaxDietSharePct: 0, notForPregnant: true, doNotFeed: true },
]

/** Servi-Tech crop file 6.05.022 lab scale, ppm NO3-N [read] (descriptive only). */
export const SERVI_TECH_NITRATE_SCALE: readonly { fromPpmNo3N: number; label: string }[] = [
  { fromPpmNo3N: 0, label: 'very low' },
  { fromPpmNo3N: 700, label: 'low' },
  { fromPpmNo3N: 1400, label: 'medium' },
  { fromPpmNo3N: 2100, label: 'high' },
  { fromPpmNo3N: 2800, label: 'very high' },
  { fromPpmNo3N: 3500, label: 'extremely high' },
]

/** Manitoba Agriculture "Utilizing high nitrate feeds safely", % NO3 on DM [read]. */
export const MANITOBA_NITRATE_SCALE: readonly { fromPctNo3: number; label: string }[] = [
  { fromPctNo3: 0, label: 'virtually safe' },
  { fromPctNo3: 0.3, label: 'moderately safe; limit to 50 % of the diet for stressed stock' },
  { fromPctNo3: 0.6, label: 'potentially toxic; not as the sole feed' },
  { fromPctNo3: 0.9, label: 'dangerous' },
]

export const nitrateGuidanceInputSchema = z.object({
  value: nonNegative(),
  unit: z.enum(NITRATE_REPORT_UNITS as [NitrateReportUnit, ...NitrateReportUnit[]]),
  pregnant: z.boolean().default(false),
})
export const nitrateGuidanceSchema = z.object({
  ppmNo3N: z.number(),
  ppmNo3: z.number(),
  band: z.number().int(),
  guidance: z.string(),
  /** Largest share of ration DM for this group; null = no limit. */
  maxDietSharePct: z.number().nullable(),
  doNotFeed: z.boolean(),
  severity: z.enum(['none', 'info', 'caution', 'warning', 'danger']),
})
export type NitrateGuidance = z.infer<typeof nitrateGuidanceSchema>

/**
 * Limit for a nitrate result: converted to ppm NO3-N (NO3 = 4.43 × NO3-N, B. Anderson, UNL, via Dairy Herd [read];
 * molar-mass ratio used) and placed in the Clemson Agricultural Service Laboratory bands [read], with the tighter
 * pregnant-stock limits where the bands give them.
 */
export function nitrateGuidance(input: z.input<typeof nitrateGuidanceInputSchema>): NitrateGuidance {
  const p = nitrateGuidanceInputSchema.parse(input)
  const ppmNo3N = nitrateToPpmNo3N(p.value, p.unit)
  const band = CLEMSON_NITRATE_BANDS.findIndex((b) => ppmNo3N >= b.fromPpmNo3N && (b.toPpmNo3N === null || ppmNo3N < b.toPpmNo3N))
  const b = CLEMSON_NITRATE_BANDS[band]
  const maxDietSharePct = p.pregnant ? b.pregnantMaxDietSharePct : b.maxDietSharePct
  let severity: NitrateGuidance['severity']
  if (b.doNotFeed || (p.pregnant && b.notForPregnant)) severity = 'danger'
  else if (maxDietSharePct !== null && maxDietSharePct < 50) severity = 'warning'
  else if (maxDietSharePct !== null) severity = 'caution'
  else severity = band === 0 ? 'none' : 'info'
  return { ppmNo3N, ppmNo3: ppmNo3N * NO3_PER_NO3N_MOLAR, band, guidance: b.guidance, maxDietSharePct, doNotFeed: b.doNotFeed, severity }
}
