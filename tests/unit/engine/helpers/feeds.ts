// Feed and problem builders for balance tests; compositions are published book values (source on each).
import type { Feed, RationProblem, Requirements } from '../../../../shared/engine/index'

/** Sorghum grain, NRC 1996 / NASEM 2016 book values (from memory). */
export const sorghumGrain = (o: Partial<Feed> = {}): Feed => ({ id: 'grain', name: 'Sorghum grain', role: 'field', dmPct: 89, cpPctDm: 11.5, tdnPctDm: 82, caPctDm: 0.04, pPctDm: 0.35, isGrain: true, ...o })
/** Sorghum stover, NRC 1996 book values (from memory). */
export const sorghumStover = (o: Partial<Feed> = {}): Feed => ({ id: 'stover', name: 'Sorghum stover', role: 'field', dmPct: 85, cpPctDm: 5.2, tdnPctDm: 54, caPctDm: 0.49, pPctDm: 0.12, ...o })
/** Cowpea forage: CP within the read 15–20 % range (U. Khartoum; NSW DPI); TDN, Ca, P from memory. */
export const cowpea = (o: Partial<Feed> = {}): Feed => ({ id: 'cowpea', name: 'Cowpea forage', role: 'field', dmPct: 30, cpPctDm: 17, tdnPctDm: 57, caPctDm: 1.3, pPctDm: 0.27, isLegume: true, ...o })
/** Range cube, 38–40 % CP (common practice; use the product tag). */
export const rangeCube = (o: Partial<Feed> = {}): Feed => ({ id: 'cube', name: 'Range cube 38 % CP', role: 'supplement', dmPct: 90, cpPctDm: 38, tdnPctDm: 72, caPctDm: 1.0, pPctDm: 1.0, costPerKgDm: 0.55, ...o })
/** Dicalcium phosphate: Ca 21–23 %, P 18–19 % (NDDB India spec; feed-grade DCP listing — read). */
export const dicalcium = (o: Partial<Feed> = {}): Feed => ({ id: 'dcp', name: 'Dicalcium phosphate', role: 'mineral', dmPct: 97, cpPctDm: 0, tdnPctDm: 0, caPctDm: 22, pPctDm: 18.5, costPerKgDm: 0.9, ...o })
/** Cattle trace-mineral salt: 300–400 mg/kg Cu (Berger, Univ. of Illinois — read). */
export const cattleMineral = (o: Partial<Feed> = {}): Feed => ({ id: 'tmsalt', name: 'Cattle trace-mineral salt', role: 'mineral', dmPct: 99, cpPctDm: 0, tdnPctDm: 0, caPctDm: 12, pPctDm: 8, cuMgPerKgDm: 350, cattleOnly: true, costPerKgDm: 0.6, ...o })

export const problemOf = (requirements: Requirements, feeds: Feed[], extra: Partial<RationProblem> = {}): RationProblem => ({
  species: 'cattle',
  requirements,
  feeds,
  ...extra,
})
