import { createHash, randomBytes } from 'node:crypto';

/** 32 random bytes in base64url: the shape of every link token. */
const tokenPattern = /^[A-Za-z0-9_-]{43}$/;

/** SHA-256 of a link token, hex: what the database keeps instead of the token. */
export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

/** A new single-use link token and its hash. */
export function newToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}

/** True when the text could be one of our tokens; anything else needs no database look-up. */
export function isTokenShaped(token: string): boolean {
  return tokenPattern.test(token);
}

/** A URL with every link token in its path replaced, for logs: a logged link must not open anything. */
export function redactTokens(url: string): string {
  return url.replace(/\/[A-Za-z0-9_-]{43}(?=[/?#]|$)/g, '/[token]');
}
