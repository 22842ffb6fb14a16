// A light's real meter reading is typed into a form and changes nothing until it is confirmed; it can be
// changed and cleared, and a value the document cannot hold is refused with the accepted range named.
import { act, fireEvent, render, screen } from '@testing-library/react';
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
    fireEvent.click(screen.getByTestId('reading-open'));
    // Opening the form invents nothing: the document is the same object.
    expect(store.getState().doc).toBe(before);
    // The ISO starts at the camera's, the distance at the light's distance to the subject; the f-number is empty.
    expect(screen.getByTestId('reading-aperture')).toHaveValue('');
    expect(screen.getByTestId('reading-iso')).toHaveValue(String(demoSetups[0]!.document.items.find((i) => i.kind === 'camera')!.iso));
    expect(Number((screen.getByTestId('reading-distance') as HTMLInputElement).value)).toBeGreaterThan(0);
    fireEvent.change(screen.getByTestId('reading-aperture'), { target: { value: 'f/11' } });
    fireEvent.change(screen.getByTestId('reading-distance'), { target: { value: '1.8' } });
    expect(store.getState().doc).toBe(before);
    fireEvent.click(screen.getByTestId('reading-confirm'));
    expect(key(store).calibration).toMatchObject({ aperture: 11, distanceM: 1.8, iso: 100, shutterS: null, power: key(store).power });
    expect(screen.getByTestId('reading-kept').textContent).toContain('f/11 at ISO 100, 1.80 m from the light');
  });

  it('cancel leaves the light as it was', () => {
    const store = setup();
    const before = store.getState().doc;
    fireEvent.click(screen.getByTestId('reading-open'));
    fireEvent.change(screen.getByTestId('reading-aperture'), { target: { value: '8' } });
    fireEvent.click(screen.getByTestId('reading-cancel'));
    expect(store.getState().doc).toBe(before);
    expect(screen.queryByTestId('reading-aperture')).toBeNull();
  });

  it('refuses an empty or impossible value with the accepted range, and changes nothing', () => {
    const store = setup();
    const before = store.getState().doc;
    fireEvent.click(screen.getByTestId('reading-open'));
    fireEvent.click(screen.getByTestId('reading-confirm'));
    expect(screen.getByTestId('reading-aperture-problem').textContent).toMatch(/^Needed\. Accepted: 0\.7 to 128\./);
    fireEvent.change(screen.getByTestId('reading-aperture'), { target: { value: '500' } });
    fireEvent.click(screen.getByTestId('reading-confirm'));
    expect(screen.getByTestId('reading-aperture-problem').textContent).toMatch(/^Out of range\. Accepted: 0\.7 to 128\./);
    expect(screen.getByTestId('reading-aperture')).toHaveAttribute('aria-invalid', 'true');
    expect(store.getState().doc).toBe(before);
  });

  it('a kept reading can be changed and cleared (and undo brings it back)', () => {
    const store = setup();
    fireEvent.click(screen.getByTestId('reading-open'));
    fireEvent.change(screen.getByTestId('reading-aperture'), { target: { value: '8' } });
    fireEvent.click(screen.getByTestId('reading-confirm'));
    fireEvent.click(screen.getByTestId('reading-change'));
    expect(screen.getByTestId('reading-aperture')).toHaveValue('8');
    fireEvent.change(screen.getByTestId('reading-aperture'), { target: { value: '5.6' } });
    fireEvent.click(screen.getByTestId('reading-confirm'));
    expect(key(store).calibration?.aperture).toBe(5.6);
    fireEvent.click(screen.getByTestId('reading-clear'));
    expect(key(store).calibration).toBeNull();
    act(() => store.dispatch('undo'));
    expect(key(store).calibration?.aperture).toBe(5.6);
  });

  it('asks a continuous light for the shutter of the reading', () => {
    const store = setup();
    act(() => store.dispatch('updateItem', { id: 'key', patch: { source: { type: 'continuous', lamp: 'led', lumens: 8000, luxAt1m: null, watts: 100, kelvin: 5600 } } }));
    fireEvent.click(screen.getByTestId('reading-open'));
    fireEvent.change(screen.getByTestId('reading-aperture'), { target: { value: '4' } });
    fireEvent.change(screen.getByTestId('reading-shutter'), { target: { value: '1/60' } });
    fireEvent.click(screen.getByTestId('reading-confirm'));
    expect(key(store).calibration?.shutterS).toBeCloseTo(1 / 60);
  });
});
