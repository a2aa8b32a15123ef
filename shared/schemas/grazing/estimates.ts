// Yield worksheet schemas: head counts for grain and clipped frames for forage, several samples each, saved as an estimate.
import { z } from 'zod'
import { componentKindSchema } from './fields'

const isoDate = z.iso.date('Use a date as YYYY-MM-DD.')
const pos = (max: number, what: string) =>
  z.number({ error: `Enter ${what} as a number.` }).positive(`${what} must be more than 0.`).max(max, `${what} must be at most ${max}.`)

export const headCountSampleSchema = z.object({
  rowLengthFt: pos(1000, 'Row length'),
  rows: z.number({ error: 'Enter the rows counted as a whole number.' }).int('Rows must be a whole number.').min(1, 'Count at least one row.').max(20),
  heads: z.number({ error: 'Enter the heads counted as a whole number.' }).int('Heads must be a whole number.').min(0, 'Heads cannot be negative.').max(100_000),
})

/** Head counts (K-State eUpdates 461/608/663): one spacing and kernel figures, several stretches of row counted. */
export const headCountWorksheetSchema = z.object({
  method: z.literal('head-count'),
  measuredOn: isoDate,
  rowSpacingIn: pos(120, 'Row spacing'),
  seedsPerHead: pos(10_000, 'Seeds per head'),
  seedsPerLb: pos(100_000, 'Seeds per pound'),
  samples: z.array(headCountSampleSchema).min(1, 'Count at least one stretch of row.').max(50),
})
export type HeadCountWorksheet = z.infer<typeof headCountWorksheetSchema>

export const clipSampleSchema = z
  .object({
    wetG: pos(100_000, 'Wet weight'),
    dryG: pos(100_000, 'Dry weight'),
    containerG: z.number().min(0, 'Container weight cannot be negative.').max(10_000).default(0),
  })
  .superRefine((s, ctx) => {
    if (s.dryG > s.wetG) ctx.addIssue({ code: 'custom', path: ['dryG'], message: 'Dry weight cannot exceed wet weight.' })
    if (s.dryG <= s.containerG) ctx.addIssue({ code: 'custom', path: ['dryG'], message: 'Dry weight must exceed the container weight.' })
  })

/** Clipped frames (Univ. of Maine pasture course; NDSU R1838): one frame size, several frames clipped, dried and weighed. */
export const clippedFrameWorksheetSchema = z
  .object({
    method: z.literal('clipped-frame'),
    kind: componentKindSchema.exclude(['sorghum-grain']),
    measuredOn: isoDate,
    frameAreaFt2: pos(1000, 'Frame area').optional(),
    frameAreaM2: pos(100, 'Frame area').optional(),
    /** Where the frames were thrown: inside the legume corridor ('band') or across the whole row pattern ('field'). */
    basis: z.enum(['field', 'band']).optional(),
    samples: z.array(clipSampleSchema).min(1, 'Clip at least one frame.').max(50),
  })
  .superRefine((w, ctx) => {
    if ((w.frameAreaFt2 === undefined) === (w.frameAreaM2 === undefined)) ctx.addIssue({ code: 'custom', path: ['frameAreaFt2'], message: 'Give the frame area once, in ft² or in m².' })
  })
export type ClippedFrameWorksheet = z.infer<typeof clippedFrameWorksheetSchema>

export const worksheetSchema = z.discriminatedUnion('method', [headCountWorksheetSchema, clippedFrameWorksheetSchema], { error: 'Choose a worksheet: head-count or clipped-frame.' })
export type WorksheetInput = z.input<typeof worksheetSchema>

export const spreadSchema = z.object({ n: z.number(), mean: z.number(), sd: z.number().nullable(), cvPct: z.number().nullable(), min: z.number(), max: z.number() })

/** What a worksheet gives: the average and spread of its samples, written into the field's component. */
export const worksheetResultSchema = z.object({
  kind: componentKindSchema,
  kgDmPerHa: spreadSchema,
  /** Per-sample figures in the worksheet's order. */
  samples: z.array(z.object({ kgDmPerHa: z.number(), lbDmPerAcre: z.number(), dmPct: z.number().nullable(), buPerAcre: z.number().nullable(), headsPerAcre: z.number().nullable() })),
  buPerAcre: spreadSchema.nullable(),
  dmPct: spreadSchema.nullable(),
  basis: z.enum(['field', 'band']),
})
export type WorksheetResult = z.infer<typeof worksheetResultSchema>

export const estimateSchema = z.object({
  id: z.number(),
  fieldId: z.number(),
  componentId: z.number().nullable(),
  kind: componentKindSchema,
  method: z.enum(['head-count', 'clipped-frame']),
  measuredOn: z.string(),
  inputs: z.unknown(),
  result: worksheetResultSchema,
  createdBy: z.number().nullable(),
  createdAt: z.string(),
})
export type Estimate = z.infer<typeof estimateSchema>
