import { act, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { SetupLibrary } from '../../components/SetupLibrary';
import { renderScreen, serveApi, setup } from './support/library';

afterEach(() => {
  vi.unstubAllGlobals();
  vi.useRealTimers();
});

describe('SetupLibrary', () => {
  it('lists the setups the API returns', async () => {
    const api = serveApi(() => ({
      status: 200,
      body: {
        setups: [
          setup({ title: 'Clamshell portrait', tags: ['beauty', 'two lights'], itemCount: 5 }),
          setup({ title: 'Rembrandt with bounce', itemCount: 3 }),
        ],
        nextCursor: null,
      },
    }));
    renderScreen(<SetupLibrary />);

    expect(await screen.findByText('Clamshell portrait')).toBeInTheDocument();
    expect(screen.getByText('Rembrandt with bounce')).toBeInTheDocument();
    expect(screen.queryByText('No setups yet')).toBeNull();
    expect(api.listRequests().length).toBeGreaterThan(0);
  });

  it('says so when there are no setups yet', async () => {
    serveApi(() => ({ status: 200, body: { setups: [], nextCursor: null } }));
    renderScreen(<SetupLibrary />);

    expect(await screen.findByText('No setups yet')).toBeInTheDocument();
    expect(screen.queryByText('Clamshell portrait')).toBeNull();
  });

  it('searches as you type, once the typing stops, and says when nothing matches', async () => {
    const api = serveApi((url) =>
      url.searchParams.get('q') === 'snoot'
        ? { status: 200, body: { setups: [], nextCursor: null } }
        : { status: 200, body: { setups: [setup({ title: 'Clamshell portrait' })], nextCursor: null } },
    );
    // Fake timers make the debounce deterministic: typing takes no time at all.
    vi.useFakeTimers();
    const user = userEvent.setup({ advanceTimers: (ms) => void vi.advanceTimersByTime(ms) });
    renderScreen(<SetupLibrary />);
    expect(await screen.findByText('Clamshell portrait')).toBeInTheDocument();

    await user.type(screen.getByLabelText('Search setups'), 'snoot');
    expect(screen.queryByText('No setup matches that search')).toBeNull();
    await act(() => vi.advanceTimersByTimeAsync(250));

    expect(await screen.findByText('No setup matches that search')).toBeInTheDocument();
    expect(screen.queryByText('Clamshell portrait')).toBeNull();
    // One request for the whole word, none per keystroke.
    const searched = api.listRequests().map((u) => u.searchParams.get('q')).filter((q) => q !== null);
    expect(searched).toEqual(['snoot']);
  });

  it('shows the API error as an alert', async () => {
    serveApi(() => ({ status: 500, body: { error: { code: 'internal', message: 'database unavailable' } } }));
    renderScreen(<SetupLibrary />);

    // (An alert takes its words from its content, so find it by role and read them.)
    expect(await screen.findByRole('alert')).toHaveTextContent('Could not load your setups: database unavailable');
  });
});
