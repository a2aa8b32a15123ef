// Herd stages move with the calendar: pregnancy day from the expected birth date, days in milk after it, sheep stage boundaries of NRC 1985 Table 1.
import { describe, expect, it } from 'vitest'
import { addDays, daysBetween, type HerdValues, GESTATION_DAYS, herdStageOn, SHEEP_EARLY_LACTATION_DAYS, SHEEP_LATE_GESTATION_DAYS } from '../../../shared/schemas/nutrition/herds'

type HerdClass = HerdValues['class']
const cows = { species: 'cattle' as const, class: 'cow' as HerdClass, expectedBirthDate: '2027-03-10', lastBirthDate: null, restStage: null, litterSize: null }
const ewes = { species: 'sheep' as const, class: 'ewe' as HerdClass, expectedBirthDate: '2027-02-20', lastBirthDate: null, restStage: null, litterSize: 2 }

describe('herdStageOn', () => {
  it('when cows calve on 10 March, then on any date the pregnancy day is the 283-day gestation (Merck Veterinary Manual worked cow, read) minus the days left', () => {
    for (const date of ['2026-06-01', '2026-12-02', '2027-01-20', '2027-03-09']) {
      const s = herdStageOn(cows, date)
      expect(s.daysToBirth).toBe(daysBetween(date, '2027-03-10'))
      expect(s.pregnancyDay).toBe(GESTATION_DAYS.cattle - daysBetween(date, '2027-03-10'))
    }
    expect(herdStageOn(cows, '2027-01-20').label).toBe('Late gestation, day 234 (49 days to calving)')
  })

  it('when the calving date has passed, then the cows are nursing with days in milk counted from it; more than 283 days ahead they are not yet bred', () => {
    expect(herdStageOn(cows, '2027-03-24')).toMatchObject({ pregnancyDay: null, daysInMilk: 14 })
    expect(herdStageOn(cows, addDays('2027-03-10', -300))).toMatchObject({ pregnancyDay: null, daysInMilk: null, label: 'Not pregnant or nursing' })
  })

  it('when ewes are within the last 4 weeks before lambing, then they are in late gestation; earlier in early gestation (NRC 1985 Table 1 stage boundaries, read)', () => {
    expect(herdStageOn(ewes, addDays('2027-02-20', -SHEEP_LATE_GESTATION_DAYS)).sheepStage).toBe('late-gestation')
    expect(herdStageOn(ewes, addDays('2027-02-20', -SHEEP_LATE_GESTATION_DAYS - 1)).sheepStage).toBe('early-gestation')
  })

  it('when ewes lambed, then the first 8 weeks are early lactation and later weeks late lactation (NRC 1985 Table 1 "first 6–8 weeks", read)', () => {
    expect(herdStageOn(ewes, addDays('2027-02-20', SHEEP_EARLY_LACTATION_DAYS - 1)).sheepStage).toBe('early-lactation')
    expect(herdStageOn(ewes, addDays('2027-02-20', SHEEP_EARLY_LACTATION_DAYS)).sheepStage).toBe('late-lactation')
    expect(herdStageOn(ewes, '2027-03-10').label).toBe('Early lactation, day 18 (twins)')
  })

  it('when a heifer is bred, then she is never counted as nursing, and a growing group has no stage beyond its label', () => {
    const heifers = { ...cows, class: 'bred-heifer' as HerdClass }
    expect(herdStageOn(heifers, '2027-03-20').daysInMilk).toBeNull()
    expect(herdStageOn({ ...cows, class: 'growing' as HerdClass, expectedBirthDate: null }, '2027-01-01').label).toBe('Not pregnant or nursing')
  })
})
