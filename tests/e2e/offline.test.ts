/**
 * Offline at an out-apiary, in Chromium against the exported web build:
 * (a) a keeper who opened the app once opens it again with no connection: the shell comes from the
 *     service worker (public/sw.js), the Due list and the hives from the query cache kept on the
 *     device (React Query persistence);
 * (b) a Quick check and a feeding recorded offline wait in the queue ("2 records waiting"), which
 *     survives closing the page; back online they send themselves, the queue empties and the API
 *     holds exactly one record of each (each went with its draft's Idempotency-Key);
 * (c) a record the server refuses on sending (a sitter whose window ended while she was offline:
 *     403) stays in the queue with the server's reason, and can be sent again or discarded;
 * (d) screenshots of the queue at 390 × 844 and 1440 × 900 for a person to judge.
 * Offline is real: this file serves the app on a listener of its own and closes it (every socket
 * too) while "offline", besides Chromium's emulation (`context.setOffline`, which sets
 * navigator.onLine but does not cover a service worker's own fetches — a known Playwright gap).
 */
import http from 'node:http';
import type { AddressInfo, Socket } from 'node:net';
import type { BrowserContext, Page } from 'playwright-core';
import { byTestId, PHONE, shot, signIn, startE2e, WIDE, type E2e } from './harness';

jest.setTimeout(240_000);

const KEEPER = 'keeper@frameside.test';
const SITTER = 'sitter@frameside.test';
const DAY = 86_400_000;

let e: E2e;
let listener: http.Server | null = null;
let port = 0;
const sockets = new Set<Socket>();

async function listen() {
  const l = http.createServer(e.server.app);
  l.on('connection', (sock) => {
    sockets.add(sock);
    sock.on('close', () => sockets.delete(sock));
  });
  await new Promise<void>((resolve) => l.listen(port, '127.0.0.1', resolve));
  port = (l.address() as AddressInfo).port;
  listener = l;
}

async function unlisten() {
  const l = listener;
  listener = null;
  if (!l) return;
  const closed = new Promise<void>((resolve) => l.close(() => resolve()));
  for (const sock of sockets) sock.destroy();
  await closed;
}

beforeAll(async () => {
  e = await startE2e();
  await listen();
});
afterAll(async () => {
  // eslint-disable-next-line no-console
  console.log(`offline e2e: first offline reloads retried: ${offlineReloadRetries}`);
  await unlisten();
  await e?.close();
});

async function newPage(viewport: { width: number; height: number }) {
  const context = await e.browser.newContext({ viewport, baseURL: `http://127.0.0.1:${port}`, deviceScaleFactor: 1 });
  const page = await context.newPage();
  page.setDefaultTimeout(15_000);
  return { context, page };
}

async function count(sql: string, params: unknown[] = []): Promise<number> {
  const r = await e.server.testDb.db.$client.query<{ n: number }>(sql, params);
  return r.rows[0]!.n;
}

/**
 * Waits until the service worker is active and has kept the shell and the fonts, and the query
 * cache was written to the device after `since` (ms) with the hive, its Quick checks and the Due list.
 */
async function waitUntilKeptForOffline(page: Page, hiveId: string, since = 0) {
  await page.waitForFunction(
    async ([id, after]) => {
      const reg = await navigator.serviceWorker.getRegistration();
      if (reg?.active?.state !== 'activated') return false;
      const names = await caches.keys();
      const shell = names.find((n) => n.startsWith('frameside-shell-'));
      if (!shell) return false;
      const keys = (await (await caches.open(shell)).keys()).map((r) => r.url);
      const kept = keys.some((u) => u.endsWith('/index.html')) && keys.some((u) => u.includes('/_expo/static/js/')) && keys.some((u) => u.endsWith('.ttf'));
      const cache = localStorage.getItem('frameside:offline-cache') ?? '';
      const written = cache ? (JSON.parse(cache) as { timestamp?: number }).timestamp ?? 0 : 0;
      return kept && written > after && cache.includes(`["hives","detail","${id}"]`) && cache.includes(`["records","hive","${id}","inspection"]`) && cache.includes('["due","list"');
    },
    [hiveId, since] as const,
    { timeout: 30_000, polling: 250 },
  );
}

