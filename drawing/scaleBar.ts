// The scale bar's length: shared by the canvas (screen pixels) and the exports (paper).

/** A round length for a scale bar about `targetPx` long: 0.5, 1, 2 or 5 × 10ⁿ of the unit. */
export function scaleBarLength(scale: number, unitM: number, targetPx = 100): number {
  const raw = targetPx / scale / unitM;
  const p = 10 ** Math.floor(Math.log10(raw));
  const n = [1, 2, 5, 10].find((m) => m * p >= raw * 0.7) ?? 10;
  return n * p;
}
