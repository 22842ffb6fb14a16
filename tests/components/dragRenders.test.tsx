// A drag re-renders what the hand moves — the dragged item's glyph, its beam and the handles — and nothing
// else: not the other items, not the inspector, the meter's text at most at its readable pace (usePaced) however
// fast the meter's results come, the frame view at its own pace, and the light map's lines not element by element
// (written straight into the DOM). And the plan hands the editor at most one pointer move a frame.
import { act, render } from '@testing-library/react';
import { Profiler, type ProfilerOnRenderCallback } from 'react';
import { createEditor, type Editor } from '../../canvas/editor/editor';
import { toScreen } from '../../canvas/editor/camera';
import { EditorContext, FRAME_PACE_MS, PANEL_PACE_MS } from '../../canvas/editor/react';
import { createMeter, type Meter } from '../../canvas/meter/meter';
import { PlanCanvas, type LightMapSource } from '../../canvas/PlanCanvas';
import { graphiteTheme } from '../../canvas/views';
import { Inspector } from '../../components/editor/Inspector';
import { LiveMeterPanel, LiveSuggestedPower } from '../../components/editor/LiveMeter';
import { EditorFrame } from '../../components/frame/EditorFrame';
import { demoSetups } from '../../db/seed-setups';
import { formatStops } from '../../model/units';
import { firePlanPointer } from './support/planPointer';

// Every glyph drawn, by item id (the plan draws each item through ItemView).
const glyphRenders = vi.hoisted(() => new Map<string, number>());
vi.mock('../../canvas/views', async (importOriginal) => {
  const views = await importOriginal<typeof import('../../canvas/views')>();
  const { createElement } = await import('react');
  const Counted = (p: Parameters<typeof views.ItemView>[0]) => {
    glyphRenders.set(p.item.id, (glyphRenders.get(p.item.id) ?? 0) + 1);
    return createElement(views.ItemView, p);
  };
  return { ...views, ItemView: Counted };
});

// Every plan the frame view was handed (each one is a new draft picture to render).
const frameDocs = vi.hoisted(() => new Set<unknown>());
vi.mock('../../components/frame/FrameView', async (importOriginal) => {
  const mod = await importOriginal<typeof import('../../components/frame/FrameView')>();
  const { createElement } = await import('react');
  const Counted = (p: Parameters<typeof mod.FrameView>[0]) => {
    frameDocs.add(p.doc);
    return createElement(mod.FrameView, p);
  };
  return { ...mod, FrameView: Counted };
});

// Every react-native-svg element a sketch drew through React (SketchView), counted.
const sketchRenders = vi.hoisted(() => ({ n: 0 }));
vi.mock('../../canvas/views/SketchView', async (importOriginal) => {
  const mod = await importOriginal<typeof import('../../canvas/views/SketchView')>();
  const { createElement } = await import('react');
  const Counted = (p: Parameters<typeof mod.SketchView>[0]) => {
    sketchRenders.n++;
    return createElement(mod.SketchView, p);
  };
  return { ...mod, SketchView: Counted };
});

const twinRims = demoSetups.find((d) => d.title.startsWith('Twin rims'))!.document;

