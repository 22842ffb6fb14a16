// The meter's readings as the worker posts them: the light map's contour lines (a few thousand [x, y] pairs, each
// an object for the structured clone to copy and the page to collect) travel packed, one Float64Array a line,
// transferred, not copied. The page unpacks the lines only when something reads
// them (the level labels, placed when the hand is off the plan), not for every map a drag brings.
import type { ContourLevel, LightMapResult } from '../../calc';
import type { Readings } from '../../model/setupReadings';

type PackedLevel = { stops: number; lines: Float64Array[] };
/** Readings with the map's `contours` packed (`packedContours`). */
export type PackedReadings = Omit<Readings, 'map'> & { map: (Omit<LightMapResult, 'contours'> & { packedContours: PackedLevel[] }) | null };

export function packReadings(r: Readings): { readings: PackedReadings; transfer: ArrayBuffer[] } {
  if (!r.map) return { readings: { ...r, map: null }, transfer: [] };
  const { contours, ...rest } = r.map;
  const packedContours = contours.map((level) => ({
    stops: level.stops,
    lines: level.lines.map((line) => {
      const a = new Float64Array(line.length * 2);
      for (let k = 0; k < line.length; k++) {
        a[2 * k] = line[k]![0];
        a[2 * k + 1] = line[k]![1];
      }
      return a;
    }),
  }));
  // Only the buffers made here are transferred: the map's own arrays may be kept by the calc's cache, and a
  // copy of them is one memcpy each.
  const transfer = packedContours.flatMap((l) => l.lines.map((a) => a.buffer as ArrayBuffer));
  return { readings: { ...r, map: { ...rest, packedContours } }, transfer };
}

function unpackLevels(levels: PackedLevel[]): ContourLevel[] {
  return levels.map((level) => ({
    stops: level.stops,
    lines: level.lines.map((a) => {
      const line: [number, number][] = new Array(a.length / 2);
      for (let k = 0; k < line.length; k++) line[k] = [a[2 * k]!, a[2 * k + 1]!];
      return line;
    }),
  }));
}

/** The readings the worker packed, with `map.contours` unpacked on first read. */
export function unpackReadings(r: PackedReadings): Readings {
  if (!r.map) return { ...r, map: null };
  const { packedContours, ...rest } = r.map;
  let contours: ContourLevel[] | null = null;
  const map = Object.defineProperty(rest, 'contours', {
    enumerable: true,
    get: () => (contours ??= unpackLevels(packedContours)),
  }) as LightMapResult;
  return { ...r, map };
}
