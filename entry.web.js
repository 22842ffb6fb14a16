// The app's entry on the web: what Expo Router's own entry (expo-router/entry-classic) does — the metro runtime
// first, then render the router's root — but with the libraries' modules evaluated in steps, each in a task of
// its own, so that no single task at start evaluates the whole first chunk (on a slow phone that was one task
// of about a second: React DOM, react-native-web with its style sheets, Expo Router and its navigation).
// The modules are the same; only the main thread gets to breathe between steps. Steps are plain `require`s (not
// `import()`): they are in the entry chunk already, nothing more is fetched. The first step also asks for the
// route's large lazy chunks (preloadLater), which then download while the steps run.
require('@expo/metro-runtime');

/** Runs `fn` in a task of its own: after whatever the browser has queued (input, paint), not after a timer's clamp. */
function nextTask(fn) {
  if (typeof MessageChannel === 'function') {
    const ch = new MessageChannel();
    ch.port1.onmessage = () => {
      ch.port1.close();
      fn();
    };
    ch.port2.postMessage(null);
  } else setTimeout(fn, 0);
}

/** The large scripts this page's route loads lazily (the plan chunks), named by the server in a meta tag
 *  (server/web.ts, appPage): asked for now that this chunk has arrived, so they download while it evaluates. */
function preloadLater() {
  if (typeof document === 'undefined') return;
  const meta = document.querySelector('meta[name="falloff-later-scripts"]');
  for (const href of (meta?.getAttribute('content') ?? '').split(' ').filter(Boolean)) {
    const link = document.createElement('link');
    link.rel = 'preload';
    link.as = 'script';
    link.href = href;
    document.head.appendChild(link);
  }
}

/** On a page rendered at build time (scripts/staticPages.mjs): the route's own chunks (its layouts and its
 *  screen, named by the server in a meta tag), run as scripts now, so that by the last step their modules are
 *  defined and the router's lazy routes resolve at once. React then hydrates the whole page in one pass; a
 *  route still loading would leave its part of the page waiting, and any update reaching it before it had
 *  hydrated would make React throw the build's markup away and draw it again. A promise for all of them
 *  (never rejected: a chunk that fails to load is asked for again by the router, as on any page). */
function loadForHydration() {
  if (typeof document === 'undefined') return Promise.resolve();
  const meta = document.querySelector('meta[name="falloff-hydrate-scripts"]');
  const srcs = (meta?.getAttribute('content') ?? '').split(' ').filter(Boolean);
  return Promise.all(
    srcs.map(
      (src) =>
        new Promise((resolve) => {
          const script = document.createElement('script');
          script.src = src;
          script.onload = script.onerror = () => resolve();
          document.head.appendChild(script);
        }),
    ),
  );
}

const prerendered = typeof document !== 'undefined' && document.querySelector('meta[name="falloff-prerendered"]') !== null;
let hydrationReady = Promise.resolve();

// Groups of what the router's entry evaluates, the libraries underneath first; each step evaluates only what
// the earlier ones have not (Metro evaluates a module once, on its first require).
const steps = [
  () => {
    preloadLater();
    if (prerendered) hydrationReady = loadForHydration();
    require('react-dom/client');
  },
  // react-native-web in three: its style sheet with the core views, the Animated library it vendors (with the
  // lists and the scroll view), then the rest of its exports.
  () => {
    require('react-native-web/dist/exports/StyleSheet');
    require('react-native-web/dist/exports/View');
    require('react-native-web/dist/exports/Text');
  },
  () => require('react-native-web/dist/exports/Animated'),
  () => require('react-native'),
  () => require('expo-router/build/react-navigation/core'),
  () => require('expo-router/build/react-navigation/native'),
  () => require('expo-router/build/global-state/store'),
  () => require('expo-router/build/useScreens'),
  () => require('expo-router/build/global-state/router-store'),
  () => require('expo-router/build/head'),
  () => require('expo-router/build/ExpoRoot'),
  () => require('expo-router/build/qualified-entry'),
  () => {
    // A page rendered at build time (scripts/staticPages.mjs marks it) is hydrated: React takes over the markup
    // already on screen. Every other page (the app shell's empty root) is rendered into.
    globalThis.__EXPO_ROUTER_HYDRATE__ = prerendered;
    const { App } = require('expo-router/build/qualified-entry');
    const render = () => require('expo-router/build/renderRootComponent').renderRootComponent(App);
    if (prerendered) hydrationReady.then(render);
    else render();
  },
];

// Each step leaves a mark (`falloff:start 1/13` …) in the page's User Timing, where a profile shows it and the
// first-load e2e test finds it.
function run(i) {
  steps[i]();
  if (typeof performance !== 'undefined' && typeof performance.mark === 'function') performance.mark(`falloff:start ${i + 1}/${steps.length}`);
  if (i + 1 < steps.length) nextTask(() => run(i + 1));
}
run(0);
