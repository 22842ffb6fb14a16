// `import … from 'react-native'` in a test or in app code becomes react-native-web, as Metro resolves it for
// the web build. It must be the same react-native-web that library code gets through Node's `require`
// (rn-require.ts), or there would be two StyleSheets and two sets of contexts; so this plugin resolves
// 'react-native' to a virtual module that loads react-native-web with `require` and re-exports each of its
// public names (read from the `exports.A = exports.B = … = void 0;` line of its CommonJS index).
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { Plugin } from 'vite';

const VIRTUAL_ID = '\0falloff-react-native-web';

export function publicNames(indexSource: string): string[] {
  const line = indexSource.split('\n').find((l) => /^exports\.\w+ = exports\.\w+ = /.test(l)) ?? '';
  return [...line.matchAll(/exports\.([A-Za-z_$][\w$]*) =/g)].map((m) => m[1]!);
}

function bridgeSource(root: string): string {
  const requireFromRoot = createRequire(`${root}/package.json`);
  const names = publicNames(readFileSync(requireFromRoot.resolve('react-native-web'), 'utf8'));
  if (names.length < 50) throw new Error(`falloff-react-native-web: found only ${names.length} public names in react-native-web's index`);
  return [
    `import { createRequire } from 'node:module';`,
    `const rn = createRequire(${JSON.stringify(`${root}/package.json`)})('react-native');`,
    `export default rn;`,
    ...names.map((n) => `export const ${n} = rn[${JSON.stringify(n)}];`),
  ].join('\n');
}

export function reactNativeBridge(): Plugin {
  let root = process.cwd();
  let source: string | undefined;
  return {
    name: 'falloff-react-native-web-bridge',
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
