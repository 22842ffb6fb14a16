// kill -9 in the middle of a burst of saves, then a restart and a retry of every save whose answer never came
// (same Idempotency-Key, same body): no 409, and each save applied exactly once.
import { afterAll, beforeAll, expect, test } from 'vitest';
import { startChildServer, type ChildServer } from '../support/child';
import { Client, freshEmail } from '../support/http';
import { startCluster } from '../support/pg';

let server: ChildServer | undefined;
beforeAll(() => startCluster());
afterAll(async () => {
  await server?.stop('SIGKILL');
});

type Lane = { id: string; acked: number; pending: { key: string; from: number; title: string } | null; sent: number };

test('kill -9 mid-burst, restart, retry the unacknowledged saves: no 409s, no duplicates', async () => {
  server = await startChildServer();
  const email = freshEmail('burst');
  const c = await new Client(server.url).signUp('Burst Saver', email, 'a fine long password');
  const lanes: Lane[] = [];
  for (let i = 0; i < 8; i++) {
    const s = await c.post('/api/setups', { title: `Lane ${i}` });
    expect(s.status).toBe(201);
    lanes.push({ id: s.body.id, acked: s.body.version, pending: null, sent: 0 });
  }
  const put = (base: string, lane: Lane) => {
    const p = lane.pending!;
    return new Client(base, c.address).request('PUT', `/api/setups/${lane.id}`, { version: p.from, title: p.title }, { cookie: cookieOf(c), 'idempotency-key': p.key });
  };
  // Every lane saves until its save fails because the process is gone, so each ends with a save in flight at the
  // kill (stopping the lanes first let all eight finish their last save on a quick machine: nothing was left to retry).
  let killing = false;
  const runLane = async (lane: Lane, i: number) => {
    for (;;) {
      lane.pending = { key: `lane${i}-save${lane.sent}-${Math.random().toString(36).slice(2, 8)}`, from: lane.acked, title: `Lane ${i} save ${lane.sent}` };
      lane.sent++;
      try {
        const r = await put(server!.url, lane);
        expect(r.status, JSON.stringify(r.body)).toBe(200);
        lane.acked = r.body.version;
        lane.pending = null;
      } catch (err) {
        if (!killing) throw err;
        return; // the server died with this save in flight: it stays pending
      }
    }
  };
  const burst = Promise.all(lanes.map(runLane));
  await new Promise((r) => setTimeout(r, 1_500));
  killing = true;
  await server.stop('SIGKILL');
  await burst;
  const unacked = lanes.filter((l) => l.pending);
  expect(unacked.length).toBe(lanes.length);

  server = await startChildServer();
  let replays = 0;
  for (const lane of unacked) {
    const r = await put(server.url, lane);
    expect(r.status, `retry of ${lane.pending!.title}: ${JSON.stringify(r.body)}`).toBe(200);
    expect(r.body.version).toBe(lane.pending!.from + 1);
    if (r.headers.get('idempotent-replay') === 'true') replays++;
    lane.acked = r.body.version;
    lane.pending = null;
  }
  console.log(`[faults] ${lanes.reduce((n, l) => n + l.sent, 0)} saves sent, ${unacked.length} unacknowledged at kill -9, ${replays} of them had committed (answered from their receipt)`);
  for (const [i, lane] of lanes.entries()) {
    const d = await new Client(server.url, c.address).request('GET', `/api/setups/${lane.id}`, undefined, { cookie: cookieOf(c) });
    // Every save applied once: the version is one past the number of saves made.
    expect(d.body.version).toBe(lane.sent + 1);
    expect(d.body.title).toBe(`Lane ${i} save ${lane.sent - 1}`);
  }
}, 120_000);

function cookieOf(c: Client): string {
  return [...(c as unknown as { cookies: Map<string, string> }).cookies].map(([k, v]) => `${k}=${v}`).join('; ');
}
