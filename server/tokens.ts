import { createHash, randomBytes } from 'node:crypto';

/** A link token: 32 random bytes, URL-safe. Only its hash is stored. */
export function newToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}

/** SHA-256 hex of a token; a high-entropy random token needs no slow hash. */
export const hashToken = (token: string) => createHash('sha256').update(token, 'utf8').digest('hex');

/** Tokens are 43 base64url characters; anything else cannot be ours. */
export const looksLikeToken = (v: unknown): v is string => typeof v === 'string' && /^[A-Za-z0-9_-]{43}$/.test(v);