/**
 * Reloads with no connection. Now and then (about 1 run in 4 here) Chromium's offline emulation
 * fails the first offline reload of a freshly registered worker's page with
 * ERR_INTERNET_DISCONNECTED before the worker answers; a second reload is served by the worker.
 * The retries are counted and printed, so the figure stays visible.
 */
let offlineReloadRetries = 0;
async function reloadOffline(page: Page) {
  try {
    await page.reload();
  } catch (err) {
    if (!String(err).includes('ERR_INTERNET_DISCONNECTED')) throw err;
    offlineReloadRetries++;
    await page.waitForTimeout(1000);
    await page.reload();
  }
}

const summary = (page: Page) => byTestId(page, 'offline-queue-summary');

/** Waits until the device's copy holds `n` waiting records (what a closed tab would leave). */
async function waitUntilKept(page: Page, n: number) {
  await page.waitForFunction(
    (want) => {
      const raw = localStorage.getItem('frameside:offline-cache');
      if (!raw) return false;
      const mutations = (JSON.parse(raw) as { clientState?: { mutations?: unknown[] } }).clientState?.mutations ?? [];
      return mutations.length === want;
    },
    n,
    { polling: 100 },
  );
}

/** No signal: the browser says offline and the server cannot be reached at all; and back. */
async function goOffline(context: BrowserContext, on: boolean) {
  if (on) {
    await context.setOffline(true);
    await unlisten();
  } else {
    await listen();
    await context.setOffline(false);
  }
}

