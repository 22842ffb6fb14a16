// Due dates typed as a day, or a day and a time, in the reader's time zone; impossible and past days refused.
import { describe, expect, it } from 'vitest';
import { dueDateText, parseDueDate } from '../../../model/dueDate';

const now = new Date(2026, 11, 3, 15, 0); // 3 Dec 2026, 15:00 local

describe('parseDueDate', () => {
  it.each([
    ['', null],
    ['  ', null],
    ['2027-03-01', new Date(2027, 2, 1, 23, 59).toISOString()],
    ['2027-03-01 18:00', new Date(2027, 2, 1, 18, 0).toISOString()],
    ['2027-3-1T08:30', new Date(2027, 2, 1, 8, 30).toISOString()],
    ['2026-12-03', new Date(2026, 11, 3, 23, 59).toISOString()],
  ])('reads %j', (text, value) => {
    expect(parseDueDate(text, now)).toEqual({ ok: true, value });
  });

  it.each([
    ['next Friday', /^Not a date this field reads/],
    ['01/03/2027', /^Not a date this field reads/],
    ['2027-02-31', /^No such day or time/],
    ['2027-03-01 25:00', /^No such day or time/],
    ['2026-12-03 14:00', /already past/],
    ['2025-01-01', /already past/],
  ])('refuses %j with a reason', (text, message) => {
    const r = parseDueDate(text, now);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(message);
  });

  it('shows a stored date the way it is typed, and reads it back to the same instant', () => {
    const iso = new Date(2027, 2, 1, 18, 0).toISOString();
    expect(dueDateText(iso)).toBe('2027-03-01 18:00');
    expect(parseDueDate(dueDateText(iso), now)).toEqual({ ok: true, value: iso });
    expect(dueDateText(null)).toBe('');
  });
});
