// Display units for the grazing screens: US customary by default (ac, ft, in, lb, bu, $/ton) or metric, from the session's unit system; the API stays in SI.
import { computed } from 'vue'
import { useSessionStore } from '@/stores/session'
import { ACRE_M2, FT_M, IN_M, LB_KG, TON_KG, SORGHUM_BU_LB } from '@shared/engine/units'
import type { UnitSystem } from '@shared/schemas/common'

const HA_PER_AC = ACRE_M2 / 10_000
/** kg/ha → lb/ac: (kg ÷ lb) per (ha ÷ ac). */
const KGHA_TO_LBAC = HA_PER_AC / LB_KG

type Def = { us: string; metric: string; metricUnit?: string; toUs: number; toMetric?: number }
/** Each quantity: its SI value times the factor gives the display value. */
const DEFS = {
  area: { us: 'ac', metric: 'ha', toUs: 1 / HA_PER_AC },
  length: { us: 'ft', metric: 'm', toUs: 1 / FT_M },
  rowSpacing: { us: 'in', metric: 'cm', toUs: 1 / IN_M, toMetric: 100 },
  dmPerArea: { us: 'lb DM/ac', metric: 'kg DM/ha', toUs: KGHA_TO_LBAC },
  nPerArea: { us: 'lb N/ac', metric: 'kg N/ha', toUs: KGHA_TO_LBAC },
  mass: { us: 'lb', metric: 'kg', toUs: 1 / LB_KG },
  frameArea: { us: 'ft²', metric: 'm²', toUs: 1 / (FT_M * FT_M) },
  /** Feed prices: per short ton or per tonne, as fed, from a price per kg. */
  pricePerMass: { us: '$/ton', metric: '$/tonne', toUs: TON_KG, toMetric: 1000 },
  pricePerArea: { us: '$/ac', metric: '$/ha', toUs: HA_PER_AC },
  pricePerN: { us: '$/lb N', metric: '$/kg N', toUs: LB_KG },
} satisfies Record<string, Def>
export type Quantity = keyof typeof DEFS

export function unitsFor(system: UnitSystem) {
  const us = system === 'us'
  const factor = (q: Quantity) => (us ? DEFS[q].toUs : ((DEFS[q] as Def).toMetric ?? 1))
  const unit = (q: Quantity) => (us ? DEFS[q].us : DEFS[q].metric)
  const show = (q: Quantity, si: number) => si * factor(q)
  const toSi = (q: Quantity, v: number) => v / factor(q)
  const num = (v: number, digits = 0) => (Number.isFinite(v) ? v.toLocaleString('en-US', { maximumFractionDigits: digits, minimumFractionDigits: 0 }) : '—')
  const fmt = (q: Quantity, si: number, digits = 0) => `${num(show(q, si), digits)} ${unit(q)}`
  /** Standing grain: bushels per acre in US units, kg per hectare as-is in metric. */
  const grain = (kgAsIsPerHa: number) => (us ? `${num((kgAsIsPerHa * HA_PER_AC) / (SORGHUM_BU_LB * LB_KG), 0)} bu/ac` : `${num(kgAsIsPerHa, 0)} kg/ha`)
  /** Dollars with fixed decimals (prices are the user's own; the app has no currency setting). */
  const money = (v: number, digits = 0) => (Number.isFinite(v) ? `$${v.toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits })}` : '—')
  return { system, us, unit, show, toSi, fmt, num, grain, money }
}

export function useUnits() {
  const session = useSessionStore()
  return computed(() => unitsFor(session.unitSystem))
}

/** A calendar date as "Nov 15" (or with the year), read in UTC so it never shifts a day with the viewer's zone. */
export function fmtDate(iso: string | null | undefined, withYear = false): string {
  if (!iso) return '—'
  return new Date(`${iso}T00:00:00Z`).toLocaleDateString('en-US', { month: 'short', day: 'numeric', ...(withYear ? { year: 'numeric' } : {}), timeZone: 'UTC' })
}
export function fmtTime(isoDateTime: string): string {
  return new Date(isoDateTime).toLocaleTimeString('en-US', { hour: 'numeric', minute: '2-digit' })
}
/** Today's calendar date in the viewer's zone (the crew's day). */
export function localToday(now = new Date()): string {
  return `${now.getFullYear()}-${String(now.getMonth() + 1).padStart(2, '0')}-${String(now.getDate()).padStart(2, '0')}`
}
