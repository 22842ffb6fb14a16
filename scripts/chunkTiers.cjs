// Where shared modules go in the web build (loaded by metro.config.js).
//
// Expo's serializer gives every lazily imported module (each route, and the two screen bundles) a chunk holding
// everything it imports, and moves each module that two such chunks hold into `__common`, which every page
// downloads before anything else. So the sign-in page would pay for every module any two signed-in screens share.
// `placeShared` runs after Expo's split and before the chunks' file names (content hashes) are computed, and
// keeps in `__common` only what a light chunk needs — the root layout, the share link's route file and the
// not-found page — and what two group layouts both need: Expo Router fetches every group's layout at start, on
// every page (the share page and the sign-in page download both `(app)` and `(auth)` layouts), so a module
// placed in each would be downloaded twice (the session client, better-auth, was). Every other common module
// goes to the lazy chunks that need it (the signed-out forms to the signed-out group's pages):
//   - not to a chunk that always loads after another one that needs it too (its "parent": a group's layout
//     for the routes in that group, and for a tier the lower chunk for the upper one);
//   - to each of the remaining ones otherwise. A module in two chunks is defined by the first that loads
//     (Metro's runtime ignores a second definition), so a copy costs bytes only when both load on one page.
// A tier is a pair of lazy chunks the app always loads in order — `lower` first, then `upper`
// (components/workspaceScreen.tsx and hooks/setups.ts do so): here the read-only link's screen
// (components/shareScreen.ts) below everything else that draws a plan (components/workspace.ts), so the share
// page downloads the plan, the meter and the document model but not the editor, classes or crew sheets.

/** Modules a chunk's entries reach by static imports (as Expo gathers a chunk: lazy imports start other chunks). */
function staticClosure(chunk) {
  const seen = new Set();
  const stack = [...chunk.entries];
  while (stack.length) {
    const m = stack.pop();
    if (!m || seen.has(m)) continue;
    seen.add(m);
    for (const dep of m.dependencies.values()) {
      if (!dep.absolutePath || dep.data?.data?.asyncType) continue;
      const next = chunk.graph.dependencies.get(dep.absolutePath);
      if (next) stack.push(next);
    }
  }
  return seen;
}

const slash = (p) => p.replace(/\\/g, '/');
const entryPaths = (chunk) => [...chunk.entries].map((m) => slash(m.path));
const entryEndsWith = (chunk, suffix) => entryPaths(chunk).some((p) => p.endsWith(suffix));

// The frame's renderer in the page (components/frame/engine.ts, only without a worker) loads after the share chunk.
const tiers = [
  { lower: 'components/shareScreen.ts', upper: 'components/workspace.ts' },
  { lower: 'components/shareScreen.ts', upper: 'calc/frame/job.ts' },
];
/** Chunks whose modules every page needs: what they import stays in `__common`. */
const light = [/\/app\/_layout\.tsx$/, /\/app\/\+not-found\.tsx$/, /\/app\/s\/\[token\]\.tsx$/];
/** Route groups whose layout always renders (and so loads) before any route inside the group. */
const groups = ['app/(app)/', 'app/(auth)/'];

/**
 * Moves modules out of the common chunk as the header says. `rules`: { tiers, light (RegExps on entry paths),
 * groups (folders ending in '/', each with a `_layout.tsx`) }. Returns what moved: modules, and copies (a
 * module placed in n chunks counts n).
 */
function placeShared(chunks, rules, chunksByPath) {
  const all = [...chunks];
  const common = all.find((c) => c.isVendor && c.name === '/__common.js');
  if (!common) return { modules: 0, copies: 0 };
  const lazy = all.filter((c) => c.isAsync && !c.sealed && !c.isEntry);
  const closures = new Map(lazy.map((c) => [c, staticClosure(c)]));
  const isLight = (c) => entryPaths(c).some((p) => (rules.light ?? []).some((re) => re.test(p)));
  // The chunk that has always loaded before this one, if any.
  const parent = new Map();
  for (const t of rules.tiers ?? []) {
    const lower = lazy.find((c) => entryEndsWith(c, t.lower));
    const upper = lazy.find((c) => entryEndsWith(c, t.upper));
    if (lower && upper) parent.set(upper, lower);
  }
  for (const g of rules.groups ?? []) {
    const layout = lazy.find((c) => entryEndsWith(c, `${g}_layout.tsx`));
    if (!layout) continue;
    for (const c of lazy) if (c !== layout && !parent.has(c) && entryPaths(c).some((p) => p.includes(`/${g}`))) parent.set(c, layout);
  }
  // Every group layout loads on every page (see the header).
  const layouts = new Set((rules.groups ?? []).map((g) => lazy.find((c) => entryEndsWith(c, `${g}_layout.tsx`))).filter(Boolean));
  const entryModules = new Set(lazy.flatMap((c) => [...c.entries]));
  let modules = 0;
  let copies = 0;
  for (const m of [...common.deps]) {
    if (entryModules.has(m)) continue;
    const users = lazy.filter((c) => closures.get(c).has(m));
    if (!users.length || users.some(isLight) || users.filter((c) => layouts.has(c)).length > 1) continue;
    const hasParentUser = (c) => {
      for (let p = parent.get(c), n = 0; p && n < 20; p = parent.get(p), n++) if (users.includes(p)) return true;
      return false;
    };
    const homes = users.filter((c) => !hasParentUser(c));
    common.deps.delete(m);
    for (const h of homes) h.deps.add(m);
    chunksByPath?.set(m.path, homes[0]);
    modules++;
    copies += homes.length;
  }
  return { modules, copies };
}

/** Wraps Expo's chunk-naming step (the first one after the split) so the placement applies to every web bundle. */
function installChunkTiers() {
  const naming = require(require.resolve('@expo/metro-config/build/serializer/computeChunkFilenames', { paths: [require.resolve('expo/metro-config')] }));
  if (naming.__falloffTiers) return;
  const original = naming.precomputeChunkFilenames;
  if (typeof original !== 'function') throw new Error('metro.config.js: Expo no longer has precomputeChunkFilenames; see scripts/chunkTiers.cjs');
  naming.precomputeChunkFilenames = (args) => {
    placeShared(args.chunks, { tiers, light, groups }, args.chunksByPath);
    return original(args);
  };
  naming.__falloffTiers = true;
}

module.exports = { placeShared, staticClosure, installChunkTiers, tiers, light, groups };
