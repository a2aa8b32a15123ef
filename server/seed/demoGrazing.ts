// Demo fields, worksheets, frost dates, strip plans, season settings and crew records for the invented demo operations (every figure invented, every name labelled demo). Idempotent.
import type { Sequelize } from 'sequelize'
import type { DemoIds } from './demo'
import { Field, FieldComponent, GrazingPlan, GrazingRecord, SeasonSettings } from '../models/grazing'
import { Herd } from '../models/nutrition'
import { createField } from '../services/grazing/fields'
import { createEstimate } from '../services/grazing/estimates'
import { fieldCreateSchema, type Field as FieldJson, type FieldCreate } from '../../shared/schemas/grazing/fields'
import { worksheetSchema, type WorksheetInput } from '../../shared/schemas/grazing/estimates'
import { planCreateSchema, type Plan, type PlanCreate } from '../../shared/schemas/grazing/plans'
import type { SeasonSettingsValues } from '../../shared/schemas/grazing/season'
import { computeWorksheet } from '../../shared/adapters/grazing/worksheets'
import { addDays } from '../../shared/engine/grazing/dates'
import { FT_M, IN_M, LB_KG, TON_KG, lbPerAcreToKgPerHa } from '../../shared/engine/units'
import { evaluatePlan, planDay } from '../../shared/adapters/grazing/planEval'
import { getField } from '../services/grazing/fields'
import { getPlan } from '../services/grazing/plans'
import { todayIso } from '../services/dates'

const AC = 4046.8564224 / 10_000
const ft = (v: number) => v * FT_M
const inch = (v: number) => v * IN_M
const lbAc = lbPerAcreToKgPerHa
const perTon = (dollars: number) => dollars / TON_KG

/**
 * The demo's winter: from 15 November when the seed runs between November and March, so the demo reads like the
 * season it is seeded in; at any other time of year it starts three weeks before the seed date, so Today, the Strip
 * plan and the Season still show a winter in progress.
 */
export function demoSeasonStart(today = todayIso()): string {
  const y = Number(today.slice(0, 4))
  const m = Number(today.slice(5, 7))
  if (m >= 11 || m <= 3) {
    const start = `${m >= 11 ? y : y - 1}-11-15`
    if (start <= addDays(today, -3)) return start
  }
  return addDays(today, -21)
}

type DemoField = { body: FieldCreate; worksheets: WorksheetInput[] }

