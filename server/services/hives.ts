import { asc, eq, inArray, and, desc } from 'drizzle-orm';
import type { HiveCreateInput, HiveDto, HiveUpdateInput, QueenDto } from '../../shared/schemas/hives';
import { hiveCreateSchema, queenSchema } from '../../shared/schemas/hives';
import { apiaries, hives, queens } from '../../db/schema';
import type { Ctx, SessionUser } from '../context';
import { conflict, notFound } from '../errors';
import { requireApiary, requireHive } from './access';
import { recordAudit } from './audit';

type HiveRow = typeof hives.$inferSelect;
type QueenRow = typeof queens.$inferSelect;
type Tx = Parameters<Parameters<Ctx['db']['transaction']>[0]>[0];

const queenDto = (q: QueenRow | undefined): QueenDto | null =>
  q ? { id: q.id, origin: q.origin, year: q.year, markColour: q.markColour, clipped: q.clipped, status: q.status } : null;

function toDto(h: HiveRow, apiaryName: string, q: QueenRow | undefined): HiveDto {
  return {
    id: h.id,
    apiaryId: h.apiaryId,
    apiaryName,
    name: h.name,
    boxes: h.boxes,
    status: h.status,
    note: h.note,
    queen: queenDto(q),
    version: h.version,
    createdAt: h.createdAt.toISOString(),
    updatedAt: h.updatedAt.toISOString(),
  };
}

/** The current queen of each hive: the newest queen row that is still present. */
async function currentQueens(db: Ctx['db'] | Tx, hiveIds: string[]): Promise<Map<string, QueenRow>> {
  if (hiveIds.length === 0) return new Map();
  const rows = await db
    .select()
    .from(queens)
    .where(and(inArray(queens.hiveId, hiveIds), eq(queens.status, 'present')))
    .orderBy(desc(queens.createdAt));
  const map = new Map<string, QueenRow>();
  for (const q of rows) if (!map.has(q.hiveId)) map.set(q.hiveId, q);
  return map;
}

export async function listHives(ctx: Ctx, user: SessionUser, apiaryId: string): Promise<HiveDto[]> {
  await requireApiary(ctx, user, apiaryId, 'hive:read');
  const rows = await ctx.db
    .select({ h: hives, apiaryName: apiaries.name })
    .from(hives)
    .innerJoin(apiaries, eq(apiaries.id, hives.apiaryId))
    .where(eq(hives.apiaryId, apiaryId))
    .orderBy(asc(hives.name));
  const qs = await currentQueens(ctx.db, rows.map((r) => r.h.id));
  return rows.map((r) => toDto(r.h, r.apiaryName, qs.get(r.h.id)));
}

export async function getHive(ctx: Ctx, user: SessionUser, hiveId: string): Promise<HiveDto> {
  await requireHive(ctx, user, hiveId, 'hive:read');
  return loadHive(ctx.db, hiveId);
}

async function loadHive(db: Ctx['db'] | Tx, hiveId: string): Promise<HiveDto> {
  const [r] = await db
    .select({ h: hives, apiaryName: apiaries.name })
    .from(hives)
    .innerJoin(apiaries, eq(apiaries.id, hives.apiaryId))
    .where(eq(hives.id, hiveId))
    .limit(1);
  if (!r) throw notFound('That hive');
  const qs = await currentQueens(db, [hiveId]);
  return toDto(r.h, r.apiaryName, qs.get(hiveId));
}

export async function createHive(ctx: Ctx, user: SessionUser, apiaryId: string, input: HiveCreateInput): Promise<HiveDto> {
  await requireApiary(ctx, user, apiaryId, 'hive:create');
  const v = hiveCreateSchema.parse(input);
  return ctx.db.transaction(async (tx) => {
    const [h] = await tx
      .insert(hives)
      .values({ apiaryId, name: v.name, boxes: v.boxes, status: v.status, note: v.note })
      .returning();
    if (v.queen) await tx.insert(queens).values({ hiveId: h!.id, ...queenSchema.parse(v.queen) });
    const dto = await loadHive(tx, h!.id);
    await recordAudit(tx, ctx, { apiaryId, userId: user.id, entity: 'hive', entityId: h!.id, action: 'create', after: { ...dto } });
    return dto;
  });
}

/**
 * Edits a hive. With `version`, a stale edit answers 409 with the current hive rather than
 * overwriting someone else's change.
 */
export async function updateHive(ctx: Ctx, user: SessionUser, hiveId: string, input: HiveUpdateInput): Promise<HiveDto> {
  await requireHive(ctx, user, hiveId, 'hive:update');
  return ctx.db.transaction(async (tx) => {
    const [locked] = await tx.select().from(hives).where(eq(hives.id, hiveId)).for('update');
    if (!locked) throw notFound('That hive');
    if (input.version !== undefined && input.version !== locked.version) {
      throw conflict('Someone else changed this hive since you opened it. Here is the current version.', {
        current: await loadHive(tx, hiveId),
      });
    }
    const before = await loadHive(tx, hiveId);
    const { queen, version: _v, ...fields } = input;
    await tx
      .update(hives)
      .set({ ...fields, version: locked.version + 1, updatedAt: ctx.now() })
      .where(eq(hives.id, hiveId));
    if (queen !== undefined) {
      const current = (await currentQueens(tx, [hiveId])).get(hiveId);
      if (queen === null) {
        if (current) await tx.update(queens).set({ status: 'lost', updatedAt: ctx.now() }).where(eq(queens.id, current.id));
      } else if (current) {
        await tx.update(queens).set({ ...queen, updatedAt: ctx.now() }).where(eq(queens.id, current.id));
      } else {
        await tx.insert(queens).values({ hiveId, ...queenSchema.parse(queen) });
      }
    }
    const after = await loadHive(tx, hiveId);
    await recordAudit(tx, ctx, { apiaryId: locked.apiaryId, userId: user.id, entity: 'hive', entityId: hiveId, action: 'update', before: { ...before }, after: { ...after } });
    return after;
  });
}
