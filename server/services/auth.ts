import { and, eq, isNull } from 'drizzle-orm';
import { apiaries, memberships, sessions, users } from '../../db/schema';
import type { SignInInput, SignUpInput, MeDto, UserDto } from '../../shared/schemas/auth';
import type { Ctx } from '../context';
import { AppError } from '../errors';
import { dummyHash, hashPassword, verifyPassword } from '../password';

const WRONG = 'That e-mail and password do not match an account.';

const toUser = (u: { id: string; email: string; name: string }): UserDto => ({ id: u.id, email: u.email, name: u.name });

export async function signUp(ctx: Ctx, input: SignUpInput): Promise<{ user: UserDto; sessionId: string }> {
  const passwordHash = await hashPassword(input.password);
  const name = input.name ?? input.email.split('@')[0]!;
  try {
    return await ctx.db.transaction(async (tx) => {
      const [u] = await tx.insert(users).values({ email: input.email, name, passwordHash }).returning();
      const [s] = await tx.insert(sessions).values({ userId: u!.id }).returning({ id: sessions.id });
      return { user: toUser(u!), sessionId: s!.id };
    });
  } catch (err) {
    if ((err as { cause?: { code?: string } }).cause?.code === '23505') {
      throw new AppError('email_taken', 'An account with that e-mail already exists. Sign in instead.', 409, {
        fields: { email: 'An account with that e-mail already exists.' },
      });
    }
    throw err;
  }
}

export async function signIn(ctx: Ctx, input: SignInInput): Promise<{ user: UserDto; sessionId: string }> {
  const [u] = await ctx.db.select().from(users).where(eq(users.email, input.email)).limit(1);
  // Compare against a dummy hash for an unknown e-mail so the answer time does not reveal accounts.
  const ok = await verifyPassword(input.password, u?.passwordHash ?? (await dummyHash()));
  if (!u || !ok) throw new AppError('bad_credentials', WRONG, 401);
  const [s] = await ctx.db.insert(sessions).values({ userId: u.id }).returning({ id: sessions.id });
  return { user: toUser(u), sessionId: s!.id };
}

export async function signOut(ctx: Ctx, sessionId: string | undefined): Promise<void> {
  if (!sessionId) return;
  await ctx.db
    .update(sessions)
    .set({ revokedAt: ctx.now() })
    .where(and(eq(sessions.id, sessionId), isNull(sessions.revokedAt)));
}

export async function me(ctx: Ctx, userId: string): Promise<MeDto> {
  const [u] = await ctx.db.select().from(users).where(eq(users.id, userId)).limit(1);
  if (!u) throw new AppError('unauthorized', 'Please sign in first.', 401);
  const rows = await ctx.db
    .select({
      apiaryId: memberships.apiaryId,
      apiaryName: apiaries.name,
      role: memberships.role,
      startsAt: memberships.startsAt,
      endsAt: memberships.endsAt,
    })
    .from(memberships)
    .innerJoin(apiaries, eq(apiaries.id, memberships.apiaryId))
    .where(eq(memberships.userId, userId))
    .orderBy(apiaries.name);
  return {
    user: toUser(u),
    memberships: rows.map((r) => ({
      ...r,
      startsAt: r.startsAt?.toISOString() ?? null,
      endsAt: r.endsAt?.toISOString() ?? null,
    })),
  };
}
