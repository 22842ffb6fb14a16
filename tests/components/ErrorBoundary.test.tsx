// When part of the app throws, that part shows a way back, and every open editor saves what is pending
// before the message says so; "Try again" renders the part again with the work still there.
import { act, fireEvent, render, screen } from '@testing-library/react';
import { useState } from 'react';
import { Text } from 'react-native';
import { createEditor } from '../../canvas/editor/editor';
import { createPersist, type SaveBody } from '../../canvas/editor/persist';
import { EditorContext, useEditor } from '../../canvas/editor/react';
import { ErrorBoundary } from '../../components/ErrorBoundary';
import { demoSetups } from '../../db/seed-setups';

const doc = demoSetups[0]!.document;
let fail = true;

function KeyPosition() {
  const x = useEditor((s) => (s.doc.items.find((i) => i.id === 'key') as unknown as { x: number }).x);
  if (fail) throw new Error('the plan could not be drawn');
  return <Text>key at {x.toFixed(1)} m</Text>;
}

function Screen({ onLeave }: { onLeave: () => void }) {
  const [, rerender] = useState(0);
  return (
    <ErrorBoundary what="the plan" onLeave={onLeave}>
      <KeyPosition />
      <Text onPress={() => rerender((n) => n + 1)}>refresh</Text>
    </ErrorBoundary>
  );
}

describe('error boundaries', () => {
  it('save pending work, show a way back, and try again', async () => {
    const editor = createEditor(doc);
    const saves: SaveBody[] = [];
    const persist = createPersist(editor, { setup: { id: 's1', version: 1, studioId: 'st1', title: 't', notes: '', document: doc }, client: { save: async (_id, body) => (saves.push(body), { version: 2 }), createCopy: async () => ({ id: 'c' }) } });
    editor.dispatch('select', { ids: ['key'] });
    editor.dispatch('nudge', { dx: 0.5, dy: 0 }); // pending: the debounce has not run
    const left = vi.fn();
    const quiet = vi.spyOn(console, 'error').mockImplementation(() => {});
    render(
      <EditorContext.Provider value={editor}>
        <Screen onLeave={left} />
      </EditorContext.Provider>,
    );
    expect(await screen.findByText('Something went wrong in the plan.')).toBeInTheDocument();
    expect(await screen.findByText('Your changes are saved. Try again, or leave and come back.')).toBeInTheDocument();
    expect(saves.length).toBe(1);
    expect((saves[0]!.document!.items.find((i) => i.id === 'key') as unknown as { x: number }).x).toBeCloseTo(4.5);
    fail = false;
    await act(async () => fireEvent.click(screen.getByRole('button', { name: 'Try again' })));
    expect(screen.getByText('key at 4.5 m')).toBeInTheDocument();
    quiet.mockRestore();
    persist.dispose();
  });

  it('"Back to setups" leaves after saving', async () => {
    fail = true;
    const left = vi.fn();
    const quiet = vi.spyOn(console, 'error').mockImplementation(() => {});
    render(
      <EditorContext.Provider value={createEditor(doc)}>
        <Screen onLeave={left} />
      </EditorContext.Provider>,
    );
    await act(async () => fireEvent.click(await screen.findByRole('button', { name: 'Back to setups' })));
    expect(left).toHaveBeenCalledTimes(1);
    quiet.mockRestore();
  });
});
