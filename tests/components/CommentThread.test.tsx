// The comment thread shows its plan for pinning and follows edits, and computes no meter
// readings for it (a meter run on the page's thread at every edit: the release of every drag in the editor).
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, render, screen } from '@testing-library/react';
import { CommentThread } from '../../components/comments/CommentThread';
import { demoSetups } from '../../db/seed-setups';
import type { SetupComment } from '../../model/api';

const meterRuns = vi.hoisted(() => ({ n: 0 }));
vi.mock('../../model/setupReadings', async (importOriginal) => {
  const mod = await importOriginal<typeof import('../../model/setupReadings')>();
  return {
    ...mod,
    computeReadings: (...a: Parameters<typeof mod.computeReadings>) => {
      meterRuns.n++;
      return mod.computeReadings(...a);
    },
  };
});

const SETUP = '0b6f3f0e-7c1a-4d7e-9a55-3c2d1e0f9a11';
const doc = demoSetups.find((d) => d.title.startsWith('Twin rims'))!.document;
const pinned: SetupComment = {
  id: 'c1',
  body: 'Raise this one a hand',
  itemId: doc.items.find((i) => i.kind === 'light')!.id,
  point: null,
  parentId: null,
  resolvedAt: null,
  resolvedBy: null,
  createdAt: '2026-11-02T10:00:00Z',
  author: { id: 'u2', name: 'Noor' },
};

afterEach(() => vi.unstubAllGlobals());

it('shows a pinned comment beside a plan of the setup without running the meter, as the plan changes too (the pin marker itself needs a laid-out plan: e2e comment-pins)', async () => {
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: string | URL | Request) => {
      const url = new URL(String(input), 'http://falloff.test');
      const body = url.pathname.endsWith('/comments') ? { comments: [pinned], lastReadAt: null } : {};
      return new Response(JSON.stringify(body), { status: 200, headers: { 'content-type': 'application/json' } });
    }),
  );
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  const me = { id: 'u1', name: 'Ada' };
  const view = render(
    <QueryClientProvider client={client}>
      <CommentThread setupId={SETUP} doc={doc} units="metric" me={me} canWrite />
    </QueryClientProvider>,
  );
  expect(await screen.findByText('Raise this one a hand')).toBeInTheDocument();
  expect(screen.getByTestId('comment-plan')).toBeInTheDocument();
  // An edit: the plan follows it.
  const moved = { ...doc, items: doc.items.map((i) => (i.id === pinned.itemId ? { ...i, x: (i as { x: number }).x + 0.5 } : i)) };
  await act(async () => {
    view.rerender(
      <QueryClientProvider client={client}>
        <CommentThread setupId={SETUP} doc={moved} units="metric" me={me} canWrite />
      </QueryClientProvider>,
    );
  });
  expect(screen.getByText('Raise this one a hand')).toBeInTheDocument();
  expect(meterRuns.n).toBe(0);
});