function demoFields(start: string): { main: DemoField[]; client: DemoField[] } {
  const measured = addDays(start, -28)
  const killing = [addDays(start, -12)]
  const partial = [addDays(start, -16)]
  const econ = {
    fertilizerPricePerKgN: 0.6 / LB_KG,
    cropCostPerHa: 180 / AC,
    fencePerHa: 8 / AC,
    laborMinutesPerDay: 20,
    laborPricePerHour: 18,
    combiningPerHa: 40 / AC,
    haulingPerKgGrain: 0.12 / (56 * LB_KG),
    harvestLossFraction: 0.03,
    feedingPerHeadDay: 0.25,
    feedPricePerKgDm: perTon(110),
    feedWasteFraction: 0.2,
    headCount: null,
    intakeKgDmPerHead: null,
  }
  const heads = (rowSpacingIn: number, counts: number[], seedsPerHead = 2000, seedsPerLb = 15000): WorksheetInput => ({
    method: 'head-count',
    measuredOn: measured,
    rowSpacingIn,
    seedsPerHead,
    seedsPerLb,
    // 2/1000 ac of row per count: steadier than 1/1000 ac on wide rows (common practice).
    samples: counts.map((h) => ({ rowLengthFt: (2 * 522.72) / rowSpacingIn, rows: 1, heads: h })),
  })
  const frames = (kind: 'sorghum-stover' | 'legume-forage', frameAreaFt2: number, pairs: [number, number][]): WorksheetInput => ({
    method: 'clipped-frame',
    kind,
    measuredOn: measured,
    frameAreaFt2,
    samples: pairs.map(([wetG, dryG]) => ({ wetG, dryG, containerG: 0 })),
  })
  const main: DemoField[] = [
    {
      body: {
        name: 'North cowpea corridor (demo)',
        areaHa: 40 * AC,
        fenceLengthM: ft(660),
        rowSpacingM: inch(60),
        corridorWidthM: inch(30),
        legume: 'cowpea',
        legumeShareOfWidth: 0.5,
        killingFrostDates: killing,
        partialFrostDates: partial,
        nitrate: { value: 600, unit: 'ppm-NO3-N', sampledOn: measured },
        economics: { ...econ, nitrogenCreditKgNPerHa: lbAc(40) },
        notes: 'Invented demo field: grain sorghum on 60-in rows with cowpea in the 30-in corridor; water tank at the west end.',
        components: [
          { kind: 'legume-seed', kgDmPerHa: lbAc(350), measuredOn: measured, method: 'visual' },
        ],
      },
      worksheets: [
        heads(60, [74, 82, 79, 85, 77]),
        frames('sorghum-stover', 9.6, [[720, 480], [800, 540], [690, 455], [760, 510]]),
        frames('legume-forage', 2.4, [[260, 88], [300, 95], [240, 80], [280, 92]]),
      ],
    },
    {
      body: {
        name: 'East soybean corridor (demo)',
        areaHa: 16 * AC,
        fenceLengthM: ft(500),
        rowSpacingM: inch(60),
        corridorWidthM: inch(30),
        legume: 'forage-soybean',
        legumeShareOfWidth: 0.5,
        killingFrostDates: killing,
        partialFrostDates: partial,
        nitrate: { value: 1250, unit: 'ppm-NO3-N', sampledOn: measured },
        economics: { ...econ, nitrogenCreditKgNPerHa: lbAc(30) },
        notes: 'Invented demo field: forage soybean in the corridor; shared by the bred heifers (from the water end) and the ewes carrying twins (from the middle).',
        components: [{ kind: 'legume-seed', kgDmPerHa: lbAc(500), measuredOn: measured, method: 'visual' }],
      },
      worksheets: [heads(60, [66, 70, 61, 72, 68]), frames('sorghum-stover', 9.6, [[640, 420], [700, 455], [610, 400]]), frames('legume-forage', 2.4, [[330, 104], [360, 112], [310, 99]])],
    },
    {
      body: {
        name: 'South conventional rows (demo)',
        areaHa: 24 * AC,
        fenceLengthM: ft(800),
        rowSpacingM: inch(30),
        corridorWidthM: 0,
        legume: 'none',
        legumeShareOfWidth: 0,
        killingFrostDates: killing,
        partialFrostDates: partial,
        nitrate: { value: 1800, unit: 'ppm-NO3-N', sampledOn: measured },
        grainOnGround: { kgPerHa: (9 * 56 * LB_KG) / AC, observedOn: addDays(start, -5) },
        economics: { ...econ, nitrogenCreditKgNPerHa: 0 },
        notes: 'Invented demo field: grain sorghum on 30-in rows, no legume; some heads lodged by wind. The steers start at the water end, the ewes with singles in the far strip.',
        components: [],
      },
      worksheets: [heads(30, [46, 50, 44, 52, 47]), frames('sorghum-stover', 9.6, [[780, 540], [820, 570], [760, 520]])],
    },
  ]
  const client: DemoField[] = [
    {
      body: {
        name: 'Home corridor field (demo)',
        areaHa: 25 * AC,
        fenceLengthM: ft(550),
        rowSpacingM: inch(60),
        corridorWidthM: inch(30),
        legume: 'cowpea',
        legumeShareOfWidth: 0.5,
        killingFrostDates: killing,
        partialFrostDates: [],
        nitrate: { value: 450, unit: 'ppm-NO3-N', sampledOn: measured },
        economics: { ...econ, nitrogenCreditKgNPerHa: lbAc(35) },
        notes: 'Invented demo field of the client operation.',
        components: [],
      },
      worksheets: [heads(60, [70, 76, 72, 68]), frames('sorghum-stover', 9.6, [[700, 470], [740, 490], [690, 460]]), frames('legume-forage', 2.4, [[250, 82], [270, 88], [240, 79]])],
    },
  ]
  return { main, client }
}

/** Lab quality (invented) the demo gives some components once the worksheets have created them; the rest carry book values. */
const DEMO_QUALITY: Record<string, Partial<Record<'sorghum-grain' | 'legume-forage', { cp: number; tdn: number; ref: string }>>> = {
  'North cowpea corridor (demo)': { 'sorghum-grain': { cp: 10.8, tdn: 80, ref: 'DL-101' }, 'legume-forage': { cp: 18.5, tdn: 62, ref: 'DL-102' } },
  'East soybean corridor (demo)': { 'legume-forage': { cp: 19.5, tdn: 63, ref: 'DL-151' } },
  'South conventional rows (demo)': { 'sorghum-grain': { cp: 10.5, tdn: 81, ref: 'DL-214' } },
  'Home corridor field (demo)': { 'legume-forage': { cp: 17.5, tdn: 61, ref: 'DL-301' } },
}

