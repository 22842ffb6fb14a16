// vitest setup file of the `components` project: library code resolves as Metro resolves it for the web
// (rn-require.ts), the testing library's matchers go on `expect`, and every test ends unmounted.
import { afterAll, afterEach, expect, vi } from 'vitest';
import { installRequireHooks, requireFromRoot } from './rn-require';

installRequireHooks();

// What Metro defines for a development web build.
(globalThis as { __DEV__?: boolean }).__DEV__ = true;

// React's act() environment flag, as @testing-library/react sets it when it can see a global afterEach.
(globalThis as { IS_REACT_ACT_ENVIRONMENT?: boolean }).IS_REACT_ACT_ENVIRONMENT = true;

// Pointer capture, which every browser has and jsdom lacks (gesture handler's web side captures the pointer
// on pointerdown): a capture that keeps nothing, since jsdom dispatches events to their target anyway.
const proto = Element.prototype as Element & Partial<Pick<Element, 'setPointerCapture' | 'releasePointerCapture' | 'hasPointerCapture'>>;
proto.setPointerCapture ??= () => {};
proto.releasePointerCapture ??= () => {};
proto.hasPointerCapture ??= () => false;

// The testing library looks for a global `jest` to tell whether fake timers are on (waitFor and findBy*
// then advance them instead of waiting for real time): give it vitest's.
(globalThis as { jest?: unknown }).jest = { advanceTimersByTime: (ms: number) => vi.advanceTimersByTime(ms) };

// Loaded through Node (components.config.ts makes @testing-library external), so they share react-dom with
// react-native-web. Node caches them for the worker; cleanup is registered for every file here.
const rtl = requireFromRoot('@testing-library/react') as typeof import('@testing-library/react');
const matchers = requireFromRoot('@testing-library/jest-dom/matchers') as typeof import('@testing-library/jest-dom/matchers');
expect.extend(matchers);
// findBy*/waitFor poll up to 15 s (not 1 s): a screen that loads the plan screens' chunk on demand
// (components/workspace.ts) imports it cold in a test, which takes seconds on a loaded 2-core machine.
rtl.configure({ asyncUtilTimeout: 15_000 });

afterEach(() => {
  rtl.cleanup();
});
// Test files share one worker without isolation (components.config.ts), so that the libraries load once.
// Node's cache stays; vite's registry of app and test modules is emptied for every file, so each file
// imports the app afresh and its `vi.mock` calls apply to everything it imports.
vi.resetModules();
// Fake timers left on would stall the next file.
afterAll(() => {
  vi.useRealTimers();
});
