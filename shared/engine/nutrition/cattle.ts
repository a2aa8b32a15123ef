// Beef cattle daily requirements: maintenance with its adjustments, cold, pregnancy, lactation, growth, intake, CP, Ca, P.
import { z } from 'zod'
import { DE_PER_KG_TDN, ME_PER_DE, nemFromMe, negFromMe } from './energy'
import { cToF, kphToMph } from '../units'
import { SOURCES } from './sources'
import type { Requirements } from './requirements'

export const cattleAnimalSchema = z
  .object({
    class: z.enum(['cow', 'bred-heifer', 'growing', 'bull']),
    bodyWeightKg: z.number().finite().min(50).max(1500),
    matureWeightKg: z.number().finite().min(200).max(1500),
    bcs: z.number().finite().min(1).max(9),
    breed: z.enum(['british', 'continental', 'indicus-cross', 'indicus', 'dairy-cross']).optional(),
    pregnancyDay: z.number().finite().min(0).max(300).optional(),
    calfBirthWeightKg: z.number().finite().min(10).max(80).optional(),
    daysInMilk: z.number().finite().min(0).max(400).optional(),
    peakMilkKg: z.number().finite().min(0).max(30).optional(),
    adgKg: z.number().finite().min(0).max(2.5).optional(),
    grazing: z.boolean().optional(),
    environment: z
      .object({
        tempC: z.number().finite().min(-60).max(50),
        windKph: z.number().finite().min(0).max(150).optional(),
        coat: z.enum(['summer-or-wet', 'dry-fall', 'dry-winter', 'heavy-winter']),
        mud: z.enum(['none', 'some', 'wet', 'caked']).optional(),
      })
      .strict()
      .optional(),
  })
  .strict()
export type CattleAnimal = z.infer<typeof cattleAnimalSchema>

/** Settings with stated defaults; none is a hidden constant. */
export const cattleSettingsSchema = z
  .object({
    /** Multiplies predicted intake: the NRC 1996 cow equation under-predicts modern cows by 14–17 % (Gross, OSU thesis — read). */
    intakeFactor: z.number().finite().min(0.5).max(1.5).default(1),
    /** Grazing activity on maintenance; default 1.10, inside the ×1.08–1.30 range of Di Marco & Aello (2001) (read). */
    grazingActivityFactor: z.number().finite().min(1).max(1.3).default(1.1),
  })
  .strict()
export type CattleSettings = z.input<typeof cattleSettingsSchema>

/** SBW = 0.96 × full BW (NRC 1996 — from memory). */
export const SHRINK = 0.96
/** Standard reference weight for the NRC growth equations, 478 kg (NRC 1996/2000 — from memory). */
export const SRW_KG = 478
/** Default calf birth weight behind NRC 2000 Table 4-2 (read). */
export const DEFAULT_CBW_KG = 38.5
/** km for the conceptus on a 2.0 Mcal ME/kg forage diet (NRC 2000 p. 43 — read). */
export const KM_PREGNANCY = 0.576
/** Week of peak milk for suckled beef cows (NRC 2000 p. 45 — read). */
export const PEAK_WEEK = 8.5
/** NEl of beef milk, Mcal/kg: 0.092 × 4.0 fat + 0.049 × 8.3 SNF − 0.0569 (NRC dairy form — from memory). */
export const MILK_NEL_MCAL_PER_KG = 0.092 * 4.0 + 0.049 * 8.3 - 0.0569
/** Milk true protein 3.4 % (NRC 1996 beef assumption — from memory). */
export const MILK_PROTEIN = 0.034

const BREED_FACTOR: Record<NonNullable<CattleAnimal['breed']>, number> = {
  // NRC 1996 breed table (from memory); the NRC 2000 p. 7 text reviews the data behind it (read).
  british: 1.0,
  continental: 1.0,
  'indicus-cross': 0.95,
  indicus: 0.9,
  'dairy-cross': 1.2,
}

/** Lower critical temperature by coat, °F (extension coat table, read). */
export const LCT_F: Record<NonNullable<CattleAnimal['environment']>['coat'], number> = {
  'summer-or-wet': 59,
  'dry-fall': 45,
  'dry-winter': 32,
  'heavy-winter': 18,
}

/** Base maintenance NEm, Mcal/d = 0.077 × SBW^0.75 (Lofgreen & Garrett 1968, as stated by Zinn et al. 2008 — read). */
export function maintenanceNemBase(sbwKg: number): number {
  return 0.077 * sbwKg ** 0.75
}

