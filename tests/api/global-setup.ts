// The API tests talk to the real server over HTTP (no web app served).
import type { TestProject } from 'vitest/node';
import { provideTestServer } from '../support/server';

// Comment e-mails wait a moment to be grouped and then hold off for a gap; short here so tests see both.
process.env.COMMENT_DIGEST_DELAY_MS ??= '600';
process.env.COMMENT_DIGEST_GAP_MS ??= '12000'; // long enough that a loaded machine stays inside it (tests/api/comments.test.ts)

export default (project: TestProject) => provideTestServer(project, { web: false });
