// The editor's meter panel before the meter's first answer: the live meter computes nothing when it is made
// (that ran in the editor's first render), so the panel says the meter is still reading the plan — no number,
// not "cannot read", not "add a subject" — and shows the engine's numbers once it answers.
import { act, render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { createEditor } from '../../canvas/editor/editor';
import { EditorContext } from '../../canvas/editor/react';
import type { MeterEngine, MeterJob } from '../../canvas/meter/engine';
import { createMeter } from '../../canvas/meter/meter';
import { LiveMeterPanel } from '../../components/editor/LiveMeter';
import { demoSetups } from '../../db/seed-setups';
import { computeReadings, type Readings } from '../../model/setupReadings';
import { formatAperture } from '../../model/units';

/** An engine that answers when the test says, with the real computation of the job. */
function heldEngine() {
  const jobs: { job: MeterJob; answer: () => void }[] = [];
  const engine: MeterEngine = {
    kind: 'worker',
    compute: (job) => new Promise<Readings>((resolve) => jobs.push({ job, answer: () => resolve(computeReadings(job.doc, job)) })),
    dispose: () => {},
  };
  return { engine, jobs };
}

describe('the live meter panel at the editor’s start', () => {
  it('says the meter is reading until the first answer, then shows the subject’s reading', async () => {
    const editor = createEditor(demoSetups[0]!.document);
    const { engine, jobs } = heldEngine();
    const meter = createMeter(editor, { lightMap: true }, engine);
    render(
      <EditorContext.Provider value={editor}>
        <LiveMeterPanel meter={meter} units="metric" />
      </EditorContext.Provider>,
    );
    expect(screen.getByTestId('meter-pending')).toHaveTextContent('Reading the plan…');
    expect(screen.queryByTestId('meter-subject')).toBeNull();
    expect(screen.queryByText(/cannot read/)).toBeNull();
    expect(screen.queryByText(/^Add /)).toBeNull();
    expect(jobs).toHaveLength(0);
    act(() => meter.start());
    expect(jobs).toHaveLength(1);
    // Asked, not answered: still reading.
    expect(screen.getByTestId('meter-pending')).toBeInTheDocument();
    await act(async () => jobs[0]!.answer());
    const want = computeReadings(editor.getState().doc).meter!.subject.aperture;
    expect(await screen.findByTestId('meter-subject')).toHaveTextContent(formatAperture(want));
    expect(screen.queryByTestId('meter-pending')).toBeNull();
    meter.dispose();
  });
});
