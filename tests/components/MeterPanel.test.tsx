// The meter panel shows the meter's readings as text: per light, the total, ratios, ambient, sync, safety.
import { render, screen } from '@testing-library/react';
import { MeterPanel } from '../../components/editor/MeterPanel';
import { computeReadings } from '../../model/setupReadings';
import { demoSetups } from '../../db/seed-setups';
import { parseDocument, type ItemOf, type SetupDocument } from '../../model/document';
import { formatAperture, formatStops } from '../../model/units';

function show(doc: SetupDocument) {
  const readings = computeReadings(doc);
  render(<MeterPanel readings={readings} doc={doc} selectedLight={null} units="metric" />);
  return readings;
}

describe('MeterPanel', () => {
  it('shows the subject reading and each light as f-numbers and stops, from the meter', () => {
    const r = show(demoSetups[1]!.document);
    const m = r.meter!;
    expect(screen.getByTestId('meter-subject')).toHaveTextContent(formatAperture(m.subject.aperture));
    for (const l of m.lights) {
      expect(screen.getByTestId(`meter-light-${l.id}`)).toHaveTextContent(formatAperture(l.aperture));
      expect(screen.getByTestId(`meter-light-${l.id}-stops`)).toHaveTextContent(formatStops(l.stopsVsCamera));
    }
    expect(screen.getByTestId('meter-background')).toHaveTextContent(`${formatStops(m.background!.stopsVsSubject)} stops`);
  });

  it('reads a kicker in a look with no key against the camera, pointed at it, not only "no key"', () => {
    // Look 1 of the everyday looks: a snooted kicker from behind and no key. Bare 400 Ws head at 1/4, √2 m from the
    // face, no bounce: H = 2400 cd·s / (2 + 0.09²) m² = 1195 lx·s (inverse-square law), log2(1195/160) = +2.9 over f/8.
    const doc = parseDocument({
      schemaVersion: 1,
      stage: { widthM: 8, depthM: 6 },
      meter: { floor: { colour: '#111111', reflectance: 0 }, ceiling: { heightM: null } },
      items: [
        { id: 'sub', kind: 'subject', x: 4, y: 3, facingDeg: 90, faceHeightM: 1.6 },
        { id: 'cam', kind: 'camera', x: 4, y: 5.6, heightM: 1.6, aimDeg: -90, iso: 100, aperture: 8, shutterS: 1 / 200 },
        { id: 'kick', kind: 'light', x: 5, y: 2, heightM: 1.6, aimDeg: 135, tiltDeg: 0, source: { type: 'strobe', energyWs: 400 }, power: 1 / 4, modifier: 'bare-reflector', role: 'kicker' },
      ],
    });
    show(doc);
    expect(screen.getByTestId('meter-light-kick-vskey')).toHaveTextContent('no key: pointed at it, +2.9 vs the camera');
  });

  it('shows the ambient as stops under when a room reading is given', () => {
    const r = show(demoSetups[2]!.document);
    expect(screen.getByTestId('meter-ambient')).toHaveTextContent(`${formatStops(r.meter!.ambient!.stopsVsCamera)} stops`);
  });

  it('warns when the shutter is faster than the flash sync', () => {
    const d = demoSetups[0]!.document;
    const fast = { ...d, items: d.items.map((i) => (i.kind === 'camera' ? { ...i, shutterS: 1 / 1000 } : i)) };
    show(fast);
    expect(screen.getAllByRole('alert').map((a) => a.textContent).join(' ')).toMatch(/faster than the flash sync/);
  });

  it('says what the light map is relative to: the subject, at face height', () => {
    const doc = demoSetups[1]!.document;
    const readings = computeReadings(doc, { lightMap: true });
    render(<MeterPanel readings={readings} doc={doc} selectedLight={null} units="metric" />);
    expect(readings.map!.reference).toBe('subject');
    expect(screen.getByTestId('meter-map-caption')).toHaveTextContent(`Light map: stops vs the subject (${formatAperture(readings.meter!.subject.aperture)}), at face height (1.70 m)`);
  });

  it('says how each point of the light map is read: by the setup receptor (a dome by default)', () => {
    const doc = demoSetups[1]!.document;
    const readings = computeReadings(doc, { lightMap: true });
    render(<MeterPanel readings={readings} doc={doc} selectedLight={null} units="metric" />);
    expect(readings.map!.receptor).toBe('dome');
    const caption = screen.getByTestId('meter-map-caption');
    expect(caption).toHaveTextContent('read at each point by a dome pointed at the camera');
    expect(caption).not.toHaveTextContent('flat meter');
  });

  it('gives a rim under the key as a signed difference, not "−0.9 stops over the key"', () => {
    const doc = demoSetups.find((d) => d.document.items.some((i) => i.id === 'rimL'))!.document;
    show(doc);
    const text = screen.getByTestId('meter-light-rimL-vskey').textContent;
    expect(text).toMatch(/^[+−±]\d\.\d vs the key \(wanted \+1\.0\)/);
    expect(text).not.toMatch(/stops over/);
  });

  it('says what is missing before it can read', () => {
    show(parseDocument({ schemaVersion: 1, stage: { widthM: 4, depthM: 4 }, items: [] }));
    expect(screen.getByText('Add a subject and a light to read the light.')).toBeInTheDocument();
  });

  it('shows a caution for a boom with no sandbag, deferring to local codes', () => {
    const d = demoSetups[0]!.document;
    show({ ...d, items: d.items.map((i) => (i.kind === 'light' ? { ...i, stand: 'boom' as const, sandbagged: false } : i)) });
    expect(screen.getByText(/on a boom with no sandbag noted/)).toBeInTheDocument();
    expect(screen.getByText(/local electrical and venue codes/)).toBeInTheDocument();
  });

  it('draws the selected light\'s falloff: the inverse-square curve, round stops and distances on its axes', () => {
    const doc = demoSetups[1]!.document;
    const readings = computeReadings(doc);
    const light = doc.items.find((i) => i.kind === 'light') as ItemOf<'light'>;
    const reading = readings.meter!.lights.find((l) => l.id === light.id)!;
    const { container } = render(<MeterPanel readings={readings} doc={doc} selectedLight={light} units="metric" />);
    const chart = container.querySelector('svg')!;
    const labels = Array.from(chart.querySelectorAll('text')).map((t) => t.textContent ?? '');
    // Distances from 0.5 m to max(4 m, twice the light's): ticks at round metres (d3-array's ticks).
    const maxD = Math.max(4, reading.distanceM * 2);
    const metres = labels.filter((l) => l.endsWith(' m')).map((l) => parseFloat(l));
    expect(metres.length).toBeGreaterThanOrEqual(3);
    for (const d of metres) {
      expect(d).toBeGreaterThanOrEqual(0.5);
      expect(d).toBeLessThanOrEqual(maxD);
      expect(Number.isInteger(d * 2)).toBe(true);
    }
    // Stops on the other axis: round values spanning the curve, which falls 2 stops at twice the distance
    // (inverse-square law) — from the reading at 0.5 m to the reading at the far end.
    const stops = labels.filter((l) => !l.endsWith(' m')).map((l) => parseFloat(l.replace('−', '-').replace('±', '')));
    expect(stops.length).toBeGreaterThanOrEqual(2);
    const at = (d: number) => reading.stopsVsCamera! - 2 * Math.log2(d / reading.distanceM);
    expect(Math.min(...stops)).toBeGreaterThanOrEqual(Math.floor(at(maxD)) - 1);
    expect(Math.max(...stops)).toBeLessThanOrEqual(Math.ceil(at(0.5)) + 1);
    const path = chart.querySelector('path')!.getAttribute('d')!;
    expect(path).toMatch(/^M[\d.]+,[\d.]+(L[\d.]+,[\d.]+){39}$/);
    // The curve falls from left to right: its first point is higher on screen (smaller y) than its last.
    const ys = path.slice(1).split('L').map((p) => Number(p.split(',')[1]));
    expect(ys[0]!).toBeLessThan(ys.at(-1)!);
  });
});
