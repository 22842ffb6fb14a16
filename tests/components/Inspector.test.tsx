// The inspector edits the selected item through editor actions, with units, and refuses bad input.
import { vi } from 'vitest';
import { act, fireEvent, render, screen } from '@testing-library/react';
import { Inspector } from '../../components/editor/Inspector';
import { createEditor as createEditorStore, type Editor as EditorStore } from '../../canvas/editor/editor';
import { EditorContext } from '../../canvas/editor/react';
import { demoSetups } from '../../db/seed-setups';
import type { ItemOf } from '../../model/document';

function setup(select: string, units: 'metric' | 'imperial' = 'metric') {
  const store = createEditorStore(demoSetups[0]!.document);
  store.dispatch('select', { ids: [select] });
  render(
    <EditorContext.Provider value={store}>
      <Inspector units={units} />
    </EditorContext.Provider>,
  );
  return store;
}
const item = <K extends 'light' | 'camera' | 'subject'>(store: EditorStore, id: string) => store.getState().doc.items.find((i) => i.id === id) as ItemOf<K>;

describe('Inspector', () => {
  it('asks to pick an item when nothing is selected', () => {
    const store = createEditorStore(demoSetups[0]!.document);
    render(
      <EditorContext.Provider value={store}>
        <Inspector units="metric" />
      </EditorContext.Provider>,
    );
    expect(screen.getByText(/Tap an item on the plan/)).toBeInTheDocument();
  });

  it('gives every field its own key (length fields share one label function; a shared key lets React mix up their inputs)', () => {
    const errors = vi.spyOn(console, 'error').mockImplementation(() => {});
    try {
      setup('key');
      setup('cam');
      const dupes = errors.mock.calls.filter((c) => String(c[0]).includes('same key'));
      expect(dupes).toEqual([]);
    } finally {
      errors.mockRestore();
    }
  });

  it('moves a light by typing a position, and undo puts it back', () => {
    const store = setup('key');
    const field = screen.getByLabelText('Down (m)');
    fireEvent.change(field, { target: { value: '4.6' } });
    fireEvent.keyDown(field, { key: 'Enter' });
    expect(item<'light'>(store, 'key').y).toBeCloseTo(4.6);
    act(() => store.dispatch('undo'));
    expect(item<'light'>(store, 'key').y).toBeCloseTo(4.1);
  });

  it('reads feet and inches when the user works in imperial units', () => {
    const store = setup('key', 'imperial');
    const field = screen.getByLabelText('Height (ft)');
    fireEvent.change(field, { target: { value: `6' 6"` } });
    fireEvent.keyDown(field, { key: 'Enter' });
    expect(item<'light'>(store, 'key').heightM).toBeCloseTo(6.5 * 0.3048, 6);
  });

  it('steps power by a third of a stop', () => {
    const store = setup('key');
    const before = item<'light'>(store, 'key').power;
    fireEvent.click(screen.getByRole('button', { name: 'More power' }));
    expect(Math.log2(item<'light'>(store, 'key').power / before)).toBeCloseTo(1 / 3, 6);
    expect(screen.getByLabelText('Power')).toHaveValue('1/8 +0.3');
  });

  it('takes power typed as a fraction', () => {
    const store = setup('key');
    const field = screen.getByLabelText('Power');
    fireEvent.change(field, { target: { value: '1/32' } });
    fireEvent.keyDown(field, { key: 'Enter' });
    expect(item<'light'>(store, 'key').power).toBeCloseTo(1 / 32);
  });

  it('refuses what is not a number, keeps the value, and says under the field what it accepts', () => {
    const store = setup('key');
    const field = screen.getByLabelText('Down (m)');
    fireEvent.change(field, { target: { value: 'near the window' } });
    fireEvent.keyDown(field, { key: 'Enter' });
    expect(item<'light'>(store, 'key').y).toBeCloseTo(4.1);
    // The typed text stays for correcting, with the reason under it (never a silent revert).
    expect(screen.getByLabelText('Down (m)')).toHaveValue('near the window');
    expect(screen.getByText(/Not a value this field reads\. Accepted: 0\.00 to \d+\.00\./)).toBeInTheDocument();
    expect(screen.getByLabelText('Down (m)')).toHaveAttribute('aria-invalid', 'true');
    // Typing again clears the message; a good value commits.
    fireEvent.change(field, { target: { value: '3.2' } });
    expect(screen.queryByText(/Not a value this field reads/)).toBeNull();
    fireEvent.keyDown(field, { key: 'Enter' });
    expect(item<'light'>(store, 'key').y).toBeCloseTo(3.2);
  });

  it.each([
    ['cam', 'ISO', '0', 'Out of range. Accepted: 25 to 409600.'],
    ['cam', 'ISO', '100000000', 'Out of range. Accepted: 25 to 409600.'],
    ['cam', 'Shutter (s)', '0', 'Not a value this field reads. Accepted: 1/8000 to 30″.'],
    ['key', 'Power', '2000', 'Out of range. Accepted: 1/256 to 1/1.'],
  ])('%s: %s "%s" is refused with "%s"', (id, label, typed, message) => {
    const store = setup(id);
    const before = JSON.stringify(store.getState().doc);
    const field = screen.getByLabelText(label);
    fireEvent.change(field, { target: { value: typed } });
    fireEvent.blur(field);
    expect(screen.getByText(message)).toBeInTheDocument();
    expect(JSON.stringify(store.getState().doc)).toBe(before);
  });

  it('keeps a position on the stage: a negative position is refused, naming the stage', () => {
    const store = setup('key');
    const { widthM } = store.getState().doc.stage;
    const field = screen.getByLabelText('Across (m)');
    fireEvent.change(field, { target: { value: '-2' } });
    fireEvent.keyDown(field, { key: 'Enter' });
    expect(screen.getByText(`Out of range. Accepted: 0.00 to ${widthM.toFixed(2)}.`)).toBeInTheDocument();
    expect(item<'light'>(store, 'key').x).toBeGreaterThanOrEqual(0);
  });

  it('opens the number pad on number fields', () => {
    setup('cam');
    for (const label of ['ISO', 'Aperture (f/)', 'Shutter (s)', 'Across (m)', 'Height (m)']) {
      expect(screen.getByLabelText(label)).toHaveAttribute('inputmode', 'decimal');
    }
  });

  it('takes a shutter typed as the camera shows it ("250" is 1/250 s) and steps on the third-stop scale', () => {
    const store = setup('cam');
    const field = screen.getByLabelText('Shutter (s)');
    fireEvent.change(field, { target: { value: '250' } });
    fireEvent.keyDown(field, { key: 'Enter' });
    expect(item<'camera'>(store, 'cam').shutterS).toBeCloseTo(1 / 250, 9);
    fireEvent.click(screen.getByRole('button', { name: 'More shutter (s)' }));
    expect(item<'camera'>(store, 'cam').shutterS).toBeCloseTo(1 / 320, 9);
    expect(screen.getByLabelText('Shutter (s)')).toHaveValue('1/320');
  });

  it('shows and reads feet and inches as written: 5′ 6″ in, 5′ 6″ out', () => {
    const store = setup('key', 'imperial');
    const field = screen.getByLabelText('Height (ft)');
    fireEvent.change(field, { target: { value: '5′ 6″' } });
    fireEvent.keyDown(field, { key: 'Enter' });
    expect(item<'light'>(store, 'key').heightM).toBeCloseTo(5.5 * 0.3048, 6);
    expect(screen.getByLabelText('Height (ft)')).toHaveValue('5′ 6″');
  });

  it('picks a gel from the collapsed list', () => {
    const store = setup('key');
    fireEvent.click(screen.getByRole('button', { name: 'Gel: no gel. Change' }));
    fireEvent.click(screen.getByRole('radio', { name: 'half CTO' }));
    expect(item<'light'>(store, 'key').gel).toBe('half-cto');
  });

  it('switching a lamp keeps the other source fields (a function patch reads the current item)', () => {
    const store = setup('key');
    fireEvent.click(screen.getByRole('radio', { name: 'continuous' }));
    fireEvent.click(screen.getByRole('radio', { name: 'tungsten' }));
    const src = item<'light'>(store, 'key').source;
    expect(src).toMatchObject({ type: 'continuous', lamp: 'tungsten', kelvin: 3200, lumens: 8000 });
  });

  it('steps ISO the way the trade expects: "+" to the next third-stop value up, "−" down', () => {
    const store = setup('cam');
    expect(item<'camera'>(store, 'cam').iso).toBe(100);
    fireEvent.click(screen.getByRole('button', { name: 'More iso' }));
    expect(item<'camera'>(store, 'cam').iso).toBe(125);
    expect(screen.getByLabelText('ISO')).toHaveValue('125');
    fireEvent.click(screen.getByRole('button', { name: 'Less iso' }));
    fireEvent.click(screen.getByRole('button', { name: 'Less iso' }));
    expect(item<'camera'>(store, 'cam').iso).toBe(80);
  });

  it('steps the shutter with "−" to a longer time (1/250 → 1/200)', () => {
    const store = setup('cam');
    const field = screen.getByLabelText('Shutter (s)');
    fireEvent.change(field, { target: { value: '250' } });
    fireEvent.keyDown(field, { key: 'Enter' });
    fireEvent.click(screen.getByRole('button', { name: 'Less shutter (s)' }));
    expect(item<'camera'>(store, 'cam').shutterS).toBeCloseTo(1 / 200, 9);
    expect(screen.getByLabelText('Shutter (s)')).toHaveValue('1/200');
  });

  it('steps the camera aperture along the usual third-stop scale', () => {
    const store = setup('cam');
    fireEvent.click(screen.getByRole('button', { name: 'More aperture (f/)' }));
    expect(item<'camera'>(store, 'cam').aperture).toBe(9);
  });

  it('has duplicate, lock and delete buttons for touch', () => {
    const store = setup('key');
    fireEvent.click(screen.getByRole('button', { name: 'Lock' }));
    expect(item<'light'>(store, 'key').locked).toBe(true);
    fireEvent.click(screen.getByRole('button', { name: 'Duplicate' }));
    expect(store.getState().doc.items.filter((i) => i.kind === 'light')).toHaveLength(2);
  });

  it('crew see the settings but cannot change them', () => {
    const store = createEditorStore(demoSetups[0]!.document, { readOnly: true });
    store.dispatch('select', { ids: ['key'] });
    render(
      <EditorContext.Provider value={store}>
        <Inspector units="metric" />
      </EditorContext.Provider>,
    );
    expect(screen.queryByRole('button', { name: 'Delete' })).toBeNull();
    fireEvent.click(screen.getByRole('button', { name: 'More power' }));
    expect(item<'light'>(store, 'key').power).toBe(1 / 8);
  });
});
