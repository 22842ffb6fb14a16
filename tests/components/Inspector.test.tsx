// The inspector edits the selected item through editor actions, with units, and refuses bad input.
import { act, fireEvent, render, screen } from '@testing-library/react-native';
import { Inspector } from '../../components/editor/Inspector';
import { EditorContext, createEditorStore, type EditorStore } from '../../canvas/state/store';
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
    expect(screen.getByText(/Tap an item on the plan/)).toBeOnTheScreen();
  });

  it('moves a light by typing a position, and undo puts it back', () => {
    const store = setup('key');
    const field = screen.getByLabelText('Down (m)');
    fireEvent.changeText(field, '4.6');
    fireEvent(field, 'submitEditing');
    expect(item<'light'>(store, 'key').y).toBeCloseTo(4.6);
    act(() => store.dispatch('undo'));
    expect(item<'light'>(store, 'key').y).toBeCloseTo(4.1);
  });

  it('reads feet and inches when the user works in imperial units', () => {
    const store = setup('key', 'imperial');
    const field = screen.getByLabelText('Height (ft)');
    fireEvent.changeText(field, `6' 6"`);
    fireEvent(field, 'submitEditing');
    expect(item<'light'>(store, 'key').heightM).toBeCloseTo(6.5 * 0.3048, 6);
  });

  it('steps power by a third of a stop', () => {
    const store = setup('key');
    const before = item<'light'>(store, 'key').power;
    fireEvent.press(screen.getByRole('button', { name: 'More power' }));
    expect(Math.log2(item<'light'>(store, 'key').power / before)).toBeCloseTo(1 / 3, 6);
    expect(screen.getByLabelText('Power').props.value).toBe('1/8 +0.3');
  });

  it('takes power typed as a fraction', () => {
    const store = setup('key');
    const field = screen.getByLabelText('Power');
    fireEvent.changeText(field, '1/32');
    fireEvent(field, 'submitEditing');
    expect(item<'light'>(store, 'key').power).toBeCloseTo(1 / 32);
  });

  it('refuses what is not a number and keeps the value', () => {
    const store = setup('key');
    const field = screen.getByLabelText('Down (m)');
    fireEvent.changeText(field, 'near the window');
    fireEvent(field, 'submitEditing');
    expect(item<'light'>(store, 'key').y).toBeCloseTo(4.1);
    expect(screen.getByLabelText('Down (m)').props.value).toBe('4.10');
  });

  it('picks a gel from the collapsed list', () => {
    const store = setup('key');
    fireEvent.press(screen.getByRole('button', { name: 'Gel: no gel. Change' }));
    fireEvent.press(screen.getByRole('radio', { name: 'half CTO' }));
    expect(item<'light'>(store, 'key').gel).toBe('half-cto');
  });

  it('switching a lamp keeps the other source fields (a function patch reads the current item)', () => {
    const store = setup('key');
    fireEvent.press(screen.getByRole('radio', { name: 'continuous' }));
    fireEvent.press(screen.getByRole('radio', { name: 'tungsten' }));
    const src = item<'light'>(store, 'key').source;
    expect(src).toMatchObject({ type: 'continuous', lamp: 'tungsten', kelvin: 3200, lumens: 8000 });
  });

  it('steps the camera aperture along the usual third-stop scale', () => {
    const store = setup('cam');
    fireEvent.press(screen.getByRole('button', { name: 'More aperture (f/)' }));
    expect(item<'camera'>(store, 'cam').aperture).toBe(9);
  });

  it('has duplicate, lock and delete buttons for touch', () => {
    const store = setup('key');
    fireEvent.press(screen.getByRole('button', { name: 'Lock' }));
    expect(item<'light'>(store, 'key').locked).toBe(true);
    fireEvent.press(screen.getByRole('button', { name: 'Duplicate' }));
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
    fireEvent.press(screen.getByRole('button', { name: 'More power' }));
    expect(item<'light'>(store, 'key').power).toBe(1 / 8);
  });
});
