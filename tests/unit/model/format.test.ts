import { describe, expect, it } from 'vitest';
import { count, formatDate, formatDateTime, formatTime, formatWhen, kb } from '../../../model/format';

describe('dates', () => {
  const d = '2026-12-03T14:05:00Z';
  it('writes the month as a word, so day and month never swap', () => {
    expect(formatDate(d, 'en-GB', 'UTC')).toBe('3 Dec 2026');
    expect(formatDate(d, 'en-US', 'UTC')).toBe('Dec 3, 2026');
    expect(formatDate(d, 'en-GB', 'UTC')).not.toMatch(/\d+\/\d+\/\d+/);
  });
  it('adds the time when asked', () => {
    expect(formatDateTime(d, 'en-GB', 'UTC')).toBe('3 Dec 2026, 14:05');
    expect(formatTime(d, 'en-GB', 'UTC')).toBe('14:05');
  });
  it('writes the hour as the locale reads a clock: no padded 12-hour hour, a padded 24-hour one', () => {
    const pm = '2026-12-03T16:18:00Z';
    const am = '2026-12-03T09:05:00Z';
    expect(formatDateTime(pm, 'en-US', 'UTC')).toBe('Dec 3, 2026, 4:18 PM');
    expect(formatTime(am, 'en-US', 'UTC')).toBe('9:05 AM');
    expect(formatDateTime(am, 'en-GB', 'UTC')).toBe('3 Dec 2026, 09:05');
    expect(formatTime(pm, 'en-GB', 'UTC')).toBe('16:18');
  });
  it('says "today" for what happened today in the reader\'s calendar, the full date otherwise', () => {
    const now = '2026-12-03T18:00:00Z';
    expect(formatWhen('2026-12-03T16:18:00Z', { now, locale: 'en-US', timeZone: 'UTC' })).toBe('today, 4:18 PM');
    expect(formatWhen('2026-12-03T16:18:00Z', { now, locale: 'en-GB', timeZone: 'UTC' })).toBe('today, 16:18');
    expect(formatWhen('2026-12-02T23:30:00Z', { now, locale: 'en-GB', timeZone: 'UTC' })).toBe('2 Dec 2026, 23:30');
    // The same instant is "today" in Tokyo (already 4 Dec there) only when the reader's day matches.
    expect(formatWhen('2026-12-03T16:18:00Z', { now, locale: 'en-GB', timeZone: 'Asia/Tokyo' })).toBe('today, 01:18');
    expect(formatWhen('2026-12-03T14:00:00Z', { now, locale: 'en-GB', timeZone: 'Asia/Tokyo' })).toBe('3 Dec 2026, 23:00');
  });
  it('takes a Date, an ISO string or a time in ms alike', () => {
    expect(formatDate(new Date(d), 'en-GB', 'UTC')).toBe(formatDate(Date.parse(d), 'en-GB', 'UTC'));
  });
});

describe('file sizes', () => {
  it.each([
    [0, '1 KB'],
    [300, '1 KB'],
    [1024, '1 KB'],
    [1536, '2 KB'],
    [68_000, '66 KB'],
    [5 * 1024 * 1024, '5120 KB'],
  ])('%i bytes → %s', (n, out) => expect(kb(n)).toBe(out));
  it('is the one copy: the crew downloads and the day sheets use it, nobody divides by 1024 on their own', async () => {
    const { readFileSync } = await import('node:fs');
    const { resolve } = await import('node:path');
    const root = resolve(__dirname, '../../..');
    for (const f of ['components/crew/ExportButtons.tsx', 'components/library/DaySheetBar.tsx']) {
      const src = readFileSync(resolve(root, f), 'utf8');
      expect(src, f).toMatch(/import \{[^}]*\bkb\b[^}]*\} from '\.\.\/\.\.\/model\/format'/);
      expect(src, f).not.toMatch(/\/\s*1024/);
    }
  });
});

describe('counts', () => {
  it.each([
    [0, 'student', '0 students'],
    [1, 'student', '1 student'],
    [2, 'student', '2 students'],
    [1, 'comment', '1 comment'],
    [21, 'comment', '21 comments'],
  ])('%i %s → %s', (n, noun, out) => expect(count(n, noun)).toBe(out));
  it('takes an irregular plural', () => expect(count(3, 'person', 'people')).toBe('3 people'));
});
