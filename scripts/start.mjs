// `npm start`: install what is missing, start PostgreSQL, migrate, seed the demo once,
// build the web app when it changed, and serve everything on one port.
import { ensureDeps, exportWeb, migrate, seed, sessionSecret, spawnChild, step, bin } from './lib.mjs';

ensureDeps();
const { ensurePostgres } = await import('./pg.mjs');
const pg = await ensurePostgres({ kind: 'dev' });
step(`PostgreSQL is running on 127.0.0.1:${pg.port} (data in ${pg.dataDir})`);
migrate(pg.url);
seed(pg.url);
exportWeb();

const port = process.env.PORT ?? '8080';
step(`Starting Frameside on http://127.0.0.1:${port}`);
const child = spawnChild(bin('tsx'), ['server/index.ts'], {
  DATABASE_URL: pg.url,
  PORT: port,
  NODE_ENV: 'production',
  // A local run keeps e-mail in .mail/ (listed at /dev/mail); a real host sets SMTP_HOST/SMTP_PORT instead.
  MAIL_FAKE: process.env.MAIL_FAKE ?? 'true',
  // Links in e-mail open this server (PORT=9000 npm start mails :9000 links).
  PUBLIC_URL: process.env.PUBLIC_URL ?? `http://127.0.0.1:${port}`,
  SESSION_PASSWORD: process.env.SESSION_PASSWORD ?? sessionSecret(),
});
child.on('exit', (code) => process.exit(code ?? 0));
