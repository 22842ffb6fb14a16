// Where the web build puts shared modules (scripts/chunkTiers.cjs): after Expo's split, the common chunk (every
// page's download) keeps only what a light chunk needs; every other module goes to the chunks that need it,
// but not to one whose parent (a tier's lower chunk, a group's layout) needs it too.
// Fake chunks shaped like Expo's (entries, deps, graph, flags).
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';

const { placeShared } = createRequire(__filename)('../../../scripts/chunkTiers.cjs') as {
  placeShared: (chunks: Set<Chunk>, rules: { tiers?: { lower: string; upper: string }[]; light?: RegExp[]; groups?: string[] }, byPath?: Map<string, Chunk>) => { modules: number; copies: number };
};
const tiers = [{ lower: 'components/shareScreen.ts', upper: 'components/workspace.ts' }];
const rules = { tiers, light: [/\/app\/routes\/sign-in\.tsx$/] };
const layerChunks = (set: Set<Chunk>, _tiers: unknown, byPath?: Map<string, Chunk>) => [placeShared(set, rules, byPath)];

type Mod = { path: string; dependencies: Map<string, { absolutePath: string; data: { data: { asyncType: string | null } } }> };
type Chunk = { name: string; entries: Set<Mod>; deps: Set<Mod>; graph: { dependencies: Map<string, Mod> }; isAsync: boolean; isVendor: boolean; isEntry: boolean; sealed: boolean };

/** A graph from `path: [static deps] | { lazy: [...] }` lines. */
function graphOf(edges: Record<string, { imports?: string[]; lazy?: string[] }>) {
  const dependencies = new Map<string, Mod>();
  for (const path of Object.keys(edges)) dependencies.set(path, { path, dependencies: new Map() });
  for (const [path, { imports = [], lazy = [] }] of Object.entries(edges)) {
    const m = dependencies.get(path)!;
    for (const d of imports) m.dependencies.set(d, { absolutePath: d, data: { data: { asyncType: null } } });
    for (const d of lazy) m.dependencies.set(d, { absolutePath: d, data: { data: { asyncType: 'async' } } });
  }
  return { dependencies };
}

