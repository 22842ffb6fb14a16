// An inspector change always reaches the item the inspector shows — also when two items show the same values
// (the demo's twin rim lights). An earlier inspector skipped a field's re-render when only its callbacks
// changed, so after switching between look-alike lights a "+" on Power raised the light selected before.
import { act, fireEvent, render, screen } from '@testing-library/react';
import { Inspector } from '../../components/editor/Inspector';
import { createEditor as createEditorStore, type Editor as EditorStore } from '../../canvas/editor/editor';
import { EditorContext } from '../../canvas/editor/react';
import { demoSetups } from '../../db/seed-setups';
import type { ItemOf, SetupDocument } from '../../model/document';

const twinRims = demoSetups.find((d) => d.document.items.some((i) => i.id === 'rimL'))!.document;

function open(doc: SetupDocument = twinRims) {
  const store = createEditorStore(doc);
  render(
    <EditorContext.Provider value={store}>
      <Inspector units="metric" />
    </EditorContext.Provider>,
  );
  return store;
}
const light = (store: EditorStore, id: string) => store.getState().doc.items.find((i) => i.id === id) as ItemOf<'light'>;
const select = (store: EditorStore, id: string) => act(() => store.dispatch('select', { ids: [id] }));
/** Both rims as they are now, without the fields the test does not look at. */
const both = (store: EditorStore) => [light(store, 'rimL'), light(store, 'rimR')];

describe('Inspector edits the item it shows, between two identical lights', () => {
  it('starts from two rims whose fields show the same values', () => {
    const [l, r] = both(open());
    expect(l!.power).toBe(r!.power);
    expect(l!.heightM).toBe(r!.heightM);
    expect(l!.modifier).toBe(r!.modifier);
  });

  it('number stepper: "+" on Power raises the shown light only', () => {
    const store = open();
    select(store, 'rimL');
    select(store, 'rimR');
    fireEvent.click(screen.getByRole('button', { name: 'More power' }));
    expect(light(store, 'rimR').power).toBeGreaterThan(0.25);
    expect(light(store, 'rimL').power).toBe(0.25);
  });

  it('typed number: a height typed for the shown light goes to it', () => {
    const store = open();
    select(store, 'rimL');
    select(store, 'rimR');
    const field = screen.getByLabelText('Height (m)');
    fireEvent.change(field, { target: { value: '2.40' } });
    fireEvent.keyDown(field, { key: 'Enter' });
    expect(light(store, 'rimR').heightM).toBeCloseTo(2.4);
    expect(light(store, 'rimL').heightM).toBeCloseTo(1.8);
  });

  it('choice: a stand picked for the shown light goes to it', () => {
    const store = open();
    select(store, 'rimL');
    select(store, 'rimR');
    fireEvent.click(screen.getByRole('radio', { name: 'boom' }));
    expect(light(store, 'rimR').stand).toBe('boom');
    expect(light(store, 'rimL').stand).toBe('stand');
  });

  it('switch: turning the shown light off leaves the other on', () => {
    const store = open();
    select(store, 'rimL');
    select(store, 'rimR');
    fireEvent.click(screen.getByRole('switch', { name: 'On' }));
    expect(light(store, 'rimR').on).toBe(false);
    expect(light(store, 'rimL').on).toBe(true);
  });

  it('text: a label typed for the shown light goes to it', () => {
    const store = open();
    select(store, 'rimL');
    select(store, 'rimR');
    const field = screen.getByLabelText('Label');
    fireEvent.change(field, { target: { value: 'Rim right — camera left of frame' } });
    fireEvent.blur(field);
    expect(light(store, 'rimR').label).toBe('Rim right — camera left of frame');
    expect(light(store, 'rimL').label).toBe('Rim left');
  });

  it('aim typed for a light turns that light, never the camera', () => {
    const store = open();
    select(store, 'cam');
    select(store, 'rimR');
    const field = screen.getByLabelText('Aim (°)');
    fireEvent.change(field, { target: { value: '160' } });
    fireEvent.keyDown(field, { key: 'Enter' });
    expect(light(store, 'rimR').aimDeg).toBe(160);
    expect((store.getState().doc.items.find((i) => i.id === 'cam') as ItemOf<'camera'>).aimDeg).toBe(-90);
  });

  it('selection moving on while a number is being typed: the text goes to the item it was typed for', () => {
    const store = open();
    select(store, 'rimL');
    const field = screen.getByLabelText('Height (m)');
    fireEvent.focus(field);
    fireEvent.change(field, { target: { value: '2.10' } });
    select(store, 'rimR'); // e.g. a press on the other light mid-typing
    expect(light(store, 'rimL').heightM).toBeCloseTo(2.1);
    expect(light(store, 'rimR').heightM).toBeCloseTo(1.8);
    // and the field now shows the new item's value, not the text typed for the other
    expect(screen.getByLabelText('Height (m)')).toHaveValue('1.80');
  });

  it('selection moving on while a label is being typed: the text goes to the item it was typed for', () => {
    const store = open();
    select(store, 'rimL');
    const field = screen.getByLabelText('Label');
    fireEvent.focus(field);
    fireEvent.change(field, { target: { value: 'Left strip' } });
    select(store, 'rimR');
    expect(light(store, 'rimL').label).toBe('Left strip');
    expect(light(store, 'rimR').label).toBe('Rim right');
    expect(screen.getByLabelText('Label')).toHaveValue('Rim right');
  });

  it('selection changing during a drag: the stepper afterwards reaches the newly shown light', () => {
    const store = open();
    select(store, 'rimL');
    // a drag of the left rim: several moves in one gesture, then the other light is selected
    const origin = [light(store, 'rimL')];
    for (let k = 1; k <= 3; k++) act(() => store.dispatch('dragItems', { origin, dx: 0.05 * k, dy: 0, gestureKey: 'drag-1' }));
    select(store, 'rimR');
    fireEvent.click(screen.getByRole('button', { name: 'Less power' }));
    expect(light(store, 'rimR').power).toBeLessThan(0.25);
    expect(light(store, 'rimL').power).toBe(0.25);
    expect(light(store, 'rimL').x).toBeGreaterThan(2.7); // it moved (snapped to the grid)
  });
});
