// Panels that follow an outside store during a gesture (usePaced) share one clock per pace: two panels whose
// values change at different moments of a drag commit together, at most once a pace, not once each.
import { act, render } from '@testing-library/react';
import { Profiler } from 'react';
import { Text } from 'react-native';
import { createStore, type StoreApi } from 'zustand';
import { createEditor } from '../../canvas/editor/editor';
import { EditorContext, PANEL_PACE_MS, usePaced } from '../../canvas/editor/react';
import { demoSetups } from '../../db/seed-setups';

const doc = demoSetups.find((d) => d.title.startsWith('Twin rims'))!.document;

function Shows({ store, testID }: { store: StoreApi<{ n: number }>; testID: string }) {
  const n = usePaced(store, (s) => s.n);
  return <Text testID={testID}>{n}</Text>;
}

describe('usePaced', () => {
  beforeEach(() => vi.useFakeTimers({ toFake: ['setTimeout', 'clearTimeout', 'Date'] }));
  afterEach(() => vi.useRealTimers());

  it('commits panels that change at different moments of a gesture together, once a pace', async () => {
    const editor = createEditor(doc);
    editor.dispatch('setViewport', { w: 900, h: 700 });
    const a = createStore<{ n: number }>(() => ({ n: 0 }));
    const b = createStore<{ n: number }>(() => ({ n: 0 }));
    let commits = 0;
    const view = render(
      <EditorContext.Provider value={editor}>
        <Profiler id="panels" onRender={() => commits++}>
          <Shows store={a} testID="a" />
          <Shows store={b} testID="b" />
        </Profiler>
      </EditorContext.Provider>,
    );
    // A hand on the plan: a gesture is under way.
    const s = editor.getState();
    const light = s.doc.items.find((i) => i.id === 'rimR') as { x: number; y: number };
    const cam = s.camera!;
    act(() => editor.pointer.down({ screen: { x: cam.tx + light.x * cam.scale, y: cam.ty + light.y * cam.scale }, pointer: 'mouse' }));
    expect(editor.getState().gesture).toBeTruthy();
    commits = 0;
    await act(async () => {
      a.setState({ n: 1 });
      await vi.advanceTimersByTimeAsync(100);
      b.setState({ n: 1 });
      await vi.advanceTimersByTimeAsync(PANEL_PACE_MS - 100 - 10);
    });
    // Within one pace: one commit (the first change), the second panel waits for the clock's next tick…
    expect(commits).toBe(1);
    expect(view.getByTestId('a').textContent).toBe('1');
    expect(view.getByTestId('b').textContent).toBe('0');
    await act(async () => {
      a.setState({ n: 2 });
      await vi.advanceTimersByTimeAsync(20);
    });
    // …where both catch up in one commit.
    expect(commits).toBe(2);
    expect(view.getByTestId('a').textContent).toBe('2');
    expect(view.getByTestId('b').textContent).toBe('1');
    // The gesture's end shows the newest at once.
    await act(async () => {
      b.setState({ n: 5 });
      editor.pointer.up({ screen: { x: cam.tx + light.x * cam.scale, y: cam.ty + light.y * cam.scale }, pointer: 'mouse' });
      await vi.advanceTimersByTimeAsync(0);
    });
    expect(view.getByTestId('b').textContent).toBe('5');
  });

  it('when a gesture ends on a value that is not final, steps once to the final one', async () => {
    const editor = createEditor(doc);
    editor.dispatch('setViewport', { w: 900, h: 700 });
    type Live = { n: number; computing: boolean };
    const store = createStore<Live>(() => ({ n: 0, computing: false }));
    const seen: number[] = [];
    function Shows() {
      const n = usePaced(store, (st) => st.n, PANEL_PACE_MS, (st) => !st.computing);
      seen.push(n);
      return <Text>{n}</Text>;
    }
    render(
      <EditorContext.Provider value={editor}>
        <Shows />
      </EditorContext.Provider>,
    );
    const s = editor.getState();
    const light = s.doc.items.find((i) => i.id === 'rimR') as { x: number; y: number };
    const cam = s.camera!;
    const at = { x: cam.tx + light.x * cam.scale, y: cam.ty + light.y * cam.scale };
    act(() => editor.pointer.down({ screen: at, pointer: 'mouse' }));
    await act(async () => {
      store.setState({ n: 1, computing: true });
      await vi.advanceTimersByTimeAsync(PANEL_PACE_MS + 10);
      // A result for an older position arrives while the newest is being computed…
      store.setState({ n: 2, computing: true });
    });
    seen.length = 0;
    // …and the hand lets go before the next tick: the older value is not shown…
    await act(async () => {
      editor.pointer.up({ screen: at, pointer: 'mouse' });
      await vi.advanceTimersByTimeAsync(PANEL_PACE_MS + 10);
    });
    expect(seen).not.toContain(2);
    // …nor when the store changes without a final value (the next job starting sets its flag again)…
    await act(async () => {
      store.setState({ computing: true });
      await vi.advanceTimersByTimeAsync(0);
    });
    expect(seen).not.toContain(2);
    // …the final one is, at once.
    await act(async () => {
      store.setState({ n: 3, computing: false });
      await vi.advanceTimersByTimeAsync(0);
    });
    expect(seen).not.toContain(2);
    expect(seen.at(-1)).toBe(3);
  });

  it('holds back a value the pace kept when the store changes in the very update that ends the gesture', async () => {
    const editor = createEditor(doc);
    editor.dispatch('setViewport', { w: 900, h: 700 });
    type Live = { n: number; computing: boolean };
    const store = createStore<Live>(() => ({ n: 0, computing: false }));
    // Like the live meter: subscribed to the editor before any panel, it starts a job as the hand lets go.
    editor.subscribe((s, prev) => {
      if (prev.gesture && !s.gesture) store.setState({ computing: true });
    });
    const seen: number[] = [];
    function Shows() {
      const n = usePaced(store, (st) => st.n, PANEL_PACE_MS, (st) => !st.computing);
      seen.push(n);
      return <Text>{n}</Text>;
    }
    render(
      <EditorContext.Provider value={editor}>
        <Shows />
      </EditorContext.Provider>,
    );
    const s = editor.getState();
    const light = s.doc.items.find((i) => i.id === 'rimR') as { x: number; y: number };
    const cam = s.camera!;
    const at = { x: cam.tx + light.x * cam.scale, y: cam.ty + light.y * cam.scale };
    act(() => editor.pointer.down({ screen: at, pointer: 'mouse' }));
    await act(async () => {
      store.setState({ n: 1 });
      await vi.advanceTimersByTimeAsync(PANEL_PACE_MS + 10);
      // A result held back by the pace (shown less than a pace ago)…
      store.setState({ n: 2 });
    });
    seen.length = 0;
    // …is not let out by the job that the release starts…
    await act(async () => {
      editor.pointer.up({ screen: at, pointer: 'mouse' });
      await vi.advanceTimersByTimeAsync(PANEL_PACE_MS + 10);
    });
    expect(seen).not.toContain(2);
    // …the job's result shows, once.
    await act(async () => {
      store.setState({ n: 3, computing: false });
      await vi.advanceTimersByTimeAsync(0);
    });
    expect(seen).not.toContain(2);
    expect(seen.at(-1)).toBe(3);
  });
});
