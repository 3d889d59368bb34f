import { count, eq, inArray } from 'drizzle-orm';
import { windowState } from '../../shared/domain/access';
import type { ApiaryCreateInput, ApiaryDto, ApiaryUpdateInput } from '../../shared/schemas/apiaries';
import { apiaryCreateSchema } from '../../shared/schemas/apiaries';
import { apiaries, hives, memberships } from '../../db/schema';
import type { Ctx, SessionUser } from '../context';
import { requireApiary, type Membership } from './access';
import { recordAudit } from './audit';

type ApiaryRow = typeof apiaries.$inferSelect;

function toDto(a: ApiaryRow, m: Pick<Membership, 'role' | 'startsAt' | 'endsAt'>, hiveCount: number): ApiaryDto {
  return {
    id: a.id,
    name: a.name,
    hemisphere: a.hemisphere,
    climateNote: a.climateNote,
    winterStoresTargetKg: a.winterStoresTargetKg,
    myRole: m.role,
    myStartsAt: m.startsAt?.toISOString() ?? null,
    myEndsAt: m.endsAt?.toISOString() ?? null,
    hiveCount,
    createdAt: a.createdAt.toISOString(),
    updatedAt: a.updatedAt.toISOString(),
  };
}

async function hiveCounts(ctx: Ctx, apiaryIds: string[]): Promise<Map<string, number>> {
  if (apiaryIds.length === 0) return new Map();
  const rows = await ctx.db
    .select({ apiaryId: hives.apiaryId, n: count() })
    .from(hives)
    .where(inArray(hives.apiaryId, apiaryIds))
    .groupBy(hives.apiaryId);
  return new Map(rows.map((r) => [r.apiaryId, r.n]));
}

/**
 * The apiaries a person may see: every membership whose window is open, and a sitting still to
 * come (listed with its start, so the sitter knows when; opening it answers 403 until then).
 * An ended window drops out.
 */
export async function listApiaries(ctx: Ctx, user: SessionUser): Promise<ApiaryDto[]> {
  const rows = await ctx.db
    .select({ a: apiaries, m: { role: memberships.role, startsAt: memberships.startsAt, endsAt: memberships.endsAt } })
    .from(memberships)
    .innerJoin(apiaries, eq(apiaries.id, memberships.apiaryId))
    .where(eq(memberships.userId, user.id))
    .orderBy(apiaries.name);
  const now = ctx.now();
  const open = rows.filter((r) => windowState(r.m, now) !== 'ended');
  const counts = await hiveCounts(ctx, open.map((r) => r.a.id));
  return open.map((r) => toDto(r.a, r.m, counts.get(r.a.id) ?? 0));
}

/** Anyone signed in may start an apiary; they become its owner in the same transaction. */
export async function createApiary(ctx: Ctx, user: SessionUser, input: ApiaryCreateInput): Promise<ApiaryDto> {
  const values = apiaryCreateSchema.parse(input);
  return ctx.db.transaction(async (tx) => {
    const [a] = await tx.insert(apiaries).values(values).returning();
    const [m] = await tx.insert(memberships).values({ apiaryId: a!.id, userId: user.id, role: 'owner' }).returning();
    await recordAudit(tx, ctx, { apiaryId: a!.id, userId: user.id, entity: 'apiary', entityId: a!.id, action: 'create', after: a! });
    return toDto(a!, m!, 0);
  });
}

export async function getApiary(ctx: Ctx, user: SessionUser, apiaryId: string): Promise<ApiaryDto> {
  const m = await requireApiary(ctx, user, apiaryId, 'apiary:read');
  const [a] = await ctx.db.select().from(apiaries).where(eq(apiaries.id, apiaryId)).limit(1);
  const counts = await hiveCounts(ctx, [apiaryId]);
  return toDto(a!, m, counts.get(apiaryId) ?? 0);
}

export async function updateApiary(ctx: Ctx, user: SessionUser, apiaryId: string, input: ApiaryUpdateInput): Promise<ApiaryDto> {
  const m = await requireApiary(ctx, user, apiaryId, 'apiary:update');
  const a = await ctx.db.transaction(async (tx) => {
    const [before] = await tx.select().from(apiaries).where(eq(apiaries.id, apiaryId)).for('update');
    const [after] = await tx.update(apiaries).set({ ...input, updatedAt: ctx.now() }).where(eq(apiaries.id, apiaryId)).returning();
    await recordAudit(tx, ctx, { apiaryId, userId: user.id, entity: 'apiary', entityId: apiaryId, action: 'update', before: before!, after: after! });
    return after;
  });
  const counts = await hiveCounts(ctx, [apiaryId]);
  return toDto(a!, m, counts.get(apiaryId) ?? 0);
}
