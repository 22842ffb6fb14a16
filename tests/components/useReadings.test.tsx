// The read-only link's readings (canvas/useReadings.ts): asked of the meter's engine after the first paint,
// never computed while rendering; shown when the engine answers (at transition priority), the last ones kept
// while a changed document is read; one engine for the screen's life, let go when it closes.
import { act, render, screen } from '@testing-library/react';
import { Text } from 'react-native';
import { demoSetups } from '../../db/seed-setups';
import { useReadings } from '../../canvas/useReadings';
import type { MeterEngine, MeterJob } from '../../canvas/meter/engine';
import { parseDocument, type SetupDocument } from '../../model/document';
import { computeReadings, type Readings } from '../../model/setupReadings';
import { formatAperture } from '../../model/units';

/** An engine whose answers the test gives, one job at a time. */
function heldEngine() {
  const jobs: { job: MeterJob; answer: (r: Readings) => void }[] = [];
  let disposed = 0;
  let made = 0;
  const make = (): MeterEngine => {
    made++;
    return {
      kind: 'worker',
      compute: (job) => new Promise<Readings>((answer) => jobs.push({ job, answer })),
      dispose: () => void disposed++,
    };
  };
  return { make, jobs, made: () => made, disposed: () => disposed };
}

function Subject({ doc, make }: { doc: SetupDocument; make: () => MeterEngine }) {
  const r = useReadings(doc, { lightMap: true }, make);
  return <Text testID="subject">{r ? formatAperture(r.meter?.subject.aperture ?? null) : 'reading'}</Text>;
}

const docA = parseDocument(demoSetups[0]!.document);
const docB = parseDocument(demoSetups[1]!.document);

describe('useReadings', () => {
  it('renders first without readings, asks the engine once, and shows its answer', async () => {
    const e = heldEngine();
    render(<Subject doc={docA} make={e.make} />);
    expect(screen.getByTestId('subject')).toHaveTextContent('reading');
    expect(e.jobs).toHaveLength(1);
    expect(e.jobs[0]!.job).toEqual({ doc: docA, lightMap: true, stepIndex: undefined });
    const want = computeReadings(docA, { lightMap: true });
    await act(async () => e.jobs[0]!.answer(want));
    expect(screen.getByTestId('subject')).toHaveTextContent(formatAperture(want.meter!.subject.aperture));
  });

  it('keeps the last readings while a new document is read, and ignores an answer for a document no longer shown', async () => {
    const e = heldEngine();
    const view = render(<Subject doc={docA} make={e.make} />);
    const a = computeReadings(docA);
    const b = computeReadings(docB);
    expect(a.meter!.subject.aperture).not.toBe(b.meter!.subject.aperture);
    await act(async () => e.jobs[0]!.answer(a));
    view.rerender(<Subject doc={docB} make={e.make} />);
    expect(e.jobs).toHaveLength(2);
    expect(e.jobs[1]!.job.doc).toBe(docB);
    expect(screen.getByTestId('subject')).toHaveTextContent(formatAperture(a.meter!.subject.aperture));
    view.rerender(<Subject doc={docA} make={e.make} />);
    // The answer for B arrives after A is back on screen: not shown.
    await act(async () => e.jobs[1]!.answer(b));
    expect(screen.getByTestId('subject')).toHaveTextContent(formatAperture(a.meter!.subject.aperture));
    await act(async () => e.jobs[2]!.answer(a));
    expect(e.made()).toBe(1);
    view.unmount();
    expect(e.disposed()).toBe(1);
  });

  it('computes the same numbers as the page would, through the default engine', async () => {
    render(<Subject doc={docA} make={undefined as unknown as () => MeterEngine} />);
    const want = formatAperture(computeReadings(docA).meter!.subject.aperture);
    expect(await screen.findByText(want)).toBeInTheDocument();
  });
});
