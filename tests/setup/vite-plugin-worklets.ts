// The app's own code is built by Metro with babel-preset-expo, which includes the worklets Babel plugin:
// it marks the callbacks given to reanimated hooks and gesture handlers as worklets, and reanimated
// relies on that (e.g. `useAnimatedStyle` without a dependency array refuses to run without it). Vite
// compiles tests and app code here, so run that one Babel plugin first on the files that could need it;
// vite's own transform then strips the TypeScript and JSX as usual.
import { createRequire } from 'node:module';
import type { Plugin } from 'vite';

const NEEDS_WORKLETS = /react-native-reanimated|react-native-worklets|react-native-gesture-handler|['"]worklet['"]/;

export function workletsTransform(): Plugin {
  let root = process.cwd();
  return {
    name: 'falloff-worklets',
    enforce: 'pre',
    configResolved(config) {
      root = config.root;
    },
    async transform(code, id) {
      if (id.includes('/node_modules/') || id.startsWith('\0') || !/\.[jt]sx?$/.test(id) || !NEEDS_WORKLETS.test(code)) return undefined;
      const requireFromRoot = createRequire(`${root}/package.json`);
      const babel = requireFromRoot('@babel/core') as typeof import('@babel/core');
      const out = await babel.transformAsync(code, {
        filename: id,
        babelrc: false,
        configFile: false,
        sourceMaps: true,
        // Parse TypeScript and JSX but leave them in place for vite.
        parserOpts: { plugins: id.endsWith('.ts') ? ['typescript'] : ['typescript', 'jsx'] },
        plugins: [requireFromRoot.resolve('react-native-worklets/plugin')],
      });
      return out?.code ? { code: out.code, map: out.map } : undefined;
    },
  };
}
