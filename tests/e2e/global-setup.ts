// The browser tests open the real server, which also serves the built web app (dist/).
import type { TestProject } from 'vitest/node';
import { provideTestServer } from '../support/server';

export default (project: TestProject) => provideTestServer(project, { web: true });
