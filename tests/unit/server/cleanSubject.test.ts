// Mail subjects as one clean line (server/mail/queue.ts, cleanSubject): what a header injection, a reversed
// title or a novel-length name would need is taken out before a message is queued.
import { describe, expect, it } from 'vitest';
import { cleanSubject, SUBJECT_MAX } from '../../../server/mail/queue';

describe('cleanSubject', () => {
  it('folds line breaks and other control characters into single spaces, so the subject stays one header line', () => {
    expect(cleanSubject('Join Harbour\r\nBcc: everyone@example.test')).toBe('Join Harbour Bcc: everyone@example.test');
    expect(cleanSubject('Crew sheet:\tNight\u0000rims\u0007\u007f\u0085end')).toBe('Crew sheet: Night rims end');
    expect(cleanSubject('one\u2028two\u2029three')).toBe('one two three');
    expect(cleanSubject('a\n\n\n   b')).toBe('a b');
  });

  it('removes bidi controls and direction marks, so a title cannot read backwards', () => {
    expect(cleanSubject('Crew sheet: \u202efdp.exe\u202c portrait')).toBe('Crew sheet: fdp.exe portrait');
    expect(cleanSubject('\u2066Join\u2069 \u2067Studio\u2069 \u200e\u200f\u061con Falloff')).toBe('Join Studio on Falloff');
  });

  it('trims, and caps the length at whole characters with an ellipsis', () => {
    expect(cleanSubject('   Reset your Falloff password  \r\n')).toBe('Reset your Falloff password');
    const long = cleanSubject(`Join ${'x'.repeat(100_000)} on Falloff`);
    expect(Array.from(long)).toHaveLength(SUBJECT_MAX);
    expect(long.endsWith('…')).toBe(true);
    // An emoji (two UTF-16 units) at the cut is kept whole or dropped, never halved.
    const emoji = cleanSubject('📸'.repeat(SUBJECT_MAX + 10));
    expect(emoji.isWellFormed()).toBe(true);
    expect(Array.from(emoji)).toHaveLength(SUBJECT_MAX);
    expect(cleanSubject('Broken \ud800 half')).toBe('Broken \ufffd half');
  });

  it('leaves an ordinary subject as it is', () => {
    for (const s of ['Crew sheet: Clamshell, 2 lights', '3 new comments on Harbour rims', 'Join Studio Ünd Söhne on Falloff']) expect(cleanSubject(s)).toBe(s);
  });
});
