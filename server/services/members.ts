import { and, desc, eq, gt, isNull, sql } from 'drizzle-orm';
import { daysLeft, windowState } from '../../shared/domain/access';
import {
  windowEnd,
  windowStart,
  type ActivityDto,
  type InvitationAcceptInput,
  type InvitationCreateInput,
  type InvitationInfoDto,
  type MemberDto,
  type MembersDto,
  type MemberUpdateInput,
} from '../../shared/schemas/people';
import { passwordSchema } from '../../shared/schemas/auth';
import type { UserDto } from '../../shared/schemas/auth';
import { apiaries, auditLog, invitations, memberships, sessions, users } from '../../db/schema';
import type { Ctx, SessionUser } from '../context';
import { AppError, conflict, notFound } from '../errors';
import { invitationMail } from '../mail/templates';
import { hashPassword, verifyPassword } from '../password';
import { hashToken, looksLikeToken, newToken } from '../tokens';
import { requireApiary } from './access';
import { recordAudit } from './audit';
import { sendHandoverMail } from './handover';

/** How long an invitation link stays usable. */
export const INVITATION_DAYS = 7;
const DAY_MS = 86_400_000;

const iso = (d: Date | null) => d?.toISOString() ?? null;

/** Who has access to an apiary, until when, and the invitations not yet accepted. Owners and keepers. */
export async function listMembers(ctx: Ctx, user: SessionUser, apiaryId: string): Promise<MembersDto> {
  await requireApiary(ctx, user, apiaryId, 'members:read');
  const now = ctx.now();
  const rows = await ctx.db
    .select({
      userId: memberships.userId,
      name: users.name,
      email: users.email,
      role: memberships.role,
      startsAt: memberships.startsAt,
      endsAt: memberships.endsAt,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.apiaryId, apiaryId))
    .orderBy(sql`case ${memberships.role} when 'owner' then 0 when 'keeper' then 1 when 'sitter' then 2 else 3 end`, users.name);
  const inviter = sql<string | null>`(select name from users where users.id = ${invitations.invitedBy})`;
  const pending = await ctx.db
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      startsAt: invitations.startsAt,
      endsAt: invitations.endsAt,
      expiresAt: invitations.expiresAt,
      invitedBy: inviter,
    })
    .from(invitations)
    .where(and(eq(invitations.apiaryId, apiaryId), isNull(invitations.acceptedAt), gt(invitations.expiresAt, now)))
    .orderBy(desc(invitations.createdAt));
  return {
    members: rows.map(
      (r): MemberDto => ({
        ...r,
        startsAt: iso(r.startsAt),
        endsAt: iso(r.endsAt),
        state: windowState(r, now),
        daysLeft: daysLeft(r, now),
      }),
    ),
    invitations: pending.map((p) => ({ ...p, startsAt: iso(p.startsAt), endsAt: iso(p.endsAt), expiresAt: p.expiresAt.toISOString() })),
  };
}

/** The owner invites by e-mail; the link's token is mailed and only its hash kept. */
export async function createInvitation(
  ctx: Ctx,
  user: SessionUser,
  apiaryId: string,
  input: InvitationCreateInput,
): Promise<{ id: string; email: string; role: string; expiresAt: string }> {
  await requireApiary(ctx, user, apiaryId, 'members:manage');
  const now = ctx.now();
  const startsAt = input.role === 'sitter' && input.startsAt ? windowStart(input.startsAt) : null;
  const endsAt = input.role === 'sitter' && input.endsAt ? windowEnd(input.endsAt) : null;
  if (endsAt && endsAt.getTime() <= now.getTime()) {
    throw new AppError('invalid', 'The end date has already passed. Choose an end date from today on.', 400, {
      fields: { endsAt: 'The end date has already passed.' },
    });
  }
  const [existing] = await ctx.db
    .select({ id: memberships.id })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.apiaryId, apiaryId), eq(users.email, input.email)))
    .limit(1);
  if (existing) throw conflict(`${input.email} already has access to this apiary. Change their role in the list instead.`);

  const { token, hash } = newToken();
  // A link is no use after the sitting it is for has ended.
  const expiresAt = new Date(Math.min(now.getTime() + INVITATION_DAYS * DAY_MS, endsAt?.getTime() ?? Infinity));
  const [apiary] = await ctx.db.select({ name: apiaries.name }).from(apiaries).where(eq(apiaries.id, apiaryId));
  const inv = await ctx.db.transaction(async (tx) => {
    const [row] = await tx
      .insert(invitations)
      .values({ apiaryId, email: input.email, role: input.role, startsAt, endsAt, tokenHash: hash, expiresAt, invitedBy: user.id, createdAt: now })
      .returning();
    const { tokenHash: _t, ...safe } = row!;
    await recordAudit(tx, ctx, { apiaryId, userId: user.id, entity: 'invitation', entityId: row!.id, action: 'create', after: safe });
    return row!;
  });
  await ctx.mailer.send(
    invitationMail({
      to: input.email,
      inviterName: user.name,
      apiaryName: apiary!.name,
      role: input.role,
      startsAt,
      endsAt,
      expiresAt,
      link: `${ctx.publicUrl}/invite/${token}`,
    }),
  );
  return { id: inv.id, email: inv.email, role: inv.role, expiresAt: inv.expiresAt.toISOString() };
}

