/**
 * The Quick check and the other record forms in Chromium, against the exported web build:
 * (a) the standard record from the hive's page in ≤ 10 taps and no key press; (b) every
 * interactive element at 390 × 844 at least 64 × 64 CSS px and 8 px from its neighbours;
 * (c) a draft survives a reload and a save clears it; (d) a lost answer, retried, stores one
 * record; (e) screenshots of each form at 390 × 844 and 1440 × 900 for a person to judge.
 *
 * Targets: 64 × 64 px and the gap are the issue's figures (PRODUCT.md, "Look and feel": gloves);
 * WCAG 2.2 SC 2.5.8 asks only 24 × 24 px, so 64 is the stricter, product rule.
 */
import type { Page } from 'playwright-core';
import { byTestId, newPage, PHONE, shot, signIn, startE2e, WIDE, type E2e } from './harness';

jest.setTimeout(180_000);

const KEEPER = 'keeper@frameside.test';

interface Box {
  desc: string;
  x: number;
  y: number;
  w: number;
  h: number;
  region: number;
}

/**
 * Every visible interactive element on the page (buttons, role=button/radio/checkbox/link,
 * inputs, links, anything with a tabindex) with its box, and the scroll region it sits in:
 * boxes are compared with their neighbours in the same region (content that scrolls under the
 * fixed save bar is not "next to" it).
 */
