#!/usr/bin/env node
// Private PostgreSQL clusters for Frameside, built from Debian's PostgreSQL packages.
//
//   node scripts/pg.mjs start  [--test]   start (initdb first if needed), print DATABASE_URL=...
//   node scripts/pg.mjs stop   [--test]
//   node scripts/pg.mjs status [--test]   exit code 0 when running, 3 when stopped
//   node scripts/pg.mjs url    [--test]   print only the URL (starts nothing)
//
// Node built-ins only: this runs before `npm install`. Progress goes to stderr so that
// stdout stays machine-readable.
//
// Exports: ensurePostgres({ kind }), stopPostgres({ kind }), postgresStatus({ kind }),
// postgresUrl({ kind }), aptInstall(packages, options).

import { spawn } from 'node:child_process';
import crypto from 'node:crypto';
import fs from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const PROJECT_ROOT = fs.realpathSync(path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..'));
const PROJECT_HASH = crypto.createHash('sha256').update(PROJECT_ROOT).digest('hex').slice(0, 10);
const PG_BASE = path.join(PROJECT_ROOT, '.pg');
const TMP_BASE = `/tmp/frameside-pg-${PROJECT_HASH}`;
const PG_LIB = '/usr/lib/postgresql';
const HOST = '127.0.0.1';
const ADMIN_USER = 'postgres'; // bootstrap superuser; reachable only through the private socket
const APP_USER = 'frameside';
const APP_PASSWORD = 'frameside';
// sun_path is 108 bytes including the terminating NUL.
const SOCKET_PATH_MAX = 107;
const IS_ROOT = process.getuid?.() === 0;
const MISSING_PG_MESSAGE =
  'PostgreSQL server binaries were not found under /usr/lib/postgresql/<version>/bin. ' +
  "Install Debian's package `postgresql` (e.g. `sudo apt-get install -y postgresql`).";

const KINDS = {
  dev: { portEnv: 'FRAMESIDE_PG_PORT', defaultPort: 54329, database: 'frameside', createdb: false, durable: true },
  test: { portEnv: 'FRAMESIDE_PG_TEST_PORT', defaultPort: 54339, database: 'frameside_test', createdb: true, durable: false },
};

const sleep = (ms) => new Promise((resolve) => setTimeout(resolve, ms));
const defaultLog = (message) => process.stderr.write(`[pg] ${message}\n`);

// ---------------------------------------------------------------------------------------
// Public API

/**
 * Make sure the cluster of the given kind exists, runs, and has its role and database.
 * Idempotent; safe to call from several processes at once (they queue on a lock file).
 */
export async function ensurePostgres({ kind = 'dev', log = defaultLog } = {}) {
  const cfg = kindConfig(kind);
  log = log || (() => {});
  return withLock(kind, async () => {
    const versions = await ensureBinaries(log);
    const layout = await resolveLayout(cfg, log);
    const bin = pickBinaries(versions, layout, cfg, log);

    let state = await settledState(layout.dataDir);
    if (state.stale) {
      await cleanupStale(layout, cfg, state, log);
      state = { running: false };
    }
    // Check the port before touching anything, so a conflict leaves a running cluster
    // (and its config files) exactly as they were.
    if (!state.running || state.port !== cfg.port) await assertPortFree(cfg);

    if (!isInitialized(layout.dataDir)) await initCluster(bin, layout, cfg, log);
    const changed = writeManagedConfig(layout, cfg);

    if (state.running) {
      const moved = state.port !== cfg.port || state.socketDir !== layout.socketDir || state.listen !== HOST;
      if (moved) {
        // port, listen address and socket folder only change on restart
        log(`${kind} cluster runs with old settings (port ${state.port}); restarting on port ${cfg.port}`);
        await signalAndWait(layout.dataDir, state.pid, 'SIGINT');
        state = { running: false };
      } else if (changed) {
        signal(state.pid, 'SIGHUP'); // pg_hba / fsync settings reload without restart
      }
    }
    if (!state.running) {
      removeStaleSocketLocks(layout.socketDir, cfg.port, log);
      await startCluster(bin, layout, cfg, log);
    }
    await ensureRoleAndDatabase(bin, layout, cfg);
    return {
      url: appUrl(cfg),
      port: cfg.port,
      host: HOST,
      dataDir: layout.dataDir,
      socketDir: layout.socketDir,
      user: APP_USER,
      database: cfg.database,
      logFile: layout.logFile,
    };
  });
}

/** Stop the cluster (fast shutdown). Returns { wasRunning }. Never installs anything. */
export async function stopPostgres({ kind = 'dev', log = defaultLog } = {}) {
  const cfg = kindConfig(kind);
  log = log || (() => {});
  return withLock(kind, async () => {
    const layout = existingLayout(cfg);
    if (!layout) return { wasRunning: false };
    const state = await settledState(layout.dataDir);
    if (state.stale) {
      await cleanupStale(layout, cfg, state, log);
      return { wasRunning: false };
    }
    if (!state.running) return { wasRunning: false };
    // Signalling the postmaster directly is what `pg_ctl stop -m fast` does, minus runuser.
    await signalAndWait(layout.dataDir, state.pid, 'SIGINT');
    return { wasRunning: true };
  });
}

/** Read-only look at the cluster: { running, pid, port, dataDir, socketDir, logFile, url }. */
export async function postgresStatus({ kind = 'dev' } = {}) {
  const cfg = kindConfig(kind);
  const layout = existingLayout(cfg);
  const state = layout ? clusterState(layout.dataDir) : { running: false };
  return {
    kind,
    running: state.running,
    stale: Boolean(state.stale),
    pid: state.running ? state.pid : undefined,
    port: state.running ? state.port : cfg.port,
    dataDir: layout?.dataDir,
    socketDir: state.socketDir ?? layout?.socketDir,
    logFile: layout?.logFile,
    url: appUrl(cfg),
  };
}

export function postgresUrl({ kind = 'dev' } = {}) {
  return appUrl(kindConfig(kind));
}

// ---------------------------------------------------------------------------------------
// Configuration and layout

function kindConfig(kind) {
  const base = KINDS[kind];
  if (!base) throw new Error(`Unknown PostgreSQL cluster kind "${kind}" (expected "dev" or "test").`);
  const raw = process.env[base.portEnv];
  const port = raw ? Number(raw) : base.defaultPort;
  if (!Number.isInteger(port) || port < 1024 || port > 65535) {
    throw new Error(`${base.portEnv}=${raw} is not a usable port (1024-65535).`);
  }
  return { ...base, kind, port };
}

function appUrl(cfg) {
  return `postgres://${APP_USER}:${APP_PASSWORD}@${HOST}:${cfg.port}/${cfg.database}`;
}

const isInitialized = (dataDir) => fs.existsSync(path.join(dataDir, 'PG_VERSION'));

function layoutFor(dataDir, cfg) {
  const parent = path.dirname(dataDir);
  let socketDir = path.join(parent, `sock-${cfg.kind}`);
  // A Unix socket path over 107 bytes cannot be bound at all: use a short folder instead.
  if (Buffer.byteLength(path.join(socketDir, `.s.PGSQL.${cfg.port}`)) > SOCKET_PATH_MAX) {
    socketDir = `/tmp/frameside-pg-${PROJECT_HASH}-${cfg.kind}`;
  }
  return { dataDir, socketDir, logFile: path.join(parent, `${cfg.kind}.log`) };
}

/** The layout of an already initialised cluster, or null (used by stop/status: no side effects). */
function existingLayout(cfg) {
  for (const dataDir of [path.join(PG_BASE, cfg.kind), path.join(TMP_BASE, cfg.kind)]) {
    if (isInitialized(dataDir)) return layoutFor(dataDir, cfg);
  }
  return null;
}

/**
 * Choose data, socket and log paths, create the folders, and decide which OS user runs the
 * server. Under root that is `postgres` (initdb and pg_ctl refuse root), who must be able to
 * reach the data folder through every parent; a project under a 0700 home fails that.
 */
async function resolveLayout(cfg, log) {
  const projectData = path.join(PG_BASE, cfg.kind);
  const tmpData = path.join(TMP_BASE, cfg.kind);
  let dataDir;
  let runAs = IS_ROOT ? null : currentUser();

  if (isInitialized(projectData)) dataDir = projectData;
  else if (isInitialized(tmpData)) dataDir = tmpData; // an earlier run already fell back
  else dataDir = projectData;

  if (IS_ROOT) {
    // Keep running an existing cluster as whoever owns it; otherwise as `postgres`.
    const owner = fs.existsSync(dataDir) ? fs.statSync(dataDir).uid : 0;
    runAs = owner !== 0 ? userByUid(owner) : await ensureSystemUser('postgres', log);
    if (!isInitialized(dataDir) && !(await canReach(runAs.name, PG_BASE))) {
      log(`${runAs.name} cannot reach ${PG_BASE} (a parent folder is closed to other users); ` +
        `using ${tmpData} for the ${cfg.kind} cluster instead`);
      dataDir = tmpData;
    }
  }

  if (!IS_ROOT && fs.existsSync(dataDir) && fs.statSync(dataDir).uid !== process.getuid()) {
    throw new Error(`${dataDir} belongs to uid ${fs.statSync(dataDir).uid} (made by a run as root?). ` +
      'Run this as root too, or move that folder away to start a fresh cluster.');
  }
  if (dataDir === tmpData) makeTmpDir(TMP_BASE, 0o755, runAs);
  const layout = { ...layoutFor(dataDir, cfg), runAs };

  if (layout.socketDir.startsWith('/tmp/')) {
    if (!fs.existsSync(layout.socketDir) && dataDir === projectData) {
      log(`socket path under ${PG_BASE} would exceed ${SOCKET_PATH_MAX} bytes; using ${layout.socketDir}`);
    }
    makeTmpDir(layout.socketDir, 0o700, runAs);
  } else {
    fs.mkdirSync(layout.socketDir, { recursive: true, mode: 0o700 });
  }
  chownTo(layout.socketDir, runAs);
  fs.chmodSync(layout.socketDir, 0o700);

  // pg_ctl opens the log as the server user, so the file must exist and belong to it.
  fs.closeSync(fs.openSync(layout.logFile, 'a', 0o640));
  chownTo(layout.logFile, runAs);
  return layout;
}

/** Create a folder under /tmp, refusing one that someone else planted there first. */
function makeTmpDir(dir, mode, runAs) {
  fs.mkdirSync(dir, { recursive: true, mode });
  const st = fs.lstatSync(dir);
  if (!st.isDirectory() || (st.uid !== process.getuid() && st.uid !== runAs?.uid)) {
    throw new Error(`Refusing to use ${dir}: it is not a folder owned by this user. Remove it and retry.`);
  }
}

function chownTo(file, user) {
  if (IS_ROOT && user) fs.chownSync(file, user.uid, user.gid);
}

async function canReach(userName, dir) {
  // `test -x` as that user fails if any parent folder lacks search permission for it.
  const r = await run('/usr/sbin/runuser', ['-u', userName, '--', 'test', '-x', dir]);
  return r.code === 0;
}

// ---------------------------------------------------------------------------------------
// Users (read /etc/passwd directly: cheaper than spawning `id` on every start)

function passwdEntries() {
  return fs.readFileSync('/etc/passwd', 'utf8').split('\n').filter(Boolean).map((line) => {
    const [name, , uid, gid] = line.split(':');
    return { name, uid: Number(uid), gid: Number(gid) };
  });
}
const userByName = (name) => passwdEntries().find((u) => u.name === name) ?? null;
function userByUid(uid) {
  const user = passwdEntries().find((u) => u.uid === uid);
  if (!user) throw new Error(`The PostgreSQL data folder belongs to uid ${uid}, which has no /etc/passwd entry.`);
  return user;
}
function currentUser() {
  return { name: null, uid: process.getuid(), gid: process.getgid() };
}

async function ensureSystemUser(name, log) {
  let user = userByName(name);
  if (user) return user;
  log(`creating system user "${name}" to run PostgreSQL (it refuses to run as root)`);
  const r = await run('useradd', ['--system', '--user-group', '--no-create-home',
    '--home-dir', '/var/lib/postgresql', '--shell', '/usr/sbin/nologin', name]);
  user = userByName(name);
  if (!user) throw new Error(`useradd ${name} failed: ${r.stderr.trim()}`);
  return user;
}

// ---------------------------------------------------------------------------------------
// Binaries

function pgVersions() {
  let names = [];
  try {
    names = fs.readdirSync(PG_LIB);
  } catch {
    return [];
  }
  return names
    .filter((v) => /^\d+$/.test(v))
    .filter((v) => ['postgres', 'initdb', 'pg_ctl', 'psql'].every((b) => fs.existsSync(path.join(PG_LIB, v, 'bin', b))))
    .sort((a, b) => Number(b) - Number(a));
}

async function ensureBinaries(log) {
  let versions = pgVersions();
  if (versions.length) return versions;
  if (!IS_ROOT) throw new Error(MISSING_PG_MESSAGE);
  log('PostgreSQL is not installed; running `apt-get update && apt-get install -y postgresql` (as root)');
  await aptInstall(['postgresql'], { updateFirst: true, log });
  versions = pgVersions();
  if (!versions.length) throw new Error(`apt-get installed postgresql but no server was found under ${PG_LIB}.`);
  return versions;
}

/** The binaries that match an existing cluster's PG_VERSION, or the highest installed. */
function pickBinaries(versions, layout, cfg, log) {
  let version = versions[0];
  if (isInitialized(layout.dataDir)) {
    const clusterVersion = fs.readFileSync(path.join(layout.dataDir, 'PG_VERSION'), 'utf8').trim();
    if (versions.includes(clusterVersion)) version = clusterVersion;
    else if (cfg.durable) {
      throw new Error(`The ${cfg.kind} cluster in ${layout.dataDir} was made by PostgreSQL ${clusterVersion}, ` +
        `which is no longer installed (found ${versions.join(', ')}). Install postgresql-${clusterVersion} ` +
        `to dump it, or move the folder away to start a fresh cluster.`);
    } else {
      // test data is disposable: rebuild with what is installed
      log(`test cluster was made by PostgreSQL ${clusterVersion}; recreating it with ${version}`);
      fs.rmSync(layout.dataDir, { recursive: true, force: true });
    }
  }
  const dir = path.join(PG_LIB, version, 'bin');
  return { version, initdb: `${dir}/initdb`, pg_ctl: `${dir}/pg_ctl`, psql: `${dir}/psql` };
}

// ---------------------------------------------------------------------------------------
// initdb and managed config files

async function initCluster(bin, layout, cfg, log) {
  const { dataDir, runAs } = layout;
  if (fs.existsSync(dataDir) && fs.readdirSync(dataDir).length) {
    if (cfg.durable) {
      throw new Error(`${dataDir} exists and is not empty, but holds no PostgreSQL cluster. Move it away and retry.`);
    }
    fs.rmSync(dataDir, { recursive: true, force: true });
  }
  log(`initialising the ${cfg.kind} cluster (PostgreSQL ${bin.version}) in ${dataDir}`);
  fs.mkdirSync(dataDir, { recursive: true, mode: 0o700 });
  chownTo(dataDir, runAs);
  fs.chmodSync(dataDir, 0o700);

  const args = ['-D', dataDir, '-U', ADMIN_USER, '-E', 'UTF8',
    '--auth-local=trust', '--auth-host=scram-sha-256'];
  // Skipping initdb's final fsync only risks the cluster being created; never for dev.
  if (!cfg.durable) args.push('--no-sync');
  let r = await runAsServerUser(layout, bin.initdb, [...args, '--locale=C.UTF-8']);
  if (r.code !== 0 && /locale/i.test(r.stderr)) {
    fs.rmSync(dataDir, { recursive: true, force: true });
    fs.mkdirSync(dataDir, { recursive: true, mode: 0o700 });
    chownTo(dataDir, runAs);
    r = await runAsServerUser(layout, bin.initdb, [...args, '--locale=C']);
  }
  if (r.code !== 0) throw new Error(`initdb failed for ${dataDir}:\n${(r.stderr || r.stdout).trim()}`);

  const confPath = path.join(dataDir, 'postgresql.conf');
  fs.appendFileSync(confPath, "\n# Frameside settings live in frameside.conf (written by scripts/pg.mjs)\ninclude_if_exists = 'frameside.conf'\n");
}

const confQuote = (s) => `'${s.replaceAll("'", "''")}'`;

/** Write frameside.conf and pg_hba.conf; returns true when either changed. */
function writeManagedConfig(layout, cfg) {
  const onOff = cfg.durable ? 'on' : 'off';
  const conf = [
    '# Managed by scripts/pg.mjs and rewritten on every start: change the script, not this file.',
    `listen_addresses = ${confQuote(HOST)}`,
    `port = ${cfg.port}`,
    `unix_socket_directories = ${confQuote(layout.socketDir)}`,
    'unix_socket_permissions = 0700',
    cfg.durable
      ? '# dev keeps real records: full durability'
      : '# test data only: trade crash safety for speed',
    `fsync = ${onOff}`,
    `synchronous_commit = ${onOff}`,
    `full_page_writes = ${onOff}`,
    '',
  ].join('\n');
  const hba = [
    '# Managed by scripts/pg.mjs.',
    '# TYPE  DATABASE  USER        ADDRESS         METHOD',
    `local   all       ${ADMIN_USER}                    trust`,
    `host    all       all         ${HOST}/32    scram-sha-256`,
    '',
  ].join('\n');
  let changed = false;
  for (const [name, text] of [['frameside.conf', conf], ['pg_hba.conf', hba]]) {
    const file = path.join(layout.dataDir, name);
    let old = null;
    try {
      old = fs.readFileSync(file, 'utf8');
    } catch {}
    if (old === text) continue;
    fs.writeFileSync(file, text, { mode: 0o600 });
    chownTo(file, layout.runAs);
    changed = true;
  }
  return changed;
}

// ---------------------------------------------------------------------------------------
// Is it running? (pg_ctl status trusts kill(pid, 0), which a zombie passes: look at /proc)

function procInfo(pid) {
  let stat;
  try {
    stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
  } catch {
    return { alive: false };
  }
  const state = stat.slice(stat.lastIndexOf(')') + 2, stat.lastIndexOf(')') + 3);
  const comm = stat.slice(stat.indexOf('(') + 1, stat.lastIndexOf(')'));
  let cwd = null;
  try {
    cwd = fs.readlinkSync(`/proc/${pid}/cwd`);
  } catch {}
  return { alive: state !== 'Z' && state !== 'X', zombie: state === 'Z', comm, cwd };
}

/** True when pid is a live server process of the cluster in dataDir (postgres chdirs there). */
function isClusterProcess(pid, dataDir) {
  const p = procInfo(pid);
  return p.alive && (p.comm === 'postgres' || p.comm === 'postmaster') && p.cwd === fs.realpathSync(dataDir);
}

function readPidFile(dataDir) {
  try {
    const lines = fs.readFileSync(path.join(dataDir, 'postmaster.pid'), 'utf8').split('\n');
    return {
      pid: Number(lines[0]),
      port: Number(lines[3]),
      socketDir: lines[4] || undefined,
      listen: lines[5]?.trim(),
      status: lines[7]?.trim(),
    };
  } catch {
    return null;
  }
}

function clusterState(dataDir) {
  const info = readPidFile(dataDir);
  if (!info) return { running: false };
  if (!info.pid) return { running: false, stale: true, ...info, reason: 'postmaster.pid is empty or torn' };
  const p = procInfo(info.pid);
  if (isClusterProcess(info.pid, dataDir)) return { running: true, ...info };
  const reason = !p.alive && !p.zombie ? `process ${info.pid} is gone`
    : p.zombie ? `process ${info.pid} is a zombie (killed, never reaped)`
      : `process ${info.pid} is "${p.comm}", not this cluster's postmaster`;
  return { running: false, stale: true, ...info, reason };
}

/** Like clusterState, but waits out "starting"/"stopping" left by another caller. */
async function settledState(dataDir) {
  const deadline = Date.now() + 120_000;
  for (;;) {
    const state = clusterState(dataDir);
    if (!state.running || state.status === 'ready' || Date.now() > deadline) return state;
    await sleep(100);
  }
}

function clusterProcesses(dataDir) {
  const real = fs.realpathSync(dataDir);
  return fs.readdirSync('/proc').filter((d) => /^\d+$/.test(d)).map(Number).filter((pid) => {
    const p = procInfo(pid);
    return p.alive && p.comm === 'postgres' && p.cwd === real;
  });
}

/** After a crash: let orphaned backends die, then drop the stale lock files. */
async function cleanupStale(layout, cfg, state, log) {
  log(`${cfg.kind} cluster: stale postmaster.pid (${state.reason}); cleaning up`);
  // Backends notice their postmaster's death within moments; until they exit they still
  // use the data folder, so a new server must not start next to them.
  const deadline = Date.now() + 5000;
  let leftovers = clusterProcesses(layout.dataDir);
  while (leftovers.length && Date.now() < deadline) {
    await sleep(100);
    leftovers = clusterProcesses(layout.dataDir);
  }
  for (const pid of leftovers) {
    log(`killing leftover server process ${pid} of the crashed ${cfg.kind} cluster`);
    try {
      process.kill(pid, 'SIGKILL');
    } catch {}
  }
  if (leftovers.length) await sleep(200);
  fs.rmSync(path.join(layout.dataDir, 'postmaster.pid'), { force: true });
  for (const dir of new Set([state.socketDir, layout.socketDir].filter(Boolean))) {
    for (const port of new Set([state.port, cfg.port].filter(Boolean))) removeStaleSocketLocks(dir, port, log);
  }
}

/** A socket lock whose PID is dead, a zombie or not postgres makes the server refuse to start. */
function removeStaleSocketLocks(socketDir, port, log) {
  const lock = path.join(socketDir, `.s.PGSQL.${port}.lock`);
  let pid;
  try {
    pid = Number(fs.readFileSync(lock, 'utf8').split('\n')[0]);
  } catch {
    return;
  }
  const p = procInfo(pid);
  if (p.alive && (p.comm === 'postgres' || p.comm === 'postmaster')) return;
  log(`removing stale socket lock ${lock} (pid ${pid} ${p.zombie ? 'is a zombie' : 'is not running'})`);
  fs.rmSync(lock, { force: true });
  fs.rmSync(path.join(socketDir, `.s.PGSQL.${port}`), { force: true });
}

/** Signal the postmaster and wait until it has removed postmaster.pid (or died). */
const signal = (pid, name) => {
  try {
    process.kill(pid, name);
  } catch (err) {
    if (err.code !== 'ESRCH') throw err; // already gone is fine
  }
};

async function signalAndWait(dataDir, pid, name) {
  signal(pid, name);
  const gone = () => !fs.existsSync(path.join(dataDir, 'postmaster.pid')) || !isClusterProcess(pid, dataDir);
  for (let i = 0; i < 600 && !gone(); i++) await sleep(50);
  if (!gone()) {
    signal(pid, 'SIGQUIT'); // immediate shutdown; crash recovery runs on next start
    for (let i = 0; i < 200 && !gone(); i++) await sleep(50);
  }
  if (!gone()) throw new Error(`PostgreSQL (pid ${pid}) did not stop.`);
}

// ---------------------------------------------------------------------------------------
// Port check

async function assertPortFree(cfg) {
  const err = await new Promise((resolve) => {
    const server = net.createServer();
    server.once('error', resolve);
    server.listen({ port: cfg.port, host: HOST, exclusive: true }, () => server.close(() => resolve(null)));
  });
  if (!err) return;
  if (err.code !== 'EADDRINUSE') throw err;
  throw portInUseError(cfg);
}

function portInUseError(cfg) {
  return new Error(
    `Port ${cfg.port} on ${HOST} is already in use by another program${describePortOwner(cfg.port)}, ` +
    `not by Frameside's ${cfg.kind} PostgreSQL cluster. Stop that program, or choose another port ` +
    `with the environment variable ${cfg.portEnv} (e.g. ${cfg.portEnv}=${cfg.port + 1}).`,
  );
}

/** Best effort " (pid N, name)" for whoever listens on the port, from /proc. */
function describePortOwner(port) {
  try {
    const hexPort = port.toString(16).toUpperCase().padStart(4, '0');
    const inodes = new Set();
    for (const table of ['/proc/net/tcp', '/proc/net/tcp6']) {
      for (const line of fs.readFileSync(table, 'utf8').split('\n').slice(1)) {
        const cols = line.trim().split(/\s+/);
        if (cols[1]?.endsWith(`:${hexPort}`) && cols[3] === '0A') inodes.add(cols[9]);
      }
    }
    for (const pid of fs.readdirSync('/proc').filter((d) => /^\d+$/.test(d))) {
      let fds;
      try {
        fds = fs.readdirSync(`/proc/${pid}/fd`);
      } catch {
        continue;
      }
      for (const fd of fds) {
        let target;
        try {
          target = fs.readlinkSync(`/proc/${pid}/fd/${fd}`);
        } catch {
          continue;
        }
        const m = /^socket:\[(\d+)\]$/.exec(target);
        if (m && inodes.has(m[1])) return ` (pid ${pid}, ${procInfo(pid).comm})`;
      }
    }
  } catch {}
  return '';
}

// ---------------------------------------------------------------------------------------
// Start, role and database

async function startCluster(bin, layout, cfg, log) {
  const { dataDir, logFile } = layout;
  rotateLog(logFile, layout.runAs);
  const started = Date.now();
  const out = fs.openSync(logFile, 'a');
  const logStart = fs.fstatSync(out).size;
  fs.writeSync(out, `\n--- scripts/pg.mjs: starting ${cfg.kind} cluster ${new Date().toISOString()}\n`);
  let r;
  try {
    // pg_ctl's own output goes to the log too: a pipe inherited by the server would keep
    // our caller waiting for EOF for as long as the server lives.
    r = await runAsServerUser(layout, bin.pg_ctl, ['-D', dataDir, '-l', logFile, '-w', '-t', '120', '-s', 'start'],
      { stdio: ['ignore', out, out], detached: true, closeFds: true });
  } finally {
    fs.closeSync(out);
  }
  const state = clusterState(dataDir);
  if (r.code !== 0 || !state.running) {
    const tail = readFrom(logFile, logStart).trim().split('\n').slice(-25).join('\n');
    if (/could not bind|Address already in use/i.test(tail)) throw portInUseError(cfg);
    throw new Error(`PostgreSQL (${cfg.kind}) failed to start; from ${logFile}:\n${tail}`);
  }
  log(`${cfg.kind} cluster ready on ${HOST}:${cfg.port} (pid ${state.pid}, ${Date.now() - started} ms)`);
}

function readFrom(file, offset) {
  try {
    const buf = fs.readFileSync(file);
    return buf.subarray(Math.min(offset, buf.length)).toString('utf8');
  } catch {
    return '';
  }
}

function rotateLog(logFile, runAs) {
  try {
    if (fs.statSync(logFile).size < 10 * 1024 * 1024) return;
    fs.renameSync(logFile, `${logFile}.1`);
    fs.closeSync(fs.openSync(logFile, 'a', 0o640));
    chownTo(logFile, runAs);
  } catch {}
}

async function ensureRoleAndDatabase(bin, layout, cfg) {
  // \gexec runs each generated statement on its own (CREATE DATABASE refuses a transaction),
  // and only when something is missing, so a warm start writes nothing.
  const role = `'${APP_USER}'`;
  const sql = [
    `SELECT format('CREATE ROLE %I LOGIN PASSWORD %L', ${role}, '${APP_PASSWORD}') WHERE NOT EXISTS (SELECT FROM pg_roles WHERE rolname = ${role}) \\gexec`,
    `SELECT format('ALTER ROLE %I LOGIN PASSWORD %L', ${role}, '${APP_PASSWORD}') FROM pg_authid WHERE rolname = ${role} AND (rolpassword IS NULL OR NOT rolcanlogin) \\gexec`,
    cfg.createdb
      ? `SELECT format('ALTER ROLE %I CREATEDB', ${role}) FROM pg_roles WHERE rolname = ${role} AND NOT rolcreatedb \\gexec`
      : '',
    `SELECT format('CREATE DATABASE %I OWNER %I', '${cfg.database}', ${role}) WHERE NOT EXISTS (SELECT FROM pg_database WHERE datname = '${cfg.database}') \\gexec`,
    '',
  ].join('\n');
  const args = ['-X', '-q', '-v', 'ON_ERROR_STOP=1', '-h', layout.socketDir, '-p', String(cfg.port),
    '-U', ADMIN_USER, '-d', 'postgres', '-f', '-'];
  let r;
  for (let attempt = 0; attempt < 100; attempt++) {
    r = await run(bin.psql, args, { input: sql });
    // exit code 2 = could not connect: the server may still be finishing start-up
    if (r.code !== 2) break;
    await sleep(100);
  }
  if (r.code !== 0) throw new Error(`Creating role/database in the ${cfg.kind} cluster failed:\n${r.stderr.trim()}`);
}

// ---------------------------------------------------------------------------------------
// Lock: one pg.mjs at a time per cluster (initdb and start must not race)

async function withLock(kind, fn) {
  fs.mkdirSync(PG_BASE, { recursive: true, mode: 0o755 });
  if (IS_ROOT) fs.chmodSync(PG_BASE, 0o755); // root's umask may be 077; postgres must traverse
  const lockFile = path.join(PG_BASE, `${kind}.lock`);
  const deadline = Date.now() + 180_000;
  for (;;) {
    try {
      fs.writeFileSync(lockFile, `${process.pid}\n`, { flag: 'wx' });
      break;
    } catch (err) {
      if (err.code !== 'EEXIST') throw err;
    }
    const holder = Number(fs.readFileSync(lockFile, 'utf8').trim() || 0);
    if (!holder || !procInfo(holder).alive) {
      fs.rmSync(lockFile, { force: true }); // its owner died
      continue;
    }
    if (Date.now() > deadline) throw new Error(`Timed out waiting for ${lockFile} (held by pid ${holder}).`);
    await sleep(100);
  }
  try {
    return await fn();
  } finally {
    fs.rmSync(lockFile, { force: true });
  }
}

// ---------------------------------------------------------------------------------------
// Processes

function childEnv(extra = {}) {
  // Our arguments are explicit; a stray PGDATA/PGHOST/PGPORT from the shell must not win.
  const env = Object.fromEntries(Object.entries(process.env).filter(([k]) => !k.startsWith('PG')));
  return { ...env, ...extra };
}

// Close every inherited descriptor above 2 before exec. Node opens its own files
// close-on-exec, but descriptors it inherited (a `flock 9>…` wrapper, a CI runner's pipe)
// would otherwise pass into the long-lived server and hold locks or EOFs for its lifetime.
const PERL_CLOSE_FDS =
  'opendir(my $d, "/proc/self/fd") or die "$!\\n"; my @fds = grep { /^\\d+$/ && $_ > 2 } readdir $d; ' +
  'closedir $d; POSIX::close($_) for @fds; exec { $ARGV[0] } @ARGV or die "exec $ARGV[0]: $!\\n";';

function run(cmd, args, { input, stdio, env, detached = false, closeFds = false, echo = false } = {}) {
  if (closeFds && fs.existsSync('/usr/bin/perl')) {
    [cmd, args] = ['/usr/bin/perl', ['-MPOSIX', '-e', PERL_CLOSE_FDS, cmd, ...args]];
  }
  return new Promise((resolve, reject) => {
    const child = spawn(cmd, args, {
      cwd: '/', // the server user may not be allowed into the caller's folder
      env: env ?? childEnv(),
      stdio: stdio ?? [input === undefined ? 'ignore' : 'pipe', 'pipe', 'pipe'],
      detached,
    });
    let stdout = '';
    let stderr = '';
    child.stdout?.on('data', (d) => {
      stdout += d;
      if (echo) process.stderr.write(d);
    });
    child.stderr?.on('data', (d) => {
      stderr += d;
      if (echo) process.stderr.write(d);
    });
    child.on('error', reject);
    child.on('close', (code, signal) => resolve({ code: code ?? 128, signal, stdout, stderr }));
    if (input !== undefined) child.stdin.end(input);
  });
}

function runAsServerUser(layout, cmd, args, options) {
  if (!IS_ROOT) return run(cmd, args, options);
  return run('/usr/sbin/runuser', ['-u', layout.runAs.name, '--', cmd, ...args], options);
}

/**
 * apt-get install as root, waiting out a held apt/dpkg lock (another install may be running)
 * and running `apt-get update` first when asked or when a package has no candidate yet.
 */
export async function aptInstall(packages, { updateFirst = false, log = defaultLog, timeoutMs = 300_000 } = {}) {
  if (!IS_ROOT) throw new Error(`Installing ${packages.join(' ')} needs root.`);
  const env = childEnv({ DEBIAN_FRONTEND: 'noninteractive' });
  const deadline = Date.now() + timeoutMs;
  const lockHeld = (text) => /Could not get lock|Unable to acquire the dpkg frontend lock|Unable to lock/i.test(text);
  const apt = async (args) => {
    for (let waited = false; ;) {
      log(`apt-get ${args.join(' ')}`);
      // apt's own lock wait covers dpkg's lock; we retry for the lists lock of `update`.
      const r = await run('apt-get', ['-o', 'DPkg::Lock::Timeout=120', ...args],
        { env, closeFds: true, echo: true });
      const text = r.stdout + r.stderr;
      if (r.code === 0 || !lockHeld(text) || Date.now() > deadline) return { ...r, text };
      if (!waited) log('apt is busy (another install holds its lock); waiting');
      waited = true;
      await sleep(5000);
    }
  };
  if (updateFirst) await apt(['update']);
  let r = await apt(['install', '-y', ...packages]);
  if (r.code !== 0 && /dpkg was interrupted/i.test(r.text)) {
    log('a previous dpkg run was interrupted; running `dpkg --configure -a`');
    await run('dpkg', ['--configure', '-a'], { env, closeFds: true, echo: true });
    r = await apt(['install', '-y', ...packages]);
  }
  if (r.code !== 0 && !updateFirst && /Unable to locate package|has no installation candidate/i.test(r.text)) {
    await apt(['update']);
    r = await apt(['install', '-y', ...packages]);
  }
  if (r.code !== 0) throw new Error(`apt-get install -y ${packages.join(' ')} failed (exit ${r.code}).`);
}

// ---------------------------------------------------------------------------------------
// CLI

async function main(argv) {
  const [command, ...flags] = argv;
  const kind = flags.includes('--test') ? 'test' : 'dev';
  switch (command) {
    case 'start': {
      const pg = await ensurePostgres({ kind });
      process.stdout.write(`DATABASE_URL=${pg.url}\n`);
      return 0;
    }
    case 'stop': {
      const { wasRunning } = await stopPostgres({ kind });
      defaultLog(wasRunning ? `${kind} cluster stopped` : `${kind} cluster was not running`);
      return 0;
    }
    case 'status': {
      const s = await postgresStatus({ kind });
      if (s.running) {
        process.stdout.write(`${kind}: running (pid ${s.pid}) on ${HOST}:${s.port}\n` +
          `  data   ${s.dataDir}\n  socket ${s.socketDir}\n  log    ${s.logFile}\n  url    ${s.url}\n`);
        return 0;
      }
      const why = s.stale ? ' (stale postmaster.pid from a crash; `start` will clean it up)' : '';
      process.stdout.write(`${kind}: stopped${why}${s.dataDir ? `\n  data   ${s.dataDir}` : ' (no cluster yet)'}\n`);
      return 3;
    }
    case 'url':
      process.stdout.write(`${postgresUrl({ kind })}\n`);
      return 0;
    default:
      process.stderr.write('usage: node scripts/pg.mjs start|stop|status|url [--test]\n');
      return 64;
  }
}

const invokedDirectly = process.argv[1] && fs.realpathSync(process.argv[1]) === fileURLToPath(import.meta.url);
if (invokedDirectly) {
  main(process.argv.slice(2)).then(
    (code) => process.exit(code),
    (err) => {
      process.stderr.write(`pg.mjs: ${err.message}\n`);
      process.exit(1);
    },
  );
}
