// Reference checks of the feed-energy chain and the forage-test shortcuts.
import { describe, expect, it } from 'vitest'
import { feedEnergy, NRC1985_SHEEP_TABLE1, tdnFromAdf, dmiPctBwFromNdf, relativeFeedValue } from '../../../shared/engine/index'

// TDN % → DE, ME, NEm, NEg (Mcal/kg DM), derived from NRC 2000 p. 126 and the NRC 1996 cubics and rounded to 3 decimals.
const TABLE: [number, number, number, number, number][] = [
  [40, 1.764, 1.446, 0.604, 0.077],
  [45, 1.984, 1.627, 0.789, 0.252],
  [50, 2.204, 1.808, 0.968, 0.42],
  [55, 2.425, 1.988, 1.141, 0.582],
  [60, 2.645, 2.169, 1.31, 0.736],
  [65, 2.866, 2.35, 1.474, 0.884],
  [70, 3.086, 2.531, 1.633, 1.027],
  [80, 3.527, 2.892, 1.942, 1.297],
  [90, 3.968, 3.254, 2.238, 1.549],
]

describe('feedEnergy', () => {
  it.each(TABLE)(
    'at %d %% TDN matches DE = 4.409 × TDN and ME = 0.82 × DE (NRC Beef 2000, p. 126, read) and the NRC 1996 NEm/NEg cubics (coefficients from memory) to the table\'s 3 decimals',
    (tdn, de, me, nem, neg) => {
      const e = feedEnergy({ tdnPctDm: tdn })
      expect(e.deMcalPerKg).toBeCloseTo(de, 3)
      expect(e.meMcalPerKg).toBeCloseTo(me, 3)
      expect(e.nemMcalPerKg).toBeCloseTo(nem, 3)
      expect(e.negMcalPerKg).toBeCloseTo(neg, 3)
      expect(e.warnings).toEqual([])
    },
  )

  it('at 90 % TDN gives the NRC 1996 corn-grain row NEm 2.24, NEg 1.55 Mcal/kg (NRC 1996 feed table, from memory)', () => {
    const e = feedEnergy({ tdnPctDm: 90 })
    expect(e.nemMcalPerKg).toBeCloseTo(2.24, 2)
    expect(e.negMcalPerKg).toBeCloseTo(1.55, 2)
  })

  it('below the NEg equation\'s range (38 % TDN) floors NEg at 0 with a neg-out-of-range warning (NRC 1996 cubic turns negative just under 40 %)', () => {
    const e = feedEnergy({ tdnPctDm: 36 })
    expect(e.negMcalPerKg).toBe(0)
    expect(e.nemMcalPerKg).toBeGreaterThan(0)
    expect(e.warnings.map((w) => w.code)).toEqual(['neg-out-of-range'])
  })

  it('for a mineral (0 % TDN) floors NEm and NEg at 0 with both warnings', () => {
    const e = feedEnergy({ tdnPctDm: 0 })
    expect(e.nemMcalPerKg).toBe(0)
    expect(e.negMcalPerKg).toBe(0)
    expect(e.warnings.map((w) => w.code).sort()).toEqual(['neg-out-of-range', 'nem-out-of-range'])
  })

  it('reproduces the ME column of the read NRC 1985 sheep Table 1 rows from their TDN (TDN × 4.409 × 0.82) to the table\'s 0.1 Mcal', () => {
    const read = [...NRC1985_SHEEP_TABLE1.maintenance, ...NRC1985_SHEEP_TABLE1.flushing, ...NRC1985_SHEEP_TABLE1.earlyGestation]
    expect(read.every((r) => r.label === 'read')).toBe(true)
    for (const r of read) {
      const me = r.tdnKg * feedEnergy({ tdnPctDm: 100 }).meMcalPerKg
      expect(Math.abs(me - r.meMcal)).toBeLessThanOrEqual(0.1)
    }
  })
})

describe('forage-test shortcuts (common practice, from memory)', () => {
  it('tdnFromAdf uses DDM = 88.9 − 0.779 × ADF: 30 % ADF → 65.53 %', () => {
    expect(tdnFromAdf({ adfPctDm: 30 })).toBeCloseTo(65.53, 6)
  })
  it('dmiPctBwFromNdf uses 120 / NDF: 60 % NDF → 2.0 % of BW; RFV = DDM × DMI / 1.29', () => {
    expect(dmiPctBwFromNdf({ ndfPctDm: 60 })).toBeCloseTo(2, 12)
    expect(relativeFeedValue({ adfPctDm: 30, ndfPctDm: 60 })).toBeCloseTo((65.53 * 2) / 1.29, 6)
  })
})
