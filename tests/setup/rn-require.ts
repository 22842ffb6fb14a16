// Node's CommonJS loader, bent just enough to resolve modules the way Metro does for the web build
// (metro.config.js, platform 'web'):
//   1. `react-native` is react-native-web (Expo's web resolution aliases it so);
//   2. react-native-reanimated and react-native-worklets are empty modules (metro.config.js does the same
//      on the web: the web build carries no reanimated);
//   3. platform variants resolve for the web: `X.web.js` (or `.web.ts`/`.web.tsx`) before `X.js`; a module
//      that only exists per platform resolves to its web file;
//   4. Expo packages that publish TypeScript or ES-module source go through Babel (rn-babel.ts, a
//      `pirates` hook);
//   5. image and font files load as `{ uri, testUri }` (a path a test can read).
// The tests and the app's own code run through vite; library code (loaded by Node) and the bridge in
// vite-plugin-react-native.ts come through here, so that there is one React and one react-native-web.
import { existsSync } from 'node:fs';
import Module, { builtinModules, createRequire } from 'node:module';
import { dirname, join, relative, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import { isReactNativeWorld, shouldTransform, transformCached } from './rn-babel';

/** The parts of Node's CommonJS loader that are not in its public types. */
type NodeModule = InstanceType<typeof Module> & { filename: string };
type Loader = {
  _resolveFilename(request: string, parent: NodeModule | undefined, isMain?: boolean, options?: unknown): string;
};
const loader = Module as unknown as Loader;

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const requireFromRoot = createRequire(join(root, 'package.json'));
const { addHook } = requireFromRoot('pirates') as typeof import('pirates');

const ASSET_EXTENSIONS = ['.bmp', '.gif', '.jpg', '.jpeg', '.mp4', '.png', '.psd', '.svg', '.webp', '.ttf', '.otf'];
const builtins = new Set(builtinModules);
const isBuiltin = (request: string) => builtins.has(request) || request.startsWith('node:');

/** As metro.config.js: on the web these resolve to an empty module. */
const WEB_EMPTY = /^react-native-(reanimated|worklets)(\/|$)/;
const EMPTY_MODULE = join(root, 'tests', 'setup', 'empty.cjs');

const SOURCE_EXTENSIONS = ['.js', '.ts', '.tsx'];
const PLATFORM_SUFFIX = /\.(?:ios|android|native|web)\.[jt]sx?$/;

/** The hooks live for the whole worker (the setup runs again for every test file: install once). */
type HookState = { installed: boolean; twins: Map<string, string> };
const state: HookState = ((globalThis as { __falloffRequireHooks?: HookState }).__falloffRequireHooks ??= {
  installed: false,
  twins: new Map(),
});

/** The web variant of a resolved file, if it has one (`X.web.js` for `X.js`). */
function webTwin(resolved: string): string {
  let hit = state.twins.get(resolved);
  if (hit === undefined) {
    hit = resolved;
    const ext = SOURCE_EXTENSIONS.find((e) => resolved.endsWith(e));
    if (ext && !PLATFORM_SUFFIX.test(resolved)) {
      const base = resolved.slice(0, -ext.length);
      const extensions = [ext, ...SOURCE_EXTENSIONS.filter((e) => e !== ext)];
      hit = extensions.map((e) => `${base}.web${e}`).find((f) => existsSync(f)) ?? resolved;
    }
    state.twins.set(resolved, hit);
  }
  return hit;
}

/** What `request` names on the web: react-native is react-native-web; reanimated is nothing. */
export function webRequest(request: string): string {
  if (request === 'react-native') return 'react-native-web';
  return request;
}

export function installRequireHooks(): void {
  if (state.installed) return;
  state.installed = true;

  addHook((code, filename) => transformCached(code, filename), {
    exts: ['.js', '.ts', '.tsx'],
    matcher: shouldTransform,
    ignoreNodeModules: false,
  });

  const extensions = (Module as unknown as { _extensions: Record<string, (m: NodeModule, filename: string) => void> })._extensions;
  for (const ext of ASSET_EXTENSIONS) {
    extensions[ext] = (mod, filename) => {
      const path = relative(root, filename).split(sep).join('/');
      mod.exports = { uri: `/${path}`, testUri: path };
    };
  }

  const resolveFilename = loader._resolveFilename;
  loader._resolveFilename = function (request, parent, isMain, options) {
    if (WEB_EMPTY.test(request)) return EMPTY_MODULE;
    const asked = webRequest(request);
    let resolved: string;
    try {
      resolved = resolveFilename.call(this, asked, parent, isMain, options);
    } catch (err) {
      if (parent?.filename === undefined || !isReactNativeWorld(parent.filename) || isBuiltin(request)) throw err;
      try {
        resolved = resolveFilename.call(this, `${asked}.web`, parent, isMain, options);
      } catch {
        throw err; // report the module that was asked for
      }
    }
    return isReactNativeWorld(resolved) ? webTwin(resolved) : resolved;
  };
}

export { requireFromRoot };
