// Herds, feeds, lab results (with the CSV upload), balances and reports API calls; every response is parsed with its shared schema.
import { z } from 'zod'
import { api, ApiRequestError } from './client'
import type { ApiError } from '@shared/schemas/common'
import { herdSchema, type HerdInput, type HerdUpdate } from '@shared/schemas/nutrition/herds'
import { feedSchema, type FeedInput, type FeedUpdate } from '@shared/schemas/nutrition/feeds'
import { labResultSchema, uploadSchema, type LabResultInput, type LabResultUpdate } from '@shared/schemas/nutrition/labResults'
import { balanceSchema, type BalanceSelection, type ReportEmail } from '@shared/schemas/nutrition/balances'
import { requirementsSchema } from '@shared/engine/nutrition/requirements'
import { feedSchema as engineFeedSchema } from '@shared/engine/nutrition/ration/schema'
import type { ListQuery } from '@shared/schemas/nutrition/common'

const op = (id: number) => `/operations/${id}`
async function parsed<S extends z.ZodType>(schema: S, p: Promise<unknown>): Promise<z.output<S>> {
  return schema.parse(await p)
}
const page = <S extends z.ZodType>(item: S) => z.object({ items: z.array(item), total: z.number(), page: z.number(), pageSize: z.number() })
type Query = Partial<ListQuery> & Record<string, string | number | boolean | undefined>

export const labResultWithEffectSchema = labResultSchema.extend({ affectedBalances: z.array(z.number()).optional() })
export const uploadPreviewSchema = uploadSchema.extend({ acceptedLines: z.array(z.number()).optional(), affectedBalances: z.array(z.number()).optional() })
export const fieldOfferSchema = z.object({
  field: z.object({ id: z.number(), name: z.string() }),
  fieldName: z.string().optional(),
  feeds: z.array(engineFeedSchema),
  fieldOffer: z.array(z.object({ feedId: z.string(), shareOfDm: z.number() })),
  labResultIds: z.array(z.number()).optional(),
})
export const requirementsResponseSchema = z.object({ herdId: z.number(), date: z.string(), stage: z.record(z.string(), z.unknown()), requirements: requirementsSchema, notes: z.array(z.string()) })
export const reportSendSchema = z.object({ id: z.number(), balanceId: z.number().nullable(), balanceVersion: z.number().nullable(), recipients: z.array(z.string()), sentBy: z.object({ id: z.number().nullable(), name: z.string() }), sentAt: z.string() })

export const herdsApi = {
  list: (opId: number, query: Query = {}) => parsed(page(herdSchema), api(`${op(opId)}/herds`, { query })),
  get: (opId: number, id: number) => parsed(herdSchema, api(`${op(opId)}/herds/${id}`)),
  create: (opId: number, body: HerdInput) => parsed(herdSchema, api(`${op(opId)}/herds`, { method: 'POST', body })),
  update: (opId: number, id: number, body: HerdUpdate) => parsed(herdSchema, api(`${op(opId)}/herds/${id}`, { method: 'PATCH', body })),
  remove: (opId: number, id: number) => api<void>(`${op(opId)}/herds/${id}`, { method: 'DELETE' }),
  requirements: (opId: number, id: number, date?: string) => parsed(requirementsResponseSchema, api(`${op(opId)}/herds/${id}/requirements`, { query: { date } })),
}

export const feedsApi = {
  list: (opId: number, query: Query = {}) => parsed(page(feedSchema), api(`${op(opId)}/feeds`, { query })),
  get: (opId: number, id: number) => parsed(feedSchema, api(`${op(opId)}/feeds/${id}`)),
  create: (opId: number, body: FeedInput) => parsed(feedSchema, api(`${op(opId)}/feeds`, { method: 'POST', body })),
  update: (opId: number, id: number, body: FeedUpdate) => parsed(feedSchema, api(`${op(opId)}/feeds/${id}`, { method: 'PATCH', body })),
  remove: (opId: number, id: number) => api<void>(`${op(opId)}/feeds/${id}`, { method: 'DELETE' }),
}

export const labResultsApi = {
  list: (opId: number, query: Query = {}) => parsed(page(labResultSchema), api(`${op(opId)}/lab-results`, { query })),
  get: (opId: number, id: number) => parsed(labResultSchema, api(`${op(opId)}/lab-results/${id}`)),
  create: (opId: number, body: LabResultInput) => parsed(labResultWithEffectSchema, api(`${op(opId)}/lab-results`, { method: 'POST', body })),
  update: (opId: number, id: number, body: LabResultUpdate) => parsed(labResultWithEffectSchema, api(`${op(opId)}/lab-results/${id}`, { method: 'PATCH', body })),
  remove: (opId: number, id: number) => api<void>(`${op(opId)}/lab-results/${id}`, { method: 'DELETE' }),
  uploadStatus: (opId: number, id: number, rows?: { page?: number; pageSize?: number; status?: 'accepted' | 'refused' }) =>
    parsed(uploadPreviewSchema, api(`${op(opId)}/lab-results/uploads/${id}`, { query: rows ? { rows: 1, ...rows } : {} })),
  confirmUpload: (opId: number, id: number, lines: number[]) => parsed(uploadPreviewSchema, api(`${op(opId)}/lab-results/uploads/${id}/confirm`, { method: 'POST', body: { lines } })),
}

