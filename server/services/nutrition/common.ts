// Helpers every nutrition service shares: paging, the optimistic-version check (409 with both versions), actors' names, dates.
import { Op, type Order, type WhereOptions } from 'sequelize'
import { AppError, validationError } from '../../errors'
import { User } from '../../models/index'
import type { ListQuery } from '../../../shared/schemas/nutrition/common'
import type { z } from 'zod'
import type { Actor } from '../../../shared/schemas/nutrition/common'

export type Paged<T> = { items: T[]; total: number; page: number; pageSize: number }

export function paging(q: Pick<ListQuery, 'page' | 'pageSize'>) {
  return { limit: q.pageSize, offset: (q.page - 1) * q.pageSize }
}

/** Sort by a whitelisted column (unknown keys fall back to the default), always with id as the tie-breaker. */
export function ordering(q: Pick<ListQuery, 'sort' | 'dir'>, allowed: readonly string[], fallback: string): Order {
  const col = q.sort && allowed.includes(q.sort) ? q.sort : fallback
  const dir = q.dir === 'desc' ? 'DESC' : 'ASC'
  return [[col, dir], ['id', dir]]
}

export function textFilter(q: string | undefined, columns: string[]): WhereOptions | undefined {
  const t = q?.trim()
  if (!t) return undefined
  const like = `%${t.replace(/[\\%_]/g, (c) => `\\${c}`)}%`
  return { [Op.or]: columns.map((c) => ({ [c]: { [Op.iLike]: like } })) }
}

/** Parses with a shared schema; failures become the one 400 shape naming each field. */
export function parseWith<S extends z.ZodType>(schema: S, value: unknown, where = 'request body'): z.output<S> {
  const r = schema.safeParse(value)
  if (!r.success) throw validationError(r.error, where)
  return r.data
}

/** A stale version is a conflict: the caller gets both the version it sent and the current record. */
export function assertVersion<T>(current: { version: number }, sent: number, what: string, currentView: () => T, submitted: unknown) {
  if (current.version !== sent) {
    throw AppError.conflict(
      `This ${what} was changed by someone else (you edited version ${sent}; it is now version ${current.version}). Review both and save again.`,
      { current: currentView(), submitted: { version: sent, changes: submitted } },
    )
  }
}

export async function actors(ids: Array<number | null | undefined>): Promise<Map<number, string>> {
  const wanted = [...new Set(ids.filter((x): x is number => typeof x === 'number'))]
  const map = new Map<number, string>()
  if (wanted.length) for (const u of await User.findAll({ where: { id: wanted }, attributes: ['id', 'name'] })) map.set(u.id, u.name)
  return map
}
export function actor(map: Map<number, string>, id: number | null | undefined, fallback = 'someone'): Actor {
  return { id: id ?? null, name: id != null ? (map.get(id) ?? fallback) : fallback }
}

export const iso = (d: Date | string) => (typeof d === 'string' ? d : d.toISOString())
// One notion of "today" for every service: the farm's calendar day.
export { todayIso } from '../dates'

/**
 * Copies the keys the client actually sent (a schema's defaults must not overwrite stored values on a partial update).
 * `raw` is the request body as received; `parsed` the same body after the schema.
 */
export function applyPatch<T extends object>(base: T, parsed: object, raw: unknown): T {
  const out = { ...base } as Record<string, unknown>
  const sent = raw && typeof raw === 'object' ? Object.keys(raw) : []
  for (const k of sent) if (k !== 'version' && k in parsed) out[k] = (parsed as Record<string, unknown>)[k]
  return out as T
}

/** The parsed values of only the keys the client sent. */
export function pickSent(parsed: object, raw: unknown): Record<string, unknown> {
  const out: Record<string, unknown> = {}
  const sent = raw && typeof raw === 'object' ? Object.keys(raw) : []
  for (const k of sent) if (k !== 'version' && k in parsed) out[k] = (parsed as Record<string, unknown>)[k]
  return out
}
