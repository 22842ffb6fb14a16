/**
 * First load on a phone: `npm run bench -- load`.
 *
 * Debian's Chromium (playwright-core) with a phone profile — 390 × 844 at 3×, touch, CPU slowed 4× and the network
 * held to about 1.6 Mbps down / 750 kbps up with 150 ms round trips (both through the DevTools protocol), a fresh
 * profile and the HTTP cache off for every run — opens, against the built app (dist/, served by the real server):
 *   sign-in   /sign-in, usable when the e-mail field shows and React has hydrated it (the form is in the HTML)
 *   library   /setups signed in, usable when setup cards show
 *   editor    /setups/<id> signed in, usable when the plan shows its items and the meter its subject reading
 *   share     a read-only link /s/<token> with no account, usable when the plan, the camera settings and the
 *             subject's reading (from the meter's worker) show
 * and the same for an Expo Router hello-world built from the very same package versions in a temp folder (its
 * node_modules is a link to ours: nothing is downloaded), usable when its text shows.
 * For each: first contentful paint, usable, JavaScript and font bytes transferred (compressed, as sent), and the
 * long tasks (Long Tasks API, over 50 ms) until 1.5 s after usable: how many, their sum and the longest. Medians of
 * LOAD_RUNS runs (3 unless set). Service workers are blocked so the figures are what the page itself asks for.
 *
 * Then, from the source maps (dist-maps/, written beside the build by scripts/ensure.mjs), what the JavaScript
 * each page downloaded is made of: raw bytes per package (or per folder of ours), the largest first.
 * Measures and prints; the exit code is for a run that broke.
 */
import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, readdirSync, realpathSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { basename, join } from 'node:path';
import express from 'express';
import { TraceMap, decodedMappings } from '@jridgewell/trace-mapping';
import { chromium, type Browser } from 'playwright-core';
import { webFiles } from '../../server/web';
import { precompressDir } from '../../scripts/precompress.mjs';
import { appPages, has, ownerOf, launchChromium, phone, phonePage, type Cookie, type PageSpec } from './loadPages';

const root = join(__dirname, '..', '..');
const RUNS = Number(process.env.LOAD_RUNS ?? 3);
const SETTLE_MS = 1500;
const USABLE_TIMEOUT_MS = 90_000;
type Run = { fcp: number | null; usable: number | null; jsBytes: number; fontBytes: number; otherBytes: number; longTasks: number[]; scripts: string[] };

// ——— the hello-world ———

