// The page's worker client: replies go to the request that asked, a failing reply rejects only its own
// request, and without a worker (or after a worker error) the job runs in the page.
import { describe, expect, it } from 'vitest';
import { workerClient } from '../../../canvas/workerClient';

type Req = { n: number };
type Reply = { id: number; value: number; bad?: boolean };

/** A stand-in Worker: records posted messages; the test answers them by hand. */
class FakeWorker {
  posted: { id: number; n: number }[] = [];
  terminated = false;
  onmessage: ((e: MessageEvent<Reply>) => void) | null = null;
  onerror: ((e: ErrorEvent) => void) | null = null;
  postMessage(m: { id: number; n: number }) {
    this.posted.push(m);
  }
  terminate() {
    this.terminated = true;
  }
  reply(r: Reply) {
    this.onmessage?.({ data: r } as MessageEvent<Reply>);
  }
  fail() {
    this.onerror?.({ preventDefault() {} } as ErrorEvent);
  }
}

function client(fake: FakeWorker | null, inline = (r: Req) => r.n * 10) {
  return workerClient<Req, number, Reply>({
    url: '/workers/test.js',
    name: 'test',
    inline,
    toMessage: (r, id) => ({ id, n: r.n }),
    replyId: (r) => r.id,
    fromReply: (r) => {
      if (r.bad) throw new Error(`bad reply ${r.id}`);
      return r.value;
    },
    create: () => {
      if (!fake) throw new Error('no worker bundle');
      return fake as unknown as Worker;
    },
  });
}

describe('workerClient', () => {
  it('answers each request with the reply of its own id, in any order', async () => {
    const w = new FakeWorker();
    const c = client(w);
    expect(c.kind).toBe('worker');
    const a = c.run({ n: 1 });
    const b = c.run({ n: 2 });
    expect(w.posted.map((m) => m.n)).toEqual([1, 2]);
    w.reply({ id: w.posted[1]!.id, value: 22 });
    w.reply({ id: w.posted[0]!.id, value: 11 });
    await expect(a).resolves.toBe(11);
    await expect(b).resolves.toBe(22);
  });

  it('a reply that cannot be read rejects its own request only', async () => {
    const w = new FakeWorker();
    const c = client(w);
    const a = c.run({ n: 1 });
    const b = c.run({ n: 2 });
    w.reply({ id: w.posted[0]!.id, value: 0, bad: true });
    w.reply({ id: w.posted[1]!.id, value: 22 });
    await expect(a).rejects.toThrow(`bad reply ${w.posted[0]!.id}`);
    await expect(b).resolves.toBe(22);
  });

  it('falls back to computing in the page when the worker cannot start', async () => {
    const c = client(null);
    expect(c.kind).toBe('inline');
    await expect(c.run({ n: 4 })).resolves.toBe(40);
  });

  it('a worker error moves the waiting requests, and every later one, to the page; an inline failure rejects that request', async () => {
    const w = new FakeWorker();
    const c = client(w, (r) => {
      if (r.n < 0) throw new Error('negative');
      return r.n * 10;
    });
    const a = c.run({ n: 3 });
    const bad = c.run({ n: -1 });
    w.fail();
    expect(w.terminated).toBe(true);
    expect(c.kind).toBe('inline');
    await expect(a).resolves.toBe(30);
    await expect(bad).rejects.toThrow('negative');
    await expect(c.run({ n: 5 })).resolves.toBe(50);
    expect(w.posted).toHaveLength(2);
  });
});
