// Panels that follow an outside store during a gesture (usePaced) share one clock per pace: two panels whose
// values change at different moments of a drag commit together, at most once a pace, not once each.
import { act, render } from '@testing-library/react';
import { Profiler, useLayoutEffect } from 'react';
import { Text } from 'react-native';
import { createStore, type StoreApi } from 'zustand';
import { createEditor } from '../../canvas/editor/editor';
import { EditorContext, PANEL_PACE_MS, useEditorLate, usePaced, useSettled } from '../../canvas/editor/react';
import { demoSetups } from '../../db/seed-setups';

const doc = demoSetups.find((d) => d.title.startsWith('Twin rims'))!.document;

function Shows({ store, testID }: { store: StoreApi<{ n: number }>; testID: string }) {
  const n = usePaced(store, (s) => s.n);
  return <Text testID={testID}>{n}</Text>;
}

/** Changes the store in a layout effect: after the panel's render read it, before React subscribes the panel. */
function ChangesEarly({ store }: { store: StoreApi<{ n: number }> }) {
  useLayoutEffect(() => store.setState({ n: 7 }), [store]);
  return null;
}

describe('usePaced', () => {
  it('shows a change made between its render and its subscription (the meter answering before the panels subscribe)', () => {
    const editor = createEditor(doc);
    const store = createStore<{ n: number }>(() => ({ n: 0 }));
    const view = render(
      <EditorContext.Provider value={editor}>
        <Shows store={store} testID="early" />
        <ChangesEarly store={store} />
      </EditorContext.Provider>,
    );
    expect(view.getByTestId('early')).toHaveTextContent('7');
    view.unmount();
  });

  beforeEach(() => vi.useFakeTimers({ toFake: ['setTimeout', 'clearTimeout', 'Date', 'requestAnimationFrame', 'cancelAnimationFrame'] }));
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
    // The gesture's end shows the newest once the frame that draws the plan where the hand let go is painted:
    // not in the release's own task, but right after the next animation frame, both panels in one commit.
    commits = 0;
    await act(async () => {
      b.setState({ n: 5 });
      a.setState({ n: 6 });
      editor.pointer.up({ screen: { x: cam.tx + light.x * cam.scale, y: cam.ty + light.y * cam.scale }, pointer: 'mouse' });
    });
    expect(view.getByTestId('b').textContent).toBe('1');
    await act(async () => vi.advanceTimersByTimeAsync(17));
    expect(view.getByTestId('b').textContent).toBe('5');
    expect(view.getByTestId('a').textContent).toBe('6');
    expect(commits).toBe(1);
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

  it('useSettled holds through a gesture and catches up after the frame that shows where the hand let go', async () => {
    const editor = createEditor(doc);
    editor.dispatch('setViewport', { w: 900, h: 700 });
    editor.dispatch('toggleSnap');
    function RimX() {
      const x = useSettled((st) => (st.doc.items.find((i) => i.id === 'rimR') as unknown as { x: number }).x);
      return <Text testID="x">{x.toFixed(2)}</Text>;
    }
    const view = render(
      <EditorContext.Provider value={editor}>
        <RimX />
      </EditorContext.Provider>,
    );
    const s = editor.getState();
    const light = s.doc.items.find((i) => i.id === 'rimR') as { x: number; y: number };
    const cam = s.camera!;
    const at = { x: cam.tx + light.x * cam.scale, y: cam.ty + light.y * cam.scale };
    const before = view.getByTestId('x').textContent;
    act(() => {
      editor.pointer.down({ screen: at, pointer: 'mouse' });
      editor.pointer.move({ screen: { x: at.x + 50, y: at.y }, pointer: 'mouse' });
    });
    await act(async () => vi.advanceTimersByTimeAsync(PANEL_PACE_MS * 2));
    expect(view.getByTestId('x').textContent).toBe(before);
    act(() => editor.pointer.up({ screen: { x: at.x + 50, y: at.y }, pointer: 'mouse' }));
    // Committed, but the panel waits for the plan's frame to be painted…
    expect((editor.getState().doc.items.find((i) => i.id === 'rimR') as unknown as { x: number }).x).not.toBeCloseTo(light.x);
    expect(view.getByTestId('x').textContent).toBe(before);
    // …then shows where the light was let go.
    await act(async () => vi.advanceTimersByTimeAsync(17));
    expect(view.getByTestId('x').textContent).toBe((light.x + 50 / cam.scale).toFixed(2));
  });

  it('useEditorLate follows a gesture at once, and shows what its end commits after the plan frame is painted', async () => {
    const editor = createEditor(doc);
    editor.dispatch('setViewport', { w: 900, h: 700 });
    editor.dispatch('toggleSnap');
    const heightOf = (st: ReturnType<typeof editor.getState>) => (st.doc.items.find((i) => i.id === 'rimR') as unknown as { heightM: number }).heightM;
    const xOf = (st: ReturnType<typeof editor.getState>) => (st.doc.items.find((i) => i.id === 'rimR') as unknown as { x: number }).x;
    function Rim() {
      const h = useEditorLate(heightOf);
      const x = useEditorLate(xOf);
      return <Text testID="rim">{`${h.toFixed(2)} ${x.toFixed(2)}`}</Text>;
    }
    const view = render(
      <EditorContext.Provider value={editor}>
        <Rim />
      </EditorContext.Provider>,
    );
    const shown = () => view.getByTestId('rim').textContent!.split(' ').map(Number);
    // A lift in the side view: a gesture whose changes go straight into the document — followed at once.
    act(() => {
      editor.dispatch('setGesture', { gesture: 'lift-test' });
      editor.dispatch('setHeight', { id: 'rimR', heightM: 2.5, gestureKey: 'lift-test' });
    });
    expect(shown()[0]).toBeCloseTo(2.5);
    act(() => editor.dispatch('setGesture', { gesture: null }));
    await act(async () => vi.advanceTimersByTimeAsync(17));
    // A drag on the plan: its release commits the moves; this panel shows them after the next frame.
    const s = editor.getState();
    const cam = s.camera!;
    const x0 = xOf(s);
    const light = s.doc.items.find((i) => i.id === 'rimR') as { x: number; y: number };
    const at = { x: cam.tx + light.x * cam.scale, y: cam.ty + light.y * cam.scale };
    act(() => {
      editor.pointer.down({ screen: at, pointer: 'mouse' });
      editor.pointer.move({ screen: { x: at.x + 50, y: at.y }, pointer: 'mouse' });
      editor.pointer.up({ screen: { x: at.x + 50, y: at.y }, pointer: 'mouse' });
    });
    expect(xOf(editor.getState())).toBeCloseTo(x0 + 50 / cam.scale);
    expect(shown()[1]).toBeCloseTo(x0);
    await act(async () => vi.advanceTimersByTimeAsync(17));
    expect(shown()[1]).toBeCloseTo(x0 + 50 / cam.scale);
  });
});
