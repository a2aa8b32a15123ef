// Lab results: one analysis of a feed or a field component, entered on either basis and stored on a DM basis, with its edit history.
import { z } from 'zod'
import { NO3_PER_NO3N } from '../../engine/nutrition/conversions'
import { tdnFromAdf } from '../../engine/nutrition/energy'
import { actorSchema, isoDay, optNum, optText, positiveId, versionSchema } from './common'

/** Field components a sample can come from (the same kinds the Fields screens use). */
export const labComponents = ['sorghum-grain', 'sorghum-stover', 'legume-forage', 'legume-seed'] as const
export type LabComponent = (typeof labComponents)[number]
export const labComponentLabels: Record<LabComponent, string> = {
  'sorghum-grain': 'Sorghum grain',
  'sorghum-stover': 'Sorghum leaf and stalk',
  'legume-forage': 'Legume forage',
  'legume-seed': 'Legume seed and pods',
}
export const labBases = ['dm', 'as-fed'] as const
export type LabBasis = (typeof labBases)[number]
export const nitrateForms = ['NO3-N', 'NO3'] as const
export type NitrateForm = (typeof nitrateForms)[number]


/** The analysed values, each on the basis the lab reported (DM % is always as fed). */
export const labValueFields = {
  dmPct: optNum(1, 100, 'dry matter', '%'),
  cpPct: optNum(0, 300, 'crude protein', '%'),
  tdnPct: optNum(0, 100, 'TDN', '%'),
  adfPct: optNum(0, 100, 'ADF', '%'),
  ndfPct: optNum(0, 100, 'NDF', '%'),
  caPct: optNum(0, 40, 'calcium', '%'),
  pPct: optNum(0, 25, 'phosphorus', '%'),
  nitratePpm: optNum(0, 100_000, 'nitrate', 'ppm'),
  cuMgPerKg: optNum(0, 10_000, 'copper', 'mg/kg'),
}
export const labValueKeys = Object.keys(labValueFields) as Array<keyof typeof labValueFields>

export const labResultFields = z.object({
  feedId: positiveId.nullable().optional(),
  fieldId: positiveId.nullable().optional(),
  component: z.enum(labComponents).nullable().optional(),
  sampleDate: isoDay,
  labName: z.string({ error: 'Enter the lab name.' }).trim().min(1, 'Enter the lab name.').max(120, 'Use at most 120 characters.'),
  sampleRef: optText(60),
  basis: z.enum(labBases, { error: 'Say whether the values are on a DM or an as-fed basis.' }).default('dm'),
  nitrateForm: z.enum(nitrateForms).nullable().optional(),
  ...labValueFields,
  notes: optText(2000),
})

function labRules(r: z.infer<typeof labResultFields>, ctx: z.RefinementCtx) {
  const hasFeed = r.feedId != null
  const hasField = r.fieldId != null || r.component != null
  if (!hasFeed && !hasField) ctx.addIssue({ code: 'custom', path: ['feedId'], message: 'Say which feed or field component was sampled.' })
  if (hasFeed && hasField) ctx.addIssue({ code: 'custom', path: ['feedId'], message: 'A sample is of a feed or of a field component, not both.' })
  if (hasField && (r.fieldId == null || r.component == null)) ctx.addIssue({ code: 'custom', path: [r.fieldId == null ? 'fieldId' : 'component'], message: 'Give both the field and the component.' })
  if (r.dmPct == null) ctx.addIssue({ code: 'custom', path: ['dmPct'], message: 'Enter the dry matter: every conversion needs it.' })
  if (r.cpPct == null) ctx.addIssue({ code: 'custom', path: ['cpPct'], message: 'Enter the crude protein.' })
  if (r.tdnPct == null && r.adfPct == null) ctx.addIssue({ code: 'custom', path: ['tdnPct'], message: 'Enter TDN, or ADF so TDN can be estimated.' })
  if (r.nitratePpm != null && !r.nitrateForm) ctx.addIssue({ code: 'custom', path: ['nitrateForm'], message: 'Say whether nitrate is reported as NO3 or NO3-N.' })
  if (r.adfPct != null && r.ndfPct != null && r.adfPct > r.ndfPct) ctx.addIssue({ code: 'custom', path: ['adfPct'], message: 'ADF cannot exceed NDF (ADF is part of NDF).' })
  if (r.basis === 'as-fed' && r.dmPct != null) {
    // On an as-fed basis no nutrient can exceed the dry matter it sits in.
    for (const k of ['cpPct', 'tdnPct', 'adfPct', 'ndfPct'] as const) {
      const v = r[k]
      if (v != null && k !== 'cpPct' && v > r.dmPct) ctx.addIssue({ code: 'custom', path: [k], message: `As fed, this cannot exceed the dry matter (${r.dmPct} %).` })
    }
  }
}

