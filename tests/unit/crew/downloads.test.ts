// Every file the app saves goes through components/crew/download.ts (progress, the server's error message, the
// file name from Content-Disposition): no screen builds its own link with `download`.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = resolve(__dirname, '../../..');
const sources = (dir: string): string[] =>
  readdirSync(dir).flatMap((n) => {
    const p = join(dir, n);
    return statSync(p).isDirectory() ? sources(p) : /\.(ts|tsx)$/.test(n) ? [p] : [];
  });

describe('downloads in the client', () => {
  it('are saved only by components/crew/download.ts', () => {
    const own = ['components', 'app', 'hooks'].flatMap((d) => sources(join(ROOT, d))).filter((p) => /\.download\s*=/.test(readFileSync(p, 'utf8')));
    expect(own.map((p) => relative(ROOT, p))).toEqual(['components/crew/download.ts']);
  });

  it('the day sheets are one of them', () => {
    const bar = readFileSync(join(ROOT, 'components/library/DaySheetBar.tsx'), 'utf8');
    expect(bar).toMatch(/from '\.\.\/crew\/download'/);
    expect(bar).toMatch(/downloadWithProgress\(/);
  });
});
