import { describe, expect, it } from 'vitest';
import { count, formatDate, formatDateTime, formatTime } from '../../../model/format';

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
  it('takes a Date, an ISO string or a time in ms alike', () => {
    expect(formatDate(new Date(d), 'en-GB', 'UTC')).toBe(formatDate(Date.parse(d), 'en-GB', 'UTC'));
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