export const labResultCreateSchema = labResultFields.superRefine(labRules)
export type LabResultInput = z.input<typeof labResultCreateSchema>
export type LabResultValues = z.output<typeof labResultCreateSchema>
/** An edit sends the changed fields, on the basis it names, and the version it started from. */
export const labResultUpdateSchema = labResultFields.partial().extend({ version: versionSchema })
export type LabResultUpdate = z.input<typeof labResultUpdateSchema>

/** Stored values, all on a DM basis (nitrate as NO3-N ppm of DM). */
export const labStoredFields = {
  dmPct: z.number(),
  cpPctDm: z.number(),
  tdnPctDm: z.number(),
  tdnEstimated: z.boolean(),
  adfPctDm: z.number().nullable(),
  ndfPctDm: z.number().nullable(),
  caPctDm: z.number().nullable(),
  pPctDm: z.number().nullable(),
  nitrateNPpmDm: z.number().nullable(),
  cuMgPerKgDm: z.number().nullable(),
}
export type LabStored = { [K in keyof typeof labStoredFields]: z.infer<(typeof labStoredFields)[K]> }
export const labStoredKeys = Object.keys(labStoredFields) as Array<keyof LabStored>

export const labChangeSchema = z.object({ field: z.string(), from: z.unknown(), to: z.unknown() })
export const labHistoryEntrySchema = z.object({
  version: z.number(),
  changedAt: z.string(),
  by: actorSchema,
  changes: z.array(labChangeSchema),
})
export type LabHistoryEntry = z.infer<typeof labHistoryEntrySchema>

export const labResultSchema = z.object({
  id: z.number(),
  operationId: z.number(),
  feedId: z.number().nullable(),
  feedName: z.string().nullable(),
  fieldId: z.number().nullable(),
  component: z.enum(labComponents).nullable(),
  sampleDate: z.string(),
  labName: z.string(),
  sampleRef: z.string().nullable(),
  enteredBasis: z.enum(labBases),
  nitrateForm: z.enum(nitrateForms).nullable(),
  ...labStoredFields,
  notes: z.string().nullable(),
  version: z.number(),
  createdBy: actorSchema,
  updatedBy: actorSchema,
  createdAt: z.string(),
  updatedAt: z.string(),
  history: z.array(labHistoryEntrySchema).optional(),
})
export type LabResult = z.infer<typeof labResultSchema>

/** DDM % = 88.9 − 0.779 × ADF % (forage-testing shortcut; common practice, from memory), used as TDN when the lab gives none. */
export const TDN_FROM_ADF_EQUATION = 'TDN estimated from ADF: 88.9 − 0.779 × ADF % DM (forage-testing shortcut, common practice, from memory)'
export function tdnFromAdfPct(adfPctDm: number): number {
  return tdnFromAdf({ adfPctDm })
}

/**
 * Converts entered values to the stored DM basis: % DM = % as fed ÷ DM fraction (derived); nitrate to NO3-N
 * (NO3-N = NO3 ÷ 4.427, molar masses); TDN from ADF by the named shortcut when TDN is missing.
 */
