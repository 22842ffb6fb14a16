// scripts/routePreloads.mjs: which scripts each route of the built app needs (for the server's preloads), read from
// the build's source maps and the route files.
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { routePattern, routePreloads } from '../../../scripts/routePreloads.mjs';

const dir = mkdtempSync(join(tmpdir(), 'falloff-preloads-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('routePattern', () => {
  it('drops groups and index, matches dynamic segments, skips layouts and special files', () => {
    const re = (f: string) => new RegExp(routePattern(f)!);
    expect(re('(app)/setups/index.tsx').test('/setups')).toBe(true);
    expect(re('(app)/setups/index.tsx').test('/setups/abc')).toBe(false);
    expect(re('(app)/setups/[id].tsx').test('/setups/abc')).toBe(true);
    expect(re('(app)/setups/[id].tsx').test('/setups/abc/')).toBe(true);
    expect(re('(app)/setups/[id].tsx').test('/setups/abc/more')).toBe(false);
    expect(re('index.tsx').test('/')).toBe(true);
    expect(re('index.tsx').test('/x')).toBe(false);
    expect(re('(app)/lessons/[id]/edit.tsx').test('/lessons/7/edit')).toBe(true);
    expect(re('docs/[...rest].tsx').test('/docs/a/b')).toBe(true);
    expect(routePattern('(app)/_layout.tsx')).toBeNull();
    expect(routePattern('+not-found.tsx')).toBeNull();
  });
});

describe('routePreloads', () => {
  it('lists the layouts, and apart the route’s chunk and the plan chunks its screen loads, most specific route first', () => {
    const web = join(dir, 'dist');
    const maps = join(dir, 'dist-maps');
    const js = join(web, '_expo', 'static', 'js', 'web');
    mkdirSync(js, { recursive: true });
    mkdirSync(maps, { recursive: true });
    const chunk = (name: string, sources: string[]) => {
      writeFileSync(join(js, name), '');
      writeFileSync(join(maps, `${name}.map`), JSON.stringify({ version: 3, sources, mappings: '' }));
    };
    const route = (file: string, text: string) => {
      mkdirSync(dirname(join(dir, 'app', file)), { recursive: true });
      writeFileSync(join(dir, 'app', file), text);
    };
    chunk('_layout-1.js', ['/app/_layout.tsx']);
    // (A static export puts a route's file after the modules it imports.)
    chunk('_layout-2.js', ['/components/NavShell.tsx', '/app/(app)/_layout.tsx']);
    chunk('shareScreen-3.js', ['/node_modules/zod/index.js', '/components/shareScreen.ts']);
    chunk('workspace-4.js', ['/node_modules/x.js', '/components/workspace.ts']);
    chunk('token-5.js', ['/app/s/[token].tsx']);
    chunk('id-6.js', ['/components/Toast.tsx', '/app/(app)/setups/[id].tsx']);
    chunk('index-7.js', ['/app/(app)/setups/index.tsx']);
    chunk('join-8.js', ['/app/(app)/setups/join.tsx']);
    chunk('entry-9.js', ['/entry.web.js']);
    route('s/[token].tsx', "const S = sharedSetupScreen();\n");
    route('(app)/setups/[id].tsx', "const E = workspaceScreen('EditorScreen');\n");
    route('(app)/setups/index.tsx', 'export default function L() {}\n');
    route('(app)/setups/join.tsx', 'export default function J() {}\n');
    // The share route was rendered at build time (scripts/staticPages.mjs).
    mkdirSync(join(web, 'pages', 's'), { recursive: true });
    writeFileSync(join(web, 'pages', 's', '[token].html'), '<html></html>');
    expect(routePreloads({ root: dir, webDir: web, mapsDir: maps })).toEqual({ routes: 4 });
    const { routes } = JSON.parse(readFileSync(join(web, 'route-preloads.json'), 'utf8')) as { routes: { route: string; pattern: string; files: string[]; later: string[] }[] };
    const u = (n: string) => `/_expo/static/js/web/${n}`;
    const layouts = [u('_layout-1.js'), u('_layout-2.js')];
    const byRoute = Object.fromEntries(routes.map((r) => [r.route, r]));
    expect(byRoute['s/[token].tsx']).toMatchObject({ files: layouts, later: [u('token-5.js'), u('shareScreen-3.js')], page: '/pages/s/[token].html' });
    expect(byRoute['(app)/setups/index.tsx']).not.toHaveProperty('page');
    expect(byRoute['(app)/setups/[id].tsx']).toMatchObject({ files: layouts, later: [u('id-6.js'), u('shareScreen-3.js'), u('workspace-4.js')] });
    expect(byRoute['(app)/setups/index.tsx']).toMatchObject({ files: layouts, later: [u('index-7.js')] });
    // /setups/join is the static route, not /setups/[id]: the first pattern that matches wins.
    expect(routes.find((r) => new RegExp(r.pattern).test('/setups/join'))!.route).toBe('(app)/setups/join.tsx');
    expect(routes.find((r) => new RegExp(r.pattern).test('/setups/abc'))!.route).toBe('(app)/setups/[id].tsx');
  });
});