/** Builds (once per set of versions) an Expo Router hello-world next to a link to our node_modules. */
function helloWorld(): string {
  const pkg = JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')) as { dependencies: Record<string, string> };
  const keep = ['expo', 'expo-router', 'expo-constants', 'expo-linking', 'expo-status-bar', '@expo/metro-runtime', 'react', 'react-dom', 'react-native', 'react-native-web', 'react-native-screens', 'react-native-safe-area-context'];
  const deps = Object.fromEntries(keep.map((k) => [k, pkg.dependencies[k]!]));
  const files: Record<string, string> = {
    'package.json': JSON.stringify({ name: 'hello-router', private: true, main: 'expo-router/entry', dependencies: deps }, null, 2),
    'app.json': JSON.stringify({ expo: { name: 'Hello', slug: 'hello', scheme: 'hello', web: { bundler: 'metro', output: 'single' }, plugins: ['expo-router'] } }, null, 2),
    'metro.config.js': `const { getDefaultConfig } = require('expo/metro-config');\nconst config = getDefaultConfig(__dirname);\nconfig.watchFolders = [${JSON.stringify(realpathSync(join(root, 'node_modules')))}];\nmodule.exports = config;\n`,
    'app/_layout.tsx': "import { Stack } from 'expo-router';\n\nexport default function Layout() {\n  return <Stack />;\n}\n",
    'app/index.tsx': "import { Text, View } from 'react-native';\n\nexport default function Home() {\n  return (\n    <View style={{ flex: 1, alignItems: 'center', justifyContent: 'center' }}>\n      <Text testID=\"hello\">Hello, world</Text>\n    </View>\n  );\n}\n",
  };
  const hash = createHash('sha256').update(JSON.stringify(files)).digest('hex').slice(0, 12);
  const dir = join(tmpdir(), `falloff-hello-${hash}`);
  if (existsSync(join(dir, 'dist', '.built'))) return dir;
  rmSync(dir, { recursive: true, force: true });
  for (const [name, text] of Object.entries(files)) {
    mkdirSync(join(dir, name, '..'), { recursive: true });
    writeFileSync(join(dir, name), text);
  }
  symlinkSync(realpathSync(join(root, 'node_modules')), join(dir, 'node_modules'), 'dir');
  console.log(`building the hello-world in ${dir}…`);
  execFileSync(join(root, 'node_modules', '.bin', 'expo'), ['export', '-p', 'web', '--output-dir', 'dist', '--source-maps'], {
    cwd: dir,
    env: { ...process.env, CI: '1', EXPO_NO_TELEMETRY: '1', NODE_ENV: 'production' },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  mkdirSync(join(dir, 'dist-maps'), { recursive: true });
  moveMaps(join(dir, 'dist'), join(dir, 'dist-maps'));
  writeFileSync(join(dir, 'dist', '.built'), new Date().toISOString());
  return dir;
}

function moveMaps(from: string, to: string) {
  for (const name of readdirSync(from, { withFileTypes: true })) {
    const p = join(from, name.name);
    if (name.isDirectory()) moveMaps(p, to);
    else if (name.name.endsWith('.map')) {
      writeFileSync(join(to, name.name), readFileSync(p));
      rmSync(p);
    }
  }
}

/** The hello-world served as our server serves the app: precompressed twins, an index.html for every path. */
async function serveHello(dir: string): Promise<{ url: string; server: Server }> {
  const dist = join(dir, 'dist');
  await precompressDir(dist);
  const app = express();
  app.use(webFiles(dist));
  app.use((_req, res) => res.sendFile(join(dist, 'index.html')));
  const server = createServer(app);
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
  return { url: `http://127.0.0.1:${(server.address() as AddressInfo).port}`, server };
}

// ——— one page load on the phone profile ———

/** Watches the page from its first script: long tasks, and the moment `usable` first holds (checked each frame). */
const watcher = (usable: string) => `
(() => {
  window.__longTasks = [];
  try {
    new PerformanceObserver((l) => { for (const e of l.getEntries()) window.__longTasks.push(e.duration); }).observe({ type: 'longtask', buffered: true });
  } catch {}
  const check = () => { try { return Boolean((${usable})()); } catch { return false; } };
  const tick = () => {
    if (check()) window.__usableAt = performance.now();
    else requestAnimationFrame(tick);
  };
  requestAnimationFrame(tick);
})();`;

async function loadOnce(browser: Browser, spec: PageSpec, cookies: Cookie[]): Promise<Run> {
  const { context, page, cdp } = await phonePage(browser, spec, cookies);
  try {
    await page.addInitScript(watcher(spec.usable));
    const kinds = new Map<string, { type: string; url: string }>();
    const bytes = { js: 0, font: 0, other: 0 };
    const scripts: string[] = [];
    cdp.on('Network.responseReceived', (e) => kinds.set(e.requestId, { type: e.type, url: e.response.url }));
    cdp.on('Network.loadingFinished', (e) => {
      const k = kinds.get(e.requestId);
      if (!k) return;
      const isJs = k.type === 'Script' || /\.js(\?|$)/.test(k.url);
      if (isJs) {
        bytes.js += e.encodedDataLength;
        scripts.push(new URL(k.url).pathname);
      } else if (k.type === 'Font') bytes.font += e.encodedDataLength;
      else bytes.other += e.encodedDataLength;
    });
    await page.goto(spec.url, { waitUntil: 'commit', timeout: USABLE_TIMEOUT_MS });
    const usable = await page
      .waitForFunction(() => (window as unknown as { __usableAt?: number }).__usableAt, undefined, { timeout: USABLE_TIMEOUT_MS, polling: 250 })
      .then((h) => h.jsonValue() as Promise<number>, () => null);
    await page.waitForTimeout(SETTLE_MS);
    const fcp = await page.evaluate(() => performance.getEntriesByName('first-contentful-paint')[0]?.startTime ?? null);
    const longTasks = await page.evaluate(() => (window as unknown as { __longTasks: number[] }).__longTasks.slice());
    if (usable === null) await page.screenshot({ path: join(root, 'tests', '.artifacts', `load-${spec.name}-not-usable.png`) }).catch(() => {});
    return { fcp, usable, jsBytes: bytes.js, fontBytes: bytes.font, otherBytes: bytes.other, longTasks, scripts };
  } finally {
    await context.close();
  }
}

// ——— what the JavaScript is made of (source maps) ———

/** Raw bytes of one built file per owner, by walking its mappings (a segment owns the columns up to the next). */
function breakdown(jsPath: string, mapPath: string, into: Map<string, number>) {
  const code = readFileSync(jsPath, 'utf8').split('\n');
  const map = new TraceMap(readFileSync(mapPath, 'utf8'));
  const lines = decodedMappings(map);
  const owners = map.sources.map((s) => ownerOf(s ?? '?'));
  let mapped = 0;
  lines.forEach((segs, i) => {
    const len = code[i]?.length ?? 0;
    for (let k = 0; k < segs.length; k++) {
      const seg = segs[k]!;
      const end = k + 1 < segs.length ? segs[k + 1]![0] : len;
      const n = Math.max(0, end - seg[0]);
      const who = seg.length > 1 ? owners[seg[1]!]! : '(unmapped)';
      into.set(who, (into.get(who) ?? 0) + n);
      mapped += n;
    }
  });
  const total = code.reduce((a, l) => a + l.length + 1, 0);
  if (total > mapped) into.set('(unmapped)', (into.get('(unmapped)') ?? 0) + total - mapped);
}

function routeBreakdown(distDir: string, mapsDir: string, scripts: string[]) {
  const into = new Map<string, number>();
  let missing = 0;
  for (const s of new Set(scripts)) {
    const js = join(distDir, s);
    const mp = join(mapsDir, `${basename(s)}.map`);
    if (!existsSync(js) || !existsSync(mp)) {
      missing++;
      continue;
    }
    breakdown(js, mp, into);
  }
  return { parts: [...into].sort((a, b) => b[1] - a[1]), missing };
}

// ——— the run ———

const median = (xs: number[]) => {
  const s = xs.filter((x) => Number.isFinite(x)).sort((a, b) => a - b);
  return s.length ? s[Math.floor((s.length - 1) / 2)]! : NaN;
};
const kb = (n: number) => `${(n / 1024).toFixed(0)} KB`;
const sec = (ms: number) => (Number.isFinite(ms) ? `${(ms / 1000).toFixed(2)} s` : 'never');

async function main() {
  const helloDir = helloWorld();
  const hello = await serveHello(helloDir);
  const app = await appPages();
  const specs: PageSpec[] = [{ name: 'hello-world', url: `${hello.url}/`, usable: `() => ${has('[data-testid="hello"]')}` }, ...app.specs];
  const cookies = app.cookies;

  const browser = await launchChromium(chromium);
  mkdirSync(join(root, 'tests', '.artifacts'), { recursive: true });
  const results = new Map<string, Run[]>();
  let broken = 0;
  try {
    // Runs interleaved (page after page, then again), so a burst of load on the machine spreads over all pages.
    for (let r = 0; r < RUNS; r++) {
      for (const spec of specs) {
        const run = await loadOnce(browser, spec, cookies);
        if (run.usable === null) broken++;
        results.set(spec.name, [...(results.get(spec.name) ?? []), run]);
      }
    }
  } finally {
    await browser.close();
    await app.close();
    hello.server.close();
  }

  console.log(`\nFirst load on a phone profile (CPU ${phone.cpu}× slower, ${phone.downKbps} kbps down, ${phone.upKbps} kbps up, ${phone.rttMs} ms RTT, cold cache), median of ${RUNS}:`);
  console.log('page          FCP      usable    JS (sent)   fonts   other   long tasks (n / sum / longest)');
  const helloRuns = results.get('hello-world')!;
  const helloFcp = median(helloRuns.map((r) => r.fcp ?? NaN));
  const helloUsable = median(helloRuns.map((r) => r.usable ?? NaN));
  for (const spec of specs) {
    const runs = results.get(spec.name)!;
    const fcp = median(runs.map((r) => r.fcp ?? NaN));
    const usable = median(runs.map((r) => r.usable ?? NaN));
    const lt = runs.map((r) => r.longTasks);
    const n = median(lt.map((l) => l.length));
    const sum = median(lt.map((l) => l.reduce((a, b) => a + b, 0)));
    const max = median(lt.map((l) => (l.length ? Math.max(...l) : 0)));
    console.log(
      `${spec.name.padEnd(12)} ${sec(fcp).padStart(7)} ${sec(usable).padStart(8)} ${kb(median(runs.map((r) => r.jsBytes))).padStart(10)} ${kb(median(runs.map((r) => r.fontBytes))).padStart(7)} ${kb(median(runs.map((r) => r.otherBytes))).padStart(7)}   ${n} / ${sum.toFixed(0)} ms / ${max.toFixed(0)} ms` +
        (spec.name === 'hello-world' ? '' : `   (FCP ${(fcp / helloFcp).toFixed(2)}×, usable ${(usable / helloUsable).toFixed(2)}× the hello-world's)`),
    );
  }
  console.log('targets: FCP of sign-in and share ≤ 1.5×, library and editor usable ≤ 2× the hello-world; JS sign-in ≤ 350 KB, share ≤ 400 KB; fonts ≤ 150 KB; no long task over 200 ms');

  console.log('\nWhat each page’s JavaScript is made of (raw bytes of the files it downloaded, by source map):');
  for (const spec of specs) {
    const runs = results.get(spec.name)!;
    const [distDir, mapsDir] = spec.name === 'hello-world' ? [join(helloDir, 'dist'), join(helloDir, 'dist-maps')] : [join(root, 'dist'), join(root, 'dist-maps')];
    const { parts, missing } = routeBreakdown(distDir, mapsDir, runs[0]!.scripts);
    const total = parts.reduce((a, [, n]) => a + n, 0);
    console.log(`  ${spec.name}: ${new Set(runs[0]!.scripts).size} script file(s), ${kb(total)} raw${missing ? ` (${missing} without a source map)` : ''}`);
    for (const [who, n] of parts.slice(0, 14)) console.log(`    ${kb(n).padStart(8)}  ${((100 * n) / (total || 1)).toFixed(1).padStart(5)} %  ${who}`);
  }
  if (broken) console.log(`\n${broken} load(s) never became usable (screenshots in tests/.artifacts/load-*-not-usable.png)`);
  process.exit(broken ? 1 : 0);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
