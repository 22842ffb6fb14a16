// Starts the real server (Express + better-auth) on a free loopback port against the test database, serving the built web app (dist/).
import type { TestProject } from 'vitest/node';
import { startServer } from '../../server/main';
import { TEST_DATABASE_URL } from '../support/env';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
  }
}

export default async function setup(project: TestProject) {
  const server = await startServer({ databaseUrl: TEST_DATABASE_URL, port: 0, logLevel: 'error', webDir: undefined });
  project.provide('baseUrl', server.url);
  return () => server.close();
}
