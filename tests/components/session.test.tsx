// Who is signed in, read without better-auth's client (hooks/session.ts): a plain GET of its get-session route;
// read again after this tab signs in or out and when another tab says it did, where a change of person drops
// every other cached answer.
import { QueryClient, QueryClientProvider, useQuery } from '@tanstack/react-query';
import { act, render, screen, waitFor } from '@testing-library/react';
import { Text } from 'react-native';
import { sessionChanged, useSession } from '../../hooks/session';
import type { SessionResponse } from '../../model/api';

const person = (id: string, name: string): SessionResponse => ({
  session: { id: `s-${id}`, userId: id, expiresAt: '2030-01-01T00:00:00.000Z' },
  user: { id, name, email: `${id}@example.test`, emailVerified: true },
});

/** A fetch answering get-session with `who()` and /api/setups with a count of the asks; records every URL. */
function serve(who: () => SessionResponse) {
  const asked: string[] = [];
  let lists = 0;
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: string) => {
      asked.push(input);
      const body = input.startsWith('/api/auth/get-session') ? who() : { n: ++lists };
      return new Response(JSON.stringify(body), { status: 200, headers: { 'content-type': 'application/json' } });
    }),
  );
  return { asked };
}

function Who() {
  const { data, isPending } = useSession();
  const other = useQuery({ queryKey: ['setups'], queryFn: () => fetch('/api/setups').then((r) => r.json() as Promise<{ n: number }>), staleTime: Infinity });
  return (
    <>
      <Text>{isPending ? 'checking' : data ? `signed in as ${data.user.name}` : 'signed out'}</Text>
      <Text>{other.data ? `list ${other.data.n}` : 'no list'}</Text>
    </>
  );
}

function mount() {
  const qc = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <QueryClientProvider client={qc}>
      <Who />
    </QueryClientProvider>,
  );
  return qc;
}

afterEach(() => vi.unstubAllGlobals());

describe('useSession', () => {
  it('asks better-auth’s get-session route with a plain fetch and shows who is signed in', async () => {
    const api = serve(() => person('u1', 'Ada'));
    mount();
    expect(screen.getByText('checking')).toBeInTheDocument();
    expect(await screen.findByText('signed in as Ada')).toBeInTheDocument();
    expect(api.asked.filter((u) => u === '/api/auth/get-session')).toHaveLength(1);
  });

  it('is signed out when the route answers null', async () => {
    serve(() => null);
    mount();
    expect(await screen.findByText('signed out')).toBeInTheDocument();
  });

  it('reads the session again after this tab signs in, and after it signs out without asking', async () => {
    let who: SessionResponse = null;
    const api = serve(() => who);
    const qc = mount();
    expect(await screen.findByText('signed out')).toBeInTheDocument();
    who = person('u2', 'Bo');
    await act(() => sessionChanged(qc));
    expect(await screen.findByText('signed in as Bo')).toBeInTheDocument();
    const asks = api.asked.length;
    await act(() => sessionChanged(qc, null));
    expect(await screen.findByText('signed out')).toBeInTheDocument();
    expect(api.asked.length).toBe(asks);
  });

  it('follows another tab: the same person keeps the cached answers, another person drops them', async () => {
    let who: SessionResponse = person('u3', 'Cy');
    serve(() => who);
    mount();
    expect(await screen.findByText('signed in as Cy')).toBeInTheDocument();
    expect(await screen.findByText('list 1')).toBeInTheDocument();
    const otherTab = new BroadcastChannel('falloff-session');
    try {
      // Signed in again as the same person: the list stays as it was.
      otherTab.postMessage('changed');
      await waitFor(() => expect(screen.getByText('signed in as Cy')).toBeInTheDocument());
      await new Promise((r) => setTimeout(r, 50));
      expect(screen.getByText('list 1')).toBeInTheDocument();
      // Someone else signed in over there: this tab follows, and asks for the list afresh.
      who = person('u4', 'Di');
      otherTab.postMessage('changed');
      expect(await screen.findByText('signed in as Di')).toBeInTheDocument();
      expect(await screen.findByText('list 2')).toBeInTheDocument();
    } finally {
      otherTab.close();
    }
  });
});
