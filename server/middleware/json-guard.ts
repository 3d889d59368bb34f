/**
 * Checks a parsed JSON body before any route sees it, for two things JSON allows but the app cannot
 * keep (both found by the fuzz tests, tests/server/fuzz.test.ts):
 * - U+0000 (NUL) inside a string: PostgreSQL text and jsonb cannot store it (a write would fail
 *   with "invalid byte sequence" and answer 500);
 * - nesting deeper than MAX_DEPTH: no request of this API is nested that deep, and recursive work on
 *   such a body (the idempotency fingerprint) would overflow the stack.
 * The walk is iterative, so a body nested 50,000 levels deep is refused without recursion.
 */
import type { RequestHandler } from 'express';
import { AppError } from '../errors';

/** Deeper than any request of this API (an account export is about 8 levels). */
export const MAX_DEPTH = 32;

/** The first problem in a parsed JSON value, or null. */
export function jsonProblem(value: unknown): 'nul' | 'depth' | null {
  const stack: [unknown, number][] = [[value, 0]];
  while (stack.length > 0) {
    const [v, depth] = stack.pop()!;
    if (typeof v === 'string') {
      if (v.includes('\u0000')) return 'nul';
    } else if (v !== null && typeof v === 'object') {
      if (depth >= MAX_DEPTH) return 'depth';
      for (const [k, child] of Object.entries(v as Record<string, unknown>)) {
        if (k.includes('\u0000')) return 'nul';
        stack.push([child, depth + 1]);
      }
    }
  }
  return null;
}

export const jsonGuard: RequestHandler = (req, _res, next) => {
  const problem = req.body === undefined ? null : jsonProblem(req.body);
  if (problem === 'nul') return next(new AppError('invalid', 'Text may not contain a NUL character (\\u0000). Remove it and try again.', 400));
  if (problem === 'depth') return next(new AppError('invalid', `The request is nested too deeply (more than ${MAX_DEPTH} levels).`, 400));
  next();
};
