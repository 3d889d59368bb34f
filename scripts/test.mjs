// `npm test`: the same set-up as `npm start` (packages, PostgreSQL, web build, Chromium), then
// every Jest project (shared, server, components, e2e), then one closing line that CI reads:
// "N passed, N failed, N skipped". Extra arguments go to Jest (e.g. `npm test -- --selectProjects server`).
import fs from 'node:fs';
import path from 'node:path';
import { spawnSync } from 'node:child_process';
import { ensureDeps, exportWeb, root, run, step, bin } from './lib.mjs';

const args = process.argv.slice(2);
const t0 = Date.now();
ensureDeps();
const { ensurePostgres } = await import('./pg.mjs');
const { ensureChromium } = await import('./ensure-chromium.mjs');
const pg = await ensurePostgres({ kind: 'test' });
step(`Test PostgreSQL on 127.0.0.1:${pg.port}`);
run(bin('tsx'), ['tests/helpers/prepare-template.ts'], { env: { FRAMESIDE_TEST_DATABASE_URL: pg.url } });

const wantE2e = !args.includes('--selectProjects') || args.join(' ').includes('e2e');
if (wantE2e) {
  const chromium = await ensureChromium();
  process.env.CHROMIUM_PATH = chromium;
  exportWeb();
}
step(`Set-up done in ${((Date.now() - t0) / 1000).toFixed(0)} s; running the tests`);

const out = path.join(root, '.tmp', 'jest-results.json');
fs.mkdirSync(path.dirname(out), { recursive: true });
fs.rmSync(out, { force: true });
const r = spawnSync(bin('jest'), ['--maxWorkers=2', '--json', `--outputFile=${out}`, ...args], {
  cwd: root,
  stdio: 'inherit',
  env: { ...process.env, FRAMESIDE_TEST_DATABASE_URL: pg.url, TZ: 'UTC' },
});

let passed = 0;
let failed = 0;
let skipped = 0;
if (fs.existsSync(out)) {
  const res = JSON.parse(fs.readFileSync(out, 'utf8'));
  passed = res.numPassedTests;
  // A suite that failed to load has no failed tests of its own; count it so it cannot hide.
  failed = res.numFailedTests + res.numRuntimeErrorTestSuites;
  skipped = res.numPendingTests + res.numTodoTests;
} else {
  failed = 1;
}
console.log(`\nTests took ${((Date.now() - t0) / 1000).toFixed(0)} s in all.`);
console.log(`${passed} passed, ${failed} failed, ${skipped} skipped`);
process.exit(r.status === 0 && failed === 0 && passed > 0 ? 0 : 1);
