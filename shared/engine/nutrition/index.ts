// Nutrition: energy chain, cattle and sheep requirements, ration balance (LP), conversions and warnings.
export { SOURCES, CAUTION } from './sources'
export { warningSchema, warningCodes, type NutritionWarning, type WarningCode } from './warning'
export {
  feedEnergy,
  energyOfTdn,
  feedEnergyInputSchema,
  feedEnergySchema,
  nemFromMe,
  negFromMe,
  tdnFromAdf,
  ddmFromAdf,
  dmiPctBwFromNdf,
  relativeFeedValue,
  DE_PER_KG_TDN,
  ME_PER_DE,
  type FeedEnergy,
  type FeedEnergyInput,
} from './energy'
export {
  asFedFromDm,
  dmFromAsFed,
  pctDmFromAsFed,
  pctAsFedFromDm,
  no3FromNo3N,
  no3NFromNo3,
  ppmToPct,
  pctToPpm,
  cpFromN,
  mcalToMj,
  mjToMcal,
  NO3_PER_NO3N,
  CP_PER_N,
  MJ_PER_MCAL,
} from './conversions'
export { requirementsSchema, requirementComponentsSchema, type Requirements } from './requirements'
export {
  cattleRequirements,
  cattleAnimalSchema,
  cattleSettingsSchema,
  maintenanceNemBase,
  pregnancyNem,
  pregnancyMe,
  pregnancyMp,
  milkYieldKg,
  growthNeg,
  gainFromNeg,
  cattleDmi,
  LCT_F,
  SHRINK,
  SRW_KG,
  DEFAULT_CBW_KG,
  KM_PREGNANCY,
  MILK_NEL_MCAL_PER_KG,
  type CattleAnimal,
  type CattleSettings,
} from './cattle'
export { sheepRequirements, sheepAnimalSchema, sheepRowAt, NRC1985_SHEEP_TABLE1, SHEEP_WEIGHT_CLASS_STEP_KG, type SheepAnimal, type SheepTableRow } from './sheep'
export { pearsonSquare, pearsonInputSchema, type PearsonInput } from './pearson'
export { rationWarnings, rationWarningsInputSchema, NITRATE_N_BANDS, NITRATE_NO3_DIET, CATTLE_MAX_CU, type RationWarningsInput } from './warnings'
export {
  feedSchema,
  limitsSchema,
  rationProblemSchema,
  balanceOptionsSchema,
  balanceResultSchema,
  nutrientNames,
  type Feed,
  type RationLimits,
  type RationProblem,
  type BalanceOptions,
  type BalanceResult,
  type Nutrient,
} from './ration/schema'
export { DEFAULT_LIMITS, feedDensity } from './ration/model'
export { balanceRation, balanceRations, rationLinearProgram, dietCost } from './ration/balance'
export { checkLpSolution, type FallbackReason, type LinearProgram, type LpOutcome, type LpRow, type SolverName } from './lp/program'
export { solveLp, solveLpSync, type LpAnswer, type SolveLpOptions } from './lp/solve'
export { basisSolution, certifyInfeasible, certifyLp, type Certificate, type PrimalDual } from './lp/certificate'
export { DenseSimplex, simplex, type LpBasis, type SimplexResult } from './lp/simplex'
export { configureHighs, loadHighs } from './lp/adapter'
