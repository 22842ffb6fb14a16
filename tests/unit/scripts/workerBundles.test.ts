// scripts/workerBundles.mjs: the Web Workers are bundled with the pages' zod stand-ins (metro.config.js), so a
// worker does not carry zod's table of every language's messages nor its JSON Schema conversion.
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { bundleWorker } from '../../../scripts/workerBundles.mjs';

const root = join(__dirname, '..', '..', '..');
const out = mkdtempSync(join(tmpdir(), 'falloff-workers-'));
afterAll(() => rmSync(out, { recursive: true, force: true }));

describe('the meter worker bundle', () => {
  it('has zod without its other languages or its JSON Schema conversion, and is a third of the plain bundle', async () => {
    const bytes = await bundleWorker({ root, entry: 'canvas/meter/worker.ts', outfile: join(out, 'meter.js') });
    const js = readFileSync(join(out, 'meter.js'), 'utf8');
    // zod itself is there (the document's schemas), with its English messages.
    expect(js).toMatch(/Invalid input/);
    // Not the German table (one of the languages in zod's locales), nor the JSON Schema generator's own words.
    expect(js).not.toMatch(/Ungültige Eingabe/);
    expect(js).toContain("is not part of the web build");
    // 612 KB before the stand-ins.
    expect(bytes).toBeLessThan(400 * 1024);
  });
});
