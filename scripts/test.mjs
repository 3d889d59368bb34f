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

// Two passes: the unit, server and component suites two at a time, then the browser suites one
// at a time (two Chromiums beside the server suites on two cores make sign-in waits flaky).
// With arguments of your own, one pass does exactly what you asked.
const passes = args.length
  ? [{ name: 'selected', jestArgs: ['--maxWorkers=2', ...args] }]
  : [
      { name: 'unit-server-components', jestArgs: ['--maxWorkers=2', '--selectProjects', 'shared', 'server', 'components'] },
      { name: 'e2e', jestArgs: ['--runInBand', '--selectProjects', 'e2e'] },
    ];

let passed = 0;
let failed = 0;
let skipped = 0;
let allOk = true;
fs.mkdirSync(path.join(root, '.tmp'), { recursive: true });
for (const pass of passes) {
  const out = path.join(root, '.tmp', `jest-results-${pass.name}.json`);
  fs.rmSync(out, { force: true });
  const r = spawnSync(bin('jest'), [...pass.jestArgs, '--json', `--outputFile=${out}`], {
    cwd: root,
    stdio: 'inherit',
    env: { ...process.env, FRAMESIDE_TEST_DATABASE_URL: pg.url, TZ: 'UTC' },
  });
  if (r.status !== 0) allOk = false;
  if (fs.existsSync(out)) {
    const res = JSON.parse(fs.readFileSync(out, 'utf8'));
    passed += res.numPassedTests;
    // A suite that failed to load has no failed tests of its own; count it so it cannot hide.
    failed += res.numFailedTests + res.numRuntimeErrorTestSuites;
    skipped += res.numPendingTests + res.numTodoTests;
  } else {
    failed += 1;
  }
}
console.log(`\nTests took ${((Date.now() - t0) / 1000).toFixed(0)} s in all.`);
console.log(`${passed} passed, ${failed} failed, ${skipped} skipped`);
process.exit(allOk && failed === 0 && passed > 0 ? 0 : 1);
