// Turns a ration problem into linear programs: least-cost with every need and limit, and least-shortfall diets.
import { energyOfTdn } from '../energy'
import type { LinearProgram, LpRow } from '../lp/program'
import type { Feed, Nutrient, ParsedRationProblem } from './schema'

/** Default limits, each with its label; all can be overridden in `limits`. */
export const DEFAULT_LIMITS = {
  /** Ca:P at least 1:1 (common practice). */
  minCaToP: 1,
  /** Urea at most ≈ 1 % of diet DM (common practice). */
  maxUreaShareOfDm: 0.01,
  /** Sheep: Cu at most 10 mg/kg DM — toxicity seen from ≈ 10 mg/kg (Berger, Univ. of Illinois, citing Church & Pond 1988 — read). */
  sheepMaxCuMgPerKgDm: 10,
  /** Field selection may depart ±0.10 of field DM from the offered shares (a default setting; no published figure). */
  selectionTolerance: 0.1,
} as const

export const NUTRIENT_UNIT: Record<Nutrient, 'kg' | 'Mcal' | 'g'> = { tdn: 'kg', nem: 'Mcal', neg: 'Mcal', cp: 'kg', ca: 'g', p: 'g' }

export interface FeedDensity {
  tdn: number
  nem: number
  neg: number
  cp: number
  ca: number
  p: number
  cu: number
}

/** Per kg DM: kg TDN, Mcal NEm and NEg, kg CP, g Ca and P, mg Cu. */
export function feedDensity(f: Feed): FeedDensity {
  const e = energyOfTdn(f.tdnPctDm)
  return {
    tdn: f.tdnPctDm / 100,
    nem: e.nemMcalPerKg,
    neg: e.negMcalPerKg,
    cp: f.cpPctDm / 100,
    ca: (f.caPctDm ?? 0) * 10,
    p: (f.pPctDm ?? 0) * 10,
    cu: f.cuMgPerKgDm ?? 0,
  }
}

export interface NeedSpec {
  nutrient: Nutrient
  need: number
}

/** What a limit row or bound is, as plain data; `limitText` puts it in words only when a conflict needs it. */
export interface LimitLabel {
  kind: 'intake' | 'grain' | 'urea' | 'ca-p-min' | 'ca-p-max' | 'ca-max' | 'p-max' | 'cu' | 'offer' | 'feed-max' | 'feed-min'
  value: number
  feed?: number
  low?: number
}
const label = (kind: LimitLabel['kind'], value: number, feed?: number, low?: number): LimitLabel => ({ kind, value, feed, low })

export function limitText(l: LimitLabel, ctx: RationContext): string {
  const name = l.feed === undefined ? '' : ctx.p.feeds[l.feed].name
  switch (l.kind) {
    case 'intake':
      return `intake capacity (${fmt(l.value)} kg DM/day)`
    case 'ca-max':
      return `Ca at most ${fmt(l.value)} g/day`
    case 'p-max':
      return `P at most ${fmt(l.value)} g/day`
    case 'ca-p-min':
      return `Ca:P at least ${fmt(l.value, 2)}:1`
    case 'ca-p-max':
      return `Ca:P at most ${fmt(l.value, 2)}:1`
    case 'grain':
      return `grain at most ${fmt(l.value * 100, 1)} % of diet DM`
    case 'urea':
      return `urea at most ${fmt(l.value * 100, 2)} % of diet DM`
    case 'cu':
      return `Cu at most ${fmt(l.value, 1)} mg/kg DM`
    case 'offer':
      return `what the field offers (${name} within ${fmt((l.low ?? 0) * 100, 0)}–${fmt(l.value * 100, 0)} % of field DM)`
    case 'feed-max':
      return `the availability of ${name} (at most ${fmt(l.value)} kg DM/day)`
    case 'feed-min':
      return `the minimum of ${name} (${fmt(l.value)} kg DM/day)`
  }
}

export interface RationLp {
  lp: LinearProgram
  /** For each LP column: the feed index, and which energy pool it feeds when NEm and NEg are split; -1 for shortfall columns. */
  colFeed: number[]
  colPool: ('all' | 'm' | 'g' | 'short')[]
  needRow: Partial<Record<Nutrient, number>>
  shortCol: Partial<Record<Nutrient, number>>
  /** Non-need rows and bounded columns, labelled for conflicts in words. */
  rowLimit: (LimitLabel | null)[]
  colLimit: (LimitLabel | null)[]
}

