// The Requirements record shared by the cattle and sheep models and by the ration balance.
import { z } from 'zod'

const amount = z.number().finite().min(0)

export const requirementComponentsSchema = z.object({
  maintenanceNemMcal: amount,
  pregnancyNemMcal: amount,
  lactationNemMcal: amount,
  growthNegMcal: amount,
  coldStressNemMcal: amount,
})

/** Daily needs per head, SI: kg DM, kg TDN, Mcal, kg CP, g Ca and P. */
export const requirementsSchema = z.object({
  dmiKg: z.number().finite().gt(0),
  tdnKg: amount,
  meMcal: amount,
  nemMcal: amount.optional(),
  negMcal: amount.optional(),
  cpKg: amount,
  caG: amount,
  pG: amount,
  components: requirementComponentsSchema.optional(),
  notes: z.array(z.string()),
  sources: z.array(z.string()),
})
export type Requirements = z.infer<typeof requirementsSchema>
