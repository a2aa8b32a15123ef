// Weathering defaults and book quality values for standing sorghum and corridor legume through winter.
import type { Cited } from './common'
import type { ComponentKind, ComponentQuality, CorridorLegume, WeatheringRate, WeatheringSettings } from './field'

/**
 * Monthly weathering of standing feed. No published monthly loss exists for standing grain sorghum or a corridor
 * legume, so every figure here is a default (evidence 'default') the user should replace with their own. Nearest
 * published figures, which these defaults are placed against:
 * - ungrazed maize residue lost 21 % of DM over ≈3 months, ≈7.6 %/month compounding (van Pletzen, Meissner &
 *   Laas 1991, S. Afr. J. Anim. Sci. 21(4):178–184) [read; monthly rate derived]; sorghum leaves stay attached far
 *   longer than corn leaves (UNL CropWatch 2023, 2024) [read], hence a lower stover default;
 * - corn leaf TDN fell from 51–52 % (Nov) to 47–51 % (Dec) (K-State eUpdate "Crop residues", Table 1) [read], and
 *   rain leaches sugars so TDN falls faster than CP (farms.com, UNL source) [read];
 * - legume leaf is largely shed after a killing frost while pods and seed remain (common practice; Manitoba
 *   Agriculture "Stockpiled forages" on leaf loss driving quality) [read].
 */
export const WEATHERING_DEFAULTS: Record<ComponentKind, Cited<WeatheringRate>> = {
  'sorghum-grain': {
    value: { dmLossPerMonth: 0.02, cpDropPtsPerMonth: 0, tdnDropPtsPerMonth: 0.5 },
    source: 'default: no published rate for grain left on standing heads',
    evidence: 'default',
  },
  'sorghum-stover': {
    value: { dmLossPerMonth: 0.05, cpDropPtsPerMonth: 0.3, tdnDropPtsPerMonth: 1.5 },
    source: 'default, set below the ≈7.6 %/month maize-residue figure of van Pletzen et al. 1991 because sorghum keeps its leaves longer',
    evidence: 'default',
  },
  'legume-forage': {
    value: { dmLossPerMonth: 0.1, cpDropPtsPerMonth: 1, tdnDropPtsPerMonth: 2 },
    source: 'default: no published rate for cowpea or forage soybean standing in a corridor',
    evidence: 'default',
  },
  'legume-seed': {
    value: { dmLossPerMonth: 0.03, cpDropPtsPerMonth: 0, tdnDropPtsPerMonth: 0.5 },
    source: 'default: no published rate for legume pods left standing',
    evidence: 'default',
  },
}

/** Share of legume forage dry matter lost at the first killing frost (default; "most leaf is lost", common practice). */
export const DEFAULT_LEGUME_FORAGE_LOSS_AT_KILLING_FROST: Cited<number> = {
  value: 0.5,
  source: 'default: legume leaf is largely shed after a killing frost, pods and seed remain (common practice)',
  evidence: 'default',
}

/** Rates for one component: the field's overrides laid over WEATHERING_DEFAULTS (defaults, no published rate). */
export function weatheringRateFor(kind: ComponentKind, settings?: WeatheringSettings): { rate: WeatheringRate; isDefault: boolean } {
  const base = WEATHERING_DEFAULTS[kind].value
  const over = settings?.rates?.[kind]
  if (!over) return { rate: base, isDefault: true }
  const rate = { ...base, ...Object.fromEntries(Object.entries(over).filter(([, v]) => v !== undefined)) } as WeatheringRate
  const isDefault =
    rate.dmLossPerMonth === base.dmLossPerMonth &&
    rate.cpDropPtsPerMonth === base.cpDropPtsPerMonth &&
    rate.tdnDropPtsPerMonth === base.tdnDropPtsPerMonth
  return { rate, isDefault }
}

