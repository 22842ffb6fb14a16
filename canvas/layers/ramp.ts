// Colour for a light-map value: at the subject's level a warm glow, each stop darker a cooler, deeper shade;
// brighter than the subject turns paler. Our own ramp; the contour lines carry the numbers.
const stopsRamp: [number, [number, number, number, number]][] = [
  [2, [255, 244, 214, 150]],
  [0, [240, 178, 74, 120]],
  [-1, [205, 120, 60, 100]],
  [-2, [140, 80, 90, 85]],
  [-3, [80, 70, 120, 70]],
  [-5, [40, 50, 90, 50]],
  [-8, [20, 24, 30, 0]],
];

function stopsColour(stops: number): [number, number, number, number] {
  if (stops >= stopsRamp[0]![0]) return stopsRamp[0]![1];
  for (let k = 1; k < stopsRamp.length; k++) {
    const [s1, c1] = stopsRamp[k]!;
    const [s0, c0] = stopsRamp[k - 1]!;
    if (stops >= s1) {
      const t = (stops - s1) / (s0 - s1);
      return [0, 1, 2, 3].map((i) => Math.round(c1[i]! + (c0[i]! - c1[i]!) * t)) as [number, number, number, number];
    }
  }
  return stopsRamp[stopsRamp.length - 1]![1];
}

/** The ramp tabulated every 1/32 stop from −10 to +4 as packed RGBA bytes, so painting a map allocates nothing. */
export const RAMP_MIN = -10;
export const RAMP_STEPS_PER_STOP = 32;
export const rampTable: Uint8ClampedArray = (() => {
  const n = 14 * RAMP_STEPS_PER_STOP + 1;
  const t = new Uint8ClampedArray(n * 4);
  for (let k = 0; k < n; k++) t.set(stopsColour(RAMP_MIN + k / RAMP_STEPS_PER_STOP), k * 4);
  return t;
})();
