// Public surface of the Bankside chemistry engine. Pure TypeScript: no DOM, storage or UI.
// Other parts of the app import from here only.
export { InputError, type ChemWarning, type WarningCode } from './errors';
export { SPECIES, MOLAR_MASS, MG_CACO3_PER_MEQ, isIon, type Ion, type SpeciesInfo } from './species';
export { dielectricConstant, waterDensity, debyeHuckelA, debyeHuckelB, kelvin } from './water';
export {
  activityCoefficient,
  meanActivityCoefficient,
  chooseActivityModel,
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
  DEFAULT_CONDUCTANCE_FACTOR,
  CONDUCTANCE_ESTIMATE_REL_UNCERTAINTY,
} from './ionic-strength';
export { speciate, type Speciation, type SpeciationInput } from './speciation';
export { specificConductance, conductivityAtTemperature, calculatedConductance } from './conductance';
export { chargeBalance, SM1030E_LIMITS, type ChargeBalance, type BalanceLimits } from './balance';
export {
  analyzeSample,
  DEFAULT_UNCERTAINTIES,
  type Analysis,
  type AnalyzeOptions,
  type SampleInput,
  type CalciteState,
  type IonicStrengthSource,
  type Uncertainties,
} from './analyze';
export { ENGINE_VERSION, ATMOSPHERIC_LOG_PCO2 } from './version';
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
} from './profiles';