async function interactiveBoxes(page: Page): Promise<Box[]> {
  return page.evaluate(() => {
    const sel = 'button, [role=button], [role=radio], [role=checkbox], [role=link], [role=switch], input, textarea, select, a[href], [tabindex]';
    const regions: Element[] = [];
    const regionOf = (el: Element): number => {
      let p: Element | null = el.parentElement;
      while (p && p !== document.body) {
        const s = getComputedStyle(p);
        if (/(auto|scroll)/.test(s.overflowY) && p.scrollHeight > p.clientHeight) break;
        p = p.parentElement;
      }
      const r = p && p !== document.body ? p : document.body;
      let i = regions.indexOf(r);
      if (i < 0) i = regions.push(r) - 1;
      return i;
    };
    const out: Box[] = [];
    for (const el of Array.from(document.querySelectorAll(sel))) {
      const s = getComputedStyle(el);
      if (s.visibility === 'hidden' || s.display === 'none') continue;
      const r = el.getBoundingClientRect();
      if (r.width === 0 || r.height === 0) continue;
      const region = regionOf(el);
      const scroller = regions[region];
      const dy = scroller === document.body ? 0 : scroller.scrollTop;
      const id = el.getAttribute('data-testid');
      const label = el.getAttribute('aria-label') ?? (el.textContent ?? '').trim().slice(0, 40);
      out.push({ desc: `${el.tagName.toLowerCase()}${id ? `#${id}` : ''} "${label}"`, x: r.x, y: r.y + dy, w: r.width, h: r.height, region });
    }
    return out;
  });
}

/** The gap between two boxes: 0 when they overlap, else the shortest distance between their edges. */
function gapBetween(a: Box, b: Box): number {
  const dx = Math.max(0, Math.max(a.x, b.x) - Math.min(a.x + a.w, b.x + b.w));
  const dy = Math.max(0, Math.max(a.y, b.y) - Math.min(a.y + a.h, b.y + b.h));
  return Math.hypot(dx, dy);
}

const contains = (a: Box, b: Box) => a.x <= b.x + 0.5 && a.y <= b.y + 0.5 && a.x + a.w >= b.x + b.w - 0.5 && a.y + a.h >= b.y + b.h - 0.5;

interface TargetReport {
  count: number;
  /** The narrowest and the shortest target (they may be two different elements). */
  smallest: { w: number; wDesc: string; h: number; hDesc: string };
  smallestGap: { between: string; gap: number };
  tooSmall: string[];
  tooClose: string[];
}

/**
 * The issue asks for 8 px between targets; PRODUCT.md ("Look and feel") and the team's glove rule
 * ask for 12 px, which the tokens (targetGap) give. The stricter 12 is asserted.
 */
function measure(boxes: Box[], minSize = 64, minGap = 12): TargetReport {
  const tooSmall = boxes.filter((b) => b.w < minSize - 0.01 || b.h < minSize - 0.01).map((b) => `${b.desc} ${b.w.toFixed(1)}×${b.h.toFixed(1)}`);
  const tooClose: string[] = [];
  let smallestGap = { between: '', gap: Infinity };
  for (let i = 0; i < boxes.length; i++) {
    for (let j = i + 1; j < boxes.length; j++) {
      const a = boxes[i];
      const b = boxes[j];
      if (a.region !== b.region) continue;
      // One target inside another is one target (a link wrapping its button), not two neighbours.
      if (contains(a, b) || contains(b, a)) continue;
      const gap = gapBetween(a, b);
      if (gap < smallestGap.gap) smallestGap = { between: `${a.desc} ↔ ${b.desc}`, gap };
      if (gap < minGap - 0.01) tooClose.push(`${a.desc} ↔ ${b.desc}: ${gap.toFixed(1)} px`);
    }
  }
  const narrowest = boxes.reduce((m, b) => (b.w < m.w ? b : m), boxes[0]);
  const shortest = boxes.reduce((m, b) => (b.h < m.h ? b : m), boxes[0]);
  return { count: boxes.length, smallest: { w: narrowest.w, wDesc: narrowest.desc, h: shortest.h, hDesc: shortest.desc }, smallestGap, tooSmall, tooClose };
}

/** Screenshots of the form top to bottom: the first at the top, then one per screenful of the scrolling column. */
async function shotForm(page: Page, name: string) {
  await page.waitForLoadState('networkidle');
  await shot(page, name);
  const scrollers = await page.evaluate(() => {
    const all = Array.from(document.querySelectorAll('div')).filter((d) => {
      const s = getComputedStyle(d);
      return /(auto|scroll)/.test(s.overflowY) && d.scrollHeight > d.clientHeight + 4;
    });
    // The form's column is the tallest scroller.
    all.sort((a, b) => b.scrollHeight - a.scrollHeight);
    if (!all[0]) return 0;
    all[0].setAttribute('data-shot-scroller', '1');
    return Math.ceil(all[0].scrollHeight / all[0].clientHeight);
  });
  for (let i = 1; i < Math.min(scrollers, 6); i++) {
    await page.evaluate((n) => {
      const el = document.querySelector('[data-shot-scroller]') as HTMLElement;
      el.scrollTop = n * (el.clientHeight - 80);
    }, i);
    await page.waitForTimeout(100);
    await shot(page, `${name}-${i + 1}`);
  }
  await page.evaluate(() => {
    const el = document.querySelector('[data-shot-scroller]') as HTMLElement | null;
    if (el) el.scrollTop = 0;
  });
}

async function api<T>(page: Page, path: string, init?: { method?: string; body?: unknown; headers?: Record<string, string> }): Promise<{ status: number; body: T }> {
  return page.evaluate(
    async ({ path, init }) => {
      const res = await fetch(path, {
        method: init?.method ?? 'GET',
        headers: { 'Content-Type': 'application/json', ...(init?.headers ?? {}) },
        body: init?.body === undefined ? undefined : JSON.stringify(init.body),
      });
      const text = await res.text();
      return { status: res.status, body: text ? JSON.parse(text) : null };
    },
    { path, init },
  );
}

interface InspectionRow {
  id: string;
  occurredAt: string;
  framesBrood: number;
  framesBees: number;
  queenStatus: string;
  eggsSeen: boolean;
  temperament: number | null;
}

/** A previous check ten days back, so "same as last time" has known values whatever the seed holds. */
async function postPreviousCheck(page: Page, hiveId: string) {
  const r = await api<{ inspection: InspectionRow }>(page, `/api/hives/${hiveId}/inspections`, {
    method: 'POST',
    headers: { 'Idempotency-Key': `prev-${hiveId}-${Date.now()}` },
    body: {
      occurredAt: new Date(Date.now() - 10 * 86_400_000).toISOString(),
      framesBrood: 5,
      framesBees: 8,
      honeyFrames: 2,
      pollenFrames: 1,
      queenStatus: 'queen-seen',
      eggsSeen: false,
      youngLarvaeSeen: true,
      broodPattern: 'solid',
      temperament: 3,
    },
  });
  expect(r.status).toBe(201);
  return r.body.inspection;
}

async function inspections(page: Page, hiveId: string) {
  return (await api<{ records: InspectionRow[] }>(page, `/api/hives/${hiveId}/inspections`)).body.records;
}

describe('Quick check and record forms, end to end in Chromium', () => {
  let e: E2e;
  beforeAll(async () => {
    e = await startE2e();
  });
  afterAll(() => e?.close());

  it('(a) records a standard check from the hive page in at most 10 taps and no key press', async () => {
    const { context, page } = await newPage(e, PHONE);
    await signIn(page, KEEPER);
    await byTestId(page, 'nav-apiaries').waitFor();
    const hiveId = e.ids.hives.Bramble;
    const previous = await postPreviousCheck(page, hiveId);
    await page.goto(`/hives/${hiveId}`);
    await byTestId(page, 'record-quick-check').waitFor();

    // Count what the page itself receives, not only what the script meant to do.
    await page.evaluate(() => {
      const w = window as unknown as { __taps: number; __keys: number };
      w.__taps = 0;
      w.__keys = 0;
      document.addEventListener('pointerdown', () => (w.__taps += 1), true);
      document.addEventListener('keydown', () => (w.__keys += 1), true);
    });
    let scripted = 0;
    const tap = async (id: string) => {
      scripted += 1;
      await byTestId(page, id).click();
    };

    await tap('record-quick-check');
    await byTestId(page, 'quick-check-basis').waitFor();
    await expect(byTestId(page, 'quick-check-basis').textContent()).resolves.toContain('Same as last time');
    // Pre-filled from the previous check (5 brood, 8 bees).
    await expect(byTestId(page, 'stepper-framesBrood-value').textContent()).resolves.toBe('5');
    await tap('stepper-framesBrood-inc'); // 5½
    await tap('stepper-framesBrood-inc'); // 6
    await tap('stepper-framesBees-inc'); // 8½
    await tap('stepper-framesBees-inc'); // 9
    await tap('chips-queenStatus-eggs-seen');
    await tap('chips-temperament-2');
    await tap('quick-check-save');
    await byTestId(page, 'hive-screen').waitFor();

    const { taps, keys } = await page.evaluate(() => {
      const w = window as unknown as { __taps: number; __keys: number };
      return { taps: w.__taps, keys: w.__keys };
    });
    console.log(`Standard Quick check: ${taps} taps (${scripted} scripted), ${keys} key presses`);
    expect(taps).toBe(scripted);
    expect(taps).toBeLessThanOrEqual(10);
    expect(keys).toBe(0);

    const rows = await inspections(page, hiveId);
    const saved = rows.find((r) => r.id !== previous.id && Date.parse(r.occurredAt) > Date.parse(previous.occurredAt));
    expect(saved).toMatchObject({ framesBrood: 6, framesBees: 9, queenStatus: 'eggs-seen', eggsSeen: true, temperament: 2 });
    await context.close();
  });

  it('(b) every interactive element of the Quick check at 390 × 844 is at least 64 × 64 px and 12 px (≥ 8) from its neighbours', async () => {
    const { context, page } = await newPage(e, PHONE);
    await signIn(page, KEEPER);
    await byTestId(page, 'nav-apiaries').waitFor();
    await page.goto(`/hives/${e.ids.hives.Clover}/check`);
    await byTestId(page, 'quick-check-save').waitFor();
    await page.waitForLoadState('networkidle');

    const plain = measure(await interactiveBoxes(page));
    // Open everything that folds away, so its controls are measured too.
    await byTestId(page, 'chips-queenCells-seen').click();
    await byTestId(page, 'airTempC-add').click();
    await byTestId(page, 'note-open').click();
    await byTestId(page, 'chips-diseaseSigns-suspected-foulbrood').click();
    await byTestId(page, 'caution-notifiable-disease').waitFor();
    await page.mouse.click(5, 400); // blur the note field: a focused outline is thicker, not bigger
    const open = measure(await interactiveBoxes(page));

    for (const [label, r] of [
      ['as it opens', plain],
      ['with everything open', open],
    ] as const) {
      console.log(
        `Quick check ${label}: ${r.count} targets; narrowest ${r.smallest.w.toFixed(1)} px (${r.smallest.wDesc}), ` +
          `shortest ${r.smallest.h.toFixed(1)} px (${r.smallest.hDesc}); ` +
          `smallest gap ${r.smallestGap.gap.toFixed(1)} px (${r.smallestGap.between})`,
      );
      expect(r.tooSmall).toEqual([]);
      expect(r.tooClose).toEqual([]);
      expect(r.count).toBeGreaterThan(30);
    }
    // The save bar sits at the bottom of the screen, in thumb reach.
    const save = await byTestId(page, 'quick-check-save').boundingBox();
    expect(save).not.toBeNull();
    expect(save!.y + save!.height).toBeGreaterThan(PHONE.height - 200);
    await context.close();
  });

  it('(c) keeps the draft through a reload and forgets it once saved', async () => {
    const { context, page } = await newPage(e, PHONE);
    await signIn(page, KEEPER);
    await byTestId(page, 'nav-apiaries').waitFor();
    const hiveId = e.ids.hives.Damson;
    await page.goto(`/hives/${hiveId}/check`);
    await byTestId(page, 'quick-check-save').waitFor();
    await byTestId(page, 'stepper-framesBees-inc').click();
    await byTestId(page, 'stepper-framesBees-inc').click();
    await byTestId(page, 'stepper-framesBrood-inc').click();
    await byTestId(page, 'chips-queenStatus-eggs-seen').click();
    await byTestId(page, 'chips-diseaseSigns-chalkbrood').click();
    const before = {
      bees: await byTestId(page, 'stepper-framesBees-value').textContent(),
      brood: await byTestId(page, 'stepper-framesBrood-value').textContent(),
    };

    await page.reload();
    await byTestId(page, 'quick-check-restored').waitFor();
    await expect(byTestId(page, 'stepper-framesBees-value').textContent()).resolves.toBe(before.bees);
    await expect(byTestId(page, 'stepper-framesBrood-value').textContent()).resolves.toBe(before.brood);
    await expect(byTestId(page, 'chips-queenStatus-eggs-seen').getAttribute('aria-checked')).resolves.toBe('true');
    await expect(byTestId(page, 'chips-diseaseSigns-chalkbrood').getAttribute('aria-checked')).resolves.toBe('true');

    await byTestId(page, 'quick-check-save').click();
    await byTestId(page, 'hive-screen').waitFor();
    const stored = await page.evaluate((k) => localStorage.getItem(k), `frameside:draft:inspection:${hiveId}`);
    expect(stored).toBeNull();
    await page.goto(`/hives/${hiveId}/check`);
    await byTestId(page, 'quick-check-basis').waitFor();
    expect(await byTestId(page, 'quick-check-restored').count()).toBe(0);
    await context.close();
  });

  it('(d) stores one record when the first answer is lost and the same draft is sent again', async () => {
    const { context, page } = await newPage(e, PHONE);
    await signIn(page, KEEPER);
    await byTestId(page, 'nav-apiaries').waitFor();
    const hiveId = e.ids.hives.Elder;
    const countBefore = (await inspections(page, hiveId)).length;
    await page.goto(`/hives/${hiveId}/check`);
    await byTestId(page, 'quick-check-save').waitFor();
    await byTestId(page, 'stepper-framesBees-inc').click();
    await byTestId(page, 'stepper-framesBees-inc').click();
    await byTestId(page, 'chips-queenStatus-queen-seen').click();

    // The first POST reaches the server and is stored; its answer never reaches the page.
    const keys: string[] = [];
    let lost = 0;
    await page.route(`**/api/hives/${hiveId}/inspections`, async (route) => {
      const req = route.request();
      if (req.method() !== 'POST') return route.continue();
      keys.push(req.headers()['idempotency-key'] ?? '');
      if (lost === 0) {
        lost += 1;
        await route.fetch();
        return route.abort('connectionreset');
      }
      return route.continue();
    });

    await byTestId(page, 'quick-check-save').click();
    await byTestId(page, 'quick-check-save-error').waitFor();
    await expect(byTestId(page, 'quick-check-save-error').textContent()).resolves.toContain('kept on this device');
    // A reload in between: the retry must still carry the draft's key.
    await page.reload();
    await byTestId(page, 'quick-check-restored').waitFor();
    await byTestId(page, 'quick-check-save').click();
    await byTestId(page, 'hive-screen').waitFor();

    expect(keys).toHaveLength(2);
    expect(keys[0]).toMatch(/^[0-9a-f-]{36}$/);
    expect(keys[1]).toBe(keys[0]);
    expect((await inspections(page, hiveId)).length).toBe(countBefore + 1);
    await context.close();
  });

  it('(e) takes screenshots of each form at 390 × 844 and 1440 × 900', async () => {
    const hive = e.ids.hives.Ash;
    const forms: { name: string; path: string; ready: string; prepare?: (page: Page) => Promise<void> }[] = [
      { name: 'quick-check', path: `/hives/${hive}/check`, ready: 'quick-check-save' },
      {
        name: 'quick-check-foulbrood',
        path: `/hives/${hive}/check`,
        ready: 'quick-check-save',
        prepare: async (page) => {
          await byTestId(page, 'chips-diseaseSigns-suspected-foulbrood').click();
          await byTestId(page, 'caution-notifiable-disease').scrollIntoViewIfNeeded();
        },
      },
      { name: 'feeding', path: `/hives/${hive}/feeding`, ready: 'feeding-save' },
      {
        name: 'treatment',
        path: `/hives/${hive}/treatment`,
        ready: 'treatment-save',
        prepare: async (page) => {
          await byTestId(page, 'chips-activeIngredient-oxalic-acid').click();
          await byTestId(page, 'chips-method-vaporisation').click();
        },
      },
      { name: 'mite-count', path: `/hives/${hive}/mite-count`, ready: 'mite-count-save' },
      { name: 'harvest', path: `/hives/${hive}/harvest`, ready: 'harvest-save' },
      { name: 'queen-event', path: `/hives/${hive}/queen-event`, ready: 'queen-event-save' },
      {
        name: 'colony-event',
        path: `/hives/${hive}/colony-event`,
        ready: 'colony-event-save',
        prepare: async (page) => {
          await byTestId(page, 'chips-kind-combined').click();
        },
      },
      { name: 'forage-check', path: `/apiaries/${e.ids.orchardRow}/forage-check`, ready: 'forage-check-save' },
    ];
    for (const viewport of [PHONE, WIDE]) {
      const { context, page } = await newPage(e, viewport);
      await signIn(page, KEEPER);
      await byTestId(page, 'nav-apiaries').waitFor();
      for (const f of forms) {
        await page.goto(f.path);
        await byTestId(page, f.ready).waitFor();
        if (f.prepare) {
          await f.prepare(page);
          await shot(page, f.name);
        } else {
          await shotForm(page, f.name);
        }
        // Drafts of the prepared forms would greet the next viewport: start clean.
        await page.evaluate(() => localStorage.clear());
      }
      await page.goto(`/hives/${hive}`);
      await byTestId(page, 'record-quick-check').waitFor();
      await shot(page, 'hive-record-actions');
      await context.close();
    }
  });

  it('(f) saves every other record from one tap on the hive (or apiary) page, with its cautions shown', async () => {
    const { context, page } = await newPage(e, PHONE);
    await signIn(page, KEEPER);
    await byTestId(page, 'nav-apiaries').waitFor();
    const hiveId = e.ids.hives.Fennel;
    const count = async (segment: string) => (await api<{ records: unknown[] }>(page, `/api/hives/${hiveId}/${segment}`)).body.records.length;
    const open = async (button: string, save: string) => {
      await page.goto(`/hives/${hiveId}`);
      await byTestId(page, button).click();
      await byTestId(page, save).waitFor();
    };
    const saveAndBack = async (save: string) => {
      await byTestId(page, save).click();
      await byTestId(page, 'hive-screen').waitFor();
    };

    // Feeding: 2:1 syrup, shown in US gallons, stored in litres; the robbing caution is shown.
    let before = await count('feedings');
    await open('record-feeding', 'feeding-save');
    await byTestId(page, 'caution-robbing').waitFor();
    await byTestId(page, 'chips-ratio-2:1').click();
    await byTestId(page, 'chips-units-us').click();
    await expect(byTestId(page, 'stepper-amount-value').textContent()).resolves.toContain('1');
    await byTestId(page, 'chips-feederType-top-feeder').click();
    await saveAndBack('feeding-save');
    const feedings = (await api<{ records: { ratio: string; amountL: number }[] }>(page, `/api/hives/${hiveId}/feedings`)).body.records;
    expect(feedings.length).toBe(before + 1);
    // 1 US gallon = 3.785411784 L (exact by definition; TRADE-REFERENCES §2b), stored to 0.01 L.
    expect(feedings[0]).toMatchObject({ ratio: '2:1', amountL: 3.79 });
    // The units choice is remembered on the device.
    expect(await page.evaluate(() => localStorage.getItem('frameside:units'))).toBe('us');

    // Treatment: oxalic acid by vapour shows the acid, vapour and supers cautions; dose and batch are typed from the pack.
    before = await count('treatments');
    await open('record-treatment', 'treatment-save');
    await byTestId(page, 'chips-activeIngredient-oxalic-acid').click();
    await byTestId(page, 'chips-method-vaporisation').click();
    for (const id of ['acid-treatment', 'oxalic-vapour', 'treatment-supers']) await byTestId(page, `caution-${id}`).waitFor();
    await byTestId(page, 'treatment-save').click();
    await byTestId(page, 'treatment-save-error').waitFor();
    await expect(byTestId(page, 'treatment-save-error').textContent()).resolves.toContain('dose');
    await byTestId(page, 'treatment-dose').fill('1 g per brood box, as on the label');
    await byTestId(page, 'treatment-batch').fill('LOT-TEST-1');
    await byTestId(page, 'date-withdrawalUntil-set').click();
    await byTestId(page, 'stepper-withdrawalUntil-inc').click();
    await saveAndBack('treatment-save');
    expect(await count('treatments')).toBe(before + 1);

    // Mite count: 6 mites in 300 bees shows 2 per 100 at once.
    before = await count('mite-counts');
    await open('record-mite-count', 'mite-count-save');
    await expect(byTestId(page, 'stepper-beesSampled-value').textContent()).resolves.toBe('300');
    for (let i = 0; i < 6; i++) await byTestId(page, 'stepper-mites-inc').click();
    // 6 ÷ 300 × 100 = 2 mites per 100 bees (BEEBOOK formula, shared/domain/mites.ts).
    await expect(byTestId(page, 'mite-load').textContent()).resolves.toContain('2 mites per 100 bees');
    await saveAndBack('mite-count-save');
    expect(await count('mite-counts')).toBe(before + 1);

    before = await count('harvests');
    await open('record-harvest', 'harvest-save');
    await byTestId(page, 'moisture-add').click();
    await saveAndBack('harvest-save');
    expect(await count('harvests')).toBe(before + 1);

    before = await count('queen-events');
    await open('record-queen-event', 'queen-event-save');
    await byTestId(page, 'chips-kind-marked').click();
    await saveAndBack('queen-event-save');
    expect(await count('queen-events')).toBe(before + 1);

    before = await count('colony-events');
    await open('record-colony-event', 'colony-event-save');
    await byTestId(page, 'chips-kind-combined').click();
    await byTestId(page, `chips-otherHiveId-${e.ids.hives.Ash}`).click();
    await saveAndBack('colony-event-save');
    expect(await count('colony-events')).toBe(before + 1);

    // Forage check from the apiary page: a dish emptied in 20 minutes reads as dearth (≤ 30 min, common practice; TRADE-REFERENCES §9).
    const apiaryId = e.ids.orchardRow;
    const forage = async () => (await api<{ records: { judgement: string }[] }>(page, `/api/apiaries/${apiaryId}/forage-checks`)).body.records;
    const forageBefore = (await forage()).length;
    await page.goto(`/apiaries/${apiaryId}`);
    await byTestId(page, 'record-forage-check').click();
    await byTestId(page, 'forage-check-save').waitFor();
    await byTestId(page, 'caution-robbing').waitFor();
    await expect(byTestId(page, 'forage-verdict').textContent()).resolves.toContain('Dearth');
    await byTestId(page, 'forage-check-save').click();
    await byTestId(page, 'apiary-screen').waitFor();
    const checks = await forage();
    expect(checks.length).toBe(forageBefore + 1);
    expect(checks[0].judgement).toBe('dearth');
    await context.close();
  });

  it('(g) offers each person only the records their role may make (sitter: Quick check and feeding; viewer: none)', async () => {
    const hiveId = e.ids.hives.Clover;
    for (const [email, offered, withheld] of [
      ['sitter@frameside.test', ['record-quick-check', 'record-feeding'], ['record-treatment', 'record-mite-count', 'record-harvest', 'record-queen-event', 'record-colony-event']],
      ['mentor@frameside.test', [], ['record-quick-check', 'record-feeding', 'record-treatment']],
    ] as const) {
      const { context, page } = await newPage(e, PHONE);
      await signIn(page, email);
      await byTestId(page, 'nav-apiaries').waitFor();
      await page.goto(`/hives/${hiveId}`);
      await byTestId(page, 'hive-title').waitFor();
      await page.waitForLoadState('networkidle');
      for (const id of offered) expect(await byTestId(page, id).count()).toBe(1);
      for (const id of withheld) expect(await byTestId(page, id).count()).toBe(0);
      await page.goto(`/apiaries/${e.ids.orchardRow}`);
      await byTestId(page, 'apiary-title').waitFor();
      await page.waitForLoadState('networkidle');
      // A sitter may record a Forage check (shared/domain/access.ts); a viewer may not.
      expect(await byTestId(page, 'record-forage-check').count()).toBe(email.startsWith('sitter') ? 1 : 0);
      await context.close();
    }
  });

  it('(h) edits a saved check in the same form, and a stale edit shows the newer version instead of overwriting it', async () => {
    const { context, page } = await newPage(e, PHONE);
    await signIn(page, KEEPER);
    await byTestId(page, 'nav-apiaries').waitFor();
    const hiveId = e.ids.hives.Heather;
    const check = await postPreviousCheck(page, hiveId);
    const edit = `/hives/${hiveId}/check?recordId=${check.id}`;

    await page.goto(edit);
    await byTestId(page, 'quick-check-editing').waitFor();
    await expect(byTestId(page, 'stepper-framesBrood-value').textContent()).resolves.toBe('5');
    await byTestId(page, 'stepper-framesBrood-inc').click();
    await byTestId(page, 'quick-check-save').click();
    await byTestId(page, 'hive-screen').waitFor();
    let stored = (await api<{ inspection: InspectionRow & { version: number } }>(page, `/api/inspections/${check.id}`)).body.inspection;
    expect(stored).toMatchObject({ framesBrood: 5.5, version: 2 });
    const countAfterEdit = (await inspections(page, hiveId)).length;

    // Open the form, then someone else saves first (version 3): this save must not overwrite theirs.
    await page.goto(edit);
    await byTestId(page, 'quick-check-editing').waitFor();
    const other = await api(page, `/api/inspections/${check.id}`, { method: 'PATCH', body: { version: 2, framesBees: 9 } });
    expect(other.status).toBe(200);
    await byTestId(page, 'stepper-framesBrood-inc').click();
    await byTestId(page, 'quick-check-save').click();
    // The notice changes when the 409 arrives: wait for it rather than read it once.
    await page.waitForFunction(() => document.querySelector('[data-testid="quick-check-editing"]')?.textContent?.includes('Someone else saved this check first'));
    await expect(byTestId(page, 'quick-check-editing').textContent()).resolves.toContain('Someone else saved this check first');
    await expect(byTestId(page, 'stepper-framesBees-value').textContent()).resolves.toBe('9');
    await expect(byTestId(page, 'stepper-framesBrood-value').textContent()).resolves.toBe('5½');
    stored = (await api<{ inspection: InspectionRow & { version: number } }>(page, `/api/inspections/${check.id}`)).body.inspection;
    expect(stored).toMatchObject({ framesBrood: 5.5, framesBees: 9, version: 3 });

    // Made again on their version, the change saves.
    await byTestId(page, 'stepper-framesBrood-inc').click();
    await byTestId(page, 'quick-check-save').click();
    await byTestId(page, 'hive-screen').waitFor();
    stored = (await api<{ inspection: InspectionRow & { version: number } }>(page, `/api/inspections/${check.id}`)).body.inspection;
    expect(stored).toMatchObject({ framesBrood: 6, framesBees: 9, version: 4 });
    // Edits never add a record.
    expect((await inspections(page, hiveId)).length).toBe(countAfterEdit);

    // The other forms edit the same way: a treatment's batch number corrected from the pack.
    const t = await api<{ treatment: { id: string; version: number } }>(page, `/api/hives/${hiveId}/treatments`, {
      method: 'POST',
      headers: { 'Idempotency-Key': `treat-${Date.now()}` },
      body: { activeIngredient: 'thymol', method: 'gel', dose: 'One tray, as on the label', batch: 'LOT-0O1', startDate: new Date().toISOString().slice(0, 10) },
    });
    expect(t.status).toBe(201);
    await page.goto(`/hives/${hiveId}/treatment?recordId=${t.body.treatment.id}`);
    await byTestId(page, 'treatment-editing').waitFor();
    await expect(byTestId(page, 'chips-activeIngredient-thymol').getAttribute('aria-checked')).resolves.toBe('true');
    await byTestId(page, 'caution-treatment-temperature').waitFor();
    await byTestId(page, 'treatment-batch').fill('LOT-001');
    await byTestId(page, 'treatment-save').click();
    await byTestId(page, 'hive-screen').waitFor();
    const treated = (await api<{ treatment: { batch: string; version: number; dose: string } }>(page, `/api/treatments/${t.body.treatment.id}`)).body.treatment;
    expect(treated).toMatchObject({ batch: 'LOT-001', version: 2, dose: 'One tray, as on the label' });
    await context.close();
  });
});
