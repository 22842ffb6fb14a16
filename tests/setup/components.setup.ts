// vitest setup file of the `components` project: makes React Native loadable under Node, then runs the
// same setup Jest users get from React Native and gesture handler.

import './worker-env';
import { afterAll, afterEach, vi } from 'vitest';
import { installExpoEnvironment } from './expo-env';
import { installJestShim } from './jest-shim';
import { installRequireHooks, requireFromRoot } from './rn-require';

installRequireHooks();
installJestShim();

// React Native's jest setup: globals (__DEV__, requestAnimationFrame, …) and mocks of the native
// components and modules. Idempotent per worker: its effects live in Node's module cache and globals,
// which outlive one test file when the project runs without isolation.
requireFromRoot('@react-native/jest-preset/jest/setup.js');
// Gesture handler's mocks of its native module and buttons; must come after React Native's setup.
requireFromRoot('react-native-gesture-handler/jestSetup.js');
// What Expo's packages expect of their native runtime (see there).
installExpoEnvironment();

// The testing library registers its unmount-after-each-test hook when it is first loaded, i.e. in the
// first test file of a worker only, since Node caches the module (worker-env.ts turns that off); register
// the same hook for every test file instead. Loading it here also adds its matchers to `expect`.
const rntl = requireFromRoot('@testing-library/react-native') as typeof import('@testing-library/react-native');
// findBy*/waitFor poll up to 15 s (not 1 s): a screen that loads the plan screens' chunk on demand
// (components/workspace.ts) imports it cold in a test, which takes seconds on a loaded 2-core machine.
rntl.configure({ asyncUtilTimeout: 15_000 });
// Taken now, before a test can install fake timers (expo-router's renderRouter always does).
const realSetImmediate = setImmediate;
afterEach(async () => {
  await new Promise((resolve) => realSetImmediate(resolve));
  await rntl.cleanupAsync();
});
// Test files share one worker without isolation (components.config.ts), so that React Native loads once.
// That cache is Node's and stays; vite's registry of app and test modules is emptied for every file, so
// each file imports the app afresh and its `vi.mock` calls apply to everything it imports.
vi.resetModules();
// And fake timers left on would stall the next file.
afterAll(() => {
  vi.useRealTimers();
});
