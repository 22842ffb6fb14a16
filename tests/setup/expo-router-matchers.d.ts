// Types for the matchers expo-router's testing library adds to `expect` (it ships them untyped). The
// testing library's own matchers need nothing here: they extend `jest.Matchers`, which vitest's
// `Assertion` already includes.
import 'vitest';

declare module 'vitest' {
  // Same type parameter as vitest's own declaration, which this one merges into.
  interface Assertion<T = any> {
    toHavePathname(pathname: string): void;
    toHavePathnameWithParams(pathnameWithParams: string): void;
    toHaveSegments(segments: string[]): void;
    toHaveSearchParams(params: Record<string, string | string[]>): void;
    toHaveRouterState(state: unknown): void;
  }
}