export function labValuesToDm(v: Pick<LabResultValues, 'basis' | 'nitrateForm' | keyof typeof labValueFields>): LabStored {
  const dm = v.dmPct ?? 100
  const f = v.basis === 'as-fed' ? 100 / dm : 1
  const conv = (x: number | null | undefined) => (x == null ? null : x * f)
  const adf = conv(v.adfPct)
  const tdnGiven = conv(v.tdnPct)
  const tdnEstimated = tdnGiven == null && adf != null
  let nitrate = conv(v.nitratePpm)
  if (nitrate != null && v.nitrateForm === 'NO3') nitrate = nitrate / NO3_PER_NO3N
  return {
    dmPct: dm,
    cpPctDm: conv(v.cpPct) ?? 0,
    tdnPctDm: tdnGiven ?? (adf != null ? tdnFromAdfPct(adf) : 0),
    tdnEstimated,
    adfPctDm: adf,
    ndfPctDm: conv(v.ndfPct),
    caPctDm: conv(v.caPct),
    pPctDm: conv(v.pPct),
    nitrateNPpmDm: nitrate,
    cuMgPerKgDm: conv(v.cuMgPerKg),
  }
}

/** The stored record back to entry values on a DM basis (what an edit form starts from). */
export function labStoredToDmEntry(r: LabStored & { nitrateForm?: NitrateForm | null }) {
  return {
    basis: 'dm' as const,
    dmPct: r.dmPct,
    cpPct: r.cpPctDm,
    tdnPct: r.tdnEstimated ? null : r.tdnPctDm,
    adfPct: r.adfPctDm,
    ndfPct: r.ndfPctDm,
    caPct: r.caPctDm,
    pPct: r.pPctDm,
    nitratePpm: r.nitrateNPpmDm,
    nitrateForm: r.nitrateNPpmDm == null ? null : ('NO3-N' as const),
    cuMgPerKg: r.cuMgPerKgDm,
  }
}

// ── CSV upload ───────────────────────────────────────────────────────────────────────────────────────────────────
/** Size and row limits of one upload. */
export const LAB_UPLOAD_MAX_BYTES = 5 * 1024 * 1024
export const LAB_UPLOAD_MAX_ROWS = 10_000

/** Columns a lab CSV may have (header names, case-insensitive); feed by name, or field id + component. */
export const labCsvColumns = [
  'feed', 'field_id', 'component', 'sample_date', 'lab', 'sample_ref', 'basis',
  'dm', 'cp', 'tdn', 'adf', 'ndf', 'ca', 'p', 'nitrate', 'nitrate_form', 'cu', 'notes',
] as const

export const uploadRowSchema = z.object({
  line: z.number(),
  status: z.enum(['accepted', 'refused']),
  reasons: z.array(z.object({ field: z.string(), message: z.string() })),
  target: z.string().nullable(),
  values: z.record(z.string(), z.unknown()).nullable(),
})
export type UploadRow = z.infer<typeof uploadRowSchema>

export const uploadSchema = z.object({
  id: z.number(),
  filename: z.string(),
  status: z.enum(['parsing', 'ready', 'failed', 'confirmed']),
  processed: z.number(),
  total: z.number(),
  accepted: z.number(),
  refused: z.number(),
  error: z.string().nullable(),
  rows: z.array(uploadRowSchema).optional(),
  rowsTotal: z.number().optional(),
  createdIds: z.array(z.number()).optional(),
})
export type LabUpload = z.infer<typeof uploadSchema>

export const uploadConfirmSchema = z.object({
  /** The accepted lines the user confirms; only these are written, in one transaction. */
  lines: z.array(z.number().int().min(1)).min(1, 'Choose at least one accepted row to save.').max(LAB_UPLOAD_MAX_ROWS),
})

export const uploadRowsQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(1000).default(200),
  status: z.enum(['accepted', 'refused']).optional(),
})
