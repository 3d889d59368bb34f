/**
 * End-to-end harness: the real server (createApp + the exported web build in dist/) on a fresh
 * seeded database, and Debian's Chromium driven by playwright-core.
 */
import fs from 'node:fs';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { seedDemo, type DemoIds, DEMO_PASSWORD } from '../../db/seed';
import type { Mailer } from '../../server/mail/mailer';
import { startTestServer, type TestServer } from '../helpers/server';

export const PHONE = { width: 390, height: 844 } as const;
export const WIDE = { width: 1440, height: 900 } as const;
export const VIEWPORTS = { phone: PHONE, wide: WIDE } as const;

const root = path.resolve(__dirname, '../..');
export const SHOTS_DIR = path.join(root, 'test-results', 'screens');

export interface E2e {
  server: TestServer;
  ids: DemoIds;
  baseUrl: string;
  browser: Browser;
  close(): Promise<void>;
}

export async function startE2e(opts: { mailer?: Mailer } = {}): Promise<E2e> {
  const dist = path.join(root, 'dist');
  if (!fs.existsSync(path.join(dist, 'index.html'))) {
    throw new Error('dist/index.html is missing: run `npm test` (it builds the web app) or `npm run export:web`.');
  }
  const server = await startTestServer({ webDir: dist, mailer: opts.mailer });
  const ids = await seedDemo(server.testDb.db, { now: server.clock.now });
  const http: Server = await new Promise((resolve) => {
    const s = server.app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const { port } = http.address() as AddressInfo;
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  return {
    server,
    ids,
    baseUrl: `http://127.0.0.1:${port}`,
    browser,
    async close() {
      await browser.close();
      await new Promise<void>((resolve) => http.close(() => resolve()));
      await server.close();
    },
  };
}

export async function newPage(e: E2e, viewport: { width: number; height: number } = PHONE): Promise<{ context: BrowserContext; page: Page }> {
  const context = await e.browser.newContext({ viewport, baseURL: e.baseUrl, deviceScaleFactor: 1 });
  const page = await context.newPage();
  page.setDefaultTimeout(15_000);
  return { context, page };
}

export const byTestId = (page: Page, id: string) => page.locator(`[data-testid="${id}"]`);

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto('/sign-in');
  await byTestId(page, 'sign-in-email').fill(email);
  await byTestId(page, 'sign-in-password').fill(password);
  await byTestId(page, 'sign-in-submit').click();
}

/** Saves a screenshot to test-results/screens/<name>-<w>x<h>.png (git-ignored) for a person to judge. */
export async function shot(page: Page, name: string) {
  fs.mkdirSync(SHOTS_DIR, { recursive: true });
  const vp = page.viewportSize();
  await page.screenshot({ path: path.join(SHOTS_DIR, `${name}-${vp?.width}x${vp?.height}.png`), fullPage: true });
}
