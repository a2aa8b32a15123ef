// The Pearson square: the two-feed mix that hits a target crude protein.
import { z } from 'zod'

export const pearsonInputSchema = z
  .object({
    a: z.object({ cpPct: z.number().finite().min(0).max(300) }).strict(),
    b: z.object({ cpPct: z.number().finite().min(0).max(300) }).strict(),
    targetCpPct: z.number().finite().min(0).max(300),
  })
  .strict()
  .superRefine((v, ctx) => {
    const lo = Math.min(v.a.cpPct, v.b.cpPct)
    const hi = Math.max(v.a.cpPct, v.b.cpPct)
    if (!(v.targetCpPct >= lo && v.targetCpPct <= hi) || lo === hi) {
      ctx.addIssue({ code: 'custom', path: ['targetCpPct'], message: 'The target must lie between the two feeds\' CP, and the feeds must differ.' })
    }
  })
export type PearsonInput = z.infer<typeof pearsonInputSchema>

/**
 * Fractions of feed A and feed B (DM basis) whose blend has the target CP: parts of A = |CP_B − target|, parts of B = |CP_A − target|.
 * Source: the Pearson square as worked in Montana State Univ. Extension, "Pearson Square Examples".
 */
export function pearsonSquare(input: PearsonInput): { fracA: number; fracB: number } {
  const v = pearsonInputSchema.parse(input)
  return pearsonFractions(v.a.cpPct, v.b.cpPct, v.targetCpPct)
}

/** The square's arithmetic on values already checked (target between two different CPs). */
export function pearsonFractions(cpA: number, cpB: number, target: number): { fracA: number; fracB: number } {
  const partsA = Math.abs(cpB - target)
  const partsB = Math.abs(cpA - target)
  const total = partsA + partsB
  return { fracA: partsA / total, fracB: partsB / total }
}
