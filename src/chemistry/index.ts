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