export interface RationContext {
  p: ParsedRationProblem
  density: FeedDensity[]
  needs: NeedSpec[]
  capacity: number
  split: boolean
  checkCa: boolean
  checkP: boolean
  /** Feeds the species may be offered (cattle-only products never go to sheep). */
  allowed: boolean[]
  limits: {
    minCaToP: number | undefined
    maxCaToP: number | undefined
    maxGrainShareOfDm: number | undefined
    maxUreaShareOfDm: number
    maxCaG: number | undefined
    maxPG: number | undefined
    maxCuMgPerKgDm: number | undefined
    selectionTolerance: number
  }
}

export function rationContext(p: ParsedRationProblem): RationContext {
  const r = p.requirements
  const density = p.feeds.map(feedDensity)
  const allowed = p.feeds.map((f) => !(p.species === 'sheep' && f.cattleOnly))
  const checkCa = p.feeds.some((f) => f.caPctDm !== undefined)
  const checkP = p.feeds.some((f) => f.pPctDm !== undefined)
  // Needs below a microgram or a microcalorie are nothing to balance (and would make the relative shortfall price blow up).
  const TINY = 1e-9
  const split = p.species === 'cattle' && r.nemMcal !== undefined && (r.negMcal ?? 0) > TINY
  const needs: NeedSpec[] = []
  const add = (nutrient: Nutrient, need: number | undefined) => {
    if (need !== undefined && need > TINY) needs.push({ nutrient, need })
  }
  add('tdn', r.tdnKg)
  if (p.species === 'cattle') {
    add('nem', r.nemMcal)
    if (split) add('neg', r.negMcal)
  }
  add('cp', r.cpKg)
  if (checkCa) add('ca', r.caG)
  if (checkP) add('p', r.pG)
  const l = p.limits ?? {}
  const hasCu = p.feeds.some((f, i) => allowed[i] && f.cuMgPerKgDm !== undefined)
  return {
    p,
    density,
    needs,
    capacity: l.maxDmiKg ?? r.dmiKg,
    split,
    checkCa,
    checkP,
    allowed,
    limits: {
      minCaToP: checkCa && checkP ? (l.minCaToP ?? DEFAULT_LIMITS.minCaToP) : undefined,
      maxCaToP: checkCa && checkP ? l.maxCaToP : undefined,
      maxGrainShareOfDm: l.maxGrainShareOfDm,
      maxUreaShareOfDm: l.maxUreaShareOfDm ?? DEFAULT_LIMITS.maxUreaShareOfDm,
      maxCaG: checkCa ? l.maxCaG : undefined,
      maxPG: checkP ? l.maxPG : undefined,
      maxCuMgPerKgDm: hasCu ? (l.maxCuMgPerKgDm ?? (p.species === 'sheep' ? DEFAULT_LIMITS.sheepMaxCuMgPerKgDm : undefined)) : undefined,
      selectionTolerance: l.selectionTolerance ?? DEFAULT_LIMITS.selectionTolerance,
    },
  }
}

const fmt = (v: number, d = 2) => (Math.round(v * 10 ** d) / 10 ** d).toString()

/**
 * Builds one LP. `include` picks the feeds (the rest are left out); `mode` 'cost' requires every need and minimises feed cost,
 * breaking ties towards the most field feed; 'shortfall' lets each need fall short at a price of 1 per whole need (relative),
 * so the optimum is the diet that comes closest, with feed cost as the tie-breaker when `costTieBreak` is set.
 */
