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
  return async (req, res, next) => {
    const cookie = await readCookie(req, res, opts);
    if (cookie.sid && /^[0-9a-f-]{36}$/.test(cookie.sid)) {
      const [row] = await ctx.db
        .select({ id: users.id, email: users.email, name: users.name })
        .from(sessions)
        .innerJoin(users, eq(users.id, sessions.userId))
        .where(and(eq(sessions.id, cookie.sid), isNull(sessions.revokedAt)))
        .limit(1);
      if (row) {
        req.user = row satisfies SessionUser;
        req.sessionId = cookie.sid;
      }
    }
    next();
  };
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
