// What Expo's packages (expo-router and what it pulls in: expo, expo-constants, expo-linking, …) need from
// their native runtime, supplied for Node. Installed by components.setup.ts after React Native's setup.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { vi } from 'vitest';
import { registerMock, requireFromRoot } from './rn-require';

type ExpoGlobal = { modules: Record<string, unknown> };

/**
 * A native module that is not there: it takes event listeners and never emits, and every other method
 * is a mock that resolves to nothing, so a package can load and call it (register a font, read a
 * setting); a test that cares about a call mocks it itself.
 */
function absentNativeModule(): object {
  const base: Record<PropertyKey, unknown> = {
    addListener: () => ({ remove() {} }),
    removeListener() {},
    removeAllListeners() {},
    emit() {},
    listenerCount: () => 0,
  };
  return new Proxy(base, {
    get(target, key) {
      if (key in target || typeof key === 'symbol' || key === 'then') return target[key];
      return (target[key] = vi.fn(async () => undefined));
    },
  });
}

export function installExpoEnvironment(): void {
  // Once per worker, like the rest of the setup (see rn-require.ts on why state sits on globalThis).
  const g = globalThis as { __falloffExpoEnvironment?: boolean };
  if (g.__falloffExpoEnvironment) return;
  g.__falloffExpoEnvironment = true;
  const requireFromExpo = createRequire(requireFromRoot.resolve('expo/package.json'));

  // The `expo` global (EventEmitter, NativeModule, SharedObject, …) that the native runtime installs;
  // expo-modules-core publishes its web stand-in for exactly this use (Expo's own jest preset installs it).
  (requireFromExpo('expo-modules-core/src/polyfill/dangerous-internal') as { installExpoGlobalPolyfill(): void }).installExpoGlobalPolyfill();

  // Native modules looked up through `globalThis.expo.modules`. expo-constants gets the app config
  // (app.json), which it would find embedded in a native build.
  const expo = (globalThis as unknown as { expo: ExpoGlobal }).expo;
  const appJson = JSON.parse(readFileSync(requireFromRoot.resolve('./app.json'), 'utf8')) as { expo: Record<string, unknown> };
  const constants = Object.assign(absentNativeModule(), { manifest: appJson.expo, appOwnership: null, executionEnvironment: 'bare' });
  expo.modules = new Proxy({ ExponentConstants: constants } as Record<string, unknown>, {
    get: (known, name: string) => (known[name] ??= absentNativeModule()),
  });

  // Expo's runtime replaces globalThis.fetch (and friends) when `expo` is first loaded. Load it now, so that a
  // test's stubbed fetch (vi.stubGlobal) is never replaced by it later, when a screen imports a chunk that
  // brings `expo` in on demand (components/workspace.ts).
  requireFromExpo('./src/winter');

  // Dev-server plumbing (HMR client, fast refresh, the reload socket) that `expo` starts whenever it sees
  // a `window`, which React Native's jest setup defines: there is no dev server to talk to in a test.
  for (const devOnly of ['expo/src/async-require/setup', 'expo/src/async-require/messageSocket']) {
    registerMock(undefined, requireFromExpo.resolve(devOnly), () => ({}));
  }
}
