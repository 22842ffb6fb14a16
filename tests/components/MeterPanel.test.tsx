// The meter panel shows the meter's readings as text: per light, the total, ratios, ambient, sync, safety.
import { render, screen } from '@testing-library/react';
import { MeterPanel } from '../../components/editor/MeterPanel';
import { computeReadings } from '../../model/setupReadings';
import { demoSetups } from '../../db/seed-setups';
import { parseDocument, type SetupDocument } from '../../model/document';
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
});
