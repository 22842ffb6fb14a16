// Babel for the React Native world, as Node `require` sees it in the components test worker.
//
// React Native and its ecosystem ship untranspiled source: Flow (including Flow's component syntax), JSX,
// ES modules in `.js` files without "type": "module", and some Expo packages ship plain TypeScript.
// Node can run none of that, so every such file goes through Babel on its way into `require`.
//
// Pass 1 is babel-preset-expo (it parses Flow with the Hermes parser, strips types, compiles JSX and
// modules). React Native's codegen plugin inside it can emit `export` statements after the preset's
// CommonJS transform has run; when any import/export is left, pass 2 (just the CommonJS transform) turns
// it into `require`/`exports`. With the versions installed now no file needs pass 2, so it only runs when
// the output of pass 1 asks for it: about a fifth of the cold cost saved, and still right if that changes.
//
// Output is cached on disk, keyed by file path, mtime and size (a reinstall rewrites every file, so new
// mtimes), this file's text and the versions of Babel, the preset and the worklets plugin, so only the
// first run after an install pays for Babel.
import { createHash } from 'node:crypto';
import { mkdirSync, readFileSync, renameSync, statSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { PluginObj, PluginPass, TransformOptions, types as BabelTypes } from '@babel/core';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const requireFromRoot = createRequire(join(root, 'package.json'));
type Babel = typeof import('@babel/core');
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

export function shouldTransform(filename: string): boolean {
  return !transforming && TRANSFORMED.test(filename);
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

/**
 * Gives each transformed module that uses the free variable `jest` its own binding, made for that
 * module (see jest-shim.ts): React Native's jest setup and gesture handler's jestSetup.js call
 * `jest.mock('./relative/path')` and `jest.requireActual('../x')`, which Jest resolves from the calling
 * file. Binding per module is exact where a text rewrite of call sites would be a guess.
 */
function bindJestPerModule({ types: t }: { types: typeof BabelTypes }): PluginObj<PluginPass> {
  return {
    name: 'falloff-bind-jest-per-module',
    visitor: {
      Program: {
        exit(path) {
          if (path.scope.hasBinding('jest') || !path.scope.hasGlobal('jest')) return;
          // const jest = globalThis.__falloffJestFor(module);
          path.unshiftContainer(
            'body',
            t.variableDeclaration('const', [
              t.variableDeclarator(
                t.identifier('jest'),
                t.callExpression(t.memberExpression(t.identifier('globalThis'), t.identifier('__falloffJestFor')), [t.identifier('module')]),
              ),
            ]),
          );
        },
      },
    },
  };
}

const firstPass: TransformOptions = {
  babelrc: false,
  sourceType: 'unambiguous',
  configFile: false,
  compact: false,
  comments: false,
  sourceMaps: false,
  // A development build for iOS, the platform React Native's own jest preset uses. `isDev: true` matters:
  // with `false` the preset inlines process.env.NODE_ENV = 'production', __DEV__ = false and Platform.OS.
  caller: { name: 'falloff-vitest', platform: 'ios', engine: 'hermes', isDev: true, isServer: false, isNodeModule: true, supportsStaticESM: false } as TransformOptions['caller'],
  presets: [[requireFromRoot.resolve('babel-preset-expo'), { enableBabelRuntime: false }]],
  plugins: [bindJestPerModule],
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
