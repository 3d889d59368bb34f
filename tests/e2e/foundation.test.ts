import { byTestId, newPage, shot, signIn, startE2e, VIEWPORTS, type E2e } from './harness';

jest.setTimeout(120_000);

describe('foundation, end to end in Chromium', () => {
  let e: E2e;
  beforeAll(async () => {
    e = await startE2e();
  });
  afterAll(() => e?.close());

  it('shows a clear message for a wrong password', async () => {
    const { context, page } = await newPage(e);
    await signIn(page, 'keeper@frameside.test', 'not-the-password');
    await expect(byTestId(page, 'sign-in-error').textContent()).resolves.toMatch(/do not match/);
    await context.close();
  });

  it.each(Object.entries(VIEWPORTS))('signs in as the demo keeper, sees both sites and their hives, adds a hive and signs out (%s)', async (label, viewport) => {
    const { context, page } = await newPage(e, viewport);
    await page.goto('/sign-in');
    await page.waitForLoadState('networkidle');
    await shot(page, 'sign-in');
    await signIn(page, 'keeper@frameside.test');
    await byTestId(page, 'nav-apiaries').waitFor();
    // The shipped typeface is really in use, not a fallback.
    // (document.fonts.check answers true for an unknown family, so look for the loaded face itself.)
    const loaded = await page.evaluate(() =>
      [...document.fonts].some((f) => f.family.replace(/"/g, '') === 'Atkinson Hyperlegible' && f.status === 'loaded'),
    );
    expect(loaded).toBe(true);
    await shot(page, 'home');

    await byTestId(page, 'nav-apiaries').click();
    await byTestId(page, `apiary-${e.ids.orchardRow}`).waitFor();
    await expect(byTestId(page, `apiary-${e.ids.orchardRow}`).textContent()).resolves.toContain('Orchard Row');
    await expect(byTestId(page, `apiary-${e.ids.quarryHill}`).textContent()).resolves.toContain('Quarry Hill');
    await shot(page, 'apiaries');

    await byTestId(page, `apiary-${e.ids.quarryHill}`).click();
    await byTestId(page, `hive-${e.ids.hives.Granite}`).waitFor();
    for (const name of ['Granite', 'Heather', 'Iris', 'Juniper']) {
      await expect(byTestId(page, `hive-${e.ids.hives[name]}`).textContent()).resolves.toContain(name);
    }
    await shot(page, 'apiary-hives');

    await byTestId(page, 'add-hive').click();
    await byTestId(page, 'hive-name').fill(`Larch ${label}`);
    await byTestId(page, 'add-box').click();
    await shot(page, 'hive-new');
    await byTestId(page, 'hive-save').click();
    await byTestId(page, 'hive-title').waitFor();
    await expect(byTestId(page, 'hive-title').textContent()).resolves.toContain(`Larch ${label}`);
    await shot(page, 'hive-page');

    await byTestId(page, 'nav-sign-out').click();
    await byTestId(page, 'sign-in-email').waitFor();
    const me = await page.evaluate(() => fetch('/api/me').then((r) => r.status));
    expect(me).toBe(401);
    await context.close();
  });

  it('sends a signed-out visitor of a deep link to sign-in', async () => {
    const { context, page } = await newPage(e);
    await page.goto(`/hives/${e.ids.hives.Ash}`);
    await byTestId(page, 'sign-in-email').waitFor();
    expect(page.url()).toContain('/sign-in');
    await context.close();
  });
});
