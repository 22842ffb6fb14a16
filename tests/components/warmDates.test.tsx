// useWarmDates (hooks/warmDates.ts): the root builds the date formatter the screens use in an idle moment after
// its first render, not during it, and not at all once it has closed.
import { render } from '@testing-library/react';
import { Text } from 'react-native';
import { useWarmDates } from '../../hooks/warmDates';

function Root() {
  useWarmDates();
  return <Text>root</Text>;
}

afterEach(() => vi.unstubAllGlobals());

describe('useWarmDates', () => {
  it('builds the screens’ date formatter when the browser is idle, once', () => {
    const waiting = new Map<number, () => void>();
    let next = 1;
    vi.stubGlobal('requestIdleCallback', (cb: () => void) => (waiting.set(next, cb), next++));
    vi.stubGlobal('cancelIdleCallback', (id: number) => waiting.delete(id));
    // Intl.DateTimeFormat, recording what it is asked to build.
    const Real = Intl.DateTimeFormat;
    const made: unknown[][] = [];
    Intl.DateTimeFormat = function (...args: ConstructorParameters<typeof Real>) {
      made.push(args);
      return new Real(...args);
    } as unknown as typeof Real;
    try {
      render(<Root />);
      expect(made).toEqual([]);
      expect(waiting.size).toBe(1);
      [...waiting.values()].forEach((cb) => cb());
      // The very options formatDate uses (model/format.ts), so its cache holds the formatter the cards ask for.
      expect(made).toEqual([[undefined, { day: 'numeric', month: 'short', year: 'numeric' }]]);
    } finally {
      Intl.DateTimeFormat = Real;
    }
  });

  it('lets go of its idle callback when the root closes first', () => {
    const waiting = new Map<number, () => void>();
    vi.stubGlobal('requestIdleCallback', (cb: () => void) => (waiting.set(1, cb), 1));
    vi.stubGlobal('cancelIdleCallback', (id: number) => waiting.delete(id));
    render(<Root />).unmount();
    expect(waiting.size).toBe(0);
  });
});
