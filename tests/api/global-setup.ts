// The API tests talk to the real server over HTTP (no web app served).
import type { TestProject } from 'vitest/node';
import { provideTestServer } from '../support/server';

export default (project: TestProject) => provideTestServer(project, { web: false });
