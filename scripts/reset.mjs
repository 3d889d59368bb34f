// `npm run db:reset`: drop the local database, migrate it again and write the demo afresh.
// Asks nothing: it is for a keeper's local demo copy, never a server with real records.
import { ensureDeps, migrate, seed, step } from './lib.mjs';
import { spawnSync } from 'node:child_process';

ensureDeps();
const { ensurePostgres } = await import('./pg.mjs');
const pg = await ensurePostgres({ kind: 'dev' });
step(`Resetting database "${pg.database}" on 127.0.0.1:${pg.port}`);
// The app's role owns its database and so its schemas: emptying them needs no superuser.
const r = spawnSync('psql', [pg.url, '-v', 'ON_ERROR_STOP=1', '-qc', 'drop schema if exists drizzle cascade; drop schema public cascade; create schema public;'], {
  stdio: 'inherit',
});
if (r.status !== 0) throw new Error('psql could not empty the database');
migrate(pg.url);
seed(pg.url);
step('Done: the demo scenario is back. Start the app with npm start.');
