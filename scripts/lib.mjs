// Set-up steps shared by `npm start`, `npm test` and `npm run dev`. Node built-ins only:
// this runs before the npm packages are installed.
import { spawn, spawnSync } from 'node:child_process';
import { createHash, randomBytes } from "node:crypto";
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

export const step = (msg) => console.log(`\x1b[1m›\x1b[0m ${msg}`);

function hashFiles(files) {
  const h = createHash('sha256');
  for (const f of files) {
    h.update(f);
    try {
      h.update(fs.readFileSync(path.join(root, f)));
    } catch {
      h.update('missing');
    }
  }
  return h.digest('hex');
}

/** `npm ci` when node_modules is missing or the lockfile changed since the last install. */
export function ensureDeps() {
  const marker = path.join(root, 'node_modules', '.frameside-lock-hash');
  // The lockfile alone: it changes with every dependency change, and not with a new npm script.
  const want = hashFiles(['package-lock.json']);
  const have = fs.existsSync(marker) ? fs.readFileSync(marker, 'utf8') : '';
  if (have === want && fs.existsSync(path.join(root, 'node_modules', '.bin', 'tsx'))) return;
  step('Installing npm packages (npm ci) …');
  const t = Date.now();
  run('npm', ['ci', '--no-audit', '--no-fund', '--loglevel=error']);
  fs.writeFileSync(marker, want);
  step(`npm packages installed in ${((Date.now() - t) / 1000).toFixed(0)} s`);
}

/** Runs a command in the project, inheriting output; throws on a non-zero exit. */
export function run(cmd, args, { env = {}, quiet = false } = {}) {
  const r = spawnSync(cmd, args, { cwd: root, stdio: quiet ? 'pipe' : 'inherit', env: { ...process.env, ...env } });
  if (r.status !== 0) {
    if (quiet) process.stderr.write(r.stdout?.toString() ?? '', () => undefined), process.stderr.write(r.stderr?.toString() ?? '');
    throw new Error(`${cmd} ${args.join(' ')} failed (exit ${r.status ?? r.signal})`);
  }
  return r;
}

export const bin = (name) => path.join(root, 'node_modules', '.bin', name);

export function migrate(url) {
  run(bin('tsx'), ['db/migrate.ts'], { env: { DATABASE_URL: url } });
}

export function seed(url) {
  run(bin('tsx'), ['db/seed.ts'], { env: { DATABASE_URL: url } });
}

function listFiles(dir) {
  const out = [];
  const walk = (d) => {
    for (const e of fs.readdirSync(path.join(root, d), { withFileTypes: true })) {
      const rel = path.join(d, e.name);
      if (e.isDirectory()) walk(rel);
      else out.push(rel);
    }
  };
  if (fs.existsSync(path.join(root, dir))) walk(dir);
  return out.sort();
}

/**
 * Exports the web build to dist/, skipped when nothing it is built from has changed. A lock
 * folder keeps two runs (two terminals, parallel test runs) from writing dist/ at once.
 */
export function exportWeb({ force = false } = {}) {
  const lock = path.join(root, '.tmp', 'export.lock');
  fs.mkdirSync(path.dirname(lock), { recursive: true });
  for (let waited = 0; ; waited += 1) {
    try {
      fs.mkdirSync(lock);
      fs.writeFileSync(path.join(lock, 'pid'), String(process.pid));
      break;
    } catch {
      const owner = Number(fs.readFileSync(path.join(lock, 'pid'), { encoding: 'utf8', flag: 'a+' }) || 0);
      let alive = false;
      try {
        process.kill(owner, 0);
        alive = owner > 0;
      } catch {}
      if (!alive || waited > 600) {
        fs.rmSync(lock, { recursive: true, force: true });
        continue;
      }
      if (waited === 0) step('Waiting for another web build to finish …');
      spawnSync('sleep', ['1']);
    }
  }
  try {
    exportWebLocked({ force });
  } finally {
    fs.rmSync(lock, { recursive: true, force: true });
  }
}

function exportWebLocked({ force }) {
  const inputs = [
    ...['app', 'components', 'shared', 'assets', 'public'].flatMap(listFiles),
    'app.json',
    'package-lock.json',
    'tsconfig.json',
  ];
  const want = hashFiles(inputs);
  const marker = path.join(root, 'dist', '.build-hash');
  if (!force && fs.existsSync(marker) && fs.readFileSync(marker, 'utf8') === want && fs.existsSync(path.join(root, 'dist', 'index.html'))) {
    step('Web build is up to date (dist/)');
    return;
  }
  step('Building the web app (expo export) …');
  const t = Date.now();
  run(bin('expo'), ['export', '--platform', 'web', '--output-dir', 'dist'], {
    env: { CI: '1', EXPO_NO_TELEMETRY: '1', EXPO_UNSTABLE_HEADLESS: '1' },
    quiet: true,
  });
  fs.writeFileSync(marker, want);
  step(`Web app built in ${((Date.now() - t) / 1000).toFixed(0)} s`);
}

/** Starts a long-running child that dies with us. */
export function spawnChild(cmd, args, env = {}) {
  const child = spawn(cmd, args, { cwd: root, stdio: 'inherit', env: { ...process.env, ...env } });
  const stop = () => child.kill('SIGTERM');
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
  return child;
}

/** A random session secret made once per checkout and kept (git-ignored) beside the data. */
export function sessionSecret() {
  const file = path.join(root, '.pg', 'session-secret');
  if (!fs.existsSync(file)) {
    fs.mkdirSync(path.dirname(file), { recursive: true });
    fs.writeFileSync(file, randomBytes(32).toString('hex'), { mode: 0o600 });
  }
  return fs.readFileSync(file, 'utf8').trim();
}
