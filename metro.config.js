// Expo's Metro config.
// - On the web, react-native-reanimated (and its worklets runtime) resolve to an empty module: nothing on the
//   web animates on a UI thread, and gesture handler, which asks for reanimated inside a try, runs its
//   callbacks on the JS thread without it (the phone's bottom sheet animates with React Native's Animated).
// - On the web, zod's table of every language's error messages (`z.locales`, two thirds of zod's bytes) resolves
//   to an empty module: the app words its own messages and zod's English default stays. Its JSON Schema
//   conversion and `z.compile` (never used in the browser) resolve to web/zodWithoutJsonSchema.js.
// - On the web, culori resolves to web/culoriCss.js: only the colour spaces CSS writes are registered.
// - On the web, calc's reference contour engine through d3-contour (contourEngine: 'd3', used by tests and
//   benchmarks in Node) resolves to web/contoursD3Absent.js: the app draws with the fast tracer.
// - Route chunks in tiers (scripts/chunkTiers.cjs): the read-only link's screen is a chunk of its own below the
//   other plan screens, so the share page does not download the editor.
// - For `npm run dev` only: the dev server hands /api/* to the Express server, so the app keeps one origin in
//   development as it has in production.
const { getDefaultConfig } = require('expo/metro-config');
const http = require('node:http');

const config = getDefaultConfig(__dirname);
require('./scripts/chunkTiers.cjs').installChunkTiers();

const webEmpty = /^react-native-(reanimated|worklets)(\/|$)/;
const zodWebOnly = /^\.\.?\/(core\/)?(compile|to-json-schema|json-schema-processors|json-schema-generator|from-json-schema)\.js$/;
const zodStandIn = require.resolve('./web/zodWithoutJsonSchema.js');
const culoriCss = require.resolve('./web/culoriCss.js');
const d3ContoursAbsent = require.resolve('./web/contoursD3Absent.js');
const upstreamResolve = config.resolver.resolveRequest;
config.resolver.resolveRequest = (context, moduleName, platform) => {
  if (platform === 'web' && webEmpty.test(moduleName)) return { type: 'empty' };
  if (platform === 'web' && moduleName === 'culori') return { type: 'sourceFile', filePath: culoriCss };
  if (platform === 'web' && moduleName === './contours-d3' && /[\\/]calc[\\/]lightmap\.ts$/.test(context.originModulePath)) return { type: 'sourceFile', filePath: d3ContoursAbsent };
  if (platform === 'web' && /\/locales\/index(\.c?js)?$/.test(moduleName) && /[\\/]node_modules[\\/]zod[\\/]/.test(context.originModulePath)) return { type: 'empty' };
  if (platform === 'web' && zodWebOnly.test(moduleName) && /[\\/]node_modules[\\/]zod[\\/]v4[\\/]/.test(context.originModulePath)) return { type: 'sourceFile', filePath: zodStandIn };
  return (upstreamResolve ?? context.resolveRequest)(context, moduleName, platform);
};
const api = process.env.FALLOFF_API_URL;

if (api) {
  const target = new URL(api);
  config.server = {
    ...config.server,
    enhanceMiddleware: (metroMiddleware) => (req, res, next) => {
      if (!req.url || !req.url.startsWith('/api/')) return metroMiddleware(req, res, next);
      const upstream = http.request(
        { host: target.hostname, port: target.port, path: req.url, method: req.method, headers: { ...req.headers, host: target.host } },
        (r) => {
          res.writeHead(r.statusCode ?? 502, r.headers);
          r.pipe(res);
        },
      );
      upstream.on('error', () => {
        res.writeHead(502, { 'content-type': 'application/json' });
        res.end(JSON.stringify({ error: { code: 'api_down', message: `the API at ${api} is not answering` } }));
      });
      req.pipe(upstream);
    },
  };
}

module.exports = config;