async function seedField(sequelize: Sequelize, operationId: number, userId: number, d: DemoField) {
  const existing = await Field.findOne({ where: { operationId, name: d.body.name } })
  if (existing) return existing.id
  const created = await createField(sequelize, operationId, fieldCreateSchema.parse(d.body))
  for (const w of d.worksheets) await createEstimate(sequelize, operationId, created.id, userId, worksheetSchema.parse(w))
  const q = DEMO_QUALITY[d.body.name] ?? {}
  const f = await getField(sequelize, operationId, created.id)
  for (const c of f.components) {
    const lab = q[c.kind as 'sorghum-grain' | 'legume-forage']
    if (lab && !c.quality) {
      await FieldComponent.update(
        { quality: { cpPctDm: lab.cp, tdnPctDm: lab.tdn, source: { kind: 'lab', label: `Demo lab, sample ${lab.ref} (invented)`, sampledOn: c.measuredOn } } },
        { where: { id: c.id } },
      )
    }
  }
  return created.id
}

type DemoPlan = { body: PlanCreate; records?: boolean }

function demoPlans(start: string, fieldIds: Record<string, number>): { main: DemoPlan[]; client: DemoPlan[] } {
  const cattleMineral = { label: 'Cattle mineral (demo)', intendedFor: 'cattle' as const, copperPpm: 1200 }
  const main: DemoPlan[] = [
    {
      records: true,
      body: {
        fieldId: fieldIds['North cowpea corridor (demo)'],
        groupName: 'Spring-calving cows (demo)',
        species: 'cattle',
        headCount: 120,
        bodyWeightKg: 1200 * LB_KG,
        intakeKgDmPerHead: 21.5 * LB_KG,
        pregnant: true,
        grainAdapted: true,
        mineral: cattleMineral,
        access: 'strip',
        daysPerMove: 1,
        basis: 'forage',
        startDate: start,
        supplement: { label: 'Range cubes 20 % CP (demo price)', kgAsFedPerHeadPerDay: 2 * LB_KG, dmFraction: 0.9, pricePerKgAsFed: perTon(340) },
        notes: 'Invented demo plan: daily strips from the water end, one poly wire, step-in posts.',
      },
    },
    {
      body: {
        fieldId: fieldIds['East soybean corridor (demo)'],
        groupName: 'Bred heifers (demo)',
        species: 'cattle',
        headCount: 35,
        bodyWeightKg: 900 * LB_KG,
        intakeKgDmPerHead: 19 * LB_KG,
        pregnant: true,
        grainAdapted: true,
        mineral: cattleMineral,
        access: 'strip',
        daysPerMove: 1,
        basis: 'forage',
        startDate: start,
        supplement: { label: 'Range cubes 20 % CP (demo price)', kgAsFedPerHeadPerDay: 1.5 * LB_KG, dmFraction: 0.9, pricePerKgAsFed: perTon(340) },
        notes: 'Invented demo plan: the front half of the field from the water end.',
      },
    },
    {
      body: {
        fieldId: fieldIds['East soybean corridor (demo)'],
        groupName: 'Late-winter ewes, twins (demo)',
        species: 'sheep',
        headCount: 85,
        bodyWeightKg: 155 * LB_KG,
        intakeKgDmPerHead: 3.1 * LB_KG,
        pregnant: true,
        mineral: { label: 'Sheep mineral, no added copper (demo)', intendedFor: 'sheep', copperPpm: 8 },
        access: 'strip',
        daysPerMove: 3,
        basis: 'forage',
        startDate: start,
        // The ewes take the back half: their first fence stands at the middle of the field.
        startOffsetM: (16 * AC * 10_000) / ft(500) / 2,
        supplement: { label: 'Whole corn (demo price)', kgAsFedPerHeadPerDay: 0.5 * LB_KG, dmFraction: 0.86, pricePerKgAsFed: 0.11 },
        notes: 'Invented demo plan: 3-day strips in electric netting on the back half; water trailer moved with them.',
      },
    },
    {
      body: {
        fieldId: fieldIds['South conventional rows (demo)'],
        groupName: 'Late-winter ewes, singles (demo)',
        species: 'sheep',
        headCount: 60,
        bodyWeightKg: 155 * LB_KG,
        intakeKgDmPerHead: 3.1 * LB_KG,
        pregnant: true,
        mineral: { label: 'Sheep mineral, no added copper (demo)', intendedFor: 'sheep', copperPpm: 8 },
        access: 'strip',
        daysPerMove: 3,
        basis: 'forage',
        startDate: start,
        // The far seventh of the field, away from the steers' wire.
        startOffsetM: ((24 * AC * 10_000) / ft(800)) * 0.85,
        notes: 'Invented demo plan: 3-day strips in netting at the far end; stepped onto the grain over a week.',
      },
    },
    {
      body: {
        fieldId: fieldIds['South conventional rows (demo)'],
        groupName: 'Weaned steer calves (demo)',
        species: 'cattle',
        headCount: 90,
        bodyWeightKg: 550 * LB_KG,
        intakeKgDmPerHead: 13 * LB_KG,
        access: 'strip',
        daysPerMove: 1,
        basis: 'forage',
        startDate: start,
        supplement: { label: 'Dried distillers grains (demo price)', kgAsFedPerHeadPerDay: 2 * LB_KG, dmFraction: 0.9, pricePerKgAsFed: perTon(260) },
        notes: 'Invented demo plan: two strands for calves; stepped onto the grain over the first week.',
      },
    },
  ]
  const client: DemoPlan[] = [
    {
      body: {
        fieldId: fieldIds['Home corridor field (demo)'],
        groupName: 'Client cows (demo)',
        species: 'cattle',
        headCount: 40,
        bodyWeightKg: 1200 * LB_KG,
        intakeKgDmPerHead: 27 * LB_KG,
        pregnant: true,
        grainAdapted: true,
        access: 'strip',
        daysPerMove: 1,
        basis: 'forage',
        startDate: start,
        notes: 'Invented demo plan of the client operation.',
      },
    },
  ]
  return { main, client }
}

