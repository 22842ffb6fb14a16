/**
 * Falloff's meter engine: pure functions from a calc-level scene to exposure readings and light maps.
 * No UI, no I/O. See README.md in this folder for the model, its constants and its error.
 */
export type { Vec3 } from './vec';
export { directionFromAim } from './vec';
export {
  type Exposure,
  DEFAULT_CALIBRATION_C,
  MIN_POWER_FRACTION,
  apertureForFlashExposure,
  apertureFromGuideNumber,
  apertureStops,
  candelaSecondsFromGuideNumber,
  ev100FromLux,
  exposureDifferenceStops,
  exposureValue,
  guideNumberFromCandelaSeconds,
  luxFromEv100,
  luxSecondsForAperture,
  powerFractionFromStops,
  powerFractionStops,
} from './exposure';
export {
  angleOfViewDeg,
  discAxisIlluminanceLux,
  illuminanceLux,
  inverseSquareStops,
  kelvinFromMired,
  mired,
  shiftKelvin,
} from './photometry';
export {
  type PatchBounceArgs,
  type RectangleBounceArgs,
  patchBounceLux,
  polygonIrradiancePerLuminance,
  rectangleBounceLux,
} from './bounce';
export {
  type Rgb,
  PAINT_REFLECTANCE_MAX,
  PAINT_REFLECTANCE_MIN,
  cctOfLinearRgb,
  hueHex,
  kelvinToLinearRgb,
  linearRgbOf,
  linearToSrgb,
  mcCamyCct,
  planckianXy,
  relativeLuminance,
  srgbToLinear,
  surfaceReflectance,
} from './colour';
export {
  type GelId,
  type GelSpec,
  type ModifierId,
  type ModifierSpec,
  GELS,
  GEL_IDS,
  MODIFIERS,
  MODIFIER_IDS,
  beamProfile,
  beamSolidAngleSr,
} from './modifiers';
export * from './sceneSchema';
export { BARE_REFLECTOR_BEAM_SR, MIN_DISTANCE_SQ_M2, lightColour } from './flatScene';
export type { ColourReading, LightReading, MeterResult, MeterWarning, PointReading, PowerAdvice } from './results';
export { DARK_LUX_SECONDS, chooseKeyFill, findBackground, meter, meterParsed } from './meter';
export {
  type LightMapCache,
  type LightMapGrid,
  type LightMapResult,
  type LightMapStats,
  createLightMapCache,
  lightMap,
} from './lightmap';
export type { ContourLevel, Polyline } from './contours';
