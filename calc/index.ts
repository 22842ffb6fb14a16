/**
 * Falloff's meter engine: pure functions from a calc-level scene to exposure readings and light maps.
 * No UI, no I/O. See README.md in this folder for the model, its constants and its error.
 */
export type { Vec3 } from './vec';
export {
  DEFAULT_CALIBRATION_C,
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
  patchBounceLux,
  polygonIrradiancePerLuminance,
  rectangleBounceLux,
} from './bounce';
export {
  PAINT_REFLECTANCE_MAX,
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
  GELS,
  GEL_IDS,
  MODIFIERS,
  MODIFIER_IDS,
  beamProfile,
  beamSolidAngleSr,
} from './modifiers';
export * from './sceneSchema';
export { BARE_REFLECTOR_BEAM_SR, lightColour } from './flatScene';
export type { LightReading, MeterResult } from './results';
export { meter, meterParsed } from './meter';
export { warmRoomCache } from './room';
export {
  type LightMapCache,
  type LightMapGrid,
  type LightMapResult,
  createLightMapCache,
  lightMap,
} from './lightmap';
export type { ContourLevel } from './contours';