/** Words that tie a demo plan to the demo herd group of the same class. */
const DEMO_LINK_KEYS = ['spring-calving', 'heifer', 'twin', 'single', 'steer', 'client cow']

/** Links each demo plan to the demo herd group whose name carries its keyword, once the herd groups exist. */
export async function linkGrazingDemoPlans(ids: DemoIds) {
  for (const operationId of [ids.operations.main, ids.operations.client]) {
    const herds = await Herd.findAll({ where: { operationId } })
    const plans = await GrazingPlan.findAll({ where: { operationId, herdId: null } })
    for (const p of plans) {
      const key = DEMO_LINK_KEYS.find((k) => p.groupName.toLowerCase().includes(k))
      if (!key) continue
      const herd = herds.find((h) => h.name.toLowerCase().includes(key))
      if (herd) await p.update({ herdId: herd.id })
    }
  }
}

async function seedPlans(sequelize: Sequelize, operationId: number, handId: number | undefined, plans: DemoPlan[], today: string) {
  for (const d of plans) {
    if (await GrazingPlan.findOne({ where: { operationId, groupName: d.body.groupName } })) continue
    const p = await GrazingPlan.create({ ...planCreateSchema.parse(d.body), operationId })
    if (!d.records || !handId) continue
    // Yesterday's and the day before's moves and feedings, as the hand would have recorded them.
    const plan = await getPlan(sequelize, operationId, p.id)
    const ev = evaluatePlan(await getField(sequelize, operationId, plan.fieldId), plan)
    if (!ev.ok) continue
    for (const back of [2, 1]) {
      const day = addDays(today, -back)
      const pd = planDay(plan, ev, day)
      if (pd.status !== 'grazing') continue
      const at = (h: number, m: number) => new Date(`${day}T${String(h).padStart(2, '0')}:${String(m).padStart(2, '0')}:00`)
      if (pd.moveToday) await GrazingRecord.create({ operationId, planId: p.id, kind: 'moved', recordedAt: at(7, 40 + back), recordedBy: handId, distanceM: pd.moveToday.toM - pd.moveToday.fromM, feedLabel: null, amountKgAsFed: null, note: '' })
      if (plan.supplement) {
        await GrazingRecord.create({ operationId, planId: p.id, kind: 'fed', recordedAt: at(8, 5), recordedBy: handId, distanceM: null, feedLabel: plan.supplement.label, amountKgAsFed: plan.supplement.kgAsFedPerHeadPerDay * plan.headCount, note: back === 2 ? 'Cubes on the hilltop, ground frozen.' : '' })
      }
    }
  }
}

