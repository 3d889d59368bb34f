/**
 * CSRF defence for cookie-authenticated writes, beside the SameSite=Lax session cookie.
 *
 * Every /api request that can change something (any method but GET, HEAD, OPTIONS) must come
 * from the app's own origin:
 * - with an `Origin` header (every current browser sends one on a cross-origin request and on
 *   any POST/PATCH/PUT/DELETE fetch; Fetch Standard, "origin header"), it must be the origin
 *   the request was addressed to (scheme + Host), the configured public address, or the dev
 *   server's origin in `npm run dev`; `Origin: null` (sandboxed frames, some redirects) is refused;
 * - without one (curl, scripts, older browsers on same-origin requests), a `Sec-Fetch-Site:
 *   cross-site` header (W3C Fetch Metadata Request Headers) is refused; anything else passes,
 *   since a request that carries neither header does not come from a modern browser page.
 * This is the "verifying origin with standard headers" defence of the OWASP CSRF Prevention
 * Cheat Sheet; the session cookie's SameSite=Lax is the other layer.
 */
import type { RequestHandler } from 'express';
import { AppError } from '../errors';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

export interface SameOriginOptions {
  /** The address the app is reached at (PUBLIC_URL), e.g. https://frameside.example. */
  publicUrl?: string;
  /** Development only: the Metro dev server's origin. */
  devOrigin?: string;
}

const originOf = (url: string | undefined): string | null => {
  if (!url) return null;
  try {
    const u = new URL(url);
    return u.origin === 'null' ? null : u.origin;
  } catch {
    return null;
  }
};

export const CROSS_SITE_MESSAGE =
  'This change was sent from another website, so it was refused. Open Frameside itself and try again.';

export function sameOrigin(opts: SameOriginOptions = {}): RequestHandler {
  const fixed = new Set([originOf(opts.publicUrl), originOf(opts.devOrigin)].filter((o): o is string => o !== null));
  return (req, _res, next) => {
    if (SAFE.has(req.method)) return next();
    const origin = req.get('origin');
    if (origin !== undefined) {
      const host = req.get('host');
      const own = host ? originOf(`${req.protocol}://${host}`) : null;
      const sent = originOf(origin);
      if (sent !== null && (sent === own || fixed.has(sent))) return next();
      return next(new AppError('cross_site', CROSS_SITE_MESSAGE, 403));
    }
    if (req.get('sec-fetch-site')?.toLowerCase() === 'cross-site') {
      return next(new AppError('cross_site', CROSS_SITE_MESSAGE, 403));
    }
    next();
  };
}
