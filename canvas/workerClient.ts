// One client for a page's Web Worker: numbered requests, a waiting map, and a fallback that computes in the
// page (after the current task) when the worker cannot start or fails. The meter and the frame both use it.

/** What a client sends and gets back: a request in, a result out. */
export type WorkerClient<Req, Res> = {
  run(req: Req): Promise<Res>;
  dispose(): void;
  readonly kind: 'worker' | 'inline';
};

export type WorkerClientOptions<Req, Res, Reply> = {
  /** Where the worker bundle is served. */
  url: string;
  /** The worker's name (shown in the browser's tools). */
  name: string;
  /** The same job in this thread (the fallback). */
  inline: (req: Req) => Res | Promise<Res>;
  /** The message posted for request `id`. */
  toMessage: (req: Req, id: number) => unknown;
  /** The reply's request id. */
  replyId: (reply: Reply) => number;
  /** The result for a reply to `req`. */
  fromReply: (reply: Reply, req: Req) => Res;
  /** Starts a worker (tests pass a fake); default `new Worker(url, { type: 'module', name })`. */
  create?: (url: string, name: string) => Worker;
};

/** Run the job in this thread after the current task (a drag's event handler never waits for it). */
export function inlineClient<Req, Res>(inline: (req: Req) => Res | Promise<Res>): WorkerClient<Req, Res> {
  return {
    kind: 'inline',
    run: (req) => new Promise<Res>((resolve, reject) => setTimeout(() => Promise.resolve().then(() => inline(req)).then(resolve, reject), 0)),
    dispose: () => {},
  };
}

/**
 * A worker client: posts each request with a new id and resolves its promise with the reply of that id. If the
 * worker cannot start (no Worker, a bundle not served) or reports an error, it is dropped and every waiting
 * request, and every later one, is computed in the page instead.
 */
export function workerClient<Req, Res, Reply>(o: WorkerClientOptions<Req, Res, Reply>): WorkerClient<Req, Res> {
  let worker: Worker | null = null;
  let fallback: WorkerClient<Req, Res> | null = null;
  let nextId = 1;
  const waiting = new Map<number, { req: Req; resolve: (r: Res) => void; reject: (e: unknown) => void }>();
  const toFallback = () => {
    fallback ??= inlineClient(o.inline);
    worker?.terminate();
    worker = null;
    for (const [id, w] of waiting) {
      waiting.delete(id);
      fallback.run(w.req).then(w.resolve, w.reject);
    }
  };
  try {
    if (typeof Worker === 'undefined' && !o.create) throw new Error('no Worker here');
    worker = o.create ? o.create(o.url, o.name) : new Worker(o.url, { type: 'module', name: o.name });
    worker.onmessage = (e: MessageEvent<Reply>) => {
      const id = o.replyId(e.data);
      const w = waiting.get(id);
      if (!w) return;
      waiting.delete(id);
      try {
        w.resolve(o.fromReply(e.data, w.req));
      } catch (err) {
        w.reject(err);
      }
    };
    worker.onerror = (e) => {
      e.preventDefault?.();
      toFallback();
    };
  } catch {
    toFallback();
  }
  return {
    get kind() {
      return worker ? ('worker' as const) : ('inline' as const);
    },
    run(req) {
      if (!worker) return (fallback ??= inlineClient(o.inline)).run(req);
      const id = nextId++;
      return new Promise<Res>((resolve, reject) => {
        waiting.set(id, { req, resolve, reject });
        worker!.postMessage(o.toMessage(req, id));
      });
    },
    dispose() {
      worker?.terminate();
      worker = null;
      fallback?.dispose();
    },
  };
}
