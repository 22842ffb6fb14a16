import { describe, expect, it } from 'vitest';
import { safeNext } from '../../../hooks/safeNext';

describe('the return path after signing in', () => {
  it.each([
    ['/setups/abc', '/setups/abc'],
    ['/invite/xyz?x=1', '/invite/xyz?x=1'],
    [undefined, '/setups'],
    ['https://elsewhere.test/', '/setups'],
    ['//elsewhere.test/x', '/setups'],
    ['/\\elsewhere.test', '/setups'],
    ['/sign-in', '/setups'],
  ])('%s → %s', (next, want) => expect(safeNext(next)).toBe(want));
});
