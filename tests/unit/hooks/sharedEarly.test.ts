// The read-only link's early request (hooks/sharedEarly.ts): asked for once as the route renders, taken once by
// the screen's query, and not taken when it has grown old.
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { fetchSharedEarly, takeSharedEarly } from '../../../hooks/sharedEarly';

let asked: string[] = [];
beforeEach(() => {
  asked = [];
  vi.useFakeTimers({ toFake: ['Date'] });
  vi.stubGlobal('fetch', async (url: string) => {
    asked.push(String(url));
    return new Response(JSON.stringify({ title: `setup ${asked.length}` }), { status: 200, headers: { 'content-type': 'application/json' } });
  });
});
afterEach(() => {
  vi.useRealTimers();
  vi.unstubAllGlobals();
});

describe('the read-only link’s early request', () => {
  it('asks once however often the route renders, and is taken once', async () => {
    fetchSharedEarly('tok-a');
    fetchSharedEarly('tok-a');
    expect(asked).toHaveLength(1);
    expect(asked[0]).toContain('/api/shared/tok-a');
    const first = takeSharedEarly('tok-a');
    expect(first).not.toBeNull();
    expect(await first).toMatchObject({ title: 'setup 1' });
    // Taken: the next fetch of the screen goes to the server itself.
    expect(takeSharedEarly('tok-a')).toBeNull();
    expect(takeSharedEarly('never-asked')).toBeNull();
  });

  it('is not taken once older than 30 s, and a new render then asks again', async () => {
    fetchSharedEarly('tok-b');
    vi.setSystemTime(Date.now() + 31_000);
    fetchSharedEarly('tok-b');
    expect(asked).toHaveLength(2);
    expect(await takeSharedEarly('tok-b')).toMatchObject({ title: 'setup 2' });
    fetchSharedEarly('tok-c');
    vi.setSystemTime(Date.now() + 31_000);
    expect(takeSharedEarly('tok-c')).toBeNull();
  });
});
