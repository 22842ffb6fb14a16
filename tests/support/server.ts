// The real server for a test project: Express + better-auth on a free loopback port against the test
// database, with the fake SMTP (mail read back at /dev/inbox.json) and a fake S3 in a temp dir.
import httpProxy from 'http-proxy';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { TestProject } from 'vitest/node';
import { fakeServices, startFakes } from '../../server/fakes';
import { startServer } from '../../server/main';
import { startChildServer } from './child';
import { TEST_DATABASE_URL } from './env';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
    /** The fake S3 the server stores photos in (tests look in the bucket). */
    s3: { endpoint: string; bucket: string };
    /** The API tests' two server processes' own addresses (baseUrl is the proxy in front of both). */
    instances: string[];
  }
}

/**
 * Start it and hand its address to the tests; returns the teardown. `web` also serves the built app.
 * `instances: 2` starts two servers on the one database behind a round-robin loopback proxy (http-proxy), as
 * several machines behind a load balancer would be: every test then talks to both.
 */
export async function provideTestServer(project: TestProject, { web, instances = 1 }: { web: boolean; instances?: number }) {
  const s3Dir = mkdtempSync(join(tmpdir(), 'falloff-s3-'));
  const fakes = await startFakes({ s3Dir });
  const server = await startServer({ databaseUrl: TEST_DATABASE_URL, port: 0, logLevel: 'error', webDir: web ? undefined : null, ...fakeServices(fakes) });
  // The second one in a process of its own (nothing in one module's memory is shared with it).
  const second = instances > 1 ? await startChildServer({ FALLOFF_TEST_SMTP_PORT: String(fakes.smtp.port), FALLOFF_TEST_S3_ENDPOINT: fakes.s3.endpoint, FALLOFF_TEST_S3_BUCKET: fakes.s3.bucket }) : null;
  const urls = [server.url, ...(second ? [second.url] : [])];
  // /dev/inbox (the fake mail server's inbox) lives in this process: the proxy sends it to the first.
  const proxy = second ? await startProxy(urls, (path) => (path.startsWith('/dev/') ? server.url : null)) : null;
  project.provide('baseUrl', proxy?.url ?? server.url);
  project.provide('instances', urls);
  project.provide('s3', fakes.s3);
  return async () => {
    await proxy?.close();
    await second?.stop();
    await server.close();
    await fakes.close();
    rmSync(s3Dir, { recursive: true, force: true });
  };
}

/** A loopback round-robin proxy (http-proxy) that adds X-Forwarded-For as a real one would. */
export async function startProxy(targets: string[], pinned: (path: string) => string | null) {
  const proxy = httpProxy.createProxyServer({ xfwd: true });
  proxy.on('error', (_err, _req, res) => {
    const r = res as ServerResponse;
    if (!r.headersSent) r.writeHead(502, { 'content-type': 'application/json' });
    r.end(JSON.stringify({ error: { code: 'bad_gateway', message: 'the instance did not answer' } }));
  });
  let next = 0;
  const server = createServer((req, res) => proxy.web(req, res, { target: pinned(req.url ?? '/') ?? targets[next++ % targets.length] }));
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', () => r()));
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    close: async () => {
      server.closeAllConnections();
      await new Promise<void>((r) => server.close(() => r()));
      proxy.close();
    },
  };
}
