// The public face of the core (DEVELOPERS.md, "The core's public face"): re-exports only.
export { InputError } from './basics/InputError';
export type { Part, Range, Sampler, Look } from './basics/types';
export { MAX_SYMMETRY, MAX_IMAGES_LIMIT } from './basics/types';
export { defaultLookOptions, THRESHOLD_SLACK, type LookOptions } from './physics/lookOptions';
export { DEFAULT_SETTING_STEP_HZ, settingStepHz, isSettableBand } from './physics/settableBands';
export {
  apparentMotion,
  type ApparentMotion,
  type ApparentMotionOptions,
} from './physics/apparentMotion';
export { lockRates, lockCountBound, type LockRate } from './physics/lockRates';
export { ratesForApparent } from './physics/ratesForApparent';
export {
  rateBands,
  type RateBand,
  type RateBandCause,
  type RateBandOptions,
} from './physics/rateBands';
export {
  rateMapSeries,
  defaultRateMapPoints,
  MAX_RATE_MAP_POINTS,
  type RateMapSeries,
  type RateMapOptions,
} from './physics/rateMapSeries';
export {
  findSpeed,
  type StrobeReading,
  type SpeedCandidate,
  type SpeedFinding,
  type FindSpeedOptions,
  type Prediction,
} from './physics/findSpeed';
export {
  blurDegrees,
  blurPitches,
  exposureFromShutterAngle,
  shutterAngleFromExposure,
  flashArcBlurM,
  rollingSkewDegrees,
} from './formulas/exposure';
export {
  flickerRisk,
  flickerLimits,
  percentFlicker,
  svm,
  svmThreshold,
  lightHarmonics,
  lightSvm,
  SVM_MAX_HZ,
  type FlickerRisk,
  type LightComponent,
  type LightShape,
  type LightWave,
} from './formulas/flicker';
export {
  synchronousSpeedHz,
  motorSpeedHz,
  slipFromSpeed,
  beltSpeedHz,
  gearSpeedHz,
  wheelSpeedHz,
  tyreDiameterM,
} from './formulas/drives';
export {
  foldedHz,
  lowPassGainDb,
  rcCutoffHz,
  converterRangeDb,
  orderForAttenuation,
  niceSampleRateHz,
} from './formulas/logger';
export * from './formulas/units';
export { gcd } from './basics/gcd';
// Field tools: speed finder steps, whole machine, lighting, camera, logger, reports.
export { plainNumber } from './basics/plainNumber';
export {
  cautionCodes,
  cautionFlags,
  SEIZURE_RISK_LOW_HZ,
  SEIZURE_RISK_HIGH_HZ,
  type CautionCode,
  type CautionContext,
} from './plans/cautions';
export {
  speedFinderSteps,
  motorExpectedRange,
  type SpeedFinderStage,
  type SpeedFinderStep,
  type SpeedFinderInput,
  type SpeedFinderOptions,
  type StepCandidate,
  type StepPrediction,
  type StepGuide,
  type CheckState,
} from './plans/speedFinderSteps';
export {
  driveChain,
  type ChainRoot,
  type ChainLink,
  type ChainPartSpec,
  type ChainSpec,
  type ChainPart,
} from './plans/driveChain';
export {
  stillRates,
  freezeRates,
  noStillRates,
  type StillSpan,
  type FreezeBand,
  type StillRateOptions,
} from './plans/freezeRates';
export {
  lightingCheck,
  type Lamp,
  type LitPart,
  type LightingVerdict,
  type PartUnderLight,
  type LightingCheck,
  type LightingRemedy,
} from './plans/lightingCheck';
export {
  cameraPlan,
  type CameraAbilities,
  type CameraGoal,
  type CameraSetting,
  type CameraPlan,
  type CameraPlanOptions,
  type CameraCondition,
  type CameraNeeds,
  type LookRate,
} from './plans/cameraPlan';
export { MAX_LOOK_RATES } from './plans/cameraNeeds';
export { standardFrameRates, type StandardFrameRate } from './plans/frameRates';
export {
  loggerPlan,
  type ComponentSource,
  type LoggerNote,
  type LoggerPlanInput,
  type MachineTones,
  type AntiAliasFilter,
  type LoggerComponent,
  type LoggerProposal,
  type LoggerPlan,
  type LoggerPlanOptions,
} from './plans/loggerPlan';
export { csv, csvField, csvTable, type CsvValue, type CsvColumn } from './basics/csv';
export { MAX_WORK_ITEMS } from './basics/workLimit';
// Hear the speed: the spectrum of a recording, the speeds it holds, and their join
// with strobe readings.
export {
  soundSpectrum,
  MIN_SAMPLE_RATE_HZ,
  MAX_SAMPLE_RATE_HZ,
  ANALYSIS_RATE_LIMIT_HZ,
  MIN_RECORDING_S,
  MAX_RECORDING_S,
  type SoundSpectrum,
  type SoundSpectrumOptions,
} from './sound/spectrum';
export { recordingLevel, SILENCE_DBFS, type RecordingLevel } from './sound/level';
export type { SpectrumPeak } from './sound/peaks';
export type { HumLine } from './sound/hum';
export {
  speedsFromSound,
  DEFAULT_SOUND_SPEED_RANGE,
  type SpeedsFromSoundOptions,
  type SoundSpeeds,
  type SoundSpeedCandidate,
  type SoundLine,
  type SoundConfidence,
} from './sound/speedsFromSound';
export {
  joinSoundWithStrobe,
  type SoundStrobeOptions,
  type SoundStrobeJoin,
  type SoundStrobeMatch,
  type StrobeView,
} from './sound/joinSoundWithStrobe';
