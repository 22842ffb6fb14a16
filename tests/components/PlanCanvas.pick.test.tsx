// A press on the plan (through the plan's own gesture, as on the web) selects the item drawn on top where two
// overlap: the one later in the document. (A light set down on another is the one the user
// means to reach; picking the one beneath would select, and then edit, the wrong light.)
import { act, render } from '@testing-library/react';
import { createEditor, type Editor } from '../../canvas/editor/editor';
import { toScreen } from '../../canvas/editor/camera';
import { EditorContext } from '../../canvas/editor/react';
import { PlanCanvas } from '../../canvas/PlanCanvas';
import { graphiteTheme } from '../../canvas/views';
import { parseDocument } from '../../model/document';
import { firePlanPointer } from './support/planPointer';

const W = 900;
const H = 700;

function twoLightsOnOneSpot(order: ['under', 'over'] | ['over', 'under']) {
  const spot = { under: { x: 3.0, y: 2.0 }, over: { x: 3.08, y: 2.0 } };
  return parseDocument({
    schemaVersion: 1,
    stage: { widthM: 6, depthM: 5 },
    items: [
      { id: 'subj', kind: 'subject', x: 3, y: 3.5 },
      ...order.map((id) => ({ id, kind: 'light', label: id, x: spot[id].x, y: spot[id].y, source: { type: 'strobe', energyWs: 400 } })),
    ],
  });
}

function mount(order: ['under', 'over'] | ['over', 'under']) {
  const editor = createEditor(twoLightsOnOneSpot(order));
  editor.dispatch('setViewport', { w: W, h: H });
  render(
    <EditorContext.Provider value={editor}>
      <PlanCanvas theme={graphiteTheme} units="metric" lightMap={null} />
    </EditorContext.Provider>,
  );
  return editor;
}

/** A press at a screen point, held and moved a few pixels: the plan's drag gesture, from the page's pointer events. */
async function press(editor: Editor, at: { x: number; y: number }) {
  await act(async () => {
    firePlanPointer([
      { type: 'down', x: at.x, y: at.y },
      { type: 'move', x: at.x + 4, y: at.y },
      { type: 'up', x: at.x + 4, y: at.y },
    ]);
  });
  return editor.getState().selection;
}

describe('a click on the plan where two lights overlap', () => {
  it.each([
    [['under', 'over'] as const, 'over'],
    [['over', 'under'] as const, 'under'],
  ])('with the document order %j selects %s, the one drawn on top', async (order, top) => {
    const editor = mount([...order] as ['under', 'over']);
    const s = editor.getState();
    // Between the two centres, within both lights' reach.
    const between = toScreen(s.camera!, { x: 3.04, y: 2.0 });
    expect(await press(editor, between)).toEqual([top]);
  });
});
