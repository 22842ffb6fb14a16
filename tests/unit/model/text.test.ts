// The text rules' length caps: the message names the cap with its digits grouped, and building a cap costs no
// Intl formatter (the document model builds hundreds on import, at the start of every page that parses one).
import { afterEach, describe, expect, it, vi } from 'vitest';
import { multiLine, oneLine, plainQuery } from '../../../model/text';

afterEach(() => vi.restoreAllMocks());

describe('length caps', () => {
  it('say the cap with its digits in groups of three', () => {
    expect(oneLine({ max: 20000 }).safeParse('x'.repeat(20001)).error?.issues[0]?.message).toBe('at most 20 000 characters');
    expect(multiLine({ max: 1234567 }).safeParse('x'.repeat(1234568)).error?.issues[0]?.message).toBe('at most 1 234 567 characters');
    expect(plainQuery(80).safeParse('x'.repeat(81)).error?.issues[0]?.message).toBe('at most 80 characters');
    expect(oneLine({ max: 999 }).safeParse('x'.repeat(1000)).error?.issues[0]?.message).toBe('at most 999 characters');
    expect(oneLine({ max: 1000 }).safeParse('x'.repeat(1001)).error?.issues[0]?.message).toBe('at most 1 000 characters');
  });

  it('are built without a locale formatter', () => {
    const locale = vi.spyOn(Number.prototype, 'toLocaleString');
    const format = vi.spyOn(Intl, 'NumberFormat');
    for (let i = 0; i < 50; i++) {
      oneLine({ max: 200 + i });
      multiLine({ max: 20000 + i });
      plainQuery(80 + i);
    }
    expect(locale).not.toHaveBeenCalled();
    expect(format).not.toHaveBeenCalled();
  });
});
