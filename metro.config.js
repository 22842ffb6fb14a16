// Expo's Metro config. For `npm run dev` only: the dev server hands /api/* to the Express server, so the app
// keeps one origin in development as it has in production.
const { getDefaultConfig } = require('expo/metro-config');
const http = require('node:http');

const config = getDefaultConfig(__dirname);
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
