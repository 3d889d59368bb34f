import { and, eq } from 'drizzle-orm';
import { can, windowState, type Action, type MembershipWindow, type Role } from '../../shared/domain/access';
import { hives, memberships } from '../../db/schema';
import type { Ctx, SessionUser } from '../context';
import { forbidden, notFound } from '../errors';

export interface Membership extends MembershipWindow {
  apiaryId: string;
  userId: string;
  role: Role;
  startsAt: Date | null;
  endsAt: Date | null;
}

const fmt = (d: Date) => d.toISOString().slice(0, 10);

export async function findMembership(ctx: Ctx, userId: string, apiaryId: string): Promise<Membership | null> {
  const [m] = await ctx.db
    .select({
      apiaryId: memberships.apiaryId,
      userId: memberships.userId,
      role: memberships.role,
      startsAt: memberships.startsAt,
      endsAt: memberships.endsAt,
    })
    .from(memberships)
    .where(and(eq(memberships.userId, userId), eq(memberships.apiaryId, apiaryId)))
    .limit(1);
  return m ?? null;
}

/**
 * The one gate every apiary-scoped request passes. A stranger gets 404 (the apiary's existence
 * is not revealed); a member outside their window gets 403 naming the dates; a member whose
 * role lacks the action gets 403.
 */
export async function requireApiary(ctx: Ctx, user: SessionUser, apiaryId: string, action: Action): Promise<Membership> {
  const m = await findMembership(ctx, user.id, apiaryId);
  if (!m) throw notFound('That apiary');
  assertAllowed(ctx, m, action);
  return m;
}

export function assertAllowed(ctx: Ctx, m: Membership, action: Action): void {
  const now = ctx.now();
  const state = windowState(m, now);
  if (state === 'not-started') {
    throw forbidden(`Your access to this apiary begins on ${fmt(m.startsAt!)}.`);
  }
  if (state === 'ended') {
    throw forbidden(`Your access to this apiary ended on ${fmt(m.endsAt!)}.`);
  }
  if (!can(m, action, now)) {
    throw forbidden(`As ${article(m.role)} ${m.role} here you cannot do that.`);
  }
}

const article = (role: Role) => (role === 'owner' ? 'an' : 'a');

/** Loads a hive's apiary id and checks access to it; unknown hives and strangers both get 404. */
export async function requireHive(ctx: Ctx, user: SessionUser, hiveId: string, action: Action) {
  const [h] = await ctx.db.select({ apiaryId: hives.apiaryId }).from(hives).where(eq(hives.id, hiveId)).limit(1);
  if (!h) throw notFound('That hive');
  const m = await findMembership(ctx, user.id, h.apiaryId);
  if (!m) throw notFound('That hive');
  assertAllowed(ctx, m, action);
  return m;
}
