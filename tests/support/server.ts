// The real server for a test project: Express + better-auth on a free loopback port against the test
// database, with the fake SMTP (mail read back at /dev/inbox.json) and a fake S3 in a temp dir.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { TestProject } from 'vitest/node';
import { fakeServices, startFakes } from '../../server/fakes';
import { startServer } from '../../server/main';
import { TEST_DATABASE_URL } from './env';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
    /** The fake S3 the server stores photos in (tests look in the bucket). */
    s3: { endpoint: string; bucket: string };
  }
}

/** Start it and hand its address to the tests; returns the teardown. `web` also serves the built app. */
export async function provideTestServer(project: TestProject, { web }: { web: boolean }) {
  const s3Dir = mkdtempSync(join(tmpdir(), 'falloff-s3-'));
  const fakes = await startFakes({ s3Dir });
  const server = await startServer({ databaseUrl: TEST_DATABASE_URL, port: 0, logLevel: 'error', webDir: web ? undefined : null, ...fakeServices(fakes) });
  project.provide('baseUrl', server.url);
  project.provide('s3', fakes.s3);
  return async () => {
    await server.close();
    await fakes.close();
    rmSync(s3Dir, { recursive: true, force: true });
  };
}
