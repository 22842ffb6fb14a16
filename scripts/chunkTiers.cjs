// Layered route chunks for the web build (loaded by metro.config.js).
//
// Expo's serializer gives every lazily imported module a chunk holding everything it imports, and moves each
// module that two such chunks hold into `__common`, which every page downloads before anything else. So two
// lazy chunks can never share code without the sign-in page paying for it. A tier is a pair of lazy chunks
// the app always loads in order — `lower` first, then `upper` (components/workspaceScreen.tsx and
// hooks/setups.ts do so) — and for such a pair the modules the two share may live in the lower one instead:
// when `upper` runs they are already defined. Here: the read-only link's screen (components/shareScreen.ts)
// below everything else that draws a plan (components/workspace.ts), so the share page downloads the plan, the
// meter and the document model but not the editor, classes or crew sheets.
//
// `layerChunks` runs after Expo has split the chunks and before their file names (content hashes) are
// computed; it only moves modules out of `__common` into the lower chunk of a tier, and only those that no
// chunk outside the tier needs.

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

const entryEndsWith = (chunk, suffix) => [...chunk.entries].some((m) => m.path.replace(/\\/g, '/').endsWith(suffix));

/**
 * Moves modules from the common chunk into each tier's lower chunk when every lazy chunk that needs them is in
 * that tier. `tiers`: [{ lower: 'components/shareScreen.ts', upper: 'components/workspace.ts' }] (path endings of
 * the chunks' entry modules). Returns what it moved per tier (for the build log and tests).
 */
function layerChunks(chunks, tiers, chunksByPath) {
  const all = [...chunks];
  const common = all.find((c) => c.isVendor && c.name === '/__common.js');
  const moved = [];
  if (!common) return moved;
  const lazy = all.filter((c) => c.isAsync && !c.sealed && !c.isEntry);
  const closures = new Map(lazy.map((c) => [c, staticClosure(c)]));
  for (const tier of tiers) {
    const lower = lazy.find((c) => entryEndsWith(c, tier.lower));
    const upper = lazy.find((c) => entryEndsWith(c, tier.upper));
    if (!lower || !upper) continue;
    let n = 0;
    for (const m of [...common.deps]) {
      if (!closures.get(lower).has(m)) continue;
      const users = lazy.filter((c) => closures.get(c).has(m));
      if (users.every((c) => c === lower || c === upper)) {
        common.deps.delete(m);
        lower.deps.add(m);
        chunksByPath?.set(m.path, lower);
        n++;
      }
    }
    moved.push({ ...tier, modules: n });
  }
  return moved;
}

const tiers = [{ lower: 'components/shareScreen.ts', upper: 'components/workspace.ts' }];

/** Wraps Expo's chunk-naming step (the first one after the split) so the tiers apply to every web bundle. */
function installChunkTiers() {
  const naming = require(require.resolve('@expo/metro-config/build/serializer/computeChunkFilenames', { paths: [require.resolve('expo/metro-config')] }));
  if (naming.__falloffTiers) return;
  const original = naming.precomputeChunkFilenames;
  if (typeof original !== 'function') throw new Error('metro.config.js: Expo no longer has precomputeChunkFilenames; see scripts/chunkTiers.cjs');
  naming.precomputeChunkFilenames = (args) => {
    layerChunks(args.chunks, tiers, args.chunksByPath);
    return original(args);
  };
  naming.__falloffTiers = true;
}

module.exports = { layerChunks, staticClosure, installChunkTiers, tiers };
