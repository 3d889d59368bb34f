import type { RequestHandler, Request, Response } from 'express';
import { getIronSession, type SessionOptions } from 'iron-session';
import { and, eq, isNull } from 'drizzle-orm';
import { sessions, users } from '../../db/schema';
import type { Ctx, SessionUser } from '../context';
import { unauthorized } from '../errors';

export interface CookieData {
  sid?: string;
}

export const SESSION_COOKIE = 'frameside_session';

export function sessionOptions(password: string, secure: boolean): SessionOptions {
  return {
    password,
    cookieName: SESSION_COOKIE,
    ttl: 60 * 60 * 24 * 30,
    cookieOptions: { httpOnly: true, sameSite: 'lax', secure, path: '/' },
  };
}

export const readCookie = (req: Request, res: Response, opts: SessionOptions) => getIronSession<CookieData>(req, res, opts);

/**
 * Loads the person behind the sealed cookie. The cookie only names a session row, so signing
 * out (revoking the row) ends it even if someone kept a copy of the cookie.
 */
export function sessionMiddleware(ctx: Ctx, opts: SessionOptions): RequestHandler {
  const sidOf = cachedUnseal(opts);
  return async (req, res, next) => {
    const sid = await sidOf(req, res);
    if (sid && /^[0-9a-f-]{36}$/.test(sid)) {
      const [row] = await ctx.db
        .select({ id: users.id, email: users.email, name: users.name })
        .from(sessions)
        .innerJoin(users, eq(users.id, sessions.userId))
        .where(and(eq(sessions.id, sid), isNull(sessions.revokedAt)))
        .limit(1);
      if (row) {
        req.user = row satisfies SessionUser;
        req.sessionId = sid;
      }
    }
    next();
  };
}

const UNSEAL_CACHE_MS = 5 * 60_000;
const UNSEAL_CACHE_MAX = 10_000;

/**
 * Unsealing the cookie costs two PBKDF2 key derivations (iron), and the same cookie comes with
 * every request: about a tenth of the server's CPU under load. The session id a cookie unseals
 * to is kept a few minutes, per app (per password). Safe because the id is only a pointer: the
 * session row is still read on every request, so signing out still ends it at once. An entry
 * never outlives the seal's own expiry (iron's 6th field, in ms).
 */
function cachedUnseal(opts: SessionOptions) {
  const known = new Map<string, { sid: string; until: number }>();
  return async (req: Request, res: Response): Promise<string | undefined> => {
    const raw = cookieValue(req.headers.cookie, opts.cookieName);
    if (!raw) return undefined;
    const now = Date.now();
    const hit = known.get(raw);
    if (hit && hit.until > now) return hit.sid;
    const { sid } = await readCookie(req, res, opts);
    if (sid) {
      const expires = Number(raw.split('*')[5]);
      if (known.size >= UNSEAL_CACHE_MAX) known.clear();
      known.set(raw, { sid, until: Math.min(now + UNSEAL_CACHE_MS, Number.isFinite(expires) && expires > 0 ? expires : now) });
    } else known.delete(raw);
    return sid;
  };
}

function cookieValue(header: string | undefined, name: string): string | undefined {
  if (!header) return undefined;
  for (const part of header.split(';')) {
    const at = part.indexOf('=');
    if (at !== -1 && part.slice(0, at).trim() === name) return part.slice(at + 1).trim();
  }
  return undefined;
}

export const requireUser: RequestHandler = (req, _res, next) => {
  if (!req.user) return next(unauthorized());
  next();
};

/** The signed-in user; call only behind requireUser. */
export function userOf(req: Request): SessionUser {
  if (!req.user) throw unauthorized();
  return req.user;
}
