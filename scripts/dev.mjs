// `npm run dev`: the API on :8080 (reloads on change, through tsx watch) and Metro on :8081 with
// fast refresh. The web app in the browser at http://127.0.0.1:8081 calls the API on :8080.
import { ensureDeps, migrate, seed, sessionSecret, spawnChild, step, bin } from './lib.mjs';

ensureDeps();
const { ensurePostgres } = await import('./pg.mjs');
const pg = await ensurePostgres({ kind: 'dev' });
migrate(pg.url);
seed(pg.url);
step('API on http://127.0.0.1:8080 · app with reload on http://127.0.0.1:8081');
spawnChild(bin('tsx'), ['watch', 'server/index.ts'], {
  DATABASE_URL: pg.url,
  NODE_ENV: 'development',
  SESSION_PASSWORD: process.env.SESSION_PASSWORD ?? sessionSecret(),
  DEV_ORIGIN: 'http://127.0.0.1:8081',
  // E-mailed links open the reloading app; the mail itself is kept in .mail/ (http://127.0.0.1:8080/dev/mail).
  PUBLIC_URL: 'http://127.0.0.1:8081',
});
spawnChild(bin('expo'), ['start', '--web', '--port', '8081', '--host', 'lan'], {
  EXPO_NO_TELEMETRY: '1',
  EXPO_UNSTABLE_HEADLESS: '1',
  EXPO_PUBLIC_API_URL: 'http://127.0.0.1:8080',
});