export function buildRationLp(ctx: RationContext, include: readonly boolean[], mode: 'cost' | 'shortfall', costTieBreak = false): RationLp {
  const { p, density, split, limits } = ctx
  const feeds = p.feeds
  const colFeed: number[] = []
  const colPool: RationLp['colPool'] = []
  feeds.forEach((_, i) => {
    if (!include[i] || !ctx.allowed[i]) return
    if (split) {
      colFeed.push(i, i)
      colPool.push('m', 'g')
    } else {
      colFeed.push(i)
      colPool.push('all')
    }
  })
  const shortCol: RationLp['shortCol'] = {}
  const shortNeed: (NeedSpec | undefined)[] = colFeed.map(() => undefined)
  if (mode === 'shortfall') {
    for (const n of ctx.needs) {
      shortCol[n.nutrient] = colFeed.length
      shortNeed.push(n)
      colFeed.push(-1)
      colPool.push('short')
    }
  }
  const nCols = colFeed.length
  const isFeedCol = (j: number) => colFeed[j] >= 0
  const rows: LpRow[] = []
  const rowLimit: (LimitLabel | null)[] = []
  const addRow = (name: string, coef: (i: number, j: number) => number, lower: number, upper: number, label: LimitLabel | null) => {
    const coefs = new Array<number>(nCols).fill(0)
    for (let j = 0; j < nCols; j++) if (isFeedCol(j)) coefs[j] = coef(colFeed[j], j)
    rows.push({ name, coefs, lower, upper })
    rowLimit.push(label)
    return rows.length - 1
  }

  addRow('intake', () => 1, -Infinity, ctx.capacity, label('intake', ctx.capacity))

  const needRow: RationLp['needRow'] = {}
  for (const n of ctx.needs) {
    const coef = (i: number, j: number): number => {
      const d = density[i]
      switch (n.nutrient) {
        case 'nem':
          return colPool[j] === 'g' ? 0 : d.nem
        case 'neg':
          return colPool[j] === 'm' ? 0 : d.neg
        default:
          return d[n.nutrient]
      }
    }
    const upper = n.nutrient === 'ca' && limits.maxCaG !== undefined ? limits.maxCaG : n.nutrient === 'p' && limits.maxPG !== undefined ? limits.maxPG : Infinity
    const r = addRow(`need:${n.nutrient}`, coef, n.need, upper, null)
    if (mode === 'shortfall') rows[r].coefs[shortCol[n.nutrient]!] = 1
    needRow[n.nutrient] = r
  }
  // A cap on Ca or P without a need row still has to hold.
  if (limits.maxCaG !== undefined && needRow.ca === undefined) addRow('max:ca', (i) => density[i].ca, -Infinity, limits.maxCaG, label('ca-max', limits.maxCaG))
  if (limits.maxPG !== undefined && needRow.p === undefined) addRow('max:p', (i) => density[i].p, -Infinity, limits.maxPG, label('p-max', limits.maxPG))

  if (limits.minCaToP !== undefined && limits.minCaToP > 0) {
    const r = limits.minCaToP
    addRow('ca-p-min', (i) => density[i].ca - r * density[i].p, 0, Infinity, label('ca-p-min', r))
  }
  if (limits.maxCaToP !== undefined) {
    const r = limits.maxCaToP
    addRow('ca-p-max', (i) => density[i].ca - r * density[i].p, -Infinity, 0, label('ca-p-max', r))
  }
  const included = (i: number) => include[i] && ctx.allowed[i]
  if (limits.maxGrainShareOfDm !== undefined && feeds.some((f, i) => included(i) && f.isGrain)) {
    const s = limits.maxGrainShareOfDm
    addRow('grain-share', (i) => (feeds[i].isGrain ? 1 : 0) - s, -Infinity, 0, label('grain', s))
  }
  if (feeds.some((f, i) => included(i) && f.isUrea)) {
    const u = limits.maxUreaShareOfDm
    addRow('urea-share', (i) => (feeds[i].isUrea ? 1 : 0) - u, -Infinity, 0, label('urea', u))
  }
  if (limits.maxCuMgPerKgDm !== undefined) {
    const c = limits.maxCuMgPerKgDm
    addRow('cu', (i) => density[i].cu - c, -Infinity, 0, label('cu', c))
  }
  // What the field offers: each field feed's share of field DM stays within ±tolerance of its offered share.
  if (p.fieldOffer) {
    const tol = limits.selectionTolerance
    const share = new Map(p.fieldOffer.map((o) => [o.feedId, o.shareOfDm]))
    feeds.forEach((f, k) => {
      if (f.role !== 'field' || !included(k)) return
      const o = share.get(f.id) ?? 0
      const isField = (i: number) => (feeds[i].role === 'field' ? 1 : 0)
      const text = label('offer', o + tol, k, o - tol)
      if (o + tol < 1) addRow(`offer-max:${f.id}`, (i) => (i === k ? 1 : 0) - (o + tol) * isField(i), -Infinity, 0, text)
      if (o - tol > 0) addRow(`offer-min:${f.id}`, (i) => (i === k ? 1 : 0) - (o - tol) * isField(i), 0, Infinity, text)
    })
  }

  const colLower = new Array<number>(nCols).fill(0)
  const colUpper = new Array<number>(nCols).fill(Infinity)
  const colLimit: (LimitLabel | null)[] = new Array(nCols).fill(null)
  feeds.forEach((f, i) => {
    if (!included(i)) return
    const maxText: LimitLabel | null = f.maxKgDm !== undefined ? label('feed-max', f.maxKgDm, i) : null
    const minText: LimitLabel | null = f.minKgDm ? label('feed-min', f.minKgDm, i) : null
    if (split) {
      if (f.maxKgDm !== undefined) addRow(`feed-max:${f.id}`, (k) => (k === i ? 1 : 0), -Infinity, f.maxKgDm, maxText)
      if (f.minKgDm) addRow(`feed-min:${f.id}`, (k) => (k === i ? 1 : 0), f.minKgDm, Infinity, minText)
    } else {
      const j = colFeed.indexOf(i)
      if (f.maxKgDm !== undefined) colUpper[j] = f.maxKgDm
      if (f.minKgDm) colLower[j] = f.minKgDm
      colLimit[j] = maxText ?? minText
    }
  })

  const feedCost = (j: number) => (isFeedCol(j) ? (feeds[colFeed[j]].costPerKgDm ?? 0) : 0)
  let cost: number[]
  let secondary: number[] | undefined
  let secondaryFloor: number | undefined
  if (mode === 'cost') {
    cost = Array.from({ length: nCols }, (_, j) => feedCost(j))
    const fieldCols = (j: number) => isFeedCol(j) && feeds[colFeed[j]].role === 'field'
    secondary = Array.from({ length: nCols }, (_, j) => (fieldCols(j) ? -1 : 0))
    if (!secondary.some((v) => v !== 0)) secondary = undefined
    // The most field DM possible: intake capacity, or all the field feeds' availability if that is less.
    const fieldMax = feeds.reduce((s, f, i) => (f.role === 'field' && included(i) ? s + (f.maxKgDm ?? Infinity) : s), 0)
    secondaryFloor = -Math.min(ctx.capacity, fieldMax)
  } else {
    cost = Array.from({ length: nCols }, (_, j) => (shortNeed[j] ? 1 / shortNeed[j]!.need : 0))
    secondary = costTieBreak ? Array.from({ length: nCols }, (_, j) => feedCost(j)) : undefined
  }
  const colNames = colFeed.map((i, j) => (i >= 0 ? `${feeds[i].id}:${colPool[j]}` : `short:${shortNeed[j]!.nutrient}`))
  return { lp: { colNames, cost, colLower, colUpper, rows, secondary, secondaryFloor, ...(mode === 'cost' ? { secondaryBindingRow: 0 } : {}) }, colFeed, colPool, needRow, shortCol, rowLimit, colLimit }
}

/** kg DM of each feed from an LP answer (columns of a split feed added up), cleaned of solver round-off below 1e-8 kg (10 mg). */
export function feedIntakes(r: RationLp, x: readonly number[], nFeeds: number): { kgDm: number[]; kgDmForGain: number[] } {
  const kgDm = new Array<number>(nFeeds).fill(0)
  const kgDmForGain = new Array<number>(nFeeds).fill(0)
  r.colFeed.forEach((i, j) => {
    if (i < 0) return
    kgDm[i] += x[j]
    if (r.colPool[j] === 'g') kgDmForGain[i] += x[j]
  })
  const clean = (v: number) => (Math.abs(v) < 1e-8 ? 0 : Math.max(0, v))
  return { kgDm: kgDm.map(clean), kgDmForGain: kgDmForGain.map(clean) }
}

/** What the LP answer supplies against each need row (NEm and NEg from their own pools). */
export function needSupply(r: RationLp, x: readonly number[], need: Nutrient): number {
  const row = r.needRow[need]
  if (row === undefined) return 0
  const coefs = r.lp.rows[row].coefs
  let s = 0
  for (let j = 0; j < x.length; j++) if (r.colFeed[j] >= 0) s += coefs[j] * x[j]
  return s
}
