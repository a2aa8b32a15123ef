// Sheep requirements checked against NRC 1985 Table 1 rows, including weights between the rows.
import { describe, expect, it } from 'vitest'
import { sheepRequirements } from '../../../shared/engine/index'
import type { SheepAnimal } from '../../../shared/engine/index'

type Row = [number, number, number, number, number, number] // BW kg, DM kg, TDN kg, CP g, Ca g, P g
const check = (a: SheepAnimal, [, dm, tdn, cp, ca, p]: Row) => {
  const r = sheepRequirements(a)
  const near = (v: number, t: number) => expect(Math.abs(v - t) / t).toBeLessThanOrEqual(0.05)
  near(r.dmiKg, dm)
  near(r.tdnKg, tdn)
  near(r.cpKg * 1000, cp)
  near(r.caG, ca)
  near(r.pG, p)
}
const ewe = (bodyWeightKg: number, stage: SheepAnimal['stage'], extra: Partial<SheepAnimal> = {}): SheepAnimal => ({ class: 'ewe', bodyWeightKg, stage, ...extra })

describe('ewe rows of NRC, Nutrient Requirements of Sheep, 6th rev. ed. (1985), Table 1, p. 45 (read), within ±5 %', () => {
  it.each<Row>([
    [50, 1.0, 0.55, 95, 2.0, 1.8],
    [70, 1.2, 0.66, 113, 2.5, 2.4],
    [90, 1.4, 0.78, 131, 2.9, 3.1],
  ])('maintenance, %d kg: DM, TDN, CP, Ca and P', (...row) => check(ewe(row[0], 'maintenance'), row))
  it.each<Row>([
    [50, 1.6, 0.94, 150, 5.3, 2.6],
    [70, 1.8, 1.06, 164, 5.7, 3.2],
    [90, 2.0, 1.18, 177, 6.1, 3.9],
  ])('flushing, %d kg: DM, TDN, CP, Ca and P', (...row) => check(ewe(row[0], 'flushing'), row))
  it.each<Row>([
    [50, 1.2, 0.67, 112, 2.9, 2.1],
    [70, 1.4, 0.77, 130, 3.5, 2.9],
  ])('first 15 weeks of gestation, %d kg: DM, TDN, CP, Ca and P', (...row) => check(ewe(row[0], 'early-gestation'), row))
})

describe('weights between the read rows, against the table\'s 60- and 80-kg rows (NRC 1985 Table 1, from memory), within ±5 %', () => {
  it.each<Row>([
    [60, 1.1, 0.61, 104, 2.3, 2.1],
    [80, 1.3, 0.72, 122, 2.7, 2.8],
  ])('maintenance, %d kg', (...row) => check(ewe(row[0], 'maintenance'), row))
  it.each<Row>([
    [60, 1.7, 1.0, 157, 5.5, 2.9],
    [80, 1.9, 1.12, 170, 5.9, 3.6],
  ])('flushing, %d kg', (...row) => check(ewe(row[0], 'flushing'), row))
  it('early gestation, 60 kg', () => check(ewe(60, 'early-gestation'), [60, 1.3, 0.72, 121, 3.2, 2.5]))
})

describe('rows for late gestation and lactation (NRC 1985 Table 1, 70-kg ewe, from memory — not verified)', () => {
  it.each<[string, SheepAnimal, Row]>([
    ['late gestation, single (130–150 % lambing)', ewe(70, 'late-gestation', { litterSize: 1 }), [70, 1.7, 0.99, 175, 5.9, 4.8]],
    ['late gestation, twins (180–225 % lambing)', ewe(70, 'late-gestation', { litterSize: 2 }), [70, 1.9, 1.24, 200, 6.5, 4.7]],
    ['early lactation, single', ewe(70, 'early-lactation', { litterSize: 1 }), [70, 2.3, 1.5, 319, 9.3, 6.7]],
    ['early lactation, twins', ewe(70, 'early-lactation', { litterSize: 2 }), [70, 2.8, 1.82, 389, 10.9, 7.7]],
    ['late lactation, single (the table pairs it with late gestation, single)', ewe(70, 'late-lactation', { litterSize: 1 }), [70, 1.7, 0.99, 175, 5.9, 4.8]],
    ['late lactation, twins (paired with early lactation, single)', ewe(70, 'late-lactation', { litterSize: 2 }), [70, 2.3, 1.5, 319, 9.3, 6.7]],
  ])('%s', (_, a, row) => {
    check(a, row)
    expect(sheepRequirements(a).notes.join(' ')).toMatch(/from memory/)
  })
})

describe('body condition (NRC 1985 Table 1 footnote, read: fat ewes at the next lower weight class, thin at the next higher)', () => {
  it('a fat 70-kg ewe (BCS 4) is fed as a 60-kg ewe and a thin one (BCS 2) as an 80-kg ewe (10-kg classes, from memory)', () => {
    expect(sheepRequirements(ewe(70, 'maintenance', { bcs: 4 })).tdnKg).toBeCloseTo(sheepRequirements(ewe(60, 'maintenance')).tdnKg, 12)
    expect(sheepRequirements(ewe(70, 'maintenance', { bcs: 2 })).tdnKg).toBeCloseTo(sheepRequirements(ewe(80, 'maintenance')).tdnKg, 12)
    expect(sheepRequirements(ewe(70, 'maintenance', { bcs: 3 })).tdnKg).toBeCloseTo(0.66, 12)
  })
})

describe('other classes', () => {
  it('a growing lamb at 30 kg gaining 295 g/d matches the finishing-lamb row (DM 1.3, TDN 0.94, CP 191 g, Ca 6.6, P 3.2; NRC 1985, from memory)', () => {
    check({ class: 'growing-lamb', bodyWeightKg: 30, stage: 'maintenance', adgG: 295 }, [30, 1.3, 0.94, 191, 6.6, 3.2])
  })
  it('a growing lamb gaining nothing needs only the maintenance row scaled to its weight (derived)', () => {
    const r = sheepRequirements({ class: 'growing-lamb', bodyWeightKg: 30, stage: 'maintenance', adgG: 0 })
    expect(r.tdnKg).toBeCloseTo(0.55 * (30 / 50) ** 0.75, 12)
  })
})
