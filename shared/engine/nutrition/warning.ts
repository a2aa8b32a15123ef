// The warning record every nutrition function returns: a stable code, plain words and the source it rests on.
import { z } from 'zod'

export const warningCodes = [
  'nem-out-of-range',
  'neg-out-of-range',
  'nitrate',
  'grain-share',
  'grain-share-unset',
  'urea',
  'urea-share',
  'copper-sheep',
  'copper-cattle',
  'cattle-product-for-sheep',
  'dmi-above-capacity',
  'mineral-value-missing',
  'ca-p-ratio',
  'supplement-unpriced',
  'solver-fallback',
  'solver-check-failed',
  'requirement-note',
] as const

export const warningSchema = z.object({
  code: z.enum(warningCodes),
  message: z.string(),
  source: z.string(),
  feedId: z.string().optional(),
})
export type NutritionWarning = z.infer<typeof warningSchema>
export type WarningCode = (typeof warningCodes)[number]
