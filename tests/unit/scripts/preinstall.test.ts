// `npm start` and `npm test` on a fresh clone run scripts/ensure.mjs before node_modules exists: it installs the
// packages itself. So ensure.mjs and every file it imports at load time may import only Node's own modules and
// other local files; a package may only be imported dynamically, after the install step.
// (A top-level import of subset-font from scripts/webfonts.mjs once stopped a clean clone's CI run in 1 s.)
import { readFileSync } from 'node:fs';
import { builtinModules } from 'node:module';
import { dirname, join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = resolve(__dirname, '../../..');
const builtins = new Set(builtinModules);

/** Static import specifiers of one ES module (import … from '…', import '…', export … from '…'). */
function staticImports(source: string): string[] {
  const out: string[] = [];
  const re = /^\s*(?:import|export)\s+(?:[^'"()]*?\s+from\s+)?['"]([^'"]+)['"]/gm;
  for (const m of source.matchAll(re)) if (m[1]) out.push(m[1]);
  return out;
}

function loadTimeGraph(entry: string): { files: string[]; packages: string[] } {
  const seen = new Set<string>();
  const packages: string[] = [];
  const walk = (file: string) => {
    if (seen.has(file)) return;
    seen.add(file);
    for (const spec of staticImports(readFileSync(file, 'utf8'))) {
      if (spec.startsWith('.')) walk(join(dirname(file), spec));
      else if (!spec.startsWith('node:') && !builtins.has(spec)) packages.push(`${file.slice(ROOT.length + 1)} → ${spec}`);
    }
  };
  walk(entry);
  return { files: [...seen], packages };
}

describe('the set-up script runs before the packages are installed', () => {
  it('finds a top-level package import (the check can fail)', () => {
    expect(staticImports("import { x } from 'subset-font';\nimport './a.mjs';\nexport { y } from \"../b.mjs\";\nconst z = await import('sharp');")).toEqual([
      'subset-font',
      './a.mjs',
      '../b.mjs',
    ]);
  });

  it('scripts/ensure.mjs and what it imports at load time use only Node and local files', () => {
    const { files, packages } = loadTimeGraph(join(ROOT, 'scripts/ensure.mjs'));
    expect(files.length).toBeGreaterThan(1);
    expect(packages).toEqual([]);
  });

  it('scripts/lib.mjs (the set-up helpers) is checked the same way', () => {
    const { packages } = loadTimeGraph(join(ROOT, 'scripts/lib.mjs'));
    expect(packages).toEqual([]);
  });
});
