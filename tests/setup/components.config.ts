// The `components` vitest project: the app's components rendered as users get them, the web flavour
// (react-native-web into a jsdom document), with @testing-library/react. How modules resolve is explained in
// rn-require.ts (Metro's web resolution for library code), vite-plugin-react-native.ts (react-native is
// react-native-web in tests and app code) and components.setup.ts.
import { join } from 'node:path';
import type { TestProjectInlineConfiguration } from 'vitest/config';
import { reactNativeBridge } from './vite-plugin-react-native';

export const componentsProject: TestProjectInlineConfiguration = {
  plugins: [reactNativeBridge()],
  // The app's own platform files as Metro picks them for the web: `X.web.tsx` before `X.tsx`.
  resolve: {
    extensions: ['.web.tsx', '.web.ts', '.web.js', '.tsx', '.ts', '.mjs', '.js', '.jsx', '.json'],
    // The share chunk's entry evaluates its modules in steps with `require`, which cannot load our TypeScript
    // here: tests get the same two exports imported together (components/shareScreenTogether.ts).
    alias: [{ find: /^(?:\.\.?\/)+(?:components\/)?shareScreen$/, replacement: join(__dirname, '..', '..', 'components', 'shareScreenTogether.ts') }],
  },
  test: {
    name: 'components',
    include: ['tests/components/**/*.test.tsx'],
    environment: 'jsdom',
    // Generous for a loaded 2-core machine: a screen that loads the plan screens' chunk imports it cold.
    testTimeout: 30_000,
    globals: true,
    setupFiles: ['tests/setup/components.setup.ts'],
    // One worker for all files, without a fresh process per file: react-native-web, expo-router and their
    // libraries then load once per run instead of once per file. The setup gives every file fresh app
    // modules (vi.resetModules) and a clean document.
    isolate: false,
    fileParallelism: false,
    env: { NODE_ENV: 'test' },
    server: {
      deps: {
        // Loaded by Node itself, so that their `require('react-dom')`, `require('react')` share one module
        // cache (one React, one react-dom) with react-native-web and the libraries.
        external: [/[\\/]node_modules[\\/]@testing-library[\\/]/],
      },
    },
  },
};