export async function seedGrazingDemo(sequelize: Sequelize, ids: DemoIds) {
  const today = todayIso()
  const existing = await GrazingPlan.findOne({ where: { operationId: ids.operations.main } })
  // A demo seeded earlier keeps its own dates: a second run adds nothing.
  const start = existing ? existing.startDate : demoSeasonStart(today)
  const owner = ids.users.owner
  const defs = demoFields(start)
  const fieldIds: Record<string, number> = {}
  for (const [key, list] of [['main', defs.main], ['client', defs.client]] as const) {
    for (const d of list) fieldIds[d.body.name] = await seedField(sequelize, ids.operations[key], owner, d)
  }
  const plans = demoPlans(start, fieldIds)
  await seedPlans(sequelize, ids.operations.main, ids.users.hand, plans.main, today)
  await seedPlans(sequelize, ids.operations.client, undefined, plans.client, today)
  for (const operationId of [ids.operations.main, ids.operations.client]) {
    if (await SeasonSettings.findOne({ where: { operationId } })) continue
    await SeasonSettings.create({ operationId, ...demoSeasonSettings(start) })
  }
  await linkGrazingDemoPlans(ids)
}

/**
 * The main demo operation's fields, plans and season settings in the API's shapes, built without a database (the
 * worksheets run through the same pure code the server uses), for benchmarking the Season computation on the demo.
 */
export function demoSeasonData(start = demoSeasonStart()): { settings: SeasonSettingsValues; fields: FieldJson[]; plans: Plan[] } {
  const defs = demoFields(start)
  const now = new Date(0).toISOString()
  let componentId = 0
  const fields: FieldJson[] = defs.main.map((d, i) => {
    const body = fieldCreateSchema.parse(d.body)
    const id = i + 1
    const comps = new Map<string, FieldJson['components'][number]>()
    for (const c of body.components) comps.set(c.kind, { ...c, id: ++componentId, fieldId: id, basis: c.basis ?? null, dmPct: c.dmPct ?? null, labResultId: null, quality: c.quality ?? null, labQuality: null, updatedAt: now })
    for (const w of d.worksheets) {
      const ws = worksheetSchema.parse(w)
      const r = computeWorksheet(ws)
      const prev = comps.get(r.kind)
      comps.set(r.kind, { kind: r.kind, kgDmPerHa: r.kgDmPerHa.mean, basis: r.basis, measuredOn: ws.measuredOn, method: ws.method, dmPct: null, labResultId: null, quality: prev?.quality ?? null, labQuality: null, id: prev?.id ?? ++componentId, fieldId: id, updatedAt: now })
    }
    const q = DEMO_QUALITY[body.name] ?? {}
    for (const [kind, lab] of Object.entries(q)) {
      const c = comps.get(kind)
      if (c && lab) c.quality = { cpPctDm: lab.cp, tdnPctDm: lab.tdn, source: { kind: 'lab', label: `Demo lab, sample ${lab.ref} (invented)` } }
    }
    const { components: _c, ...settings } = body
    return { ...settings, id, operationId: 1, components: [...comps.values()], createdAt: now, updatedAt: now }
  })
  const ids = Object.fromEntries(fields.map((f) => [f.name, f.id]))
  const plans: Plan[] = demoPlans(start, ids).main.map((d, i) => {
    const v = planCreateSchema.parse(d.body)
    return { ...v, id: i + 1, operationId: 1, groupSource: 'plan', supplementSource: v.supplement ? 'plan' : null, createdAt: now, updatedAt: now }
  })
  return { settings: demoSeasonSettings(start), fields, plans }
}

function demoSeasonSettings(start: string): SeasonSettingsValues {
  return {
    startDate: start,
    endDate: addDays(start, 134),
    shortfallFeed: { label: 'Grass hay (demo price)', dmFraction: 0.88, pricePerKgAsFed: perTon(90) },
    harvestedAlternative: { label: 'Bought grass hay all winter (demo price)', dmFraction: 0.88, pricePerKgAsFed: perTon(90), wasteFraction: 0.2 },
    frostWaitDays: null,
  }
}