describe('offline at an out-apiary', () => {
  it('opens without a connection, queues a Quick check and a feeding that survive a closed page, and sends each once when the signal returns', async () => {
    const { context, page } = await newPage(PHONE);
    const ash = e.ids.hives.Ash!;
    const bramble = e.ids.hives.Bramble!;
    await signIn(page, KEEPER);
    await byTestId(page, 'due-screen').waitFor();
    await page.locator('[data-testid^="due-task-"]').first().waitFor();
    const dueOnline = await page.locator('[data-testid^="due-task-"]').count();
    await waitUntilKeptForOffline(page, ash);

    // (a) No connection, reload: the shell, the Due list and the hives are there.
    await goOffline(context, true);
    await reloadOffline(page);
    await byTestId(page, 'due-screen').waitFor();
    await byTestId(page, 'offline-status').waitFor();
    expect(await page.locator('[data-testid^="due-task-"]').count()).toBe(dueOnline);
    expect(dueOnline).toBeGreaterThan(0);
    // The shipped typeface came from the kept copy too (not a fallback).
    await page.waitForFunction(() => [...document.fonts].some((f) => f.family.replace(/"/g, '') === 'Atkinson Hyperlegible' && f.status === 'loaded'));
    await page.goto(`/apiaries/${e.ids.orchardRow}`);
    await byTestId(page, 'apiary-screen').waitFor();
    for (const name of ['Ash', 'Bramble', 'Clover', 'Damson', 'Elder', 'Fennel']) await page.getByText(name, { exact: true }).first().waitFor();

    const checksBefore = await count('select count(*)::int as n from inspections where hive_id = $1', [ash]);
    const feedsBefore = await count('select count(*)::int as n from feedings where hive_id = $1', [bramble]);

    // (b) A Quick check and a feeding, recorded offline.
    await page.goto(`/hives/${ash}/check`);
    await byTestId(page, 'quick-check-basis').waitFor();
    await byTestId(page, 'quick-check-save').click();
    await byTestId(page, 'quick-check-screen').waitFor({ state: 'detached' });
    await waitUntilKept(page, 1);
    await page.goto(`/hives/${bramble}/feeding`);
    await byTestId(page, 'feeding-save').waitFor();
    await byTestId(page, 'feeding-save').click();
    await byTestId(page, 'feeding-screen').waitFor({ state: 'detached' });
    await waitUntilKept(page, 2);
    await expect(summary(page).textContent()).resolves.toContain('2 records waiting to send');
    await byTestId(page, 'offline-queue-toggle').click();
    await expect(page.locator('[data-testid="offline-record-waiting"]').count()).resolves.toBe(2);
    // Signing out would clear the device: refused while records wait.
    await byTestId(page, 'nav-sign-out').click();
    await page.getByText('2 records are still waiting on this device. Send or discard them before signing out.').waitFor();
    await page.goto('/');
    await byTestId(page, 'offline-queue-toggle').click();
    await byTestId(page, 'offline-queue-list').waitFor();
    await shot(page, 'offline-queue-waiting');
    expect(await count('select count(*)::int as n from inspections where hive_id = $1', [ash])).toBe(checksBefore);

    // Closed page, new page, still offline: the queue is still there.
    await page.close();
    const again = await context.newPage();
    again.setDefaultTimeout(15_000);
    await again.goto('/');
    await expect(summary(again).textContent()).resolves.toContain('2 records waiting to send');

    // Back online: both go, the queue empties, one record each.
    await goOffline(context, false);
    await byTestId(again, 'offline-queue').waitFor({ state: 'detached', timeout: 20_000 });
    expect(await count('select count(*)::int as n from inspections where hive_id = $1', [ash])).toBe(checksBefore + 1);
    expect(await count('select count(*)::int as n from feedings where hive_id = $1', [bramble])).toBe(feedsBefore + 1);
    // Each went with its own key, once (a resend would have replayed the stored answer).
    expect(
      await count("select count(*)::int as n from idempotency_keys where path in ($1, $2) and status = 201", [`/api/hives/${ash}/inspections`, `/api/hives/${bramble}/feedings`]),
    ).toBe(2);
    await context.close();
  });

  it('keeps a record the server refuses on sending (the sitter’s window ended while offline) with the reason, to send again or discard', async () => {
    const { context, page } = await newPage(WIDE);
    const clover = e.ids.hives.Clover!;
    const damson = e.ids.hives.Damson!;
    await signIn(page, SITTER);
    await byTestId(page, 'due-screen').waitFor();
    await waitUntilKeptForOffline(page, clover);
    await waitUntilKeptForOffline(page, damson);
    await goOffline(context, true);
    await reloadOffline(page);
    await byTestId(page, 'due-screen').waitFor();
    for (const hive of [clover, damson]) {
      await page.goto(`/hives/${hive}/feeding`);
      await byTestId(page, 'feeding-save').click();
      await byTestId(page, 'feeding-screen').waitFor({ state: 'detached' });
    }
    await waitUntilKept(page, 2);
    await expect(summary(page).textContent()).resolves.toContain('2 records waiting to send');

    // The window (today − 3 d … today + 11 d in the demo) ends while she is out of signal.
    const realNow = e.server.clock.now;
    e.server.clock.set(new Date(realNow.getTime() + 12 * DAY));
    const feeds = (hive: string) => count('select count(*)::int as n from feedings where hive_id = $1', [hive]);
    const before = { clover: await feeds(clover), damson: await feeds(damson) };
    await goOffline(context, false);
    await page.locator('[data-testid="offline-record-refused"]').nth(1).waitFor({ timeout: 20_000 });
    const reasons = await page.locator('[data-testid="offline-record-reason"]').allTextContents();
    expect(reasons).toHaveLength(2);
    for (const reason of reasons) {
      expect(reason).toMatch(/^Refused: /);
      expect(reason.length).toBeGreaterThan('Refused: '.length + 10);
    }
    await expect(summary(page).textContent()).resolves.toContain('2 items not taken by the server');
    expect({ clover: await feeds(clover), damson: await feeds(damson) }).toEqual(before);
    await shot(page, 'offline-queue-refused');
    await page.setViewportSize(PHONE);
    await page.waitForTimeout(500);
    await shot(page, 'offline-queue-refused');
    await page.setViewportSize(WIDE);

    // They survive a reload with their reasons…
    await waitUntilKept(page, 2);
    await page.reload();
    await page.locator('[data-testid="offline-record-refused"]').nth(1).waitFor();
    // …one is discarded on purpose (two taps: nothing stored), and once the owner extends her
    // window (here: the clock back inside it) the other is sent again with the same key.
    await byTestId(page, 'offline-record-discard').nth(1).click();
    await byTestId(page, 'offline-record-discard-confirm').click();
    await page.waitForFunction(() => document.querySelectorAll('[data-testid="offline-record-refused"]').length === 1);
    e.server.clock.set(realNow);
    await byTestId(page, 'offline-record-retry').click();
    await byTestId(page, 'offline-queue').waitFor({ state: 'detached', timeout: 20_000 });
    const after = { clover: await feeds(clover), damson: await feeds(damson) };
    expect(after.clover + after.damson).toBe(before.clover + before.damson + 1);
    await context.close();
  });
});