function mount() {
  const editor = createEditor(twinRims);
  editor.dispatch('setViewport', { w: 900, h: 700 });
  editor.dispatch('toggleSnap');
  editor.dispatch('select', { ids: ['rimR'] });
  const meter = createMeter(editor, { lightMap: true });
  meter.start();
  const renders = new Map<string, number>();
  const counted: ProfilerOnRenderCallback = (id) => renders.set(id, (renders.get(id) ?? 0) + 1);
  const map: LightMapSource = { get: () => meter.getState().readings?.map ?? null, subscribe: (f) => meter.subscribe(f) };
  const view = render(
    <EditorContext.Provider value={editor}>
      <Profiler id="inspector" onRender={counted}>
        <Inspector units="metric" />
      </Profiler>
      <Profiler id="meter" onRender={counted}>
        <LiveMeterPanel meter={meter} units="metric" />
      </Profiler>
      <Profiler id="suggested" onRender={counted}>
        <LiveSuggestedPower meter={meter} />
      </Profiler>
      <Profiler id="panels" onRender={counted}>
        <LiveMeterPanel meter={meter} units="metric" />
        <LiveSuggestedPower meter={meter} />
      </Profiler>
      <Profiler id="offscreen" onRender={counted}>
        <LiveMeterPanel meter={meter} units="metric" offscreen />
      </Profiler>
      <EditorFrame wide readOnly={false} />
      <PlanCanvas theme={graphiteTheme} units="metric" lightMap={map} />
    </EditorContext.Provider>,
  );
  return { editor, meter, renders, view };
}

const at = (editor: Editor, id: string) => {
  const s = editor.getState();
  const i = s.doc.items.find((x) => x.id === id) as { x: number; y: number };
  return toScreen(s.camera!, { x: i.x, y: i.y });
};

