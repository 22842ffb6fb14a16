// The `components` vitest project: React Native components rendered with @testing-library/react-native
// (react-test-renderer underneath) in Node. How React Native gets loaded is explained in
// components.setup.ts, rn-require.ts, rn-babel.ts, vite-plugin-react-native.ts and vite-plugin-worklets.ts.
import type { TestProjectInlineConfiguration } from 'vitest/config';
import { reactNativeBridge } from './vite-plugin-react-native';
import { workletsTransform } from './vite-plugin-worklets';

export const componentsProject: TestProjectInlineConfiguration = {
  plugins: [reactNativeBridge(), workletsTransform()],
  test: {
    name: 'components',
    include: ['tests/components/**/*.test.tsx'],
    environment: 'node',
    // Generous for a loaded 2-core machine: a screen that loads the plan screens' chunk imports it cold.
    testTimeout: 30_000,
    // The testing library extends a global `expect` and registers hooks through the global `afterEach`.
    globals: true,
    setupFiles: ['tests/setup/components.setup.ts'],
    // One worker for all files, without a fresh process per file: React Native and its libraries (about a
    // thousand modules) then load once per run instead of once per file, and a cold run transforms each
    // file once instead of once per worker. The setup gives every file fresh app modules (vi.resetModules).
    isolate: false,
    fileParallelism: false,
    env: { NODE_ENV: 'test' },
    server: {
      deps: {
        // Loaded by Node itself, so that its `require('react-native')` goes through rn-require.ts and
        // shares one module cache (one React, one React Native) with everything else.
        external: [/[\\/]node_modules[\\/]@testing-library[\\/]/],
      },
    },
  },
};