type InvitationRow = typeof invitations.$inferSelect;

/** Unknown → 404; used or expired → 410, each saying what to do next. */
function checkUsable(ctx: Ctx, inv: InvitationRow | undefined): asserts inv is InvitationRow {
  if (!inv) throw new AppError('not_found', 'This invitation link is not known. Check that the whole link was copied, or ask the owner for a new one.', 404);
  if (inv.acceptedAt) throw new AppError('invitation_used', 'This invitation has already been used. Sign in, or ask the owner for a new invitation.', 410);
  if (inv.expiresAt.getTime() <= ctx.now().getTime()) {
    throw new AppError('invitation_expired', `This invitation expired on ${inv.expiresAt.toISOString().slice(0, 10)}. Ask the owner for a new one.`, 410);
  }
}

async function loadByToken(ctx: Ctx, token: string): Promise<InvitationRow | undefined> {
  if (!looksLikeToken(token)) return undefined;
  const [inv] = await ctx.db.select().from(invitations).where(eq(invitations.tokenHash, hashToken(token))).limit(1);
  return inv;
}

/** Public: what an invitation link is for, so the page can say it before anyone signs in. */
export async function invitationInfo(ctx: Ctx, token: string): Promise<InvitationInfoDto> {
  const inv = await loadByToken(ctx, token);
  checkUsable(ctx, inv);
  const [a] = await ctx.db.select({ name: apiaries.name }).from(apiaries).where(eq(apiaries.id, inv.apiaryId));
  const [inviter] = inv.invitedBy ? await ctx.db.select({ name: users.name }).from(users).where(eq(users.id, inv.invitedBy)) : [];
  const [account] = await ctx.db.select({ id: users.id }).from(users).where(eq(users.email, inv.email)).limit(1);
  return {
    apiaryName: a!.name,
    role: inv.role,
    email: inv.email,
    startsAt: iso(inv.startsAt),
    endsAt: iso(inv.endsAt),
    expiresAt: inv.expiresAt.toISOString(),
    invitedBy: inviter?.name ?? null,
    accountExists: Boolean(account),
  };
}

export interface AcceptResult {
  user: UserDto;
  apiaryId: string;
  role: string;
  /** Set when the visitor was signed out: the route puts it in the cookie. */
  sessionId?: string;
}

/**
 * Accepts an invitation once. Signed in: for that account. Signed out: the e-mail and password
 * sign in to an existing account or create one. The invitation row is locked so that two clicks
 * cannot both use it.
 */
