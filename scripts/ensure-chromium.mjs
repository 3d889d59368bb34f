#!/usr/bin/env node
// Debian's Chromium for the end-to-end tests (playwright-core with executablePath).
// Never `npx playwright install`: it downloads its own browser, which fails on these machines.
//
//   node scripts/ensure-chromium.mjs     prints the executable path
//
// Node built-ins only (plus the apt helper in pg.mjs, which is built-ins only too).

import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import { fileURLToPath } from 'node:url';
import { aptInstall } from './pg.mjs';

const CHROMIUM = '/usr/bin/chromium';
const IS_ROOT = process.getuid?.() === 0;
const MISSING_MESSAGE =
  `Chromium was not found at ${CHROMIUM}. ` +
  "Install Debian's package `chromium` (e.g. `sudo apt-get install -y chromium`).";

const sleep = (ms) => new Promise((resolve) => setTimeout(resolve, ms));
const defaultLog = (message) => process.stderr.write(`[chromium] ${message}\n`);

/** dpkg's view of the package: 'installed', 'missing', 'in-progress' (unpacked, half-configured…) or 'unknown'. */
function packageState() {
  const r = spawnSync('dpkg-query', ['-W', '-f=${Status}', 'chromium'], { encoding: 'utf8' });
  if (r.error) return 'unknown'; // no dpkg: judge by the file alone
  if (r.status !== 0) return 'missing';
  const [, , status] = r.stdout.trim().split(' ');
  if (status === 'installed') return 'installed';
  if (status === 'not-installed' || status === 'config-files') return 'missing';
  return 'in-progress';
}

function isExecutable(file) {
  try {
    fs.accessSync(file, fs.constants.X_OK);
    return true;
  } catch {
    return false;
  }
}

// The launcher script can exist before dpkg has finished unpacking the rest of the package
// (an install may be running in the background right now), so trust dpkg's status too.
function ready() {
  const state = packageState();
  return isExecutable(CHROMIUM) && (state === 'installed' || state === 'unknown');
}

/** Returns the path of a usable Chromium, installing Debian's package as root if needed. */
export async function ensureChromium({ log = defaultLog, timeoutMs = 300_000 } = {}) {
  log = log || (() => {});
  if (ready()) return CHROMIUM;

  if (!IS_ROOT) {
    // Someone (root) may be installing it right now: give that a few minutes to finish.
    if (packageState() !== 'in-progress') throw new Error(MISSING_MESSAGE);
    log('chromium is being installed by apt right now; waiting for it to finish');
    const deadline = Date.now() + timeoutMs;
    while (Date.now() < deadline) {
      await sleep(2000);
      if (ready()) return CHROMIUM;
      if (packageState() === 'missing') break;
    }
    throw new Error(MISSING_MESSAGE);
  }

  // apt-get waits for (and retries on) a lock held by a background install; if that
  // install already finished the package, this is a quick no-op that confirms it.
  log(`${CHROMIUM} is not ready (dpkg: ${packageState()}); running \`apt-get install -y chromium\``);
  await aptInstall(['chromium'], { log, timeoutMs });
  if (!ready()) throw new Error(`apt-get install chromium finished, but ${CHROMIUM} is still not usable.`);
  return CHROMIUM;
}

const invokedDirectly = process.argv[1] && fs.realpathSync(process.argv[1]) === fileURLToPath(import.meta.url);
if (invokedDirectly) {
  ensureChromium().then(
    (file) => process.stdout.write(`${file}\n`),
    (err) => {
      process.stderr.write(`ensure-chromium.mjs: ${err.message}\n`);
      process.exit(1);
    },
  );
}
