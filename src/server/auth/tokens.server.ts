// Personal API tokens and share-link tokens: 256 random bits, shown once, stored as sha256.
import { createHash, randomBytes } from 'node:crypto';

export const API_TOKEN_PREFIX = 'hpl_';

export function hashToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

/** A new random token (base64url of 32 bytes) with an optional prefix. */
export function newToken(prefix = ''): string {
  return prefix + randomBytes(32).toString('base64url');
}