describe('layerChunks', () => {
  const graph = graphOf({
    '/app/entry.js': { imports: ['/app/react.js'], lazy: ['/app/routes/sign-in.tsx', '/app/routes/share.tsx', '/app/routes/editor.tsx'] },
    '/app/react.js': {},
    '/app/routes/sign-in.tsx': { imports: ['/app/forms.ts'] },
    '/app/routes/share.tsx': { lazy: ['/app/components/shareScreen.ts'] },
    '/app/routes/editor.tsx': { imports: ['/app/forms.ts'], lazy: ['/app/components/shareScreen.ts', '/app/components/workspace.ts'] },
    '/app/components/shareScreen.ts': { imports: ['/app/plan.tsx', '/app/react.js'] },
    '/app/components/workspace.ts': { imports: ['/app/editor.tsx', '/app/forms.ts'] },
    '/app/editor.tsx': { imports: ['/app/plan.tsx', '/app/toolbar.tsx'] },
    '/app/plan.tsx': { imports: ['/app/gestures.js'], lazy: ['/app/later.ts'] },
    '/app/gestures.js': {},
    '/app/toolbar.tsx': {},
    '/app/forms.ts': {},
    '/app/later.ts': {},
  });
  const m = (p: string) => graph.dependencies.get(p)!;
  // As Expo leaves them: each lazy chunk without what the entry or common chunk holds.
  const chunk = (name: string, entry: string, deps: string[], flags: Partial<Chunk> = {}): Chunk => ({
    name,
    entries: new Set(entry ? [m(entry)] : []),
    deps: new Set(deps.map(m)),
    graph,
    isAsync: true,
    isVendor: false,
    isEntry: false,
    sealed: false,
    ...flags,
  });
  const build = () => {
    const chunks = {
      entry: chunk('/app/entry.js', '/app/entry.js', ['/app/entry.js', '/app/react.js'], { isAsync: false, isEntry: true }),
      common: chunk('/__common.js', '', ['/app/forms.ts', '/app/plan.tsx', '/app/gestures.js'], { isAsync: false, isVendor: true }),
      signIn: chunk('sign-in', '/app/routes/sign-in.tsx', ['/app/routes/sign-in.tsx']),
      shareRoute: chunk('share', '/app/routes/share.tsx', ['/app/routes/share.tsx']),
      editorRoute: chunk('editor', '/app/routes/editor.tsx', ['/app/routes/editor.tsx']),
      share: chunk('shareScreen', '/app/components/shareScreen.ts', ['/app/components/shareScreen.ts']),
      workspace: chunk('workspace', '/app/components/workspace.ts', ['/app/components/workspace.ts', '/app/editor.tsx', '/app/toolbar.tsx']),
      later: chunk('later', '/app/later.ts', ['/app/later.ts']),
    };
    return { chunks, set: new Set(Object.values(chunks)) };
  };
  const paths = (c: Chunk) => [...c.deps].map((d) => d.path).sort();

  it('moves what only the share screen and the workspace share into the share screen’s chunk', () => {
    const { chunks, set } = build();
    const byPath = new Map<string, Chunk>();
    const moved = layerChunks(set, [{ lower: 'components/shareScreen.ts', upper: 'components/workspace.ts' }], byPath);
    expect(moved[0]!.modules).toBe(2);
    expect(paths(chunks.share)).toEqual(['/app/components/shareScreen.ts', '/app/gestures.js', '/app/plan.tsx']);
    // The forms serve the sign-in page too: they stay where every page gets them.
    expect(paths(chunks.common)).toEqual(['/app/forms.ts']);
    expect(paths(chunks.workspace)).toEqual(['/app/components/workspace.ts', '/app/editor.tsx', '/app/toolbar.tsx']);
    expect(byPath.get('/app/plan.tsx')).toBe(chunks.share);
  });

  it('without the tier, copies a module into each chunk that needs it; without a common chunk, does nothing', () => {
    const { chunks, set } = build();
    // The editor route now draws a plan of its own too.
    graph.dependencies.get('/app/routes/editor.tsx')!.dependencies.set('/app/plan.tsx', { absolutePath: '/app/plan.tsx', data: { data: { asyncType: null } } });
    try {
      expect(placeShared(set, { light: rules.light })).toEqual({ modules: 2, copies: 6 });
      expect(paths(chunks.common)).toEqual(['/app/forms.ts']);
      for (const c of [chunks.share, chunks.editorRoute, chunks.workspace]) expect(paths(c)).toEqual(expect.arrayContaining(['/app/gestures.js', '/app/plan.tsx']));
    } finally {
      graph.dependencies.get('/app/routes/editor.tsx')!.dependencies.delete('/app/plan.tsx');
    }
    const again = build();
    again.set.delete(again.chunks.common);
    expect(placeShared(again.set, rules)).toEqual({ modules: 0, copies: 0 });
  });

  it('gives a group layout what it and its routes need, and its routes none of it', () => {
    const g = graphOf({
      '/app/app/(app)/_layout.tsx': { imports: ['/app/session.ts'] },
      '/app/app/(app)/library.tsx': { imports: ['/app/session.ts', '/app/cards.tsx'] },
      '/app/app/(app)/account.tsx': { imports: ['/app/session.ts', '/app/cards.tsx'] },
      '/app/app/s/[token].tsx': {},
      '/app/session.ts': {},
      '/app/cards.tsx': {},
    });
    const mk = (name: string, entry: string, deps: string[], flags: Partial<Chunk> = {}): Chunk => ({
      name, entries: new Set(entry ? [g.dependencies.get(entry)!] : []), deps: new Set(deps.map((d) => g.dependencies.get(d)!)), graph: g, isAsync: true, isVendor: false, isEntry: false, sealed: false, ...flags,
    });
    const common = mk('/__common.js', '', ['/app/session.ts', '/app/cards.tsx'], { isAsync: false, isVendor: true });
    const layout = mk('layout', '/app/app/(app)/_layout.tsx', ['/app/app/(app)/_layout.tsx']);
    const library = mk('library', '/app/app/(app)/library.tsx', ['/app/app/(app)/library.tsx']);
    const account = mk('account', '/app/app/(app)/account.tsx', ['/app/app/(app)/account.tsx']);
    const share = mk('share', '/app/app/s/[token].tsx', ['/app/app/s/[token].tsx']);
    const moved = placeShared(new Set([common, layout, library, account, share]), { light: [/\/s\/\[token\]\.tsx$/], groups: ['app/(app)/'] });
    expect(moved).toEqual({ modules: 2, copies: 3 });
    expect(common.deps.size).toBe(0);
    expect(paths(layout)).toEqual(['/app/app/(app)/_layout.tsx', '/app/session.ts']);
    expect(paths(library)).toEqual(['/app/app/(app)/library.tsx', '/app/cards.tsx']);
    expect(paths(account)).toEqual(['/app/app/(app)/account.tsx', '/app/cards.tsx']);
  });

  it('keeps common what two group layouts need (every page loads every group layout): one copy, not two', () => {
    const g = graphOf({
      '/app/app/(app)/_layout.tsx': { imports: ['/app/session.ts', '/app/nav.tsx'] },
      '/app/app/(auth)/_layout.tsx': { imports: ['/app/session.ts'] },
      '/app/app/(auth)/sign-in.tsx': { imports: ['/app/session.ts', '/app/forms.ts'] },
      '/app/app/(auth)/sign-up.tsx': { imports: ['/app/forms.ts'] },
      '/app/session.ts': {},
      '/app/nav.tsx': {},
      '/app/forms.ts': {},
    });
    const mk = (name: string, entry: string, deps: string[], flags: Partial<Chunk> = {}): Chunk => ({
      name, entries: new Set(entry ? [g.dependencies.get(entry)!] : []), deps: new Set(deps.map((d) => g.dependencies.get(d)!)), graph: g, isAsync: true, isVendor: false, isEntry: false, sealed: false, ...flags,
    });
    const common = mk('/__common.js', '', ['/app/session.ts', '/app/forms.ts'], { isAsync: false, isVendor: true });
    const appLayout = mk('app-layout', '/app/app/(app)/_layout.tsx', ['/app/app/(app)/_layout.tsx', '/app/nav.tsx']);
    const authLayout = mk('auth-layout', '/app/app/(auth)/_layout.tsx', ['/app/app/(auth)/_layout.tsx']);
    const signIn = mk('sign-in', '/app/app/(auth)/sign-in.tsx', ['/app/app/(auth)/sign-in.tsx']);
    const signUp = mk('sign-up', '/app/app/(auth)/sign-up.tsx', ['/app/app/(auth)/sign-up.tsx']);
    const moved = placeShared(new Set([common, appLayout, authLayout, signIn, signUp]), { groups: ['app/(app)/', 'app/(auth)/'] });
    expect(moved).toEqual({ modules: 1, copies: 2 });
    expect(paths(common)).toEqual(['/app/session.ts']);
    for (const c of [appLayout, authLayout, signIn]) expect(paths(c)).not.toContain('/app/session.ts');
    // What only one group's pages share still goes to those pages, not to every page.
    expect(paths(signIn)).toContain('/app/forms.ts');
    expect(paths(signUp)).toContain('/app/forms.ts');
  });

  it('keeps a module common when a lazy chunk outside the tier also needs it', () => {
    const { chunks, set } = build();
    // The sign-in route starts to draw a plan: the plan must stay where the sign-in page gets it.
    graph.dependencies.get('/app/routes/sign-in.tsx')!.dependencies.set('/app/plan.tsx', { absolutePath: '/app/plan.tsx', data: { data: { asyncType: null } } });
    try {
      layerChunks(set, [{ lower: 'components/shareScreen.ts', upper: 'components/workspace.ts' }]);
      expect(paths(chunks.common)).toEqual(['/app/forms.ts', '/app/gestures.js', '/app/plan.tsx']);
    } finally {
      graph.dependencies.get('/app/routes/sign-in.tsx')!.dependencies.delete('/app/plan.tsx');
    }
  });
});
