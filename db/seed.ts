/**
 * The invented demo scenario: a keeper in a temperate northern valley with two sites.
 * Every name, person and number here is made up for the demo; none is a reference value.
 * Later features add their records through `seedExtensions`.
 */
import { count } from 'drizzle-orm';
import { queenMarkColour } from '../shared/domain/queen';
import type { Box } from '../shared/domain/hives';
import { hashPassword } from '../server/password';
import { createDb, type Db } from './client';
import { apiaries, hives, memberships, queens, users } from './schema';
import { seedExtensions } from './seed-extensions';

export const DEMO_PASSWORD = 'frameside-demo';
export const DEMO_USERS = {
  keeper: { email: 'keeper@frameside.test', name: 'Rowan Hale' },
  cokeeper: { email: 'cokeeper@frameside.test', name: 'Idris Penrose' },
  sitter: { email: 'sitter@frameside.test', name: 'Maren Clough' },
  mentor: { email: 'mentor@frameside.test', name: 'Tamsin Oakes' },
} as const;

export interface DemoIds {
  users: Record<keyof typeof DEMO_USERS, string>;
  orchardRow: string;
  quarryHill: string;
  hives: Record<string, string>;
}

const deep10: Box = { size: 'deep', frames: 10 };
const medium10: Box = { size: 'medium', frames: 10 };

const ORCHARD_HIVES: { name: string; boxes: Box[]; queenYear: number; note: string }[] = [
  { name: 'Ash', boxes: [deep10, deep10, medium10], queenYear: 2025, note: 'On the hive scale.' },
  { name: 'Bramble', boxes: [deep10, deep10], queenYear: 2026, note: '' },
  { name: 'Clover', boxes: [deep10, medium10], queenYear: 2024, note: '' },
  { name: 'Damson', boxes: [deep10, deep10, medium10], queenYear: 2025, note: '' },
  { name: 'Elder', boxes: [deep10], queenYear: 2026, note: 'Made up from a split in June.' },
  { name: 'Fennel', boxes: [deep10, deep10], queenYear: 2025, note: '' },
];
const QUARRY_HIVES: typeof ORCHARD_HIVES = [
  { name: 'Granite', boxes: [deep10, deep10], queenYear: 2025, note: 'Out-apiary, no signal at the gate.' },
  { name: 'Heather', boxes: [deep10, medium10, medium10], queenYear: 2024, note: '' },
  { name: 'Iris', boxes: [deep10, deep10], queenYear: 2026, note: '' },
  { name: 'Juniper', boxes: [deep10], queenYear: 2025, note: '' },
];

const day = 86_400_000;

/** Writes the demo into an empty database. `now` fixes the sitter's window around today. */
export async function seedDemo(db: Db, { now = new Date() }: { now?: Date } = {}): Promise<DemoIds> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  return db.transaction(async (tx) => {
    const userRows = await tx
      .insert(users)
      .values(Object.values(DEMO_USERS).map((u) => ({ ...u, passwordHash })))
      .returning({ id: users.id, email: users.email });
    const byEmail = new Map(userRows.map((u) => [u.email, u.id]));
    const uid = (k: keyof typeof DEMO_USERS) => byEmail.get(DEMO_USERS[k].email)!;

    const [orchard, quarry] = await tx
      .insert(apiaries)
      .values([
        { name: 'Orchard Row', hemisphere: 'north', climateNote: 'Valley floor, old apple orchard; frost pocket in spring.', winterStoresTargetKg: 20 },
        { name: 'Quarry Hill', hemisphere: 'north', climateNote: 'Exposed hillside above the old quarry; no mobile signal.', winterStoresTargetKg: 22 },
      ])
      .returning({ id: apiaries.id });

    // The sitter's fortnight is placed around today so the demo always shows a live handover.
    const sitterStart = new Date(now.getTime() - 3 * day);
    const sitterEnd = new Date(now.getTime() + 11 * day);
    await tx.insert(memberships).values([
      { apiaryId: orchard!.id, userId: uid('keeper'), role: 'owner' },
      { apiaryId: quarry!.id, userId: uid('keeper'), role: 'owner' },
      { apiaryId: orchard!.id, userId: uid('cokeeper'), role: 'keeper' },
      { apiaryId: quarry!.id, userId: uid('cokeeper'), role: 'keeper' },
      { apiaryId: orchard!.id, userId: uid('sitter'), role: 'sitter', startsAt: sitterStart, endsAt: sitterEnd },
      { apiaryId: orchard!.id, userId: uid('mentor'), role: 'viewer' },
      { apiaryId: quarry!.id, userId: uid('mentor'), role: 'viewer' },
    ]);

    const hiveIds: Record<string, string> = {};
    for (const [apiaryId, list] of [
      [orchard!.id, ORCHARD_HIVES],
      [quarry!.id, QUARRY_HIVES],
    ] as const) {
      for (const h of list) {
        const [row] = await tx
          .insert(hives)
          .values({ apiaryId, name: h.name, boxes: h.boxes, note: h.note })
          .returning({ id: hives.id });
        hiveIds[h.name] = row!.id;
        await tx.insert(queens).values({
          hiveId: row!.id,
          origin: h.queenYear === 2026 ? 'own-rearing' : 'bought-mated',
          year: h.queenYear,
          markColour: queenMarkColour(h.queenYear),
          clipped: h.queenYear < 2026,
        });
      }
    }
    const ids: DemoIds = {
      users: { keeper: uid('keeper'), cokeeper: uid('cokeeper'), sitter: uid('sitter'), mentor: uid('mentor') },
      orchardRow: orchard!.id,
      quarryHill: quarry!.id,
      hives: hiveIds,
    };
    for (const extend of seedExtensions) await extend(tx, ids, now);
    return ids;
  });
}

export async function isEmpty(db: Db): Promise<boolean> {
  const [r] = await db.select({ n: count() }).from(users);
  return (r?.n ?? 0) === 0;
}

if (require.main === module) {
  const url = process.env.DATABASE_URL;
  if (!url) {
    console.error('seed: DATABASE_URL is not set');
    process.exit(1);
  }
  const db = createDb(url, { max: 2 });
  (async () => {
    if (!(await isEmpty(db))) {
      console.log('seed: the database already has accounts; the demo was not added again');
    } else {
      await seedDemo(db);
      console.log('seed: demo scenario written (password for every demo account: frameside-demo)');
    }
  })()
    .catch((err) => {
      console.error('seed: FAILED —', err instanceof Error ? err.message : err);
      process.exitCode = 1;
    })
    .finally(() => db.$client.end());
}
