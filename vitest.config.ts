// Four test projects, run in this order by scripts/test.mjs (npm test):
//   unit        pure TypeScript: calc/, model/, server and db helpers (no React Native)
//   components  React Native components under @testing-library/react-native (see tests/setup/)
//   api         the Express app over real HTTP against the real PostgreSQL test database
//   e2e         the built web app in Debian's Chromium, driven by playwright-core
import { defineConfig } from 'vitest/config';
import { componentsProject } from './tests/setup/components.config';

export default defineConfig({
  test: {
    projects: [
      { test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node' } },
      componentsProject,
      {
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/api/global-setup.ts'],
          testTimeout: 30_000,
          hookTimeout: 30_000,
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
        },
      },
    ],
  },
});
