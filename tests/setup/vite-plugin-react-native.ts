// `import { View } from 'react-native'` in a test or in app code must not reach Node's ES-module loader:
// that loader does not go through require hooks, so it would meet React Native's raw Flow source. This
// plugin resolves 'react-native' to a virtual module that loads it with `require` instead (where
// rn-require.ts transforms it) and re-exports each public name.
//
// The names are read from the `get Name()` getters of react-native's index.js, its public API. Reading a
// getter loads that module, so each is read once, inside try/catch (a few load native-only code and
// throw under Node) and with console.warn silenced (a few print deprecation warnings when touched).
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { Plugin } from 'vite';

const VIRTUAL_ID = '\0falloff-react-native';

export function publicNames(indexSource: string): string[] {
  const names = new Set<string>();
  for (const m of indexSource.matchAll(/^ {2}get ([A-Za-z_$][\w$]*)\(\)/gm)) names.add(m[1]!);
  return [...names];
}

function bridgeSource(root: string): string {
  const requireFromRoot = createRequire(`${root}/package.json`);
  const names = publicNames(readFileSync(requireFromRoot.resolve('react-native'), 'utf8'));
  if (names.length < 50) throw new Error(`falloff-react-native: found only ${names.length} public names in react-native/index.js`);
  return [
    `import { createRequire } from 'node:module';`,
    `const rn = createRequire(${JSON.stringify(`${root}/package.json`)})('react-native');`,
    `function read(name) {`,
    `  const warn = console.warn;`,
    `  console.warn = () => {};`,
    `  try { return rn[name]; } catch { return undefined; } finally { console.warn = warn; }`,
    `}`,
    `export default rn;`,
    ...names.map((n) => `export const ${n} = read(${JSON.stringify(n)});`),
  ].join('\n');
}

export function reactNativeBridge(): Plugin {
  let root = process.cwd();
  let source: string | undefined;
  return {
    name: 'falloff-react-native-bridge',
    enforce: 'pre',
    configResolved(config) {
      root = config.root;
    },
    resolveId(id) {
      return id === 'react-native' ? VIRTUAL_ID : undefined;
    },
    load(id) {
      if (id !== VIRTUAL_ID) return undefined;
      source ??= bridgeSource(root);
      return source;
    },
  };
}
