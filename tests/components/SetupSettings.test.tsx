// The setup's own settings: stage size (never smaller than what is on it), ceiling, the room's light (typed as
// EV or metered from camera settings) and the target aperture, each one undoable change.
import { act, fireEvent, render, screen } from '@testing-library/react';
import { createEditor } from '../../canvas/editor/editor';
import { EditorContext } from '../../canvas/editor/react';
import { SetupSettings } from '../../components/editor/SetupSettings';
import { demoSetups } from '../../db/seed-setups';

function setup(units: 'metric' | 'imperial' = 'metric') {
  const store = createEditor(demoSetups[0]!.document);
  render(
    <EditorContext.Provider value={store}>
      <SetupSettings units={units} />
    </EditorContext.Provider>,
  );
  return store;
}
const type = (label: string, text: string) => {
  const field = screen.getByLabelText(label);
  fireEvent.change(field, { target: { value: text } });
  fireEvent.keyDown(field, { key: 'Enter' });
};

describe('SetupSettings', () => {
  it('sets the stage size, and undo puts it back', () => {
    const store = setup();
    const before = store.getState().doc.stage;
    type('Stage width (m)', '10.5');
    expect(store.getState().doc.stage).toEqual({ ...before, widthM: 10.5 });
    act(() => store.dispatch('undo'));
    expect(store.getState().doc.stage).toEqual(before);
  });

  it('will not shrink the stage past the items on it, and says how far it can go', () => {
    const store = setup();
    const before = store.getState().doc.stage;
    type('Stage width (m)', '2');
    expect(screen.getByText(/^Out of range\. Accepted: \d+\.\d0 to 200\.00\.$/)).toBeInTheDocument();
    expect(store.getState().doc.stage).toEqual(before);
  });

  it('reads the stage in feet and inches for imperial users', () => {
    const store = setup('imperial');
    type('Stage depth (ft)', `30' 0"`);
    expect(store.getState().doc.stage.depthM).toBeCloseTo(9.14, 2);
    expect(screen.getByLabelText('Stage depth (ft)')).toHaveValue('30′ 0″');
  });

  it('sets the ceiling height, or none outdoors', () => {
    const store = setup();
    type('Ceiling height (m)', '4.2');
    expect(store.getState().doc.meter.ceiling.heightM).toBe(4.2);
    fireEvent.click(screen.getByRole('switch', { name: 'Indoors, under a ceiling' }));
    expect(store.getState().doc.meter.ceiling.heightM).toBeNull();
    expect(screen.queryByLabelText('Ceiling height (m)')).toBeNull();
  });

  it('takes the room light as EV at ISO 100', () => {
    const store = setup();
    fireEvent.click(screen.getByRole('radio', { name: 'EV at ISO 100' }));
    type('Ambient (EV at ISO 100)', '9.5');
    expect(store.getState().doc.ambientEv100).toBe(9.5);
    fireEvent.click(screen.getByRole('radio', { name: 'dark (does not matter)' }));
    expect(store.getState().doc.ambientEv100).toBeNull();
  });

  it('meters the room from settings that gave a good exposure', () => {
    const store = setup();
    fireEvent.click(screen.getByRole('radio', { name: 'meter the room' }));
    type('Room aperture (f/)', '2.8');
    type('Room shutter (s)', '1/30');
    type('Room ISO', '1600');
    // EV100 = log2(N²/t) − log2(S/100) (APEX): log2(7.84 × 30) − 4 = 7.88 − 4 = 3.9.
    expect(screen.getByTestId('room-ev').textContent).toBe('That is EV 3.9 at ISO 100.');
    expect(store.getState().doc.ambientEv100).toBeNull(); // nothing changes until the reading is used
    fireEvent.click(screen.getByRole('button', { name: 'Use EV 3.9' }));
    expect(store.getState().doc.ambientEv100).toBe(3.9);
  });

  it('sets a target aperture and steps it on the third-stop scale', () => {
    const store = setup();
    if (store.getState().doc.targetAperture === null) fireEvent.click(screen.getByRole('switch', { name: 'Aim for an aperture' }));
    type('Target aperture (f/)', '8');
    expect(store.getState().doc.targetAperture).toBe(8);
    fireEvent.click(screen.getByRole('button', { name: 'More target aperture (f/)' }));
    expect(store.getState().doc.targetAperture).toBe(9);
    type('Target aperture (f/)', '0');
    expect(screen.getByText('Out of range. Accepted: 0.7 to 128.')).toBeInTheDocument();
    expect(store.getState().doc.targetAperture).toBe(9);
  });
});
