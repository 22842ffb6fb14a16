// Node's CommonJS loader, bent just enough to load React Native the way React Native's jest preset would:
//   1. transform RN-world files with Babel (rn-babel.ts) through a `pirates` require hook;
//   2. resolve platform variants as the preset does for its default platform, iOS (`X.ios.js`, then
//      `X.native.js`, then `X.js`);
//   3. serve modules registered with `jest.mock` from a mock registry, and let `jest.requireActual` past it;
//   4. load image (and font) files as `{ testUri }`, as the preset's asset transformer does.
// The tests themselves run through vite; only `require` (from node_modules code, and from the
// createRequire-based bridge in vite-plugin-react-native.ts) goes through here.
import { existsSync } from 'node:fs';
import Module, { builtinModules, createRequire } from 'node:module';
import { dirname, join, relative, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import { isReactNativeWorld, shouldTransform, transformCached } from './rn-babel';

/** The parts of Node's CommonJS loader that are not in its public types. */
type NodeModule = InstanceType<typeof Module> & { filename: string };
type Loader = {
  _resolveFilename(request: string, parent: NodeModule | undefined, isMain?: boolean, options?: unknown): string;
  _load(request: string, parent: NodeModule | undefined, isMain?: boolean): unknown;
};
const loader = Module as unknown as Loader;

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const requireFromRoot = createRequire(join(root, 'package.json'));
const { addHook } = requireFromRoot('pirates') as typeof import('pirates');

const ASSET_EXTENSIONS = ['.bmp', '.gif', '.jpg', '.jpeg', '.mp4', '.png', '.psd', '.svg', '.webp', '.ttf', '.otf'];
const builtins = new Set(builtinModules);
const isBuiltin = (request: string) => builtins.has(request) || request.startsWith('node:');
const isBare = (request: string) => !request.startsWith('.') && !request.startsWith('/');

type MockEntry = { factory: () => unknown; made: boolean; exports?: unknown };
/**
 * The hooks' state lives on globalThis, not in this module: the setup resets vite's module registry for
 * every test file (components.setup.ts), which evaluates this module again, while the hooks installed
 * the first time, like Node's module cache they serve, stay for the whole worker.
 */
type HookState = {
  installed: boolean;
  mocks: Map<string, MockEntry>;
  /** Files being loaded through `requireActual` right now: the registry steps aside for them. */
  actual: Set<string>;
  twins: Map<string, string>;
};
const state: HookState = ((globalThis as { __falloffRequireHooks?: HookState }).__falloffRequireHooks ??= {
  installed: false,
  mocks: new Map(),
  actual: new Set(),
  twins: new Map(),
});
const { mocks, actual } = state;

/**
 * React Native's jest preset resolves like a Metro build for iOS: `X.ios.js`, then `X.native.js`, then
 * `X.js`. react-native-worklets is the exception its own jest resolver makes: without `.native`, so
 * that it picks its JavaScript implementation (worker-env.ts).
 */
const PLATFORMS = ['ios', 'native'];
const SOURCE_EXTENSIONS = ['.js', '.ts', '.tsx'];
const PLATFORM_SUFFIX = /\.(?:ios|android|native|web)\.[jt]sx?$/;
const WITHOUT_NATIVE = /[\\/]node_modules[\\/]react-native-worklets[\\/]/;

/** The platform variant of a resolved file, if it has one. */
function platformTwin(resolved: string): string {
  let hit = state.twins.get(resolved);
  if (hit === undefined) {
    hit = resolved;
    const ext = SOURCE_EXTENSIONS.find((e) => resolved.endsWith(e));
    if (ext && !PLATFORM_SUFFIX.test(resolved)) {
      const base = resolved.slice(0, -ext.length);
      const platforms = WITHOUT_NATIVE.test(resolved) ? ['ios'] : PLATFORMS;
      const extensions = [ext, ...SOURCE_EXTENSIONS.filter((e) => e !== ext)];
      hit = platforms.flatMap((p) => extensions.map((e) => `${base}.${p}${e}`)).find((f) => existsSync(f)) ?? resolved;
    }
    state.twins.set(resolved, hit);
  }
  return hit;
}

export function installRequireHooks(): void {
  if (state.installed) return;
  state.installed = true;

  // 1. Babel for RN-world files. `.ts`/`.tsx` because some Expo packages publish TypeScript source as `main`.
  addHook((code, filename) => transformCached(code, filename), {
    exts: ['.js', '.ts', '.tsx'],
    matcher: shouldTransform,
    ignoreNodeModules: false,
  });

  // Images, as React Native's jest preset maps them: `require('./icon.png')` is `{ testUri: 'path' }`,
  // so a test can see which image a component uses. (Node would otherwise parse the PNG as JavaScript.)
  const extensions = (Module as unknown as { _extensions: Record<string, (m: NodeModule, filename: string) => void> })._extensions;
  for (const ext of ASSET_EXTENSIONS) {
    extensions[ext] = (mod, filename) => {
      mod.exports = { testUri: relative(root, filename).split(sep).join('/') };
    };
  }

  // 2. Platform variants, for files of React Native and its ecosystem (see platformTwin). A module
  // that only exists per platform (`TabsHost.ios.js`, `TabsHost.android.js`, …) resolves to its iOS file.
  const resolveFilename = loader._resolveFilename;
  loader._resolveFilename = function (request, parent, isMain, options) {
    let resolved: string;
    try {
      resolved = resolveFilename.call(this, request, parent, isMain, options);
    } catch (err) {
      if (parent?.filename === undefined || !isReactNativeWorld(parent.filename) || isBuiltin(request)) throw err;
      try {
        resolved = resolveFilename.call(this, `${request}.ios`, parent, isMain, options);
      } catch {
        throw err; // report the module that was asked for
      }
    }
    return isReactNativeWorld(resolved) ? platformTwin(resolved) : resolved;
  };

  // 3. The mock registry, consulted before Node's module cache (as Jest's registry is).
  const load = loader._load;
  loader._load = function (request, parent, isMain) {
    if (mocks.size > 0 && !isBuiltin(request)) {
      let filename: string | undefined;
      try {
        filename = loader._resolveFilename(request, parent, isMain);
      } catch {
        // not installed: only a by-name mock can answer; otherwise let Node report it
      }
      const entry = filename === undefined ? (isBare(request) ? mocks.get(request) : undefined) : mocks.get(filename);
      if (entry && !(filename !== undefined && actual.has(filename))) {
        if (!entry.made) {
          entry.made = true;
          entry.exports = entry.factory();
        }
        return entry.exports;
      }
    }
    return load.call(this, request, parent, isMain);
  };
}

/** Where `request` leads when module `from` requires it (the project root when there is no module). */
function resolve(from: NodeModule | undefined, request: string): string {
  if (isBuiltin(request)) return request;
  return from ? loader._resolveFilename(request, from) : requireFromRoot.resolve(request);
}

/**
 * Mocks this harness declines. expo-router's testing library replaces react-native-reanimated with
 * reanimated's static mock when it is first loaded. Jest would undo that after the test file; here the
 * files of the project share one worker, so every file after the first router test would get the mock
 * or the real library depending on the order the files ran in. The real library (in its JavaScript
 * implementation) serves router tests as well, so it stays.
 */
const DECLINED_MOCKS = [{ from: /[\\/]expo-router[\\/]build[\\/]testing-library[\\/]mocks\.js$/, request: 'react-native-reanimated' }];

/** `jest.mock(request, factory)` as seen from module `from`. */
export function registerMock(from: NodeModule | undefined, request: string, factory: () => unknown): void {
  if (DECLINED_MOCKS.some((d) => d.request === request && from !== undefined && d.from.test(from.filename))) return;
  let key: string;
  try {
    key = resolve(from, request);
  } catch {
    // A package that is not installed is mocked by name, like Jest's `virtual` mocks (RN's setup mocks
    // 'prettier' this way, in case). A relative path that does not resolve names a file nothing can
    // load anyway: nothing to register.
    if (!isBare(request)) return;
    key = request;
  }
  mocks.set(key, { factory, made: false });
}

/** `jest.requireActual(request)` as seen from module `from`: the real module, past the registry. */
export function requireActual(from: NodeModule | undefined, request: string): unknown {
  const filename = resolve(from, request);
  const was = actual.has(filename);
  actual.add(filename);
  try {
    return loader._load(filename, from);
  } finally {
    if (!was) actual.delete(filename);
  }
}

export { requireFromRoot };
