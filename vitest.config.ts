// Four test projects, run in this order by scripts/test.mjs (npm test):
//   unit        pure TypeScript: calc/, model/, server and db helpers (no React Native)
//   components  the app's components as the web build renders them (react-native-web in jsdom), queried with
//               @testing-library/react by role, label, text and data-testid (see tests/setup/README.md)
//   api         the Express app over real HTTP against the real PostgreSQL test database
//   e2e         the built web app in Debian's Chromium, driven by playwright-core
//   faults      servers in their own processes while PostgreSQL or the mail server stops (one file at a time,
//               in a phase of its own: it stops the test cluster)
import { defineConfig } from 'vitest/config';
import { componentsProject } from './tests/setup/components.config';

export default defineConfig({
  test: {
    projects: [
      // 20 s a test: the suite must pass on a loaded 2-core machine (speed is measured in benches, not here).
      { test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node', testTimeout: 20_000 } },
      componentsProject,
      {
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/api/global-setup.ts'],
          // Generous: sign-in bursts hash passwords and the concurrency tests queue on the pool; on a loaded
          // 2-core machine they take several times what they take on a quiet one.
          testTimeout: 90_000,
          hookTimeout: 60_000,
        },
      },
      {
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/e2e/global-setup.ts'],
          testTimeout: 120_000,
          hookTimeout: 60_000,
          fileParallelism: false,
          // A browser wait polls with a generous timeout: the suite must pass on a loaded 2-core machine (a
          // redirect once took over a second at load 5; vitest's default poll gives up after one).
          expect: { poll: { timeout: 30_000, interval: 100 } },
        },
      },
      {
        test: {
          name: 'faults',
          include: ['tests/faults/**/*.test.ts'],
          environment: 'node',
          testTimeout: 120_000,
          hookTimeout: 90_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