describe('a drag on the plan', () => {
  let meter: Meter | null = null;
  beforeEach(() => {
    // Animation frames too: a gesture's end lets the panels catch up after the next frame (afterPaint).
    vi.useFakeTimers({ toFake: ['setTimeout', 'clearTimeout', 'Date', 'requestAnimationFrame', 'cancelAnimationFrame'] });
    glyphRenders.clear();
  });
  afterEach(() => {
    meter?.dispose();
    meter = null;
    vi.useRealTimers();
  });

  it('re-renders the dragged glyph only; the inspector holds and the meter text follows at its pace', async () => {
    const m = mount();
    meter = m.meter;
    const { editor, renders } = m;
    await act(async () => vi.advanceTimersByTime(50));
    glyphRenders.clear();
    renders.clear();
    const from = at(editor, 'rimR');
    const transforms = () => new Set(Array.from(m.view.container.querySelectorAll('[transform]')).map((e) => e.getAttribute('transform') ?? ''));
    const before = transforms();
    // The light map's stop labels (one per contour level, drawing/contourLabels.ts) are on the plan at rest.
    const levelWords = () => new Set((m.meter.getState().readings?.map?.contours ?? []).map((c) => formatStops(c.stops)));
    const plan = m.view.container.querySelector('[data-testid="item-glyph-rimR"]')!.closest('svg')!;
    const stopLabels = () => Array.from(plan.querySelectorAll('text')).filter((t) => levelWords().has(t.textContent ?? '')).length;
    expect(stopLabels()).toBeGreaterThan(0);
    const MOVES = 20;
    const mapLines = () => m.view.container.querySelector('[data-testid="light-map-lines"]')?.innerHTML ?? '';
    const linesBefore = mapLines();
    expect(linesBefore).toMatch(/<path /);
    sketchRenders.n = 0;
    frameDocs.clear();
    act(() => editor.pointer.down({ screen: from, pointer: 'mouse' }));
    for (let k = 1; k <= MOVES; k++) {
      // Each move is followed by the meter's result for it (the inline engine answers after the current task).
      await act(async () => {
        editor.pointer.move({ screen: { x: from.x - 4 * k, y: from.y + 2 * k }, pointer: 'mouse' });
        await vi.advanceTimersByTimeAsync(5);
      });
    }
    // The meter did follow the hand (it is not simply idle)…
    expect(editor.getState().drag?.items.get('rimR')).toBeTruthy();
    expect(m.meter.getState().doc.items.find((i) => i.id === 'rimR')).not.toBe(twinRims.items.find((i) => i.id === 'rimR'));
    // The stop labels step aside while the hand drags (placing them again for every new map costs frames)…
    expect(stopLabels()).toBe(0);
    // …but within one pace the meter's text re-rendered at most once, the inspector not at all.
    expect(MOVES * 5).toBeLessThan(PANEL_PACE_MS);
    expect(renders.get('meter') ?? 0).toBeLessThanOrEqual(1);
    expect(renders.get('suggested') ?? 0).toBeLessThanOrEqual(1);
    // Panels on the same pace catch up together: one commit for both, not one each.
    expect(renders.get('panels') ?? 0).toBeLessThanOrEqual(1);
    expect(renders.get('inspector') ?? 0).toBe(0);
    // The frame view takes the live plan at its own pace (a draft picture each time), not at every move: within
    // one pace, once as the hand starts and once a pace later.
    expect(MOVES * 5).toBeLessThanOrEqual(FRAME_PACE_MS);
    expect(frameDocs.size).toBeGreaterThan(0);
    expect(frameDocs.size).toBeLessThanOrEqual(2);
    // Each new map rewrote the lines (the map follows the hand), and React drew none of its elements
    // (a map is a few hundred: one new map drawn through SketchView would count that many; what is left is the
    // moved item's label stepping aside as the drag starts).
    expect(mapLines()).not.toBe(linesBefore);
    expect(sketchRenders.n).toBeLessThan(10);
    // In the browser (react-native-web) the drag layer moves the dragged glyph by writing its SVG node's
    // transform (canvas/dragViews.ts): React draws no glyph at all while the hand moves…
    expect([...glyphRenders.keys()]).toEqual([]);
    // …and the dragged item's parts (glyph, beam, mark, handles) were moved by writing their transforms.
    const written = [...transforms()].filter((t) => !before.has(t) && /^translate\(/.test(t));
    expect(written.length).toBeGreaterThan(0);

    // On release the panels catch up at once with the document as it now stands.
    const counts = { meter: renders.get('meter') ?? 0, inspector: renders.get('inspector') ?? 0 };
    await act(async () => {
      editor.pointer.up({ screen: { x: from.x - 4 * MOVES, y: from.y + 2 * MOVES }, pointer: 'mouse' });
      await vi.advanceTimersByTimeAsync(50);
    });
    expect(renders.get('inspector') ?? 0).toBeGreaterThan(counts.inspector);
    expect(renders.get('meter') ?? 0).toBeGreaterThan(counts.meter);
    expect(m.view.getAllByTestId('meter-light-rimR').length).toBeGreaterThan(0);
    expect(stopLabels()).toBeGreaterThan(0); // and come back on release
    // At release React draws the dragged item from the document once more, and no other item.
    expect([...glyphRenders.keys()]).toEqual(['rimR']);
  });

  it('a meter panel out of sight (a phone sheet at its peek) holds through a drag and catches up on release', async () => {
    const m = mount();
    meter = m.meter;
    const { editor, renders } = m;
    await act(async () => vi.advanceTimersByTime(50));
    renders.clear();
    const from = at(editor, 'rimR');
    act(() => editor.pointer.down({ screen: from, pointer: 'mouse' }));
    // Longer than two paces: the panel in sight follows at its pace, the one out of sight not at all.
    for (let k = 1; k <= 12; k++) {
      await act(async () => {
        editor.pointer.move({ screen: { x: from.x - 4 * k, y: from.y + 2 * k }, pointer: 'mouse' });
        await vi.advanceTimersByTimeAsync(50);
      });
    }
    expect(12 * 50).toBeGreaterThan(2 * PANEL_PACE_MS);
    expect(renders.get('meter') ?? 0).toBeGreaterThanOrEqual(2);
    expect(renders.get('offscreen') ?? 0).toBe(0);
    await act(async () => {
      editor.pointer.up({ screen: { x: from.x - 48, y: from.y + 24 }, pointer: 'mouse' });
      await vi.advanceTimersByTimeAsync(50);
    });
    expect(renders.get('offscreen') ?? 0).toBeGreaterThan(0);
  });

  it('a press that picks another item and drags it leaves the inspector alone until the hand lets go', async () => {
    const m = mount();
    meter = m.meter;
    const { editor, renders } = m;
    await act(async () => vi.advanceTimersByTime(50));
    renders.clear();
    // rimR is selected; the hand takes rimL.
    const from = at(editor, 'rimL');
    act(() => editor.pointer.down({ screen: from, pointer: 'mouse' }));
    expect(editor.getState().selection).toEqual(['rimL']);
    for (let k = 1; k <= 5; k++) {
      await act(async () => {
        editor.pointer.move({ screen: { x: from.x + 4 * k, y: from.y }, pointer: 'mouse' });
        await vi.advanceTimersByTimeAsync(5);
      });
    }
    expect(renders.get('inspector') ?? 0).toBe(0);
    await act(async () => {
      editor.pointer.up({ screen: { x: from.x + 20, y: from.y }, pointer: 'mouse' });
      await vi.advanceTimersByTimeAsync(50);
    });
    expect(renders.get('inspector') ?? 0).toBeGreaterThan(0);
    expect(m.view.getByTestId('inspector-rimL')).toBeInTheDocument();
  });

  it('hands the editor at most one pointer move a frame: the newest', async () => {
    const m = mount();
    meter = m.meter;
    const { editor } = m;
    await act(async () => vi.advanceTimersByTime(50));
    const from = at(editor, 'rimL');
    const moves: { x: number; y: number }[] = [];
    const move = editor.pointer.move;
    editor.pointer.move = (e) => {
      moves.push(e.screen);
      move(e);
    };
    // One gesture delivered within one frame: the start, three moves, the release.
    act(() => {
      firePlanPointer([
        { type: 'down', x: from.x, y: from.y },
        { type: 'move', x: from.x + 5, y: from.y },
        { type: 'move', x: from.x + 10, y: from.y },
        { type: 'move', x: from.x + 15, y: from.y },
        { type: 'move', x: from.x + 20, y: from.y },
        { type: 'up', x: from.x + 30, y: from.y },
      ]);
    });
    // The start places the item under the hand at once; the moves within the frame wait and are replaced by
    // the release's, which never waits for a frame.
    expect(moves).toEqual([
      { x: from.x + 5, y: from.y },
      { x: from.x + 30, y: from.y },
    ]);
    await act(async () => vi.advanceTimersByTimeAsync(20));
    expect(moves).toHaveLength(2);
  });

  it('applies the first move of each frame at once, in the frame the browser delivered it', async () => {
    // Frames on the test's clock too.
    vi.useFakeTimers({ toFake: ['setTimeout', 'clearTimeout', 'Date', 'requestAnimationFrame', 'cancelAnimationFrame'] });
    const m = mount();
    meter = m.meter;
    const { editor } = m;
    await act(async () => vi.advanceTimersByTime(50));
    const from = at(editor, 'rimL');
    const moves: number[] = [];
    const move = editor.pointer.move;
    editor.pointer.move = (e) => {
      moves.push(e.screen.x - from.x);
      move(e);
    };
    const step = (type: 'down' | 'move' | 'up', dx: number) => act(() => firePlanPointer([{ type, x: from.x + dx, y: from.y }]));
    step('down', 0);
    step('move', 5);
    // A later frame: its first move reaches the editor (and the drag layer's DOM) in the same task, not a frame
    // later; a second move in that frame waits for the next one.
    await act(async () => vi.advanceTimersByTimeAsync(20));
    step('move', 10);
    expect(moves).toEqual([5, 10]);
    step('move', 15);
    expect(moves).toEqual([5, 10]);
    await act(async () => vi.advanceTimersByTimeAsync(20));
    expect(moves).toEqual([5, 10, 15]);
    await act(async () => vi.advanceTimersByTimeAsync(20));
    step('move', 20);
    expect(moves).toEqual([5, 10, 15, 20]);
    step('up', 20);
  });
});
