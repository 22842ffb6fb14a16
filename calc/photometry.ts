/**
 * Photometry of point sources and lenses: inverse-square law, Lambert's cosine law, angle of view, mired.
 */
import { DEG } from './vec';

/**
 * Change in stops at a point when its distance to a point source goes from fromM to toM
 * (inverse-square law: E ∝ 1/d², so Δ = log2(from²/to²)). Doubling the distance gives −2.
 */
export function inverseSquareStops(fromM: number, toM: number): number {
  return 2 * Math.log2(fromM / toM);
}

/**
 * Illuminance (lux) on a surface at distanceM (m) from a point source of intensityCd (cd), the light
 * arriving incidenceDeg off the surface normal: E = I·cosθ/d² (inverse-square and Lambert's cosine law).
 * Light arriving from behind the surface (θ ≥ 90°) gives 0.
 */
export function illuminanceLux(intensityCd: number, distanceM: number, incidenceDeg = 0): number {
  const c = Math.cos(incidenceDeg * DEG);
  return c > 0 ? (intensityCd * c) / (distanceM * distanceM) : 0;
}

/**
 * Illuminance on the axis of a Lambertian disc of radius faceRadiusM whose on-axis intensity is
 * intensityCd: E = I/(d² + R²). This is the coaxial disc view factor F = R²/(R²+d²) times πL with
 * I = πR²·L; it tends to the inverse-square law when d ≫ R and stays finite up close.
 */
export function discAxisIlluminanceLux(intensityCd: number, distanceM: number, faceRadiusM: number): number {
  return intensityCd / (distanceM * distanceM + faceRadiusM * faceRadiusM);
}

/** Angle of view (degrees) across a sensor dimension sensorMm for a lens of focalMm: 2·atan(d / 2f). */
export function angleOfViewDeg(focalMm: number, sensorMm: number): number {
  return (2 * Math.atan(sensorMm / (2 * focalMm))) / DEG;
}

/** Micro-reciprocal degrees: M = 10⁶ / T (T in kelvin). */
export function mired(kelvin: number): number {
  return 1e6 / kelvin;
}

/** Colour temperature (K) of a mired value: T = 10⁶ / M. */
export function kelvinFromMired(miredValue: number): number {
  return 1e6 / miredValue;
}

/** Colour temperature after a gel that shifts the source by miredShift (positive warms: CTO). */
export function shiftKelvin(kelvin: number, miredShift: number): number {
  return 1e6 / (1e6 / kelvin + miredShift);
}
