// Benchmark: the season budget at demo scale (3 fields, 4 groups, a 150-day winter at daily resolution).
import { bench, describe } from 'vitest'
import { seasonBudget, type GrazingFieldInput, type SeasonPlanInput } from '../shared/engine/grazing/index'

const lab = (cp: number, tdn: number) => ({ cpPctDm: cp, tdnPctDm: tdn, source: { kind: 'lab' as const, label: 'Bench lab sample' } })

const fields: GrazingFieldInput[] = [
  {
    id: 'cowpea-corridor',
    name: 'Cowpea corridor field (bench data)',
    areaHa: 32,
    fenceLengthM: 400,
    rowSpacingM: 1.524,
    corridorWidthM: 0.762,
    legume: 'cowpea',
    legumeShareOfWidth: 0.5,
    components: [
      { kind: 'sorghum-grain', kgDmPerHa: 5200, measuredOn: '2025-10-10', method: 'head-count', quality: lab(11, 81) },
      { kind: 'sorghum-stover', kgDmPerHa: 5600, measuredOn: '2025-10-10', method: 'clipped-frame', quality: lab(7.5, 56) },
      { kind: 'legume-forage', kgDmPerHa: 3200, measuredOn: '2025-10-10', method: 'clipped-frame' },
      { kind: 'legume-seed', kgDmPerHa: 400, measuredOn: '2025-10-10', method: 'clipped-frame' },
    ],
    killingFrostDates: ['2025-10-29'],
    partialFrostDates: ['2025-10-21'],
  },
  {
    id: 'soybean-corridor',
    name: 'Forage-soybean corridor field (bench data)',
    areaHa: 24,
    fenceLengthM: 350,
    rowSpacingM: 1.524,
    corridorWidthM: 0.762,
    legume: 'forage-soybean',
    legumeShareOfWidth: 0.45,
    components: [
      { kind: 'sorghum-grain', kgDmPerHa: 4600, measuredOn: '2025-10-12', method: 'head-count' },
      { kind: 'sorghum-stover', kgDmPerHa: 5000, measuredOn: '2025-10-12', method: 'stover-rule' },
      { kind: 'legume-forage', kgDmPerHa: 4000, measuredOn: '2025-10-12', method: 'clipped-frame' },
    ],
    killingFrostDates: ['2025-10-29', '2025-11-18'],
  },
  {
    id: 'conventional',
    name: 'Conventional-row field (bench data)',
    areaHa: 20,
    fenceLengthM: 300,
    rowSpacingM: 0.762,
    legume: 'none',
    components: [
      { kind: 'sorghum-grain', kgDmPerHa: 6000, measuredOn: '2025-10-08', method: 'head-count' },
      { kind: 'sorghum-stover', kgDmPerHa: 6400, measuredOn: '2025-10-08', method: 'stover-rule' },
    ],
    killingFrostDates: ['2025-10-29'],
  },
]

const plan: SeasonPlanInput = {
  start: '2025-11-10',
  end: '2026-04-08',
  fields,
  groups: [
    { id: 'cows', name: 'Spring-calving cows', species: 'cattle', headCount: 120, bodyWeightKg: 590, intakeKgDmPerHead: 12.5, pregnant: true, grainAdapted: true },
    { id: 'heifers', name: 'Bred heifers', species: 'cattle', headCount: 40, bodyWeightKg: 450, intakeKgDmPerHead: 10.5, pregnant: true, routineSupplement: { label: 'protein cube', kgAsFedPerHeadPerDay: 0.9, dmFraction: 0.9, pricePerKgAsFed: 0.42 } },
    { id: 'ewes', name: 'Ewes due late winter', species: 'sheep', headCount: 250, bodyWeightKg: 72, intakeKgDmPerHead: 2.2, pregnant: true },
    { id: 'steers', name: 'Weaned steer calves', species: 'cattle', headCount: 90, bodyWeightKg: 250, intakeKgDmPerHead: 7, grainAdapted: true },
  ],
  assignments: [
    { groupId: 'cows', fieldId: 'cowpea-corridor', from: '2025-11-10', to: '2026-04-08' },
    { groupId: 'heifers', fieldId: 'soybean-corridor', from: '2025-11-10', to: '2026-04-08', daysPerMove: 3 },
    { groupId: 'ewes', fieldId: 'soybean-corridor', from: '2025-12-01', to: '2026-03-15' },
    { groupId: 'steers', fieldId: 'conventional', from: '2025-11-10', to: '2026-02-28', access: 'whole-field' },
  ],
  shortfallFeed: { label: 'grass hay', dmFraction: 0.88, pricePerKgAsFed: 0.13 },
  harvestedAlternative: { label: 'bought hay', dmFraction: 0.88, pricePerKgAsFed: 0.15, wasteFraction: 0.2 },
}

describe('seasonBudget at demo scale', () => {
  bench('3 fields × 4 groups × 150 days, daily', () => {
    seasonBudget(plan)
  })
})
