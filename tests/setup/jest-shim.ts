// The smallest `jest` object that React Native's jest setup, its mocks and gesture handler's jestSetup.js
// need, built on vitest's `vi`. Each transformed module gets one bound to itself (rn-babel.ts injects
// `const jest = globalThis.__falloffJestFor(module)`), so relative paths in `jest.mock` and
// `jest.requireActual` resolve from the calling file, as Jest resolves them. A root-bound one is also
// global, because some libraries (the testing library among them) look for `jest` to detect fake timers.
import { vi } from 'vitest';
import { registerMock, requireActual } from './rn-require';

type NodeModule = Parameters<typeof registerMock>[0];

/** What Jest's automock gives for a module mocked without a factory: its shape, with every function a mock. */
function automock(real: unknown, depth = 0): unknown {
  if (typeof real === 'function') return vi.fn();
  if (real === null || typeof real !== 'object' || depth > 2) return real;
  const out: Record<string, unknown> = {};
  for (const key of Object.keys(real)) out[key] = automock((real as Record<string, unknown>)[key], depth + 1);
  return out;
}

function jestFor(from: NodeModule) {
  return {
    fn: vi.fn,
    spyOn: vi.spyOn,
    isMockFunction: vi.isMockFunction,
    /** Jest's clock: fake when fake timers are on, as vitest's Date is then. */
    now: () => Date.now(),
    mock(request: string, factory?: () => unknown): void {
      registerMock(from, request, factory ?? (() => automock(requireActual(from, request))));
    },
    requireActual: (request: string): unknown => requireActual(from, request),
    // The testing library takes `setTimeout.clock` plus a working `getRealSystemTime` to mean "modern
    // fake timers are on" (vi.useFakeTimers), and then drives them through `advanceTimersByTime`;
    // reanimated's test helpers and expo-router's renderRouter use the rest.
    getRealSystemTime: () => vi.getRealSystemTime(),
    advanceTimersByTime: (ms: number) => vi.advanceTimersByTime(ms),
    runAllTimers: () => vi.runAllTimers(),
    runOnlyPendingTimers: () => vi.runOnlyPendingTimers(),
    useFakeTimers: () => vi.useFakeTimers(),
    useRealTimers: () => vi.useRealTimers(),
    setSystemTime: (now: number | Date) => vi.setSystemTime(now),
  };
}

export type JestShim = ReturnType<typeof jestFor>;

export function installJestShim(): void {
  const g = globalThis as typeof globalThis & { __falloffJestFor?: (m: NodeModule) => JestShim; jest?: JestShim };
  if (g.__falloffJestFor) return;
  g.__falloffJestFor = jestFor;
  g.jest = jestFor(undefined);
}
