/**
 * Frame photos in Chromium against the exported web build: choose photos through the file
 * picker (expo-image-picker opens a file input on the web; Playwright's filechooser fills it),
 * see them upload and turn into thumbnails, open one large and step to the next; on the Quick
 * check a photo waits with the draft and goes once the check is saved, then shows in the Hive
 * story. Screenshots at 390 × 844 and 1440 × 900 go to test-results/screens/ for a person to judge.
 */
import fs from 'node:fs';
import net, { type AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { makeJpeg, withExif } from '../helpers/images';
import { byTestId, newPage, PHONE, shot, signIn, startE2e, WIDE, type E2e } from './harness';

jest.setTimeout(180_000);

const KEEPER = 'keeper@frameside.test';

const relays: { close(): Promise<void> }[] = [];

/** Waits until every <img> inside the selector has loaded real pixels. */
async function imagesLoaded(page: Page, selector: string, atLeast: number) {
  await page.waitForFunction(
    ([sel, n]) => {
      const imgs = Array.from(document.querySelectorAll(`${sel} img`)) as HTMLImageElement[];
      return imgs.length >= (n as number) && imgs.every((i) => i.complete && i.naturalWidth > 0);
    },
    [selector, atLeast] as const,
    { timeout: 60_000 },
  );
}

/**
 * A TCP relay in front of the test server whose uplink (browser → server) can be slowed to a
 * given rate, like one bar of signal at an out-apiary; the page talks only to the relay.
 */
async function slowUplinkRelay(target: string) {
  const { port: targetPort } = new URL(target);
  const state = { bytesPerSecond: 0 };
  const server = net.createServer((client) => {
    const upstream = net.connect(Number(targetPort), '127.0.0.1');
    upstream.on('error', () => client.destroy());
    client.on('error', () => upstream.destroy());
    upstream.pipe(client);
    client.on('data', (chunk: Buffer) => {
      upstream.write(chunk);
      if (state.bytesPerSecond > 0) {
        client.pause();
        setTimeout(() => client.resume(), (chunk.length / state.bytesPerSecond) * 1000);
      }
    });
    client.on('end', () => upstream.end());
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  const sockets = new Set<net.Socket>();
  server.on('connection', (c) => {
    sockets.add(c);
    c.on('close', () => sockets.delete(c));
  });
  const relay = {
    url: `http://127.0.0.1:${port}`,
    state,
    close: () =>
      new Promise<void>((resolve) => {
        for (const c of sockets) c.destroy();
        server.close(() => resolve());
      }),
  };
  relays.push(relay);
  return relay;
}

describe('frame photos in the browser', () => {
  let e: E2e;
  let dir: string;
  let files: string[];

  beforeAll(async () => {
    e = await startE2e();
    dir = fs.mkdtempSync(path.join(os.tmpdir(), 'frameside-e2e-photos-'));
    // Phone-like inputs: EXIF orientation 6 and a GPS position on the first, as a camera writes them.
    const inputs = [withExif(makeJpeg(1200, 900, { gradient: true, noise: 12 }), { orientation: 6, gps: true }), makeJpeg(1600, 1200, { gradient: true, noise: 6 }), makeJpeg(800, 600)];
    // A large, noisy one (≈ 6 MB) for the slow-uplink check: bigger than what the loopback socket buffers hold.
    inputs.push(makeJpeg(3000, 2400, { gradient: true, noise: 60, quality: 95 }));
    files = inputs.map((buf, i) => {
      const f = path.join(dir, `IMG_00${i + 1}.jpg`);
      fs.writeFileSync(f, buf);
      return f;
    });
  });
  afterAll(async () => {
    await Promise.all(relays.map((r) => r.close()));
    await e?.close();
    if (dir) fs.rmSync(dir, { recursive: true, force: true });
  });

  const choose = async (page: Page, button: string, paths: string[]) => {
    const [chooser] = await Promise.all([page.waitForEvent('filechooser'), byTestId(page, button).click()]);
    await chooser.setFiles(paths);
  };

  it('on a phone: adds frame photos from the hive page, shows thumbnails, opens one large and steps to the next', async () => {
    const { context, page } = await newPage(e, PHONE);
    await signIn(page, KEEPER);
    await byTestId(page, 'nav-apiaries').waitFor();
    await page.goto(`/hives/${e.ids.hives.Ash}`);
    await byTestId(page, 'hive-photo-picker-choose').waitFor();

    await byTestId(page, 'chips-photoTarget-frame').click();
    await byTestId(page, 'stepper-photoBox-inc').click();
    for (let i = 0; i < 4; i++) await byTestId(page, 'stepper-photoFrame-inc').click();
    await expect(byTestId(page, 'stepper-photoFrame-value').textContent()).resolves.toBe('5');
    await choose(page, 'hive-photo-picker-choose', [files[0]!]);
    await byTestId(page, 'chips-photoTarget-whole').click();
    await choose(page, 'hive-photo-picker-choose', [files[1]!]);

    const framed = page.locator('[aria-label="Box 2, frame 5. Open large"]');
    const whole = page.locator('[aria-label="Whole hive. Open large"]');
    await framed.waitFor({ timeout: 60_000 });
    await whole.waitFor({ timeout: 60_000 });
    await imagesLoaded(page, '[data-testid="hive-photos"]', 2);
    // The thumbnail is upright: the 1200 × 900 input carried orientation 6, so it is served taller than wide.
    const dims = await page.evaluate(async () => {
      const el = document.querySelector('[aria-label="Box 2, frame 5. Open large"] img') as HTMLImageElement;
      return { w: el.naturalWidth, h: el.naturalHeight };
    });
    expect(dims.h).toBeGreaterThan(dims.w);
    expect(Math.max(dims.w, dims.h)).toBe(320);
    await byTestId(page, 'hive-photos').scrollIntoViewIfNeeded();
    await shot(page, 'photos-hive');

    await framed.click();
    await byTestId(page, 'photo-viewer').waitFor();
    await expect(byTestId(page, 'photo-viewer-label').textContent()).resolves.toBe('Box 2, frame 5');
    await expect(byTestId(page, 'photo-viewer-position').textContent()).resolves.toBe('Photo 1 of 2');
    await expect(page.locator('[data-testid="photo-viewer"] img').first().getAttribute('alt')).resolves.toBe('Box 2, frame 5');
    await imagesLoaded(page, '[data-testid="photo-viewer"]', 1);
    await shot(page, 'photos-viewer');
    await byTestId(page, 'photo-viewer-next').click();
    await expect(byTestId(page, 'photo-viewer-position').textContent()).resolves.toBe('Photo 2 of 2');
    await expect(byTestId(page, 'photo-viewer-label').textContent()).resolves.toBe('Whole hive');
    await byTestId(page, 'photo-viewer-prev').click();
    await expect(byTestId(page, 'photo-viewer-position').textContent()).resolves.toBe('Photo 1 of 2');
    await byTestId(page, 'photo-viewer-close').click();
    await expect(byTestId(page, 'photo-viewer').count()).resolves.toBe(0);

    // The Quick check: the photo waits with the draft, and goes once the check is saved.
    await page.goto(`/hives/${e.ids.hives.Ash}/check`);
    await byTestId(page, 'quick-check-save').waitFor();
    await byTestId(page, 'chips-photoTarget-frame').click();
    await byTestId(page, 'stepper-photoFrame-inc').click();
    await byTestId(page, 'stepper-photoFrame-inc').click();
    await choose(page, 'check-photo-picker-choose', [files[2]!]);
    const waiting = page.locator('[data-testid^="check-photo-picker-queued-"][data-testid$="-state"]');
    await expect(waiting.first().textContent()).resolves.toBe('Goes with the check when you save it');
    await byTestId(page, 'check-photo-picker').scrollIntoViewIfNeeded();
    await shot(page, 'photos-quick-check');
    if ((await byTestId(page, 'chips-queenStatus-eggs-seen').getAttribute('aria-checked')) !== 'true') {
      await byTestId(page, 'chips-queenStatus-eggs-seen').click();
    }
    await byTestId(page, 'quick-check-save').click();
    await byTestId(page, 'hive-screen').waitFor();
    const storyThumb = page.locator('[data-testid^="story-photo-"][aria-label="Box 1, frame 3. Open large"]');
    await storyThumb.first().waitFor({ timeout: 60_000 });
    await storyThumb.first().scrollIntoViewIfNeeded();
    await imagesLoaded(page, '[data-testid^="story-photo-"]', 1);
    await shot(page, 'photos-story');
    await context.close();
  });

  it('on a wide screen: the photos, progress on a slow uplink, waiting without signal, the large view and delete', async () => {
    const relay = await slowUplinkRelay(e.baseUrl);
    const context = await e.browser.newContext({ viewport: WIDE, baseURL: relay.url, deviceScaleFactor: 1 });
    const page = await context.newPage();
    page.setDefaultTimeout(15_000);
    await signIn(page, KEEPER);
    await byTestId(page, 'nav-apiaries').waitFor();
    await page.goto(`/hives/${e.ids.hives.Ash}`);
    const framed = page.locator('[aria-label="Box 2, frame 5. Open large"]');
    await framed.waitFor({ timeout: 60_000 });
    await imagesLoaded(page, '[data-testid="hive-photos"]', 3);
    await byTestId(page, 'hive-photos').scrollIntoViewIfNeeded();
    await shot(page, 'photos-hive');

    // A slow uplink (about 600 KB/s): the upload shows its progress.
    relay.state.bytesPerSecond = 600 * 1024;
    await choose(page, 'hive-photo-picker-choose', [files[3]!]);
    const bar = page.locator('[data-testid="hive-photo-picker-queued-progress"]');
    await bar.waitFor();
    await page.waitForFunction(() => {
      const el = document.querySelector('[data-testid="hive-photo-picker-queued-progress"]');
      const now = Number(el?.getAttribute('aria-valuenow') ?? 0);
      return now > 0 && now < 100;
    });
    await byTestId(page, 'hive-photo-picker-queue').scrollIntoViewIfNeeded();
    await shot(page, 'photos-uploading');
    await bar.waitFor({ state: 'detached', timeout: 60_000 });
    relay.state.bytesPerSecond = 0;

    // No signal: the photo waits on the device with a Retry, and sends itself when the connection is back.
    const cdp = await context.newCDPSession(page);
    await cdp.send('Network.enable');
    const offline = (on: boolean) => cdp.send('Network.emulateNetworkConditions', { offline: on, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });
    await offline(true);
    await choose(page, 'hive-photo-picker-choose', [files[2]!]);
    const state = page.locator('[data-testid="hive-photo-picker-queued-state"]');
    await page.waitForFunction(() => /^No signal/.test(document.querySelector('[data-testid="hive-photo-picker-queued-state"]')?.textContent ?? ''));
    await byTestId(page, 'hive-photo-picker-queued-retry').waitFor();
    const stored = await page.evaluate(
      () =>
        new Promise<number>((resolve) => {
          const req = indexedDB.open('frameside-photos');
          req.onsuccess = () => {
            const get = req.result.transaction('waiting').objectStore('waiting').count();
            get.onsuccess = () => resolve(get.result);
          };
          req.onerror = () => resolve(-1);
        }),
    );
    expect(stored).toBe(1);
    await offline(false);
    await state.first().waitFor({ state: 'detached', timeout: 60_000 });
    await page.waitForFunction(() => document.querySelectorAll('[data-testid="hive-photos"] [aria-label$="Open large"]').length === 5, undefined, { timeout: 60_000 });
    await cdp.detach();
    await framed.click();
    await byTestId(page, 'photo-viewer').waitFor();
    await imagesLoaded(page, '[data-testid="photo-viewer"]', 1);
    await expect(byTestId(page, 'photo-viewer-position').textContent()).resolves.toBe('Photo 1 of 5');
    await page.keyboard.press('ArrowRight');
    await expect(byTestId(page, 'photo-viewer-position').textContent()).resolves.toBe('Photo 2 of 5');
    await page.keyboard.press('ArrowLeft');
    await imagesLoaded(page, '[data-testid="photo-viewer"]', 1);
    await shot(page, 'photos-viewer');
    // Delete asks first: one tap arms it, the second deletes.
    for (let i = 0; i < 4; i++) await byTestId(page, 'photo-viewer-next').click();
    await expect(byTestId(page, 'photo-viewer-position').textContent()).resolves.toBe('Photo 5 of 5');
    await byTestId(page, 'photo-viewer-delete').click();
    await expect(byTestId(page, 'photo-viewer-delete').textContent()).resolves.toBe('Tap again to delete');
    await byTestId(page, 'photo-viewer-delete').click();
    // The list refreshes after the server has deleted it.
    await page.waitForFunction(() => document.querySelector('[data-testid="photo-viewer-position"]')?.textContent === 'Photo 4 of 4');
    await page.keyboard.press('Escape');
    await expect(byTestId(page, 'photo-viewer').count()).resolves.toBe(0);
    await expect(page.locator('[data-testid="hive-photos"] [aria-label$="Open large"]').count()).resolves.toBe(4);
    await context.close();
  });
});
