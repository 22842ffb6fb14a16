// The red-team figures, measured by the tests that produce them (fuzz, faults) and written together to
// tests/.artifacts/redteam.md: each test records its own figure; the file is rewritten from all recorded so
// far, so it is complete after a whole `npm test` whatever order the files ran in.
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

const dir = join(__dirname, '..', '.artifacts');
const store = join(dir, 'redteam.json');

const ORDER = ['wrongPasswords', 'fuzz', 'uploadMemory', 'exportLatency', 'dbRecovery'] as const;
export type Figure = (typeof ORDER)[number];
const TITLE: Record<Figure, string> = {
  wrongPasswords: 'Wrong passwords accepted per minute (one account)',
  fuzz: '5xx out of a fresh fuzz of every route',
  uploadMemory: 'Memory growth under four big uploads',
  exportLatency: 'A small request’s latency during eight big exports',
  dbRecovery: 'Seconds to recover from a database restart',
};

export function recordFigure(key: Figure, value: string, how: string) {
  mkdirSync(dir, { recursive: true });
  const all: Partial<Record<Figure, { value: string; how: string; at: string }>> = existsSync(store) ? JSON.parse(readFileSync(store, 'utf8')) : {};
  all[key] = { value, how, at: new Date().toISOString() };
  writeFileSync(store, JSON.stringify(all, null, 2));
  const lines = ['# Red-team figures, re-measured', '', 'Written by the tests that measure them (tests/support/redteam.ts); a row missing below was not run.', '', '| figure | measured | how | when (UTC) |', '| --- | --- | --- | --- |'];
  for (const k of ORDER) {
    const f = all[k];
    lines.push(`| ${TITLE[k]} | ${f ? f.value : '(not run)'} | ${f ? f.how : ''} | ${f ? f.at.slice(0, 16).replace('T', ' ') : ''} |`);
  }
  writeFileSync(join(dir, 'redteam.md'), lines.join('\n') + '\n');
  console.log(`[redteam] ${TITLE[key]}: ${value}`);
}
