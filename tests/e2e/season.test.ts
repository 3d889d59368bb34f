/**
 * The Season review in Chromium: wide (1440 × 900) and phone (390 × 844) screenshots of the
 * hive and apiary reviews, hovering a chart shows a record, the print view fits A4 and Letter,
 * and the sensor import screen previews and imports a file.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { byTestId, newPage, shot, signIn, startE2e, PHONE, WIDE, SHOTS_DIR, type E2e } from './harness';
import { asc } from 'drizzle-orm';
import * as schema from '../../db/schema';

jest.setTimeout(180_000);

/**
 * A screenshot of the whole screen: the app scrolls inside a fixed-height frame, so a full-page
 * shot would stop at the window; the window is made as tall as the content for the picture.
 */
async function fullShot(page: Page, name: string) {
  const vp = page.viewportSize()!;
  const height = await page.evaluate(() => {
    const scrollers = [...document.querySelectorAll('[data-testid="season-screen"] div')].filter((el) => el.scrollHeight > el.clientHeight + 10);
    return Math.max(0, ...scrollers.map((el) => el.scrollHeight));
  });
  await page.setViewportSize({ width: vp.width, height: Math.min(12_000, Math.max(vp.height, height + 200)) });
  await page.waitForTimeout(200);
  await shot(page, `${name}-full`);
  await page.setViewportSize(vp);
}

let e: E2e;
let year: number;
beforeAll(async () => {
  e = await startE2e();
  // The season of the demo's hive-scale log for Ash (it follows the demo records' season).
  const db = e.server.testDb.db;
  const [first] = await db.select({ at: schema.sensorReadings.at }).from(schema.sensorReadings).orderBy(asc(schema.sensorReadings.at)).limit(1);
  year = first.at.getUTCFullYear();
  // When the demo has no records for Ash this season yet, add a few (invented test data) so the
  // charts have something to draw beside the seeded hive-scale log.
  const existing = await db.select({ id: schema.inspections.id }).from(schema.inspections).limit(1);
  if (existing.length === 0) {
    const ash = e.ids.hives.Ash;
    const by = e.ids.users.keeper;
    const at = (m: number, d: number) => new Date(Date.UTC(year, m - 1, d, 10));
    const checks: [number, number, number, number, number][] = [
      [3, 28, 3, 6, 4], [4, 12, 4, 8, 4], [4, 26, 6, 10, 5], [5, 10, 7, 13, 6], [5, 24, 8, 15, 7], [6, 8, 8, 16, 8],
      [6, 22, 7, 16, 9], [7, 6, 6, 15, 9], [7, 20, 5, 13, 5], [8, 3, 5, 12, 4], [8, 17, 4, 11, 4], [9, 7, 4, 10, 5], [9, 28, 3, 9, 7],
    ];
    await db.insert(schema.inspections).values(
      checks.map(([m, d, brood, bees, honey]) => ({ hiveId: ash, occurredAt: at(m, d), framesBrood: brood, framesBees: bees, honeyFrames: honey, queenStatus: 'queen-seen' as const, createdBy: by })),
    );
    await db.insert(schema.miteCounts).values([
      { hiveId: ash, occurredAt: at(6, 8), method: 'alcohol-wash' as const, beesSampled: 300, mites: 3, createdBy: by },
      { hiveId: ash, occurredAt: at(8, 3), method: 'alcohol-wash' as const, beesSampled: 300, mites: 11, createdBy: by },
      { hiveId: ash, occurredAt: at(9, 28), method: 'alcohol-wash' as const, beesSampled: 300, mites: 2, createdBy: by },
    ]);
    await db.insert(schema.treatments).values({ hiveId: ash, occurredAt: at(8, 5), activeIngredient: 'formic-acid' as const, method: 'strips' as const, batch: 'T-1', startDate: `${year}-08-05`, actualEndDate: `${year}-08-19`, createdBy: by });
    await db.insert(schema.feedings).values([
      { hiveId: ash, occurredAt: at(9, 10), kind: 'syrup' as const, ratio: '2:1' as const, basis: 'weight' as const, amountL: 4, createdBy: by },
      { hiveId: ash, occurredAt: at(9, 20), kind: 'syrup' as const, ratio: '2:1' as const, basis: 'weight' as const, amountL: 4, createdBy: by },
    ]);
    await db.insert(schema.harvests).values({ hiveId: ash, occurredAt: at(7, 8), supers: 1, frames: 10, weightKg: 13.5, moisturePercent: 17.4, createdBy: by });
  }
});
afterAll(() => e?.close());

