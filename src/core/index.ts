// The public face of the core (../shared/design/core-api.md): re-exports only.
export { InputError } from './InputError';
export type { Part, Range, Sampler, Look } from './types';
export { MAX_SYMMETRY, MAX_IMAGES_LIMIT } from './types';
export { defaultLookOptions, type LookOptions } from './lookOptions';
export { apparentMotion, type ApparentMotion, type ApparentMotionOptions } from './apparentMotion';
export { lockRates, type LockRate } from './lockRates';
export { ratesForApparent } from './ratesForApparent';
export { rateBands, type RateBand, type RateBandCause, type RateBandOptions } from './rateBands';
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
export { flickerRisk, flickerLimits, percentFlicker, svm, svmThreshold, type FlickerRisk, type LightComponent } from './flicker';
export {
  synchronousSpeedHz,
  motorSpeedHz,
  slipFromSpeed,
  beltSpeedHz,
  gearSpeedHz,
  wheelSpeedHz,
  tyreDiameterM,
} from './drives';
export { foldedHz, lowPassGainDb, rcCutoffHz, converterRangeDb, orderForAttenuation } from './logger';
export * from './units';
export { gcd } from './gcd';