/** ME for the conceptus, Mcal/d (NRC 1996 pregnancy equation — constants from memory; reproduce NRC 2000 Table 4-2, derived). */
export function pregnancyMe(day: number, cbwKg: number): number {
  return (cbwKg * (0.4504 - 0.000766 * day) * Math.exp(0.03233 * day - 0.0000275 * day * day)) / 1000
}
/** NEm for pregnancy = 0.576 × ME_preg (NRC 2000 p. 43 and Table 4-2 — read). */
export function pregnancyNem(day: number, cbwKg = DEFAULT_CBW_KG): number {
  return KM_PREGNANCY * pregnancyMe(day, cbwKg)
}
/** MP for pregnancy, g/d (NRC 1996 — from memory). */
export function pregnancyMp(day: number, cbwKg = DEFAULT_CBW_KG): number {
  return (cbwKg * (0.001669 - 0.00000211 * day) * Math.exp(0.0278 * day - 0.0000176 * day * day) * 6.25) / 0.65
}

/**
 * Milk yield, kg/d, in week n of lactation: Y = n / (a·e^(k·n)), k = 1/T, a = 1/(PKYD·k·e)
 * (Jenkins & Ferrell 1984 as adopted by NRC 2000 p. 45 — read; the a and k relations derived from the curve's peak).
 */
export function milkYieldKg(week: number, peakKg: number, peakWeek = PEAK_WEEK): number {
  if (week <= 0 || peakKg <= 0) return 0
  const k = 1 / peakWeek
  const a = 1 / (peakKg * k * Math.E)
  return week / (a * Math.exp(k * week))
}

/** Retained energy for gain, Mcal/d = 0.0635 × EQEBW^0.75 × EBG^1.097 (NRC 1996 — from memory; consistent with the read inverse form, derived). */
export function growthNeg(eqsbwKg: number, swgKg: number): number {
  // Gains under a gram a day are no gain (and would underflow the power law).
  if (swgKg < 1e-3) return 0
  return 0.0635 * (0.891 * eqsbwKg) ** 0.75 * (0.956 * swgKg) ** 1.097
}
/** Shrunk weight gain from retained energy, SWG = 13.91 × RE^0.9116 × EQSBW^−0.6837 (quoted in a 2023 ASAS abstract — read). */
export function gainFromNeg(negMcal: number, eqsbwKg: number): number {
  if (negMcal <= 0) return 0
  return 13.91 * negMcal ** 0.9116 * eqsbwKg ** -0.6837
}

type IntakeKind = 'calf' | 'yearling' | 'cow-open' | 'cow-pregnant'

/** NRC 1996/2000 DMI equations, kg DM/d, NEma in Mcal/kg DM (coefficients from memory). */
export function cattleDmi(kind: IntakeKind, sbwKg: number, nema: number, milkKg = 0): number {
  const m = sbwKg ** 0.75
  switch (kind) {
    case 'calf':
      return Math.max(0, (m * (0.2435 * nema - 0.0466 * nema * nema - 0.1128)) / nema)
    case 'yearling':
      return Math.max(0, (m * (0.2435 * nema - 0.0466 * nema * nema - 0.0869)) / nema)
    case 'cow-open':
      return (m * (0.04997 * nema * nema + 0.04631)) / nema + 0.2 * milkKg
    case 'cow-pregnant':
      return (m * (0.04997 * nema * nema + 0.0384)) / nema + 0.2 * milkKg
  }
}

function dietEnergyAt(tdnPct: number) {
  const me = (tdnPct / 100) * DE_PER_KG_TDN * ME_PER_DE
  return { me, nem: nemFromMe(me), neg: negFromMe(me) }
}

/**
 * Daily requirements of beef cattle, per head.
 * Sources: NRC, Nutrient Requirements of Beef Cattle, 7th rev. ed. (1996), Update 2000 — maintenance 0.077 × SBW^0.75 (Zinn et al. 2008, read),
 * bulls +15 % (p. 8, read), lactation +20 % (Hersom AN190, read), breed and body-condition factors (NRC 1996, from memory),
 * grazing activity (Di Marco & Aello 2001, read range), pregnancy with km 0.576 (p. 43 and Table 4-2, read), milk curve (p. 45, read),
 * growth and intake equations (NRC 1996, from memory), cold stress by the coat table and the 1 %-per-°F rule (NDSU, K-State — read),
 * CP by the NRC level-1 microbial logic (from memory), Ca and P by AZ9523 concentrations (read) or the NRC factorial (from memory).
 *
 * The diet energy density the animal needs is found the NRC way: the lowest TDN % at which predicted intake × density meets
 * maintenance, pregnancy and lactation NEm plus growth NEg; intake at that density is the capacity (`dmiKg`), and TDN and ME follow.
 */
