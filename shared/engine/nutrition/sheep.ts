// Sheep daily requirements from NRC 1985 Table 1: rows by stage, interpolation between weights, the body-condition footnote.
import { z } from 'zod'
import { DE_PER_KG_TDN, ME_PER_DE } from './energy'
import { SOURCES } from './sources'
import type { Requirements } from './requirements'

export const sheepAnimalSchema = z
  .object({
    class: z.enum(['ewe', 'ewe-lamb', 'growing-lamb', 'ram']),
    bodyWeightKg: z.number().finite().min(10).max(160),
    bcs: z.number().finite().min(1).max(5).optional(),
    stage: z.enum(['maintenance', 'flushing', 'early-gestation', 'late-gestation', 'early-lactation', 'late-lactation']),
    litterSize: z.union([z.literal(1), z.literal(2), z.literal(3)]).optional(),
    adgG: z.number().finite().min(0).max(500).optional(),
  })
  .strict()
  .superRefine((a, ctx) => {
    const minWeight = a.class === 'growing-lamb' ? 10 : a.class === 'ewe-lamb' ? 20 : 30
    if (a.bodyWeightKg < minWeight) {
      ctx.addIssue({ code: 'custom', path: ['bodyWeightKg'], message: `A ${a.class} of under ${minWeight} kg is outside the table's range.` })
    }
    if (a.class === 'ram' && a.stage !== 'maintenance' && a.stage !== 'flushing') {
      ctx.addIssue({ code: 'custom', path: ['stage'], message: 'A ram can only be at maintenance or flushing (pre-breeding).' })
    }
  })
export type SheepAnimal = z.infer<typeof sheepAnimalSchema>

/** One NRC 1985 Table 1 row, per head per day. */
export interface SheepTableRow {
  bodyWeightKg: number
  dmKg: number
  tdnKg: number
  meMcal: number
  cpG: number
  caG: number
  pG: number
  /** 'read' rows were seen in the table; 'from memory' rows were not verified. */
  label: 'read' | 'from memory'
}

const me = (tdnKg: number) => tdnKg * DE_PER_KG_TDN * ME_PER_DE
const row = (bodyWeightKg: number, dmKg: number, tdnKg: number, meMcal: number, cpG: number, caG: number, pG: number, label: SheepTableRow['label']): SheepTableRow => ({
  bodyWeightKg, dmKg, tdnKg, meMcal, cpG, caG, pG, label,
})

/**
 * NRC, Nutrient Requirements of Sheep, 6th rev. ed. (1985), Table 1 (p. 45). Maintenance, flushing and early-gestation rows are read;
 * the late-gestation, lactation and finishing-lamb rows are from memory (ME derived as TDN × 4.409 × 0.82 for those).
 */
export const NRC1985_SHEEP_TABLE1 = {
  maintenance: [row(50, 1.0, 0.55, 2.0, 95, 2.0, 1.8, 'read'), row(70, 1.2, 0.66, 2.4, 113, 2.5, 2.4, 'read'), row(90, 1.4, 0.78, 2.8, 131, 2.9, 3.1, 'read')],
  flushing: [row(50, 1.6, 0.94, 3.4, 150, 5.3, 2.6, 'read'), row(70, 1.8, 1.06, 3.8, 164, 5.7, 3.2, 'read'), row(90, 2.0, 1.18, 4.2, 177, 6.1, 3.9, 'read')],
  earlyGestation: [row(50, 1.2, 0.67, 2.4, 112, 2.9, 2.1, 'read'), row(70, 1.4, 0.77, 2.8, 130, 3.5, 2.9, 'read')],
  lateGestationSingle: [row(70, 1.7, 0.99, me(0.99), 175, 5.9, 4.8, 'from memory')],
  lateGestationTwins: [row(70, 1.9, 1.24, me(1.24), 200, 6.5, 4.7, 'from memory')],
  earlyLactationSingle: [row(70, 2.3, 1.5, me(1.5), 319, 9.3, 6.7, 'from memory')],
  earlyLactationTwins: [row(70, 2.8, 1.82, me(1.82), 389, 10.9, 7.7, 'from memory')],
  finishingLamb: [row(30, 1.3, 0.94, me(0.94), 191, 6.6, 3.2, 'from memory')],
} as const satisfies Record<string, readonly SheepTableRow[]>

/** Weight step between the table's ewe rows used for the body-condition footnote: 10 kg (from memory of the full table). */
export const SHEEP_WEIGHT_CLASS_STEP_KG = 10
/** Gain of the finishing-lamb row, g/d (from memory). */
const FINISHING_ROW_GAIN_G = 295

type Nutrients = Omit<SheepTableRow, 'bodyWeightKg' | 'label'>
const KEYS = ['dmKg', 'tdnKg', 'meMcal', 'cpG', 'caG', 'pG'] as const

function scale(r: Nutrients, f: number): Nutrients {
  return { dmKg: r.dmKg * f, tdnKg: r.tdnKg * f, meMcal: r.meMcal * f, cpG: r.cpG * f, caG: r.caG * f, pG: r.pG * f }
}

/**
 * A row at any weight: linear between the table's rows (as the table itself steps), and outside them the nearest row scaled by
 * metabolic weight (W/W_row)^0.75 (derived).
 */
