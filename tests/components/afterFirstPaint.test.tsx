// useAfterFirstPaint (hooks/afterFirstPaint.ts): what it gates is not in the first render; it comes when the
// browser's idle callback runs, and never after the screen has closed.
import { act, render, screen } from '@testing-library/react';
import { Text } from 'react-native';
import { useAfterFirstPaint } from '../../hooks/afterFirstPaint';

function Page() {
  const rest = useAfterFirstPaint();
  return (
    <>
      <Text>top</Text>
      {rest ? <Text>below</Text> : null}
    </>
  );
}

afterEach(() => vi.unstubAllGlobals());

describe('useAfterFirstPaint', () => {
  it('renders the top alone first and the rest when the browser is idle', async () => {
    const waiting = new Map<number, () => void>();
    let next = 1;
    vi.stubGlobal('requestIdleCallback', (cb: () => void) => (waiting.set(next, cb), next++));
    vi.stubGlobal('cancelIdleCallback', (id: number) => waiting.delete(id));
    render(<Page />);
    expect(screen.getByText('top')).toBeInTheDocument();
    expect(screen.queryByText('below')).toBeNull();
    expect(waiting.size).toBe(1);
    await act(async () => [...waiting.values()].forEach((cb) => cb()));
    expect(screen.getByText('below')).toBeInTheDocument();
  });

  it('lets go of its idle callback when the screen closes first', () => {
    const waiting = new Map<number, () => void>();
    vi.stubGlobal('requestIdleCallback', (cb: () => void) => (waiting.set(1, cb), 1));
    vi.stubGlobal('cancelIdleCallback', (id: number) => waiting.delete(id));
    const view = render(<Page />);
    view.unmount();
    expect(waiting.size).toBe(0);
  });

  it('falls back to a timer where there is no idle callback', async () => {
    vi.stubGlobal('requestIdleCallback', undefined);
    render(<Page />);
    expect(screen.queryByText('below')).toBeNull();
    expect(await screen.findByText('below')).toBeInTheDocument();
  });
});