/**
 * Remaining share of dry matter after `months` at a compounding monthly loss, the form in which van Pletzen et al.
 * 1991's 21 % over ≈3 months becomes ≈7.6 %/month (derived).
 */
export function massRetained(dmLossPerMonth: number, months: number): number {
  return Math.pow(1 - dmLossPerMonth, Math.max(0, months))
}

/** Quality after weathering: CP and TDN fall linearly by the monthly drops (defaults; see WEATHERING_DEFAULTS), never below zero. */
export function weatheredQuality(q: ComponentQuality, rate: WeatheringRate, months: number): ComponentQuality {
  const m = Math.max(0, months)
  return {
    ...q,
    cpPctDm: Math.max(0, q.cpPctDm - rate.cpDropPtsPerMonth * m),
    tdnPctDm: Math.max(0, q.tdnPctDm - rate.tdnDropPtsPerMonth * m),
  }
}

/**
 * Book values on a DM basis, used only when a component has no lab result. Each carries its source and label.
 * Legume TDN is derived from ADF with the common lab equation TDN = 88.9 − 0.779 × ADF (equation from memory).
 */
export const BOOK_QUALITY = {
  'sorghum-grain': {
    cpPctDm: 11.5,
    tdnPctDm: 82,
    source: { kind: 'book', label: 'Sorghum grain: NRC Nutrient Requirements of Beef Cattle, 7th rev. ed. (1996), feed table (from memory)', evidence: 'from memory' },
  },
  'sorghum-stover': {
    cpPctDm: 9.7,
    tdnPctDm: 58,
    source: {
      kind: 'book',
      label: 'Grain sorghum residue: Oklahoma State Univ. PSS-2607, nine hybrids, CP 9 and 10.4 % at two sites (mean 9.7 % derived), TDN ≈58 %',
      evidence: 'read',
    },
  },
  'cowpea-forage': {
    cpPctDm: 17,
    tdnPctDm: 64,
    adfPctDm: 32,
    ndfPctDm: 37,
    source: {
      kind: 'book',
      label: 'Cowpea interseeded forage: LSU AgCenter forage blog (Han 2012), CP 17 %, ADF 32 %, NDF 37 % [read]; TDN derived from ADF',
      evidence: 'derived',
    },
  },
  'forage-soybean-forage': {
    cpPctDm: 20,
    tdnPctDm: 65.5,
    adfPctDm: 30,
    ndfPctDm: 40,
    source: {
      kind: 'book',
      label: 'Soybean forage: UW Extension "Using soybean as forage" (Wiederholt & Albrecht), CP 20 %, ADF 30 %, NDF 40 % [read]; TDN derived from ADF',
      evidence: 'derived',
    },
  },
  'cowpea-seed': {
    cpPctDm: 25,
    tdnPctDm: 80,
    source: { kind: 'book', label: 'Cowpea seed: typical feed-table values (from memory)', evidence: 'from memory' },
  },
  'forage-soybean-seed': {
    cpPctDm: 40,
    tdnPctDm: 90,
    source: { kind: 'book', label: 'Whole soybean seed: NRC 1996 feed table (from memory)', evidence: 'from memory' },
  },
} as const satisfies Record<string, ComponentQuality>

/** Book quality for a component on a field with the given legume; each value carries its source (BOOK_QUALITY). */
export function bookQuality(kind: ComponentKind, legume: CorridorLegume): ComponentQuality {
  switch (kind) {
    case 'sorghum-grain':
      return BOOK_QUALITY['sorghum-grain']
    case 'sorghum-stover':
      return BOOK_QUALITY['sorghum-stover']
    case 'legume-forage':
      return legume === 'forage-soybean' ? BOOK_QUALITY['forage-soybean-forage'] : BOOK_QUALITY['cowpea-forage']
    case 'legume-seed':
      return legume === 'forage-soybean' ? BOOK_QUALITY['forage-soybean-seed'] : BOOK_QUALITY['cowpea-seed']
  }
}