export function sheepRowAt(rows: readonly SheepTableRow[], weightKg: number): Nutrients {
  const first = rows[0]
  const last = rows[rows.length - 1]
  if (weightKg <= first.bodyWeightKg) return scale(first, (weightKg / first.bodyWeightKg) ** 0.75)
  if (weightKg >= last.bodyWeightKg) return scale(last, (weightKg / last.bodyWeightKg) ** 0.75)
  for (let i = 0; i + 1 < rows.length; i++) {
    const a = rows[i]
    const b = rows[i + 1]
    if (weightKg >= a.bodyWeightKg && weightKg <= b.bodyWeightKg) {
      const t = (weightKg - a.bodyWeightKg) / (b.bodyWeightKg - a.bodyWeightKg)
      const out = {} as Nutrients
      for (const k of KEYS) out[k] = a[k] + t * (b[k] - a[k])
      return out
    }
  }
  return scale(last, 1)
}

/**
 * Daily requirements of sheep, per head.
 * Source: NRC, Nutrient Requirements of Sheep, 6th rev. ed. (1985), Table 1, p. 45 (maintenance, flushing, early gestation read;
 * late gestation, lactation and finishing-lamb rows from memory) and its footnote: feed fat ewes at the next lower weight class
 * and thin ewes at the next higher class (read). Between weights the rows are interpolated; growing lambs combine the maintenance
 * row with the finishing-lamb row's gain part in proportion to the target gain (derived).
 */
export function sheepRequirements(animal: SheepAnimal): Requirements {
  const a = sheepAnimalSchema.parse(animal)
  const notes: string[] = []
  const sources = new Set<string>([SOURCES.nrcSheep1985Table1])
  const T = NRC1985_SHEEP_TABLE1

  let weight = a.bodyWeightKg
  const bcs = a.bcs ?? 3
  if (a.class === 'ewe' || a.class === 'ewe-lamb') {
    if (bcs >= 4) {
      weight = Math.max(weight - SHEEP_WEIGHT_CLASS_STEP_KG, weight / 2)
      notes.push(`Body condition ${bcs}: fed at the next lower weight class (${weight} kg), per the table's footnote.`)
    } else if (bcs <= 2) {
      weight += SHEEP_WEIGHT_CLASS_STEP_KG
      notes.push(`Body condition ${bcs}: fed at the next higher weight class (${weight} kg) until moderate condition, per the table's footnote.`)
    }
  }
  const litter = a.litterSize ?? 1
  let rows: readonly SheepTableRow[]
  let n: Nutrients
  if (a.class === 'growing-lamb') {
    const maint = sheepRowAt(T.maintenance, weight)
    const fin = T.finishingLamb[0]
    const maint30 = sheepRowAt(T.maintenance, fin.bodyWeightKg)
    const gainShare = (a.adgG ?? 0) / FINISHING_ROW_GAIN_G
    const w = (weight / fin.bodyWeightKg) ** 0.75
    n = {} as Nutrients
    for (const k of KEYS) n[k] = maint[k] + Math.max(0, fin[k] - maint30[k]) * gainShare * w
    sources.add(SOURCES.nrcSheep1985Memory)
    notes.push(`Growing lamb: maintenance row plus the finishing-lamb row's gain part × ${gainShare.toFixed(2)} (derived; that row is from memory).`)
    if (a.stage !== 'maintenance') notes.push('Stage is not used for growing lambs.')
  } else {
    switch (a.stage) {
      case 'maintenance':
        rows = T.maintenance
        break
      case 'flushing':
        rows = T.flushing
        break
      case 'early-gestation':
        rows = T.earlyGestation
        break
      case 'late-gestation':
        rows = litter === 1 ? T.lateGestationSingle : T.lateGestationTwins
        break
      case 'early-lactation':
        rows = litter === 1 ? T.earlyLactationSingle : T.earlyLactationTwins
        break
      case 'late-lactation':
        // The table pairs late lactation with the row one step lighter: singles with late gestation, twins with early-lactation singles.
        rows = litter === 1 ? T.lateGestationSingle : T.earlyLactationSingle
        break
    }
    n = sheepRowAt(rows, weight)
    if (rows.some((r) => r.label === 'from memory')) {
      sources.add(SOURCES.nrcSheep1985Memory)
      notes.push('This stage uses a table row recalled from memory, not verified: treat it as a default to check.')
    }
    if (litter === 3 && (a.stage === 'late-gestation' || a.stage === 'early-lactation')) {
      notes.push('Triplets: the twins row (the table\'s top lambing-rate band) is used; needs are likely higher.')
    }
    if (a.class === 'ram') notes.push('No ram rows in the engine\'s table: the ewe row at the ram\'s weight is used, a default to check.')
    if (a.class === 'ewe-lamb') notes.push('No ewe-lamb rows in the engine\'s table: the ewe row at this weight is used and does not include her own growth.')
  }
  return {
    dmiKg: n.dmKg,
    tdnKg: n.tdnKg,
    meMcal: n.meMcal,
    cpKg: n.cpG / 1000,
    caG: n.caG,
    pG: n.pG,
    notes,
    sources: [...sources],
  }
}
