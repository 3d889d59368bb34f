import { and, eq, isNull, ne } from 'drizzle-orm';
import { passwordResets, sessions, users } from '../../db/schema';
import type { Ctx } from '../context';
import { AppError } from '../errors';
import { passwordResetMail } from '../mail/templates';
import { hashPassword } from '../password';
import { hashToken, looksLikeToken, newToken } from '../tokens';
import { recordAudit } from './audit';

/** A reset link works for one hour (common practice for e-mailed reset links). */
export const RESET_MINUTES = 60;

/**
 * Always answers the same way, whether or not the account exists, so the form cannot be used to
 * find out who has an account. The e-mail goes out in the background for the same reason.
 */
export async function requestPasswordReset(ctx: Ctx, email: string): Promise<void> {
  const [u] = await ctx.db.select({ id: users.id, email: users.email }).from(users).where(eq(users.email, email)).limit(1);
  if (!u) return;
  const { token, hash } = newToken();
  const now = ctx.now();
  const expiresAt = new Date(now.getTime() + RESET_MINUTES * 60_000);
  await ctx.db.insert(passwordResets).values({ userId: u.id, tokenHash: hash, expiresAt, createdAt: now });
  void ctx.mailer
    .send(passwordResetMail({ to: u.email, link: `${ctx.publicUrl}/reset-password/${token}`, expiresAt }))
    .catch((err: unknown) => ctx.logger.warn({ err }, 'password reset mail could not be sent'));
}

/**
 * Sets a new password from a reset link: once, before it expires. Every other session of the
 * account is revoked (whoever knew the old password is signed out), and the account's other
 * unused links stop working.
 */
export async function resetPassword(ctx: Ctx, token: string, password: string, currentSessionId?: string): Promise<void> {
  const unknown = () =>
    new AppError('not_found', 'This reset link is not known. Check that the whole link was copied, or ask for a new one.', 404);
  if (!looksLikeToken(token)) throw unknown();
  const passwordHash = await hashPassword(password);
  const now = ctx.now();
  await ctx.db.transaction(async (tx) => {
    const [r] = await tx.select().from(passwordResets).where(eq(passwordResets.tokenHash, hashToken(token))).for('update');
    if (!r) throw unknown();
    if (r.usedAt) throw new AppError('reset_used', 'This reset link has already been used. Ask for a new one if you need it.', 410);
    if (r.expiresAt.getTime() <= now.getTime()) throw new AppError('reset_expired', 'This reset link has expired. Ask for a new one.', 410);
    await tx.update(passwordResets).set({ usedAt: now }).where(and(eq(passwordResets.userId, r.userId), isNull(passwordResets.usedAt)));
    await tx.update(users).set({ passwordHash, updatedAt: now }).where(eq(users.id, r.userId));
    await tx
      .update(sessions)
      .set({ revokedAt: now })
      .where(and(eq(sessions.userId, r.userId), isNull(sessions.revokedAt), currentSessionId ? ne(sessions.id, currentSessionId) : undefined));
    await recordAudit(tx, ctx, { apiaryId: null, userId: r.userId, entity: 'user', entityId: r.userId, action: 'update', before: { password: 'old' }, after: { password: 'reset by e-mail link' } });
  });
}
