// The light map as plan nodes: its contour paths (traced with the map, in the meter's worker) and the wall
// tones as strips on each wall's camera side. No tracing here: the page only turns them into SVG nodes.
import type { LightMapResult } from '../../calc';
import { g, line, path, text, type SvgNode } from '../../drawing/nodes';
import { formatStops } from '../../model/units';

/** Width of the wall-tone strip, m, and its offset from the wall's line. */
const STRIP_M = 0.08;

/** `labels: false` leaves the level labels to the caller (the editor places them clear of the items). */
export function lightMapNodes(map: LightMapResult, ink: string, o: { labels?: boolean } = {}): SvgNode {
  const levels = map.contourPaths.map((p) =>
    g(
      {},
      path({ d: p.d, fill: 'none', stroke: ink, strokeWidth: p.stops === 0 ? 0.018 : 0.01, strokeOpacity: p.stops === 0 ? 0.8 : 0.45 }),
      o.labels !== false && p.label && text({ x: p.label[0], y: p.label[1], fontSize: 0.13, fill: ink, fillOpacity: 0.8, fontFamily: 'IBMPlexMono_400Regular', textAnchor: 'middle' }, formatStops(p.stops)),
    ),
  );
  const walls = map.walls.map((w) => {
    const n = w.samples.length;
    const ox = w.nx * (STRIP_M / 2 + 0.02);
    const oy = w.ny * (STRIP_M / 2 + 0.02);
    return g(
      {},
      ...w.samples.map((t, k) =>
        t.hex
          ? line({
              x1: w.x1 + ((w.x2 - w.x1) * k) / n + ox,
              y1: w.y1 + ((w.y2 - w.y1) * k) / n + oy,
              x2: w.x1 + ((w.x2 - w.x1) * (k + 1)) / n + ox,
              y2: w.y1 + ((w.y2 - w.y1) * (k + 1)) / n + oy,
              stroke: t.hex,
              strokeWidth: STRIP_M,
            })
          : null,
      ),
    );
  });
  return g({}, ...walls, ...levels);
}

