// Public surface of the Bankside chemistry engine. Pure TypeScript: no DOM, storage or UI.
// Other parts of the app import from here only.
export { InputError, isNotice, type ChemWarning, type WarningCode, type WarningKind } from './errors';
export { SPECIES, MOLAR_MASS, MG_CACO3_PER_MEQ, isIon, type Ion, type SpeciesInfo } from './species';
export { dielectricConstant, waterDensity, debyeHuckelA, debyeHuckelB, kelvin } from './water';
export {
  activityCoefficient,
  meanActivityCoefficient,
  chooseActivityModel,
  autoTjWeight,
  autoLogGamma,
  activityModelDoubt,
  modelValidityWeight,
  AUTO_BLEND,
  ACTIVITY_MODELS,
  MODEL_MAX_IONIC_STRENGTH,
  type ActivityModel,
} from './activity';
export { logK, logKTable, isExtrapolated, REACTIONS, type Reaction } from './equilibrium';
export {
  ionicStrengthFromConductance,
  ionicStrengthFromTds,
  ionicStrengthFromSalinity,
  ionicStrengthFromIons,
  ionicStrengthFromSpecificConductance,
  seawaterWeight,
  salinityFromScExtended,
  DEFAULT_CONDUCTANCE_FACTOR,
  CONDUCTANCE_ESTIMATE_REL_UNCERTAINTY,
  SALINITY_ESTIMATE_REL_UNCERTAINTY,
  BRACKISH_BLEND_US_PER_CM,
  PSS78_MAX_SC_US_PER_CM,
  type ScIonicStrength,
} from './ionic-strength';
export { speciate, type Speciation, type SpeciationInput } from './speciation';
export { specificConductance, conductivityAtTemperature, calculatedConductance, ONSAGER_25C } from './conductance';
export { chargeBalance, SM1030E_LIMITS, type ChargeBalance, type BalanceLimits } from './balance';
export {
  analyzeSample,
  langelierFormulaPhs,
  SEAWATER_IONS_MOL_KG_S35,
  ALKALINITY_ENDPOINT_PH,
  SULFATE_RICH_MAX_IONIC_STRENGTH,
  type SiteConductanceFactor,
  type ConductanceFactorSource,
  type Analysis,
  type AnalyzeOptions,
  type SampleInput,
  type CalciteState,
  type IonicStrengthSource,
} from './analyze';
export {
  DEFAULT_UNCERTAINTIES,
  SC_ABS_U_US_PER_CM,
  LOG_K_UNCERTAINTY,
  COVERAGE_FACTOR,
  uncertaintiesFromEvidence,
  makeBudget,
  budgetLine,
  type Uncertainties,
  type SampleEvidence,
  type BudgetEntry,
  type UncertaintySource,
  type UncertaintyBasis,
  type EvidenceUncertainties,
} from './uncertainty';
export { ENGINE_VERSION, ATMOSPHERIC_LOG_PCO2 } from './version';
export { replicateVerdict, blankVerdict, type QcValues, type QcCheck, type QcVerdict } from './qc';
export {
  oxygenSaturationMgL,
  oxygenPercentSaturation,
  oxygenMgLFromPercent,
  pressureToKPa,
  stationPressureKPa,
  PRESSURE_TO_KPA,
  STANDARD_PRESSURE_KPA,
  type PressureUnit,
} from './oxygen';
export { unionizedAmmoniaFraction, unionizedAmmonia, ammoniaInRange } from './ammonia';
export {
  practicalSalinity,
  salinityFromConductivity,
  salinityFromSpecificConductance,
  C35_15_0_US_PER_CM,
} from './salinity';
export {
  titrationAlkalinity,
  type TitrationInput,
  type TitrationPoint,
  type TitrationResult,
  type TitrationMethod,
  type GranFit,
  type InflectionResult,
} from './titration';
export {
  nernstSlopeMvPerPh,
  phCalibration,
  conductivityStandardCheck,
  doAirCalibrationCheck,
  calibrationCoverage,
  type PhBufferReading,
  type PhCalibrationResult,
  type ScStandardCheck,
  type DoAirCheck,
  type CheckEvent,
  type Coverage,
  type CheckStatus,
} from './calibration';
export { stabilization, replicateRpd, median, type TimedReading, type StabilizationResult } from './stabilization';
export { dataChecks, calculatedTdsMgL, type DataCheck, type DataCheckStatus, type DataCheckExtras } from './checks';
export {
  DEFAULT_PROFILE,
  profileProblems,
  profileRef,
  toleranceAt,
  type MethodProfile,
  type ProfileRef,
  type Tolerance,
  type StabilizedParameter,
  DEFAULT_QC_LIMITS,
  type QcLimits,
  type QcParameter,
  type ReplicateLimit,
} from './profiles';
export { conductanceFactorFromAnalyses, SITE_FACTOR_MIN_ANALYSES } from './site-factor';
