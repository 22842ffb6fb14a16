// SetupLibrary's paging, with the list hook replaced (vi.mock), so the test controls what pages exist.
import { fireEvent, screen } from '@testing-library/react';
import { SetupLibrary } from '../../components/SetupLibrary';
import { renderScreen, serveApi, setup } from './support/library';

type Paging = { hasNextPage: boolean; isFetchingNextPage: boolean; fetchNextPage: () => void };
const paging = vi.hoisted(() => ({ current: {} as Paging }));

vi.mock(import('../../hooks/setups'), async (real) => ({
  ...(await real()),
  useSetupList: (() => ({
    isPending: false,
    isError: false,
    data: { pages: [{ setups: [setup({ title: 'Beauty dish overhead' }), setup({ title: 'Gridded strip as rim' })], nextCursor: 'next' }] },
    ...paging.current,
  })) as never,
}));

beforeEach(() => {
  serveApi(() => ({ status: 500, body: { error: { code: 'unused', message: 'the list comes from the mocked hook' } } }));
});
afterEach(() => {
  vi.unstubAllGlobals();
});

/**
 * The user scrolls the list to its end. jsdom lays nothing out, so the list's scroll box is given the sizes a
 * browser would report (a 2000 px list in a 600 px box, scrolled to its end) before the scroll event.
 */
const endOfList = () => {
  const box = screen.getByLabelText('Your setups');
  Object.defineProperties(box, {
    scrollHeight: { configurable: true, value: 2000 },
    offsetHeight: { configurable: true, value: 600 },
    scrollWidth: { configurable: true, value: 400 },
    offsetWidth: { configurable: true, value: 400 },
    // (jsdom ignores writes to scrollTop: the position the user scrolled to is given the same way.)
    scrollTop: { configurable: true, value: 1400 },
  });
  fireEvent.scroll(box);
};

describe('SetupLibrary paging', () => {
  it('asks for the next page at the end of the list when there is one', () => {
    const fetchNextPage = vi.fn();
    paging.current = { hasNextPage: true, isFetchingNextPage: false, fetchNextPage };
    renderScreen(<SetupLibrary />);
    expect(screen.getByText('Beauty dish overhead')).toBeInTheDocument();
    endOfList();
    expect(fetchNextPage).toHaveBeenCalledTimes(1);
  });

  it('does not ask again while a page is on its way', () => {
    const fetchNextPage = vi.fn();
    paging.current = { hasNextPage: true, isFetchingNextPage: true, fetchNextPage };
    renderScreen(<SetupLibrary />);
    endOfList();
    expect(fetchNextPage).not.toHaveBeenCalled();
  });

  it('does not ask when the last page is in', () => {
    const fetchNextPage = vi.fn();
    paging.current = { hasNextPage: false, isFetchingNextPage: false, fetchNextPage };
    renderScreen(<SetupLibrary />);
    endOfList();
    expect(fetchNextPage).not.toHaveBeenCalled();
  });
});