export async function acceptInvitation(
  ctx: Ctx,
  token: string,
  signedIn: SessionUser | undefined,
  credentials: InvitationAcceptInput | undefined,
): Promise<AcceptResult> {
  const first = await loadByToken(ctx, token);
  checkUsable(ctx, first);
  let passwordHash: string | undefined;
  let verifiedUser: UserDto | undefined;
  if (!signedIn) {
    if (!credentials) throw new AppError('invalid', 'Enter your e-mail and a password to accept.', 400);
    const [u] = await ctx.db.select().from(users).where(eq(users.email, credentials.email)).limit(1);
    if (u) {
      if (!(await verifyPassword(credentials.password, u.passwordHash))) {
        throw new AppError('bad_credentials', 'That e-mail and password do not match an account.', 401);
      }
      verifiedUser = { id: u.id, email: u.email, name: u.name };
    } else {
      const pw = passwordSchema.safeParse(credentials.password);
      if (!pw.success) throw new AppError('invalid', pw.error.issues[0]!.message, 400, { fields: { password: pw.error.issues[0]!.message } });
      passwordHash = await hashPassword(credentials.password);
    }
  }

  const now = ctx.now();
  const result = await ctx.db
    .transaction(async (tx) => {
      const [inv] = await tx.select().from(invitations).where(eq(invitations.id, first.id)).for('update');
      checkUsable(ctx, inv);
      let user: UserDto;
      let sessionId: string | undefined;
      if (signedIn) user = { id: signedIn.id, email: signedIn.email, name: signedIn.name };
      else if (verifiedUser) user = verifiedUser;
      else {
        const name = credentials!.name ?? credentials!.email.split('@')[0]!;
        const [u] = await tx.insert(users).values({ email: credentials!.email, name, passwordHash: passwordHash! }).returning();
        user = { id: u!.id, email: u!.email, name: u!.name };
      }
      if (!signedIn) {
        const [s] = await tx.insert(sessions).values({ userId: user.id }).returning({ id: sessions.id });
        sessionId = s!.id;
      }
      const [already] = await tx
        .select({ id: memberships.id })
        .from(memberships)
        .where(and(eq(memberships.apiaryId, inv.apiaryId), eq(memberships.userId, user.id)));
      if (already) throw conflict('You already have access to this apiary. Open it from your apiaries list.');
      const [m] = await tx
        .insert(memberships)
        .values({ apiaryId: inv.apiaryId, userId: user.id, role: inv.role, startsAt: inv.startsAt, endsAt: inv.endsAt })
        .returning();
      await tx.update(invitations).set({ acceptedAt: now, acceptedBy: user.id }).where(eq(invitations.id, inv.id));
      await recordAudit(tx, ctx, { apiaryId: inv.apiaryId, userId: user.id, entity: 'membership', entityId: m!.id, action: 'create', after: m! });
      return { user, apiaryId: inv.apiaryId, role: inv.role, sessionId, sitter: inv.role === 'sitter' };
    })
    .catch((err: unknown) => {
      if ((err as { cause?: { code?: string } }).cause?.code === '23505') {
        throw new AppError('email_taken', 'An account with that e-mail already exists. Enter its password to sign in.', 409, {
          fields: { password: 'Enter the password of your existing account.' },
        });
      }
      throw err;
    });
  if (result.sitter) {
    // The brief goes out once the sitter has access; a mail failure must not undo the acceptance.
    await sendHandoverMail(ctx, result.user, result.apiaryId).catch((err: unknown) =>
      ctx.logger.warn({ err }, 'handover mail could not be sent'),
    );
  }
  const { sitter: _s, ...out } = result;
  return out;
}

type Tx = Parameters<Parameters<Ctx['db']['transaction']>[0]>[0];

async function ownerCount(tx: Tx, apiaryId: string): Promise<number> {
  const [r] = await tx
    .select({ n: sql<number>`count(*)::int` })
    .from(memberships)
    .where(and(eq(memberships.apiaryId, apiaryId), eq(memberships.role, 'owner')));
  return r?.n ?? 0;
}

const LAST_OWNER = 'An apiary needs at least one owner. Make someone else an owner first.';

/** The owner changes someone's role or window. */
export async function updateMember(ctx: Ctx, user: SessionUser, apiaryId: string, userId: string, input: MemberUpdateInput): Promise<MemberDto> {
  await requireApiary(ctx, user, apiaryId, 'members:manage');
  const now = ctx.now();
  return ctx.db.transaction(async (tx) => {
    // Lock the apiary's owner rows too, so two owners demoting each other cannot leave none.
    await tx.select({ id: memberships.id }).from(memberships).where(and(eq(memberships.apiaryId, apiaryId), eq(memberships.role, 'owner'))).for('update');
    const [before] = await tx
      .select()
      .from(memberships)
      .where(and(eq(memberships.apiaryId, apiaryId), eq(memberships.userId, userId)))
      .for('update');
    if (!before) throw notFound('That member');
    const role = input.role ?? before.role;
    if (before.role === 'owner' && role !== 'owner' && (await ownerCount(tx, apiaryId)) <= 1) throw conflict(LAST_OWNER);
    let startsAt: Date | null = null;
    let endsAt: Date | null = null;
    if (role === 'sitter') {
      startsAt = input.startsAt ? windowStart(input.startsAt) : input.startsAt === null ? null : before.startsAt;
      endsAt = input.endsAt ? windowEnd(input.endsAt) : input.endsAt === null ? null : before.endsAt;
      if (!startsAt || !endsAt) {
        throw new AppError('invalid', 'A sitter needs a start and an end date.', 400, { fields: { endsAt: 'A sitter needs a start and an end date.' } });
      }
      if (endsAt.getTime() <= startsAt.getTime()) {
        throw new AppError('invalid', 'The end date must be after the start date.', 400, { fields: { endsAt: 'The end date must be after the start date.' } });
      }
    } else if (input.startsAt != null || input.endsAt != null) {
      throw new AppError('invalid', 'Only a sitter has start and end dates.', 400, { fields: { startsAt: 'Only a sitter has start and end dates.' } });
    }
    const [after] = await tx
      .update(memberships)
      .set({ role, startsAt, endsAt, updatedAt: now })
      .where(eq(memberships.id, before.id))
      .returning();
    await recordAudit(tx, ctx, { apiaryId, userId: user.id, entity: 'membership', entityId: before.id, action: 'update', before, after: after! });
    const [u] = await tx.select({ name: users.name, email: users.email }).from(users).where(eq(users.id, userId));
    return {
      userId,
      name: u!.name,
      email: u!.email,
      role: after!.role,
      startsAt: iso(after!.startsAt),
      endsAt: iso(after!.endsAt),
      state: windowState(after!, now),
      daysLeft: daysLeft(after!, now),
    };
  });
}

