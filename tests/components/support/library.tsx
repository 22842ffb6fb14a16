// Helpers for rendering the setups library: a stand-in for the API behind `fetch`, and a render inside a
// QueryClientProvider and expo-router's in-memory router (the library opens setups by route).
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import type { ReactElement } from 'react';
import type { ApiError, SetupListResponse, SetupSummary } from '../../../model/api';
import { renderRouter } from './router';

export const ORIGIN = 'http://falloff.test';
const STUDIO_ID = '7a0c3c47-2f7e-4d6b-9d7e-1b2c3d4e5f60';

export function setup(over: Partial<SetupSummary>): SetupSummary {
  return {
    id: crypto.randomUUID(),
    studioId: STUDIO_ID,
    studioName: 'North light studio',
    title: 'Untitled',
    tags: [],
    version: 1,
    isTemplate: false,
    itemCount: 0,
    updatedAt: '2026-11-20T10:00:00.000Z',
    ...over,
  };
}

type Answer = { status: number; body: unknown };
export type ListAnswer = { status: number; body: SetupListResponse | ApiError };

/**
 * Stubs the global fetch with a small API: GET /api/setups answers from `list(url)`; the signed-in user,
 * tags and invitations get plain answers; anything else is a 404 in the API's error shape.
 */
export function serveApi(list: (url: URL) => ListAnswer) {
  const fetch = vi.fn(async (input: string | URL | Request) => {
    const url = new URL(String(input), ORIGIN);
    const answer: Answer =
      url.pathname === '/api/setups'
        ? list(url)
        : url.pathname === '/api/me'
          ? {
              status: 200,
              body: {
                user: { id: 'u1', name: 'Ada', email: 'ada@example.com', units: 'metric', paper: 'a4' },
                studios: [{ id: STUDIO_ID, name: 'North light studio', personal: true, role: 'owner' }],
                classes: [],
              },
            }
          : url.pathname === '/api/tags'
            ? { status: 200, body: { tags: [] } }
            : url.pathname === '/api/invitations'
              ? { status: 200, body: { invitation: null } }
              : { status: 404, body: { error: { code: 'not_found', message: `no ${url.pathname} here` } } };
    return new Response(JSON.stringify(answer.body), { status: answer.status, headers: { 'content-type': 'application/json' } });
  });
  vi.stubGlobal('fetch', fetch);
  return {
    fetch,
    /** The URLs of the list requests made so far. */
    listRequests: () => fetch.mock.calls.map(([u]) => new URL(String(u), ORIGIN)).filter((u) => u.pathname === '/api/setups'),
  };
}

/** Renders `element` as the app's index route, with a fresh query client that does not retry. */
export function renderScreen(element: ReactElement) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false, gcTime: Infinity } } });
  const Screen = () => <QueryClientProvider client={client}>{element}</QueryClientProvider>;
  return renderRouter({ index: Screen }, { initialUrl: '/' });
}
