/**
 * The `Idempotency-Key` request header (IETF httpapi draft "The Idempotency-Key HTTP Header
 * Field"), for write routes a client may retry: a Quick check saved at an out-apiary with a
 * weak signal may be sent twice, or its answer lost on the way back.
 *
 * Usage, in a RouteDef behind `auth: true`:
 *
 *     { method: 'post', path: '/api/hives/:hiveId/inspections', auth: true,
 *       before: [idempotency(ctx)], handler: … }
 *
 * The client sends one key per draft (a random UUID, the same on every retry of that draft):
 * - no header → the route runs as usual (the key is optional);
 * - first time → the key is claimed (insert-first; unique per person and key), the route runs,
 *   and a 2xx JSON answer is stored with its status;
 * - same key, same method, path and body → the stored answer is replayed (same status and body,
 *   header `Idempotent-Replayed: true`), also when the first answer was lost on the way;
 * - same key, another payload or address → 422;
 * - same key while the first copy is still running → 409 "already being processed";
 * - a non-2xx answer (400 bad input, 403, 409 stale…) frees the key, so the same draft can be
 *   fixed and sent again with it.
 * Keys are kept 24 hours and then purged. A claim whose request died without answering (the
 * process stopped mid-write) is taken over after `abandonAfterMs`.
 */
import { createHash } from 'node:crypto';
import type { RequestHandler, Response } from 'express';
import { and, eq, lt } from 'drizzle-orm';
import { idempotencyKeys } from '../../db/schema';
import type { Ctx } from '../context';
import { AppError } from '../errors';

export const IDEMPOTENCY_HEADER = 'Idempotency-Key';
export const IDEMPOTENCY_TTL_MS = 24 * 60 * 60 * 1000;
const PURGE_EVERY_MS = 60_000;

export interface IdempotencyOptions {
  /** An in-flight claim older than this is treated as abandoned; default 60 s. */
  abandonAfterMs?: number;
}

/** JSON with object keys sorted, so `{a,b}` and `{b,a}` are the same request. */
export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== 'object') return JSON.stringify(value) ?? 'null';
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  const entries = Object.entries(value as Record<string, unknown>)
    .filter(([, v]) => v !== undefined)
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
}

const fingerprintOf = (method: string, path: string, body: unknown) =>
  createHash('sha256').update(`${method}\n${path}\n${canonicalJson(body ?? null)}`).digest('hex');

/** The key as sent: the draft writes it as a structured-field string ("…"); a bare token is accepted too. */
function readKey(raw: string | undefined): string | null {
  if (raw === undefined) return null;
  const v = raw.trim();
  const unquoted = v.length >= 2 && v.startsWith('"') && v.endsWith('"') ? v.slice(1, -1) : v;
  if (!/^[\x21-\x7e]{1,255}$/.test(unquoted)) {
    throw new AppError('invalid_idempotency_key', 'The Idempotency-Key header must be 1 to 255 visible characters (a UUID works).', 400);
  }
  return unquoted;
}

export function idempotency(ctx: Ctx, opts: IdempotencyOptions = {}): RequestHandler {
  const abandonAfterMs = opts.abandonAfterMs ?? 60_000;
  let lastPurge = -Infinity;
  return async (req, res, next) => {
    const key = readKey(req.get(IDEMPOTENCY_HEADER));
    if (key === null || !req.user) return next();
    const userId = req.user.id;
    const path = req.originalUrl.split('?')[0]!;
    const fingerprint = fingerprintOf(req.method, path, req.body);
    const now = ctx.now();

    // Purge expired keys at most once a minute (of the app's clock), not on every write.
    if (Math.abs(now.getTime() - lastPurge) >= PURGE_EVERY_MS) {
      lastPurge = now.getTime();
      await ctx.db.delete(idempotencyKeys).where(lt(idempotencyKeys.createdAt, new Date(now.getTime() - IDEMPOTENCY_TTL_MS)));
    }

    // Insert first: of two racing copies exactly one gets the row; the other sees the conflict.
    const claimed = await ctx.db
      .insert(idempotencyKeys)
      .values({ userId, key, method: req.method, path, fingerprint, createdAt: now })
      .onConflictDoNothing({ target: [idempotencyKeys.userId, idempotencyKeys.key] })
      .returning({ id: idempotencyKeys.id });

    let rowId = claimed[0]?.id;
    if (!rowId) {
      const [prior] = await ctx.db
        .select()
        .from(idempotencyKeys)
        .where(and(eq(idempotencyKeys.userId, userId), eq(idempotencyKeys.key, key)))
        .limit(1);
      if (!prior) return next(new AppError('idempotency_busy', 'This request is already being processed. Try again in a moment.', 409));
      if (prior.fingerprint !== fingerprint) {
        return next(
          new AppError(
            'idempotency_key_reused',
            'This Idempotency-Key was already used for a different request. Send a new key for new details.',
            422,
          ),
        );
      }
      if (prior.status !== null) {
        res.setHeader('Idempotent-Replayed', 'true');
        return void res.status(prior.status).json(prior.responseBody);
      }
      const abandoned = now.getTime() - prior.createdAt.getTime() > abandonAfterMs;
      if (!abandoned) {
        return next(new AppError('idempotency_busy', 'This request is already being processed. Try again in a moment.', 409));
      }
      // Take over a claim whose request died: only one taker wins the conditional update.
      const [taken] = await ctx.db
        .update(idempotencyKeys)
        .set({ createdAt: now })
        .where(and(eq(idempotencyKeys.id, prior.id), eq(idempotencyKeys.createdAt, prior.createdAt)))
        .returning({ id: idempotencyKeys.id });
      if (!taken) return next(new AppError('idempotency_busy', 'This request is already being processed. Try again in a moment.', 409));
      rowId = taken.id;
    }

    settleOnAnswer(ctx, res, rowId);
    next();
  };
}

/**
 * Stores a 2xx JSON answer against the claim before it is sent, so a retry that arrives the
 * moment the first answer lands already finds it; any other answer frees the key. The client
 * going away mid-request changes nothing: the handler still answers, the answer is still stored,
 * and the retry gets it (the "first answer lost" case).
 */
function settleOnAnswer(ctx: Ctx, res: Response, rowId: string) {
  let settled = false;
  const json = res.json.bind(res);
  const end = res.end.bind(res) as (...args: unknown[]) => Response;
  res.json = ((body: unknown) => {
    settled = true;
    const ok = res.statusCode >= 200 && res.statusCode < 300;
    const write = ok
      ? ctx.db
          .update(idempotencyKeys)
          .set({ status: res.statusCode, responseBody: body ?? null, completedAt: ctx.now() })
          .where(eq(idempotencyKeys.id, rowId))
      : ctx.db.delete(idempotencyKeys).where(eq(idempotencyKeys.id, rowId));
    write.then(
      () => json(body),
      (err: unknown) => {
        ctx.logger.error({ err }, 'could not store the idempotent answer');
        json(body);
      },
    );
    return res;
  }) as Response['json'];
  // An answer that is not JSON cannot be replayed: free the key rather than leave it claimed.
  res.end = ((...args: unknown[]) => {
    if (!settled) {
      settled = true;
      void ctx.db
        .delete(idempotencyKeys)
        .where(eq(idempotencyKeys.id, rowId))
        .catch(() => undefined)
        .then(() => end(...args));
      return res;
    }
    return end(...args);
  }) as Response['end'];
}