/** The owner ends someone's access (the last owner stays). */
export async function removeMember(ctx: Ctx, user: SessionUser, apiaryId: string, userId: string): Promise<void> {
  await requireApiary(ctx, user, apiaryId, 'members:manage');
  await ctx.db.transaction(async (tx) => {
    await tx.select({ id: memberships.id }).from(memberships).where(and(eq(memberships.apiaryId, apiaryId), eq(memberships.role, 'owner'))).for('update');
    const [before] = await tx
      .select()
      .from(memberships)
      .where(and(eq(memberships.apiaryId, apiaryId), eq(memberships.userId, userId)))
      .for('update');
    if (!before) throw notFound('That member');
    if (before.role === 'owner' && (await ownerCount(tx, apiaryId)) <= 1) throw conflict(LAST_OWNER);
    await tx.delete(memberships).where(eq(memberships.id, before.id));
    await recordAudit(tx, ctx, { apiaryId, userId: user.id, entity: 'membership', entityId: before.id, action: 'delete', before });
  });
}

/** The owner withdraws an invitation that has not been accepted yet. */
export async function revokeInvitation(ctx: Ctx, user: SessionUser, apiaryId: string, invitationId: string): Promise<void> {
  await requireApiary(ctx, user, apiaryId, 'members:manage');
  await ctx.db.transaction(async (tx) => {
    const [before] = await tx
      .select()
      .from(invitations)
      .where(and(eq(invitations.id, invitationId), eq(invitations.apiaryId, apiaryId), isNull(invitations.acceptedAt)))
      .for('update');
    if (!before) throw notFound('That invitation');
    await tx.delete(invitations).where(eq(invitations.id, before.id));
    const { tokenHash: _t, ...safe } = before;
    await recordAudit(tx, ctx, { apiaryId, userId: user.id, entity: 'invitation', entityId: before.id, action: 'delete', before: safe });
  });
}

/** Owner only. The audit row outlives the apiary (its apiary id is left empty, the name kept). */
export async function deleteApiary(ctx: Ctx, user: SessionUser, apiaryId: string): Promise<void> {
  await requireApiary(ctx, user, apiaryId, 'apiary:delete');
  await ctx.db.transaction(async (tx) => {
    const [before] = await tx.select().from(apiaries).where(eq(apiaries.id, apiaryId)).for('update');
    if (!before) throw notFound('That apiary');
    await tx.delete(apiaries).where(eq(apiaries.id, apiaryId));
    await recordAudit(tx, ctx, { apiaryId: null, userId: user.id, entity: 'apiary', entityId: apiaryId, action: 'delete', before });
  });
}

/** The owner's view of recent changes: who, when, what. */
export async function listActivity(ctx: Ctx, user: SessionUser, apiaryId: string, limit = 100): Promise<ActivityDto[]> {
  await requireApiary(ctx, user, apiaryId, 'activity:read');
  const rows = await ctx.db
    .select({
      id: auditLog.id,
      at: auditLog.at,
      userId: auditLog.userId,
      name: users.name,
      entity: auditLog.entity,
      entityId: auditLog.entityId,
      action: auditLog.action,
      changes: auditLog.changes,
    })
    .from(auditLog)
    .leftJoin(users, eq(users.id, auditLog.userId))
    .where(eq(auditLog.apiaryId, apiaryId))
    .orderBy(desc(auditLog.at), desc(auditLog.id))
    .limit(limit);
  return rows.map((r) => ({
    id: r.id,
    at: r.at.toISOString(),
    who: r.userId ? { id: r.userId, name: r.name ?? 'A former member' } : null,
    entity: r.entity,
    entityId: r.entityId,
    action: r.action,
    changes: r.changes,
  }));
}
