// Builders for grazing-engine test data: invented fields and herd groups with sensible defaults.
import type { GrazingFieldInput, GrazingGroupInput, SeasonPlanInput } from '../../../shared/engine/grazing/index'
import { ZodError } from 'zod'
import { expect } from 'vitest'

export function aField(over: Partial<GrazingFieldInput> = {}): GrazingFieldInput {
  return {
    id: 'field-a',
    name: 'Test corridor field',
    areaHa: 16,
    fenceLengthM: 400,
    rowSpacingM: 1.524,
    corridorWidthM: 0.762,
    legume: 'cowpea',
    legumeShareOfWidth: 0.5,
    components: [
      { kind: 'sorghum-grain', kgDmPerHa: 5000, measuredOn: '2025-10-15', method: 'head-count' },
      { kind: 'sorghum-stover', kgDmPerHa: 5500, measuredOn: '2025-10-15', method: 'clipped-frame' },
      { kind: 'legume-forage', kgDmPerHa: 3000, measuredOn: '2025-10-15', method: 'clipped-frame' },
    ],
    killingFrostDates: [],
    partialFrostDates: [],
    ...over,
  }
}

export function aGroup(over: Partial<GrazingGroupInput> = {}): GrazingGroupInput {
  return {
    id: 'group-a',
    name: 'Test cows',
    species: 'cattle',
    headCount: 80,
    bodyWeightKg: 600,
    intakeKgDmPerHead: 12,
    ...over,
  }
}

/** A 150-day winter; unless given, the one group is assigned to the one field for the whole plan. */
export function aSeasonPlan(over: Partial<SeasonPlanInput> = {}): SeasonPlanInput {
  const start = over.start ?? '2025-11-15'
  const end = over.end ?? '2026-04-13'
  return {
    start,
    end,
    fields: [aField()],
    groups: [aGroup()],
    assignments: [{ groupId: 'group-a', fieldId: 'field-a', from: start, to: end }],
    shortfallFeed: { label: 'grass hay', dmFraction: 0.88, pricePerKgAsFed: 0.12 },
    ...over,
  }
}

/** Asserts that fn throws a ZodError with an issue at the given path (the field the caller got wrong). */
export function expectZodErrorAt(fn: () => unknown, path: (string | number)[]): void {
  let err: unknown
  try {
    fn()
  } catch (e) {
    err = e
  }
  expect(err).toBeInstanceOf(ZodError)
  const paths = (err as ZodError).issues.map((i) => i.path.join('.'))
  expect(paths).toContain(path.join('.'))
}