export const balancesApi = {
  list: (opId: number, query: Query = {}) => parsed(page(balanceSchema), api(`${op(opId)}/balances`, { query })),
  get: (opId: number, id: number, version?: number) => parsed(balanceSchema, api(`${op(opId)}/balances/${id}`, { query: { version } })),
  create: (opId: number, body: BalanceSelection) => parsed(balanceSchema, api(`${op(opId)}/balances`, { method: 'POST', body })),
  rerun: (opId: number, id: number, body: Partial<BalanceSelection> & { version: number }) => parsed(balanceSchema, api(`${op(opId)}/balances/${id}/runs`, { method: 'POST', body })),
  rename: (opId: number, id: number, name: string | null, version: number) => parsed(balanceSchema, api(`${op(opId)}/balances/${id}`, { method: 'PATCH', body: { name, version } })),
  remove: (opId: number, id: number) => api<void>(`${op(opId)}/balances/${id}`, { method: 'DELETE' }),
  rerunOutOfDate: (opId: number, ids?: number[]) =>
    parsed(z.object({ rerun: z.array(z.union([z.object({ id: z.number(), version: z.number(), status: z.string() }), z.object({ id: z.number(), error: z.string() })])) }), api(`${op(opId)}/balances/rerun-out-of-date`, { method: 'POST', body: ids ? { ids } : {} })),
  fieldOffer: (opId: number, fieldId: number, date: string) => parsed(fieldOfferSchema, api(`${op(opId)}/balances/field-offer`, { query: { fieldId, date } })),
  email: (opId: number, id: number, body: ReportEmail) => api<{ id: number; to: string[]; version: number }>(`${op(opId)}/balances/${id}/email`, { method: 'POST', body }),
  sends: (opId: number, query: Query = {}) => parsed(page(reportSendSchema), api(`${op(opId)}/report-sends`, { query })),
}

/** Links the browser opens directly (downloads keep the session cookie). */
export const nutritionLinks = {
  pdf: (opId: number, id: number, units: string, version?: number, download = false) =>
    `/api${op(opId)}/balances/${id}/report.pdf?units=${units}${version ? `&version=${version}` : ''}${download ? '&download=1' : ''}`,
  csv: (opId: number, table: 'herds' | 'feeds' | 'lab-results' | 'balances', units: string) => `/api${op(opId)}/${table}/export.csv?units=${units}`,
  balanceCsv: (opId: number, id: number, units: string) => `/api${op(opId)}/balances/${id}/export.csv?units=${units}`,
  labTemplate: (opId: number) => `/api${op(opId)}/lab-results/template.csv`,
}

function csrf(): string | undefined {
  const m = document.cookie.match(/(?:^|;\s*)sg_csrf=([^;]+)/)
  return m ? decodeURIComponent(m[1]) : undefined
}

/** Sends a lab CSV with upload progress (fetch has none); resolves with the preview record, rejects with the API's error. */
export function uploadLabCsv(opId: number, file: File, onProgress: (fraction: number) => void): Promise<z.output<typeof uploadPreviewSchema>> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest()
    xhr.open('POST', `/api${op(opId)}/lab-results/uploads`)
    xhr.withCredentials = true
    const token = csrf()
    if (token) xhr.setRequestHeader('X-CSRF-Token', token)
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress(e.loaded / e.total)
    }
    xhr.onerror = () => reject(new ApiRequestError({ status: 0, code: 'network_error', message: 'Could not reach the server. Check the connection and try again.' }))
    xhr.onload = () => {
      let body: unknown = null
      try {
        body = JSON.parse(xhr.responseText)
      } catch {
        body = null
      }
      if (xhr.status >= 200 && xhr.status < 300) {
        onProgress(1)
        resolve(uploadPreviewSchema.parse(body))
      } else {
        const info = (body as { error?: ApiError } | null)?.error ?? { status: xhr.status, code: 'http_error', message: `The server answered ${xhr.status}.` }
        reject(new ApiRequestError(info))
      }
    }
    const form = new FormData()
    form.append('file', file)
    xhr.send(form)
  })
}
