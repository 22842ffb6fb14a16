// Babel for the React Native world, as Node `require` sees it in the components test worker.
//
// Parts of the Expo and React Native ecosystem ship untranspiled source: ES modules in `.js` files without
// "type": "module", JSX, and some Expo packages ship plain TypeScript (expo-modules-core, expo). Node can run
// none of that, so such files go through Babel on their way into `require`: babel-preset-expo for the web,
// as Metro builds the web target. react-native-web publishes CommonJS (dist/cjs) and is left alone.
// When any import/export is left after pass 1, pass 2 (just the CommonJS transform) turns it into
// `require`/`exports`.
//
// Output is cached on disk, keyed by file path, mtime and size (a reinstall rewrites every file, so new
// mtimes), this file's text and the versions of Babel, the preset and the worklets plugin, so only the
// first run after an install pays for Babel.
import { createHash } from 'node:crypto';
import { mkdirSync, readFileSync, renameSync, statSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

/** The little of @babel/core's API used here (its type package is not installed). */
type TransformOptions = Record<string, unknown> & { caller?: Record<string, unknown> };
type Result = { code?: string | null; ast?: { program: { body: { type: string }[] } } | null } | null;
type Babel = {
  transformSync(code: string, options: TransformOptions): Result;
  transformFromAstSync(ast: unknown, code: string, options: TransformOptions): Result;
};

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const requireFromRoot = createRequire(join(root, 'package.json'));
/** Loaded on the first cache miss only: a warm run never needs Babel here. */
let babelInstance: Babel | undefined;
const babel = (): Babel => (babelInstance ??= requireFromRoot('@babel/core') as Babel);

export const CACHE_DIR = join(root, 'node_modules', '.cache', 'falloff-rn-babel');

/** Files under these packages are transformed; everything else in node_modules is plain Node code. */
const TRANSFORMED = /[\\/]node_modules[\\/](?:react-native(?:-[^\\/]+)?|@react-native(?:-[^\\/]+)?[\\/][^\\/]+|expo(?:-[^\\/]+)?|@expo[\\/][^\\/]+)[\\/](?!.*[\\/]node_modules[\\/])/;

/**
 * True while Babel runs. Whatever is required then is Babel's own tooling (babel-preset-expo loading
 * `react-native-worklets/plugin` or `@react-native/babel-plugin-codegen`, say): plain Node code that must
 * not itself go through Babel, or the preset would end up requiring a plugin from inside that plugin's
 * own loading (a require cycle, which Node reports as "… inside circular dependency").
 */
let transforming = false;

/** A file of React Native or of a package of its ecosystem. */
export function isReactNativeWorld(filename: string): boolean {
  return TRANSFORMED.test(filename);
}

const PLAIN_COMMONJS = /[\\/]node_modules[\\/]react-native-web[\\/]dist[\\/]cjs[\\/]/;

export function shouldTransform(filename: string): boolean {
  return !transforming && TRANSFORMED.test(filename) && !PLAIN_COMMONJS.test(filename);
}

function version(pkg: string): string {
  return (requireFromRoot(`${pkg}/package.json`) as { version: string }).version;
}

const versionKey = [
  // This file's own text: any change to the options below invalidates the cache.
  createHash('sha1').update(readFileSync(fileURLToPath(import.meta.url))).digest('hex'),
  process.version,
  ...['@babel/core', 'babel-preset-expo', '@babel/plugin-transform-modules-commonjs', 'react-native', 'react-native-worklets'].map(
    (p) => `${p}@${version(p)}`,
  ),
].join('|');

const firstPass: TransformOptions = {
  babelrc: false,
  sourceType: 'unambiguous',
  configFile: false,
  compact: false,
  comments: false,
  sourceMaps: false,
  // A development build for the web, as Metro makes it for the web target. `isDev: true` matters: with
  // `false` the preset inlines process.env.NODE_ENV = 'production' and __DEV__ = false.
  caller: { name: 'falloff-vitest', platform: 'web', isDev: true, isServer: false, isNodeModule: true, supportsStaticESM: false },
  presets: [[requireFromRoot.resolve('babel-preset-expo'), { enableBabelRuntime: false }]],
  // Kept so that pass 2, when needed, starts from the tree instead of parsing the code again.
  ast: true,
};

const secondPass: TransformOptions = {
  babelrc: false,
  configFile: false,
  compact: false,
  comments: false,
  sourceMaps: false,
  sourceType: 'module',
  plugins: [requireFromRoot.resolve('@babel/plugin-transform-modules-commonjs')],
};

const ES_MODULE_SYNTAX = new Set(['ImportDeclaration', 'ExportNamedDeclaration', 'ExportDefaultDeclaration', 'ExportAllDeclaration']);

export function transformUncached(code: string, filename: string): string {
  transforming = true;
  try {
    const one = babel().transformSync(code, { ...firstPass, filename });
    if (!one?.ast || one.code == null) throw new Error(`Babel gave no output for ${filename}`);
    if (!one.ast.program.body.some((node) => ES_MODULE_SYNTAX.has(node.type))) return one.code;
    const two = babel().transformFromAstSync(one.ast, one.code, { ...secondPass, filename });
    return two?.code ?? '';
  } finally {
    transforming = false;
  }
}

let cacheDirReady = false;

/** The transformed source of `filename`, from the disk cache when it is fresh. */
export function transformCached(code: string, filename: string): string {
  const st = statSync(filename);
  const key = createHash('sha1').update(`${versionKey}\0${filename}\0${st.mtimeMs}\0${st.size}`).digest('hex');
  const file = join(CACHE_DIR, `${key}.js`);
  try {
    return readFileSync(file, 'utf8');
  } catch {
    // not cached yet
  }
  const out = transformUncached(code, filename);
  if (!cacheDirReady) {
    mkdirSync(CACHE_DIR, { recursive: true });
    cacheDirReady = true;
  }
  // Write then rename, so another worker never reads half a file.
  const tmp = `${file}.${process.pid}.tmp`;
  writeFileSync(tmp, out);
  renameSync(tmp, file);
  return out;
}