describe('Season review, end to end', () => {
  it('wide: charts beside the table, hover shows a record, print view fits A4 and Letter', async () => {
    const { context, page } = await newPage(e, WIDE);
    await signIn(page, 'keeper@frameside.test');
    await byTestId(page, 'nav-apiaries').waitFor();
    await page.goto(`/hives/${e.ids.hives.Ash}`);
    await byTestId(page, 'open-season-hive').click();
    await byTestId(page, `season-chart-${e.ids.hives.Ash}`).waitFor();
    await byTestId(page, `chips-season-year-${year}`).click();
    await page.waitForLoadState('networkidle');
    await byTestId(page, 'season-temperature-trace').waitFor();

    // Charts and table side by side.
    const charts = await byTestId(page, 'season-charts').boundingBox();
    const table = await byTestId(page, 'season-table').boundingBox();
    expect(charts && table).toBeTruthy();
    expect(table!.x).toBeGreaterThan(charts!.x + charts!.width - 1);
    expect(await byTestId(page, 'season-brood-nest-band').count()).toBe(1);
    expect(await byTestId(page, 'season-mite-threshold').count()).toBe(1);
    expect(await page.locator('[data-testid^="season-weight-day-"]').count()).toBeGreaterThan(30);
    expect(await page.getByText('3 per 100 bees — treat (USDA-ARS / UF)').count()).toBeGreaterThan(0);
    expect(await page.getByText(/brood nest \(Kleinhenz et al\. 2003\)/).count()).toBeGreaterThan(0);

    // Hovering over the middle of the first panel selects the nearest record.
    const target = await byTestId(page, `season-chart-target-${e.ids.hives.Ash}`).boundingBox();
    await page.mouse.move(target!.x + target!.width * 0.45, target!.y + 80);
    await byTestId(page, 'season-selected-record').waitFor();
    await expect(byTestId(page, 'season-selected-record').textContent()).resolves.toMatch(/Quick check|Mite count|Harvest|Treatment|Feeding/);
    await shot(page, 'season-hive');
    await fullShot(page, 'season-hive');

    // Printing from the wide window: charts redrawn at paper width (A4 and Letter both print
    // 186 mm ≈ 703 CSS px between 12 mm margins), columns stacked, navigation and controls hidden.
    await page.emulateMedia({ media: 'print' });
    await page.waitForTimeout(300);
    const svgWidths = await page.evaluate(() => [...document.querySelectorAll('[data-testid="season-charts"] svg')].map((el) => el.getBoundingClientRect().width));
    expect(svgWidths.length).toBeGreaterThan(0);
    for (const w of svgWidths) expect(w).toBeLessThanOrEqual(703);
    const pCharts = await byTestId(page, 'season-charts').boundingBox();
    const pTable = await byTestId(page, 'season-table').boundingBox();
    expect(pTable!.y).toBeGreaterThan(pCharts!.y + pCharts!.height - 1);
    expect(await page.locator('[role="navigation"]').first().isVisible()).toBe(false);
    expect(await byTestId(page, 'season-controls').isVisible()).toBe(false);
    expect(await byTestId(page, 'season-selection').isVisible()).toBe(false);
    for (const format of ['A4', 'Letter'] as const) {
      const pdf = await page.pdf({ format, margin: { top: '12mm', bottom: '12mm', left: '12mm', right: '12mm' }, printBackground: true });
      fs.mkdirSync(SHOTS_DIR, { recursive: true });
      fs.writeFileSync(path.join(SHOTS_DIR, `season-hive-print-${format}.pdf`), pdf);
      const pages = (pdf.toString('latin1').match(/\/Type\s*\/Page[^s]/g) ?? []).length;
      expect(pages).toBeGreaterThanOrEqual(1);
      // eslint-disable-next-line no-console
      console.log(`season print (${format}): ${pages} page(s)`);
    }
    // At the paper's width nothing runs off the page.
    await page.setViewportSize({ width: 703, height: 1000 });
    await page.waitForTimeout(300);
    const overflow = await page.evaluate(() => {
      const wide = [...document.querySelectorAll('body *')].filter((el) => el.getBoundingClientRect().right > 704);
      return { width: document.documentElement.scrollWidth, culprits: wide.slice(-3).map((el) => `${el.tagName} ${el.getAttribute('data-testid') ?? ''} ${el.textContent?.slice(0, 40)} ${el.getBoundingClientRect().right}`) };
    });
    expect(overflow).toEqual({ width: 703, culprits: [] });
    await shot(page, 'season-hive-print');
    await page.emulateMedia({ media: 'screen' });
    await page.setViewportSize(WIDE);

    // The apiary review: a small chart per hive beside the table.
    await page.goto(`/apiaries/${e.ids.orchardRow}`);
    await byTestId(page, 'open-season-apiary').click();
    await byTestId(page, `season-hive-${e.ids.hives.Fennel}`).waitFor();
    await byTestId(page, `chips-season-year-${year}`).click();
    await page.waitForLoadState('networkidle');
    await byTestId(page, 'chips-season-kind-inspection').click();
    await expect(byTestId(page, 'season-table-count').textContent()).resolves.toMatch(/of \d+ records|records/);
    await shot(page, 'season-apiary');
    await fullShot(page, 'season-apiary');
    await context.close();
  });

  it('phone: stacked and readable; a row of the table selects the record', async () => {
    const { context, page } = await newPage(e, PHONE);
    await signIn(page, 'keeper@frameside.test');
    await byTestId(page, 'nav-apiaries').waitFor();
    await page.goto(`/hives/${e.ids.hives.Ash}/season`);
    await byTestId(page, `chips-season-year-${year}`).click();
    await byTestId(page, 'season-temperature-trace').waitFor();
    await fullShot(page, 'season-hive');
    const charts = await byTestId(page, 'season-charts').boundingBox();
    const table = await byTestId(page, 'season-table').boundingBox();
    expect(table!.y).toBeGreaterThan(charts!.y + charts!.height - 1);
    expect(charts!.width).toBeLessThanOrEqual(PHONE.width);
    await byTestId(page, 'season-table-row').first().click();
    await byTestId(page, 'season-selected-record').waitFor();
    await shot(page, 'season-hive');
    await context.close();
  });

  it('imports a semicolon sensor file with a preview, a bad line reported, and nothing twice', async () => {
    const { context, page } = await newPage(e, WIDE);
    await signIn(page, 'keeper@frameside.test');
    await byTestId(page, 'nav-apiaries').waitFor();
    await page.goto(`/hives/${e.ids.hives.Bramble}/season`);
    await byTestId(page, 'open-sensor-import').click();
    const file = path.join(os.tmpdir(), `frameside-logger-${process.pid}.csv`);
    fs.writeFileSync(file, '\uFEFFDatum;Temperatur °C;Gewicht kg\n01.06.2025 00:00;34,6;52,10\n01.06.2025 01:00;34,7;52,05\n01.06.2025 02:00;kaputt;52,00\n01.06.2025 03:00;34,9;51,95\n');
    await byTestId(page, 'sensor-file-input').setInputFiles(file);
    await byTestId(page, 'sensor-preview-table').waitFor();
    expect(await byTestId(page, 'sensor-preview-row').count()).toBe(4);
    await byTestId(page, 'chips-sensor-time-format-dmy').click();
    await byTestId(page, 'chips-sensor-time-zone-UTC').click();
    await expect(byTestId(page, 'sensor-check-summary').textContent()).resolves.toBe('4 rows: 3 readings, 1 bad row to skip.');
    await expect(byTestId(page, 'sensor-bad-rows').textContent()).resolves.toMatch(/line 4: temperature "kaputt" is not a number/);
    await shot(page, 'sensor-import');
    await byTestId(page, 'sensor-import-submit').click();
    await byTestId(page, 'sensor-import-result').waitFor();
    await expect(byTestId(page, 'sensor-import-result').textContent()).resolves.toMatch(/3 new, 0 already there/);
    await byTestId(page, 'sensor-import-submit').click();
    await expect(byTestId(page, 'sensor-import-result').textContent()).resolves.toMatch(/0 new, 3 already there/);
    fs.rmSync(file, { force: true });
    await context.close();
  });
});
