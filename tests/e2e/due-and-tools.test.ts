/**
 * The Due list, the Hive story and the tools, end to end in Chromium. Records are written
 * straight into the tables (invented test data) so the test does not depend on the demo seed's
 * records. Expected syrup figures: TRADE-REFERENCES §2b (derived from the CRC density table).
 */
import { eq } from 'drizzle-orm';
import { feedings, inspections, miteCounts, tasks } from '../../db/schema';
import { addDays, utcMsToDate } from '../../shared/domain/dates';
import { byTestId, newPage, shot, signIn, startE2e, VIEWPORTS, type E2e } from './harness';

jest.setTimeout(180_000);

const tid = (key: string) => key.replace(/[^a-zA-Z0-9-]/g, '-');

describe('Due list, Hive story and tools, end to end', () => {
  let e: E2e;
  const keys: Record<string, string> = {};

  beforeAll(async () => {
    e = await startE2e();
    const db = e.server.testDb.db;
    const today = utcMsToDate(e.server.clock.now.getTime());
    const at = (days: number) => new Date(`${addDays(today, days)}T10:00:00Z`);
    const by = e.ids.users.keeper;
    const ash = e.ids.hives.Ash!;
    const [old] = await db
      .insert(inspections)
      .values({ hiveId: ash, occurredAt: at(-44), createdBy: by, framesBrood: 4, framesBees: 7, honeyFrames: 5, queenStatus: 'eggs-seen', eggsSeen: true })
      .returning({ id: inspections.id });
    const [last] = await db
      .insert(inspections)
      .values({ hiveId: ash, occurredAt: at(-40), createdBy: by, framesBrood: 2, framesBees: 6, honeyFrames: 6, queenStatus: 'queen-seen', note: 'Heavy on the heft.' })
      .returning({ id: inspections.id });
    const [mites] = await db
      .insert(miteCounts)
      .values({ hiveId: ash, occurredAt: at(-5), createdBy: by, method: 'alcohol-wash', beesSampled: 300, mites: 12 })
      .returning({ id: miteCounts.id });
    const [feed] = await db
      .insert(feedings)
      .values({ hiveId: e.ids.hives.Bramble!, occurredAt: at(-1), createdBy: by, kind: 'syrup', ratio: '2:1', basis: 'weight', amountL: 4 })
      .returning({ id: feedings.id });
    void old;
    keys.lastCheck = last!.id;
    keys.treat = `treat-varroa:${ash}:${mites!.id}`;
    keys.feeder = `feeder-refill:${e.ids.hives.Bramble}:${feed!.id}`;
  });
  afterAll(() => e?.close());

  it('shows the Due list, marks a task done, and opens the hive from a task (phone)', async () => {
    const { context, page } = await newPage(e, VIEWPORTS.phone);
    await signIn(page, 'keeper@frameside.test');
    await byTestId(page, 'due-screen').waitFor();
    await byTestId(page, 'due-group-overdue').waitFor();
    // The demo hives without a check each have a first Quick check due; Ash has its own tasks.
    const treat = byTestId(page, `due-task-${tid(keys.treat)}`);
    await treat.waitFor();
    await expect(treat.textContent()).resolves.toMatch(/Overdue by 5 days/);
    await expect(byTestId(page, `due-reason-${tid(keys.treat)}`).textContent()).resolves.toMatch(/4 mites per 100 bees/);
    await page.waitForLoadState('networkidle');
    await shot(page, 'due-list');
    await byTestId(page, `due-source-toggle-${tid(keys.treat)}`).click();
    await expect(byTestId(page, `due-source-${tid(keys.treat)}`).textContent()).resolves.toMatch(/TRADE-REFERENCES §3/);

    // One tap to mark the feeder check done: it leaves the list, and the server holds who and when.
    await byTestId(page, `due-done-${tid(keys.feeder)}`).click();
    await byTestId(page, `due-task-${tid(keys.feeder)}`).waitFor({ state: 'detached' });
    const [row] = await e.server.testDb.db.select().from(tasks).where(eq(tasks.derivedKey, keys.feeder));
    expect(row).toMatchObject({ status: 'done', resolvedBy: e.ids.users.keeper });
    await page.reload();
    await byTestId(page, `due-task-${tid(keys.treat)}`).waitFor();
    expect(await byTestId(page, `due-task-${tid(keys.feeder)}`).count()).toBe(0);

    // "Not now…" opens snooze and dismiss.
    await byTestId(page, `due-later-toggle-${tid(keys.treat)}`).click();
    await byTestId(page, `due-snooze-1-${tid(keys.treat)}`).waitFor();
    await byTestId(page, `due-dismiss-${tid(keys.treat)}`).waitFor();
    await shot(page, 'due-list-not-now');

    // One tap to the hive: its story shows the checks with what changed.
    await byTestId(page, `due-open-hive-${tid(keys.treat)}`).click();
    await byTestId(page, 'hive-title').waitFor();
    await expect(byTestId(page, 'hive-title').textContent()).resolves.toContain('Ash');
    await byTestId(page, 'hive-story').waitFor();
    await expect(byTestId(page, `story-changes-${keys.lastCheck}`).textContent()).resolves.toMatch(/Brood frames -2/);
    await page.waitForLoadState('networkidle');
    await byTestId(page, `story-item-${keys.lastCheck}`).scrollIntoViewIfNeeded();
    await shot(page, 'hive-story');
    await context.close();
  });

  it.each(Object.entries(VIEWPORTS))('computes syrup, brood dates and stores in the tools (%s)', async (label, viewport) => {
    const { context, page } = await newPage(e, viewport);
    await signIn(page, 'keeper@frameside.test');
    await byTestId(page, 'due-screen').waitFor();
    if (label === 'wide') {
      await byTestId(page, 'due-group-overdue').waitFor();
      await page.waitForLoadState('networkidle');
      await shot(page, 'due-list');
      await page.goto(`/hives/${e.ids.hives.Ash}`);
      await byTestId(page, 'hive-story').waitFor();
      await page.waitForLoadState('networkidle');
      await shot(page, 'hive-story');
    }
    await page.goto('/tools');
    await byTestId(page, 'tool-syrup-mixer').waitFor();
    await shot(page, 'tools');
    await byTestId(page, 'tool-syrup-mixer').click();
    await byTestId(page, 'syrup-mixer-screen').waitFor();
    // §2b (derived from CRC ρ = 1.2295): 1 US gal of finished 1:1 syrup holds 2.33 kg (5.13 lb) of sugar.
    await expect(byTestId(page, 'syrup-sugar-kg').textContent()).resolves.toBe('2.33 kg');
    await expect(byTestId(page, 'syrup-sugar').textContent()).resolves.toContain('5.13 lb');
    await shot(page, 'tool-syrup');
    // §2b (derived from ρ = 1.3265): 1 US gal of 2:1 holds 3.35 kg (7.38 lb).
    await byTestId(page, 'chips-syrup-ratio-2:1').click();
    await expect(byTestId(page, 'syrup-sugar-kg').textContent()).resolves.toBe('3.35 kg');
    // Common practice: nine one-gallon feeders of 1:1 take about 50 lb of sugar (within 10 %).
    await byTestId(page, 'chips-syrup-ratio-1:1').click();
    await byTestId(page, 'chips-syrup-unit-feeders').click();
    for (let i = 0; i < 5; i++) await byTestId(page, 'stepper-syrup-feeders-inc').click();
    await expect(byTestId(page, 'stepper-syrup-feeders-value').textContent()).resolves.toBe('9');
    const lb = Number(/([\d.]+) lb/.exec((await byTestId(page, 'syrup-sugar').textContent()) ?? '')?.[1]);
    expect(Math.abs(lb - 50) / 50).toBeLessThanOrEqual(0.1);

    await page.goto('/tools/brood');
    await byTestId(page, 'brood-result').waitFor();
    // §1 (Welsh BKA): a queen cell capped today emerges in 8 days.
    await expect(byTestId(page, 'brood-emerges').textContent()).resolves.toMatch(/in 8 days/);
    await shot(page, 'tool-brood');

    await page.goto('/tools/stores');
    await byTestId(page, 'stores-result').waitFor();
    // §6: 4 full deep frames at 2.7–3.6 kg each → 10.8–14.4 kg, midpoint 12.6 kg.
    await expect(byTestId(page, 'stores-kg').textContent()).resolves.toBe('About 12.6 kg of honey');
    await shot(page, 'tool-stores');
    await context.close();
  });
});
