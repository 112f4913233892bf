// The public face of the core (../shared/design/core-api.md): re-exports only.
export { InputError } from './InputError';
export type { Part, Range, Sampler, Look } from './types';
export { MAX_SYMMETRY, MAX_IMAGES_LIMIT } from './types';
export { defaultLookOptions, THRESHOLD_SLACK, type LookOptions } from './lookOptions';
export { DEFAULT_SETTING_STEP_HZ, settingStepHz, isSettableBand } from './settableBands';
export { apparentMotion, type ApparentMotion, type ApparentMotionOptions } from './apparentMotion';
export { lockRates, type LockRate } from './lockRates';
export { ratesForApparent } from './ratesForApparent';
export { rateBands, type RateBand, type RateBandCause, type RateBandOptions } from './rateBands';
export {
  rateMapSeries,
  defaultRateMapPoints,
  MAX_RATE_MAP_POINTS,
  type RateMapSeries,
  type RateMapOptions,
} from './rateMapSeries';
export {
  findSpeed,
  type StrobeReading,
  type SpeedCandidate,
  type SpeedFinding,
  type FindSpeedOptions,
  type Prediction,
} from './findSpeed';
export {
  blurDegrees,
  blurPitches,
  exposureFromShutterAngle,
  shutterAngleFromExposure,
  flashArcBlurM,
  rollingSkewDegrees,
} from './exposure';
export {
  flickerRisk,
  flickerLimits,
  percentFlicker,
  svm,
  svmThreshold,
  type FlickerRisk,
  type LightComponent,
} from './flicker';
export {
  synchronousSpeedHz,
  motorSpeedHz,
  slipFromSpeed,
  beltSpeedHz,
  gearSpeedHz,
  wheelSpeedHz,
  tyreDiameterM,
} from './drives';
export {
  foldedHz,
  lowPassGainDb,
  rcCutoffHz,
  converterRangeDb,
  orderForAttenuation,
} from './logger';
export * from './units';
export { gcd } from './gcd';
// Field tools (issue 5): speed finder steps, whole machine, lighting, camera, logger, reports.
export { plainNumber } from './plainNumber';
export {
  safetyCautions,
  cautionFlags,
  STILLNESS_CAUTION,
  FLASHING_CAUTION,
  PLANNING_AID_CAUTION,
  SEIZURE_RISK_LOW_HZ,
  SEIZURE_RISK_HIGH_HZ,
  type CautionContext,
} from './safetyCautions';
export {
  speedFinderSteps,
  motorExpectedRange,
  type SpeedFinderStage,
  type SpeedFinderStep,
  type SpeedFinderInput,
  type SpeedFinderOptions,
  type StepCandidate,
  type StepPrediction,
} from './speedFinderSteps';
export {
  driveChain,
  type ChainRoot,
  type ChainLink,
  type ChainPartSpec,
  type ChainSpec,
  type ChainPart,
} from './driveChain';
export {
  stillRates,
  freezeRates,
  noStillRates,
  type StillSpan,
  type FreezeBand,
  type StillRateOptions,
} from './freezeRates';
export {
  lightingCheck,
  type Lamp,
  type LitPart,
  type LightingVerdict,
  type PartUnderLight,
  type LightingCheck,
} from './lightingCheck';
export {
  cameraPlan,
  standardFrameRates,
  type StandardFrameRate,
  type CameraAbilities,
  type CameraGoal,
  type CameraSetting,
  type CameraPlan,
  type CameraPlanOptions,
} from './cameraPlan';
export {
  loggerPlan,
  niceSampleRateHz,
  ALIAS_AFTER_CONVERTER_NOTE,
  type MachineTones,
  type AntiAliasFilter,
  type LoggerComponent,
  type LoggerProposal,
  type LoggerPlan,
  type LoggerPlanOptions,
} from './loggerPlan';
export { csv, csvField, csvTable, type CsvValue, type CsvColumn } from './csv';
export { MAX_WORK_ITEMS } from './workLimit';
