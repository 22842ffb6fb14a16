/**
 * Exposure arithmetic: APEX values, stops between settings, flash power steps, guide numbers and the
 * incident-light meter equation. Everything here is a closed-form formula; no scene knowledge.
 */

/** Camera settings. aperture: f-number N (dimensionless); shutterS: exposure time t in seconds; iso: S. */
export type Exposure = { aperture: number; shutterS: number; iso: number };

/**
 * Default incident-light calibration constant C (lux·s for a flash meter, lux for continuous light).
 * ISO 2720:1974 gives C = 240–400 for a flat receptor (250 is the common choice) and 320–540 for a
 * hemispherical one. The meter computes illuminance on a plane (the subject's facing), which is what a flat
 * receptor measures, so it uses the flat-receptor value 250. Overridable per scene (`options.calibrationC`).
 */
export const DEFAULT_CALIBRATION_C = 250;

/** Lowest power fraction of a typical flash head, 1/256 (eight stops below full): common practice. */
export const MIN_POWER_FRACTION = 1 / 256;

/**
 * Exposure value normalised to ISO 100 (APEX, ASA PH2.5-1960): EV = log2(N²/t) − log2(S/100).
 * A higher EV means settings that record less light.
 */
export function exposureValue(e: Exposure): number {
  return Math.log2((e.aperture * e.aperture) / e.shutterS) - Math.log2(e.iso / 100);
}

/**
 * How many stops more light `to` records than `from` for the same scene (negative: `to` is darker).
 * Recorded exposure is proportional to t·S/N², so the difference is EV100(from) − EV100(to).
 */
export function exposureDifferenceStops(from: Exposure, to: Exposure): number {
  return exposureValue(from) - exposureValue(to);
}

/** Stops of a flash power fraction: 1 → 0, 1/2 → −1, 1/8 → −3 (each halving of energy is one stop). */
export function powerFractionStops(fraction: number): number {
  return Math.log2(fraction);
}

/** Inverse of powerFractionStops: −3 → 1/8. */
export function powerFractionFromStops(stops: number): number {
  return Math.pow(2, stops);
}

/** Stops between two f-numbers (positive when `to` is the smaller opening, i.e. needs more light). */
export function apertureStops(fromAperture: number, toAperture: number): number {
  return 2 * Math.log2(toAperture / fromAperture);
}

/**
 * f-number from a guide number: GN = d × N at ISO 100, and GN scales with √(S/100).
 * guideNumberM in metres at ISO 100, distanceM in metres.
 */
export function apertureFromGuideNumber(guideNumberM: number, distanceM: number, iso: number): number {
  return (guideNumberM * Math.sqrt(iso / 100)) / distanceM;
}

/**
 * Incident-light meter equation in its flash form (ISO 2720:1974 with E·t replaced by H = ∫E dt):
 * N² = H·S/C. luxSeconds: luminous exposure H at the receptor (lux·s). Returns the f-number N.
 */
export function apertureForFlashExposure(
  luxSeconds: number,
  iso: number,
  calibrationC: number = DEFAULT_CALIBRATION_C,
): number {
  return Math.sqrt((luxSeconds * iso) / calibrationC);
}

/** Inverse of apertureForFlashExposure: the luminous exposure H (lux·s) that an incident meter reads as N. */
export function luxSecondsForAperture(
  aperture: number,
  iso: number,
  calibrationC: number = DEFAULT_CALIBRATION_C,
): number {
  return (aperture * aperture * calibrationC) / iso;
}

/**
 * Illuminance (lux) that an incident meter calibrated with C reads as exposure value ev100 at ISO 100:
 * N²/t = E·S/C, so E = C·2^EV/100.
 */
export function luxFromEv100(ev100: number, calibrationC: number = DEFAULT_CALIBRATION_C): number {
  return (calibrationC * Math.pow(2, ev100)) / 100;
}

/** Inverse of luxFromEv100. */
export function ev100FromLux(lux: number, calibrationC: number = DEFAULT_CALIBRATION_C): number {
  return Math.log2((lux * 100) / calibrationC);
}

/**
 * On-axis luminous intensity-time (cd·s) of a flash from its guide number (metres, ISO 100):
 * GN² = I·t·S/C with S = 100 (ISO 2720 combined with inverse square).
 */
export function candelaSecondsFromGuideNumber(
  guideNumberM: number,
  calibrationC: number = DEFAULT_CALIBRATION_C,
): number {
  return (guideNumberM * guideNumberM * calibrationC) / 100;
}

/** Inverse of candelaSecondsFromGuideNumber: guide number (m, ISO 100) of a flash of I·t cd·s. */
export function guideNumberFromCandelaSeconds(
  candelaSeconds: number,
  calibrationC: number = DEFAULT_CALIBRATION_C,
): number {
  return Math.sqrt((candelaSeconds * 100) / calibrationC);
}
