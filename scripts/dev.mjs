#!/usr/bin/env node
// `npm run dev`: the API (restarting on server changes) on PORT (8080) and Metro's web dev server with live
// reload on 8081, which forwards /api/* to the API. Open http://127.0.0.1:8081. Ctrl-C stops both.
import { APP_PORT, DB_NAME, bin, databaseUrl, log, spawnChild } from './lib.mjs';

const apiUrl = `http://127.0.0.1:${APP_PORT}`;
// Metro's dev server forwards /api/* with its own Origin: trust it for state-changing requests (server/origin.ts).
const env = { ...process.env, DATABASE_URL: databaseUrl(DB_NAME), PORT: String(APP_PORT), FALLOFF_API_URL: apiUrl, TRUSTED_ORIGINS: process.env.TRUSTED_ORIGINS ?? 'http://localhost:8081,http://127.0.0.1:8081' };
const children = [
  spawnChild(bin('tsx'), ['watch', '--clear-screen=false', 'server/main.ts'], { env }),
  spawnChild(bin('expo'), ['start', '--web', '--port', '8081', '--host', 'localhost'], { env: { ...env, EXPO_NO_TELEMETRY: '1' } }),
];
log(`API on ${apiUrl}; the app with live reload on http://localhost:8081`);
const stop = () => children.forEach((c) => c.kill('SIGINT'));
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
