// A light's real meter reading is typed into a form and changes nothing until it is confirmed; it can be
// changed and cleared, and a value the document cannot hold is refused with the accepted range named.
import { act, fireEvent, render, screen } from '@testing-library/react-native';
import { Inspector } from '../../components/editor/Inspector';
import { createEditor, type Editor } from '../../canvas/editor/editor';
import { EditorContext } from '../../canvas/editor/react';
import { demoSetups } from '../../db/seed-setups';
import type { ItemOf } from '../../model/document';

function setup(): Editor {
  const store = createEditor(demoSetups[0]!.document);
  store.dispatch('select', { ids: ['key'] });
  render(
    <EditorContext.Provider value={store}>
      <Inspector units="metric" />
    </EditorContext.Provider>,
  );
  return store;
}
const key = (store: Editor) => store.getState().doc.items.find((i) => i.id === 'key') as ItemOf<'light'>;

describe('a real meter reading', () => {
  it('opens a form without changing the light, and keeps the reading only when confirmed', () => {
    const store = setup();
    expect(key(store).calibration).toBeNull();
    const before = store.getState().doc;
    fireEvent.press(screen.getByTestId('reading-open'));
    // Opening the form invents nothing: the document is the same object.
    expect(store.getState().doc).toBe(before);
    // The ISO starts at the camera's, the distance at the light's distance to the subject; the f-number is empty.
    expect(screen.getByTestId('reading-aperture').props.value).toBe('');
    expect(screen.getByTestId('reading-iso').props.value).toBe(String(demoSetups[0]!.document.items.find((i) => i.kind === 'camera')!.iso));
    expect(Number(screen.getByTestId('reading-distance').props.value)).toBeGreaterThan(0);
    fireEvent.changeText(screen.getByTestId('reading-aperture'), 'f/11');
    fireEvent.changeText(screen.getByTestId('reading-distance'), '1.8');
    expect(store.getState().doc).toBe(before);
    fireEvent.press(screen.getByTestId('reading-confirm'));
    expect(key(store).calibration).toMatchObject({ aperture: 11, distanceM: 1.8, iso: 100, shutterS: null, power: key(store).power });
    expect(screen.getByTestId('reading-kept').props.children.join('')).toContain('f/11 at ISO 100, 1.80 m from the light');
  });

  it('cancel leaves the light as it was', () => {
    const store = setup();
    const before = store.getState().doc;
    fireEvent.press(screen.getByTestId('reading-open'));
    fireEvent.changeText(screen.getByTestId('reading-aperture'), '8');
    fireEvent.press(screen.getByTestId('reading-cancel'));
    expect(store.getState().doc).toBe(before);
    expect(screen.queryByTestId('reading-aperture')).toBeNull();
  });

  it('refuses an empty or impossible value with the accepted range, and changes nothing', () => {
    const store = setup();
    const before = store.getState().doc;
    fireEvent.press(screen.getByTestId('reading-open'));
    fireEvent.press(screen.getByTestId('reading-confirm'));
    expect(screen.getByTestId('reading-aperture-problem').props.children).toMatch(/^Needed\. Accepted: 0\.7 to 128\./);
    fireEvent.changeText(screen.getByTestId('reading-aperture'), '500');
    fireEvent.press(screen.getByTestId('reading-confirm'));
    expect(screen.getByTestId('reading-aperture-problem').props.children).toMatch(/^Out of range\. Accepted: 0\.7 to 128\./);
    expect(screen.getByTestId('reading-aperture').props['aria-invalid']).toBe(true);
    expect(store.getState().doc).toBe(before);
  });

  it('a kept reading can be changed and cleared (and undo brings it back)', () => {
    const store = setup();
    fireEvent.press(screen.getByTestId('reading-open'));
    fireEvent.changeText(screen.getByTestId('reading-aperture'), '8');
    fireEvent.press(screen.getByTestId('reading-confirm'));
    fireEvent.press(screen.getByTestId('reading-change'));
    expect(screen.getByTestId('reading-aperture').props.value).toBe('8');
    fireEvent.changeText(screen.getByTestId('reading-aperture'), '5.6');
    fireEvent.press(screen.getByTestId('reading-confirm'));
    expect(key(store).calibration?.aperture).toBe(5.6);
    fireEvent.press(screen.getByTestId('reading-clear'));
    expect(key(store).calibration).toBeNull();
    act(() => store.dispatch('undo'));
    expect(key(store).calibration?.aperture).toBe(5.6);
  });

  it('asks a continuous light for the shutter of the reading', () => {
    const store = setup();
    act(() => store.dispatch('updateItem', { id: 'key', patch: { source: { type: 'continuous', lamp: 'led', lumens: 8000, luxAt1m: null, watts: 100, kelvin: 5600 } } }));
    fireEvent.press(screen.getByTestId('reading-open'));
    fireEvent.changeText(screen.getByTestId('reading-aperture'), '4');
    fireEvent.changeText(screen.getByTestId('reading-shutter'), '1/60');
    fireEvent.press(screen.getByTestId('reading-confirm'));
    expect(key(store).calibration?.shutterS).toBeCloseTo(1 / 60);
  });
});