export function cattleRequirements(animal: CattleAnimal, settings?: CattleSettings): Requirements {
  const a = cattleAnimalSchema.parse(animal)
  const s = cattleSettingsSchema.parse(settings ?? {})
  const notes: string[] = []
  const sources = new Set<string>([SOURCES.nrcBeef2000, SOURCES.zinn2008])

  const sbw = SHRINK * a.bodyWeightKg
  const msbw = sbw ** 0.75
  const pregnant = a.pregnancyDay !== undefined && a.pregnancyDay > 0 && a.class !== 'growing' && a.class !== 'bull'
  const cbw = a.calfBirthWeightKg ?? DEFAULT_CBW_KG
  const lactating = a.class === 'cow' && a.daysInMilk !== undefined && a.daysInMilk > 0 && (a.peakMilkKg ?? 0) > 0
  const milkKg = lactating ? milkYieldKg(a.daysInMilk! / 7, a.peakMilkKg!) : 0

  // Maintenance and its multipliers.
  let factor = BREED_FACTOR[a.breed ?? 'british']
  if (a.breed && a.breed !== 'british') sources.add(SOURCES.nrcBeef1996Memory)
  if (a.class === 'cow') {
    // Previous plane of nutrition: COMP = 0.8 + 0.05 × (BCS − 1) for mature cows (NRC 1996, from memory).
    factor *= 0.8 + 0.05 * (a.bcs - 1)
    if (a.bcs !== 5) notes.push(`Maintenance × ${(0.8 + 0.05 * (a.bcs - 1)).toFixed(2)} for body condition ${a.bcs} (NRC 1996 factor, from memory).`)
  }
  if (a.class === 'bull') {
    factor *= 1.15
    sources.add(SOURCES.nrcBeef2000p8)
  }
  if (lactating) {
    factor *= 1.2
    sources.add(SOURCES.hersomAn190)
  }
  if (a.grazing) {
    factor *= s.grazingActivityFactor
    sources.add(SOURCES.diMarco2001)
    notes.push(`Grazing activity × ${s.grazingActivityFactor} on maintenance (a setting; published range ×1.08–1.30).`)
  }
  const maintenanceNem = maintenanceNemBase(sbw) * factor

  const pregnancyNemMcal = pregnant ? pregnancyNem(a.pregnancyDay!, cbw) : 0
  if (pregnant) sources.add(SOURCES.nrcBeef2000Table42)
  if (pregnant && a.calfBirthWeightKg === undefined) notes.push(`Calf birth weight taken as ${DEFAULT_CBW_KG} kg, the value behind NRC 2000 Table 4-2.`)
  const lactationNemMcal = milkKg * MILK_NEL_MCAL_PER_KG
  if (lactating) {
    sources.add(SOURCES.nrcBeef2000p45)
    notes.push(`Milk ${milkKg.toFixed(2)} kg/d in week ${(a.daysInMilk! / 7).toFixed(1)} of lactation (peak ${a.peakMilkKg} kg at week ${PEAK_WEEK}).`)
  }

  // Growth: bred heifers and growing cattle (and bulls) with a target gain.
  const adg = a.adgKg ?? 0
  const fsbw = SHRINK * a.matureWeightKg
  const eqsbw = sbw * (SRW_KG / fsbw)
  const growthNegMcal = a.class === 'cow' ? 0 : growthNeg(eqsbw, adg)
  if (a.class === 'cow' && adg > 0) notes.push('Target gain is ignored for mature cows; body condition adjusts maintenance instead.')
  if (growthNegMcal > 0) sources.add(SOURCES.nrcBeef1996Memory)

  const nemNoCold = maintenanceNem + pregnancyNemMcal + lactationNemMcal

  // Intake equation for the class.
  const kind: IntakeKind =
    a.class === 'growing' ? (sbw < 300 ? 'calf' : 'yearling') : a.class === 'bull' ? 'cow-open' : pregnant ? 'cow-pregnant' : 'cow-open'
  const dmiAt = (tdn: number) => s.intakeFactor * cattleDmi(kind, sbw, dietEnergyAt(tdn).nem, milkKg)
  const feedNeededAt = (tdn: number) => {
    const e = dietEnergyAt(tdn)
    return nemNoCold / e.nem + (growthNegMcal > 0 ? growthNegMcal / e.neg : 0)
  }
  // Lowest TDN % in the equations' range (40–90 %) at which intake covers the feed needed; a scan then bisection copes with any shape.
  const lo = 40
  const hi = 90
  let tdnPct = hi
  let found = false
  if (dmiAt(lo) >= feedNeededAt(lo)) {
    tdnPct = lo
    found = true
  } else {
    for (let t = lo + 0.5; t <= hi + 1e-9; t += 0.5) {
      if (dmiAt(t) >= feedNeededAt(t)) {
        let l = t - 0.5
        let h = t
        for (let i = 0; i < 40; i++) {
          const mid = (l + h) / 2
          if (dmiAt(mid) >= feedNeededAt(mid)) h = mid
          else l = mid
        }
        tdnPct = h
        found = true
        break
      }
    }
  }
  const feedKg = feedNeededAt(tdnPct)
  const dmiKg = Math.max(dmiAt(tdnPct), 1e-3)
  if (!found) notes.push('Even a 90 % TDN diet cannot meet these needs within predicted intake: expect a shortfall.')
  if (tdnPct === lo && found) notes.push('Needs are met below 40 % TDN, the low end of the energy equations; 40 % is used.')
  const energy = dietEnergyAt(tdnPct)

  // Cold stress: +1 % per °F that the effective temperature falls below the coat's lower critical temperature.
  let coldStressNemMcal = 0
  let extraTdnKg = 0
  if (a.environment) {
    const env = a.environment
    const wetCoat = env.mud === 'wet' || env.mud === 'caked'
    const lct = wetCoat ? LCT_F['summer-or-wet'] : LCT_F[env.coat]
    const eatF = cToF(env.tempC) - kphToMph(env.windKph ?? 0)
    const below = Math.max(0, lct - eatF)
    if (below > 0) {
      const c = 0.01 * below
      coldStressNemMcal = c * nemNoCold
      extraTdnKg = (coldStressNemMcal / energy.nem) * (tdnPct / 100)
      sources.add(SOURCES.coatLct)
      sources.add(SOURCES.onePctPerF)
      if ((env.windKph ?? 0) > 0) sources.add(SOURCES.windChillRule)
      notes.push(
        `Cold: effective ${eatF.toFixed(0)} °F against a lower critical ${lct} °F${wetCoat ? ' (wet or mud-matted hair counts as a wet coat)' : ''}: energy +${below.toFixed(0)} %.`,
      )
    }
  }

  const tdnKg = feedKg * (tdnPct / 100) + extraTdnKg
  const meMcal = tdnKg * DE_PER_KG_TDN * ME_PER_DE
  const nemMcal = nemNoCold + coldStressNemMcal

  // Protein: MP need, then CP by the NRC level-1 microbial logic (MCP = 0.13 × TDN; MP = 0.64 MCP + 0.80 UIP) — from memory.
  let mp = 3.8 * msbw
  if (pregnant) mp += pregnancyMp(a.pregnancyDay!, cbw)
  mp += (milkKg * MILK_PROTEIN * 1000) / 0.65
  let proteinGainG = 0
  if (growthNegMcal > 0 && adg > 0) {
    proteinGainG = adg * (268 - 29.4 * (growthNegMcal / adg))
    const eff = eqsbw <= 300 ? 0.834 - 0.00114 * eqsbw : 0.492
    mp += Math.max(0, proteinGainG) / eff
  }
  const mcpG = 0.13 * tdnKg * 1000
  const cpG = mcpG + Math.max(0, mp - 0.64 * mcpG) / 0.8
  sources.add(SOURCES.nrcBeef1996Memory)

  // Ca and P: AZ9523 concentrations for cows and heifers (read); the NRC factorial for growing cattle and bulls (from memory).
  let caG: number
  let pG: number
  if (a.class === 'cow' || a.class === 'bred-heifer') {
    caG = (lactating ? 0.0028 : 0.0026) * dmiKg * 1000
    pG = (lactating ? 0.0022 : 0.002) * dmiKg * 1000
    sources.add(SOURCES.az9523)
  } else {
    const gainProtein100g = Math.max(0, proteinGainG) / 100
    caG = 0.0154 * sbw + 7.1 * gainProtein100g
    pG = 0.016 * sbw + 3.9 * gainProtein100g
  }

  return {
    dmiKg,
    tdnKg,
    meMcal,
    nemMcal,
    negMcal: growthNegMcal,
    cpKg: cpG / 1000,
    caG,
    pG,
    components: {
      maintenanceNemMcal: maintenanceNem,
      pregnancyNemMcal,
      lactationNemMcal,
      growthNegMcal,
      coldStressNemMcal,
    },
    notes: [`Diet density needed: ${tdnPct.toFixed(1)} % TDN; intake at that density ${dmiKg.toFixed(2)} kg DM/d.`, ...notes],
    sources: [...sources],
  }
}
